package org.voteworth.score;

/**
 * A two-sided interval for a share, at the confidence it was computed for.
 *
 * @param lower lower limit, in [0, 1]
 * @param upper upper limit, in [lower, 1]
 * @param confidence e.g. 0.95
 */
public record Interval(double lower, double upper, double confidence) {
    public Interval {
        if (!(lower <= upper) || lower < 0 || upper > 1) {
            throw new IllegalArgumentException("need 0 <= lower <= upper <= 1, got [" + lower + ", " + upper + "]");
        }
    }
}
