package org.voteworth.score;

/**
 * The evidence a reviewer needs before any rule ranks them: at least {@code minimum} helpful votes
 * (or total votes). A bar of 0 admits everyone a rule finds eligible.
 *
 * @param on which count the bar applies to
 * @param minimum the smallest count admitted
 */
public record EntryBar(On on, long minimum) {
    /** No bar. */
    public static final EntryBar NONE = new EntryBar(On.HELPFUL, 0);

    /** The count an entry bar is compared with. */
    public enum On { HELPFUL, TOTAL }

    public EntryBar {
        if (minimum < 0) {
            throw new IllegalArgumentException("an entry bar cannot be negative: " + minimum);
        }
    }

    public static EntryBar helpful(long minimum) {
        return new EntryBar(On.HELPFUL, minimum);
    }

    public static EntryBar total(long minimum) {
        return new EntryBar(On.TOTAL, minimum);
    }

    public boolean admits(Evidence e) {
        return (on == On.HELPFUL ? e.helpfulVotes() : e.totalVotes()) >= minimum;
    }

    /** e.g. "at least 10 helpful votes". */
    public String describe() {
        return minimum == 0 ? "no entry bar" : "at least " + minimum + (on == On.HELPFUL ? " helpful" : " total") + " votes";
    }
}
