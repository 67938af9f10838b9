package org.voteworth.score;

import java.util.Optional;

/**
 * Ranks by the lower limit of the Wilson score interval of H helpful votes in T: the share the
 * reviewer beats with the chosen confidence, so few votes count for less than many.
 * <pre>
 *   score = (p + z²/2T − z·sqrt(p(1−p)/T + z²/4T²)) / (1 + z²/T),  p = H/T;  T = 0 scores 0
 * </pre>
 * (Wilson 1927, J. Amer. Statist. Assoc. 22:209-212). With {@code continuityCorrected}, the lower
 * limit of Newcombe (1998) method 4 instead (see {@link WilsonScore}). The interval is the whole
 * two-sided interval at the same confidence, so the score is its lower end. Default eligibility
 * still needs T &gt;= 1.
 */
public final class WilsonLowerBound implements RankingRule {
    private final double confidence;
    private final boolean continuityCorrected;
    private final double z;

    /**
     * @param confidence two-sided confidence of the interval, e.g. 0.95
     * @param continuityCorrected whether to use Newcombe's continuity-corrected limits
     */
    public WilsonLowerBound(double confidence, boolean continuityCorrected) {
        this.z = WilsonScore.z(confidence);
        this.confidence = confidence;
        this.continuityCorrected = continuityCorrected;
    }

    public double confidence() {
        return confidence;
    }

    public boolean continuityCorrected() {
        return continuityCorrected;
    }

    /** The normal quantile used, e.g. 1.959964 at 95 %. */
    public double z() {
        return z;
    }

    @Override
    public String name() {
        return continuityCorrected ? "wilson-cc" : "wilson";
    }

    @Override
    public String label() {
        return (continuityCorrected ? "Wilson lower bound, continuity-corrected (" : "Wilson lower bound (")
                + Percent.of(confidence) + ")";
    }

    @Override
    public String describe() {
        return "The lowest helpful share that the reviewer's votes support with " + Percent.of(confidence)
                + " confidence (the lower end of the " + (continuityCorrected ? "continuity-corrected " : "")
                + "Wilson score interval), so that a few votes count for less than many.";
    }

    @Override
    public double score(Evidence e) {
        long h = e.helpfulVotes();
        long t = e.totalVotes();
        return continuityCorrected ? WilsonScore.correctedLower(h, t, z) : WilsonScore.lower(h, t, z);
    }

    @Override
    public Optional<Interval> interval(Evidence e) {
        long h = e.helpfulVotes();
        long t = e.totalVotes();
        return Optional.of(continuityCorrected ? WilsonScore.continuityCorrected(h, t, z, confidence)
                : WilsonScore.interval(h, t, z, confidence));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof WilsonLowerBound w && w.confidence == confidence && w.continuityCorrected == continuityCorrected;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(confidence) * 31 + Boolean.hashCode(continuityCorrected);
    }

    @Override
    public String toString() {
        return name() + "(" + confidence + ")";
    }
}
