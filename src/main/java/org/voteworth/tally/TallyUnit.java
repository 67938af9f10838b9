package org.voteworth.tally;

/** What a tally is keyed by: reviewers (the default) or single reviews. */
public enum TallyUnit {
    /** One tally per reviewer id, over all their reviews in every file. */
    REVIEWER,
    /** One tally per review id: ranks reviews instead of reviewers. */
    REVIEW
}
