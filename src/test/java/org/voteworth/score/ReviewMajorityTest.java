package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class ReviewMajorityTest {

    @Test
    void countsReviewsNotVotes() {
        ReviewMajority rule = new ReviewMajority(0.95);
        // One viral review with 990 of 1000 helpful among 9 voted reviews with no majority: 1 of 10 reviews.
        Evidence viral = new Evidence(990 + 9, 1000 + 27, 10, 1);
        Evidence steady = new Evidence(150, 200, 10, 9);
        assertThat(rule.score(viral)).isLessThan(rule.score(steady));
        // The same numbers as the Wilson bound of x = 9 of n = 10 reviews.
        assertThat(rule.score(steady)).isCloseTo(WilsonScore.interval(9, 10, 0.95).lower(), within(1e-15));
        assertThat(rule.interval(steady).orElseThrow()).isEqualTo(WilsonScore.interval(9, 10, 0.95));
    }

    @Test
    void eligibleWithAVotedReview() {
        ReviewMajority rule = new ReviewMajority(0.95);
        assertThat(rule.eligible(new Evidence(0, 0, 0, 0))).isFalse();
        assertThat(rule.eligible(new Evidence(0, 1, 1, 0))).isTrue();
        assertThat(rule.score(new Evidence(0, 0, 0, 0))).isZero();
    }

    @Test
    void names() {
        ReviewMajority rule = new ReviewMajority(0.9);
        assertThat(rule.name()).isEqualTo("review-majority");
        assertThat(rule.label()).isEqualTo("Review majority, Wilson lower bound over reviews (90 %)");
        assertThat(rule.confidence()).isEqualTo(0.9);
        assertThat(rule.describe()).endsWith(".");
    }
}
