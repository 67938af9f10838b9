package org.voteworth.score;

import java.util.Optional;

/**
 * Ranks by the Wilson lower bound over reviews rather than votes: x = the reviewer's voted
 * reviews whose helpful votes are more than half of their votes, n = their reviews with at least
 * one vote. One widely read review then counts once, however many votes it drew, which guards
 * against a single viral review carrying a reviewer. Formula as in {@link WilsonLowerBound}
 * (Wilson 1927) with x and n in place of H and T. Eligible with at least one voted review.
 */
public final class ReviewMajority implements RankingRule {
    private final double confidence;
    private final double z;

    /** @param confidence two-sided confidence of the Wilson interval over reviews, e.g. 0.95 */
    public ReviewMajority(double confidence) {
        this.z = WilsonScore.z(confidence);
        this.confidence = confidence;
    }

    public double confidence() {
        return confidence;
    }

    @Override
    public String name() {
        return "review-majority";
    }

    @Override
    public String label() {
        return "Review majority, Wilson lower bound over reviews (" + Percent.of(confidence) + ")";
    }

    @Override
    public String describe() {
        return "The lowest share of the reviewer's voted reviews judged helpful by most of their voters that is supported with "
                + Percent.of(confidence) + " confidence, so that each review counts once however many votes it drew.";
    }

    @Override
    public double score(Evidence e) {
        return WilsonScore.lower(e.majorityReviews(), e.votedReviews(), z);
    }

    @Override
    public Optional<Interval> interval(Evidence e) {
        return Optional.of(WilsonScore.interval(e.majorityReviews(), e.votedReviews(), z, confidence));
    }

    @Override
    public boolean eligible(Evidence e) {
        return e.votedReviews() >= 1;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ReviewMajority r && r.confidence == confidence;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(confidence);
    }

    @Override
    public String toString() {
        return name() + "(" + confidence + ")";
    }
}
