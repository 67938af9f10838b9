package org.voteworth.tally;

/**
 * Told each reviewer's tally as the reviewer table is written, in id order, as the writer's own
 * reused record: what the overview needs (reviews overall and per category) costs no object per
 * reviewer this way. Category ids of the record are ids of the names given.
 */
@FunctionalInterface
interface WrittenTally {
    /** No one to tell. */
    WrittenTally NONE = (record, names) -> { };

    void written(TallyRecord record, Categories names);
}
