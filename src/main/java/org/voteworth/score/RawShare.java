package org.voteworth.score;

import java.util.Optional;

/**
 * The raw helpful share p = H / T: the baseline most sites rank by, kept so that it can be
 * audited against the other rules, never the default. Whatever entry bar goes with it is an
 * {@link EntryBar} applied by the {@link Ranker}, not part of the rule.
 *
 * <p>Its interval is the Wilson score interval at 95 % ({@link WilsonScore}), shown so a reader
 * sees how little a 100 % share of two votes says. A reviewer without votes scores 0, but is
 * not eligible by default.
 */
public final class RawShare implements RankingRule {
    static final double DISPLAY_CONFIDENCE = 0.95;
    private static final double DISPLAY_Z = WilsonScore.z(DISPLAY_CONFIDENCE);

    @Override
    public String name() {
        return "raw-share";
    }

    @Override
    public String label() {
        return "Raw share (H / T)";
    }

    @Override
    public String describe() {
        return "The share of a reviewer's votes that marked a review helpful, H / T, with no allowance for how few votes there are.";
    }

    @Override
    public double score(Evidence e) {
        return e.totalVotes() == 0 ? 0 : (double) e.helpfulVotes() / e.totalVotes();
    }

    @Override
    public Optional<Interval> interval(Evidence e) {
        return Optional.of(WilsonScore.interval(e.helpfulVotes(), e.totalVotes(), DISPLAY_Z, DISPLAY_CONFIDENCE));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof RawShare;
    }

    @Override
    public int hashCode() {
        return RawShare.class.hashCode();
    }

    @Override
    public String toString() {
        return name();
    }
}
