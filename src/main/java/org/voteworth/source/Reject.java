package org.voteworth.source;

/**
 * Why one row was not accepted: a reason code, the field (its {@link Field#key()}, or
 * {@value #ROW} for the row as a whole), the offending value as text and a message for people.
 *
 * <p>{@link RowParser#parse} returns {@link #NONE} for a valid row, so a good row costs no
 * allocation; test with {@link #isNone()}. The reason codes are the constants below.
 */
public record Reject(String reason, String field, String value, String message) {
    /** The field name of a reject about the whole row rather than one field. */
    public static final String ROW = "(row)";

    /** A blank line. */
    public static final String EMPTY_ROW = "empty-row";
    /** More or fewer fields than the header has (a tab in the text, a wrong delimiter). */
    public static final String FIELD_COUNT = "field-count";
    /** CSV only: a quoted field that is not closed on its line, or text after a closing quote. */
    public static final String BAD_QUOTE = "bad-quote";
    /** The reviewer id is empty. */
    public static final String EMPTY_REVIEWER = "empty-reviewer";
    /** Helpful or total votes is not a non-negative whole number (or is too large). */
    public static final String BAD_VOTES = "bad-votes";
    /** More helpful votes than votes in total. */
    public static final String HELPFUL_ABOVE_TOTAL = "helpful-above-total";
    /** A star rating that is not 1 to 5. */
    public static final String BAD_STARS = "bad-stars";
    /** Verified or incentivised is not one of Y/N/yes/no/true/false/1/0. */
    public static final String BAD_FLAG = "bad-flag";
    /** A date that is not a real calendar date written yyyy-MM-dd. */
    public static final String BAD_DATE = "bad-date";

    /** The sentinel for "accepted": every component is empty. */
    public static final Reject NONE = new Reject("", "", "", "");

    /** Whether this is {@link #NONE}, i.e. the row was accepted. */
    public boolean isNone() {
        return this == NONE;
    }
}
