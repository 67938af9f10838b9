package org.voteworth.demo;

/**
 * The kinds of unreadable (and one kind of odd but valid) rows the demo dump plants, so a
 * reader's rejections can be reconciled exactly. Each kind is planted {@link #rowsPlanted()}
 * times, at positions reported in {@link GeneratedDump#plantedLines()}.
 */
public enum MalformedKind {
    /** 10, 5 and 11 fields instead of 12 (the row was cut short). */
    TOO_FEW_FIELDS("too-few-fields", 3, 1, true),
    /** 13, 13 and 14 fields (a trailing extra field, a repeated category, two empty fields). */
    TOO_MANY_FIELDS("too-many-fields", 3, 1, true),
    /** A tab inside the body splits it into two fields: 13 fields. */
    TAB_IN_BODY("tab-in-body", 3, 1, true),
    /** A line break inside the body: one row becomes two lines of 11 and 2 fields, both rejected. */
    NEWLINE_IN_BODY("newline-in-body", 3, 2, true),
    /** {@code abc} as helpful votes, then as total votes. */
    VOTES_NOT_A_NUMBER("votes-not-a-number", 2, 1, true),
    /** {@code 1.5} as helpful votes, then as total votes. */
    VOTES_DECIMAL("votes-decimal", 2, 1, true),
    /** {@code -3} as helpful votes, then as total votes. */
    VOTES_NEGATIVE("votes-negative", 2, 1, true),
    /** An empty helpful-votes field, then an empty total-votes field. */
    VOTES_EMPTY("votes-empty", 2, 1, true),
    /** More helpful votes than total votes (total + 2). */
    HELPFUL_ABOVE_TOTAL("helpful-above-total", 3, 1, true),
    /** {@code 2021-02-30}, {@code 2021-13-01} and {@code yesterday} as the review date. */
    DATE_INVALID("date-invalid", 3, 1, true),
    /**
     * Valid rows that must be accepted: {@code "}, {@code ''}, {@code ""} and an unbalanced
     * {@code "} in headline and body, some at the start of the field. In TSV a quote is not special.
     */
    STRAY_QUOTES("stray-quotes", 6, 1, false);

    private final String key;
    private final int rowsPlanted;
    private final int linesPerRow;
    private final boolean rejected;

    MalformedKind(String key, int rowsPlanted, int linesPerRow, boolean rejected) {
        this.key = key;
        this.rowsPlanted = rowsPlanted;
        this.linesPerRow = linesPerRow;
        this.rejected = rejected;
    }

    /** The key in {@link GeneratedDump#malformedByKind()}, e.g. {@code newline-in-body}. */
    public String key() {
        return key;
    }

    /** Logical rows of this kind in a dump with malformed rows on. */
    public int rowsPlanted() {
        return rowsPlanted;
    }

    /** Physical lines each such row takes: 2 for a stray newline, else 1. */
    public int linesPerRow() {
        return linesPerRow;
    }

    /** Whether a correct reader rejects these lines (false only for {@link #STRAY_QUOTES}). */
    public boolean rejected() {
        return rejected;
    }
}
