package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.distribution.BetaDistribution;
import org.junit.jupiter.api.Test;

class BayesianAverageTest {
    private static final BetaPrior RATS_ML = new BetaPrior(2.304768, 14.079707);

    @Test
    void scoreIsThePosteriorMeanOfCommonsMathsBeta() {
        // Reference: Commons Math BetaDistribution(α + H, β + T − H).getNumericalMean().
        BayesianAverage rule = new BayesianAverage(RATS_ML);
        for (long t = 1; t <= 200; t += 7) {
            for (long h = 0; h <= t; h += 3) {
                BetaDistribution post = new BetaDistribution(null, RATS_ML.alpha() + h, RATS_ML.beta() + t - h);
                assertThat(rule.score(Evidence.of(h, t))).isCloseTo(post.getNumericalMean(), within(1e-14));
            }
        }
    }

    @Test
    void ratsPosteriorMeanOfTheSeventyFirst() {
        // Gelman et al., BDA3 5.1 (confirmed): 4 of 14 under the moments prior give a posterior mean of 0.223; the book
        // computes it from the unrounded prior (1.35615, 8.61506, computed), which gives 0.22344 (computed). Its rounded
        // prior Beta(1.4, 8.6) would give 5.4 / 24 = 0.225.
        BayesianAverage rule = new BayesianAverage(new BetaPrior(1.35615, 8.61506));
        assertThat(rule.score(Evidence.of(4, 14))).isCloseTo(0.223, within(5e-4)).isCloseTo(0.22344, within(5e-6));
        assertThat(new BayesianAverage(new BetaPrior(1.4, 8.6)).score(Evidence.of(4, 14))).isCloseTo(0.225, within(1e-15));
    }

    @Test
    void intervalIsTheCentralPosteriorInterval() {
        BayesianAverage rule = new BayesianAverage(RATS_ML);
        Interval i = rule.interval(Evidence.of(4, 14)).orElseThrow();
        BetaDistribution post = new BetaDistribution(null, RATS_ML.alpha() + 4, RATS_ML.beta() + 10, 1e-14);
        assertThat(i.confidence()).isEqualTo(0.95);
        assertThat(i.lower()).isCloseTo(post.inverseCumulativeProbability(0.025), within(1e-12));
        assertThat(i.upper()).isCloseTo(post.inverseCumulativeProbability(0.975), within(1e-12));
        assertThat(rule.score(Evidence.of(4, 14))).isBetween(i.lower(), i.upper());
    }

    @Test
    void labelCarriesThePrior() {
        BayesianAverage rule = new BayesianAverage(RATS_ML);
        assertThat(rule.name()).isEqualTo("bayes-mean");
        assertThat(rule.label()).isEqualTo("Bayesian average (prior Beta(2.30, 14.08))");
        assertThat(rule.prior()).isEqualTo(RATS_ML);
        assertThat(rule.describe()).endsWith(".").contains("16.4 votes");
    }
}
