package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.junit.jupiter.api.Test;

class BayesianLowerQuantileTest {
    private static final BetaPrior PRIOR = new BetaPrior(2.304768, 14.079707);

    @Test
    void withTheJeffreysPriorItsIntervalIsTheJeffreysInterval() {
        // reference-checks/beta_quantiles.csv, Astropy documentation (confirmed): Jeffreys intervals at
        // confidence 0.68269 for k = 1, 2 of n = 5 are the (q, 1 − q) quantiles of Beta(k + 1/2, n − k + 1/2).
        BayesianLowerQuantile rule = new BayesianLowerQuantile(new BetaPrior(0.5, 0.5), (1 - 0.68269) / 2);
        for (Map<String, String> r : ReferenceCsv.read("beta_quantiles.csv")) {
            double a = Double.parseDouble(r.get("alpha"));
            if (a % 1 != 0.5) {
                continue;
            }
            long k = Math.round(a - 0.5);
            long n = k + Math.round(Double.parseDouble(r.get("beta")) - 0.5);
            Interval i = rule.interval(Evidence.of(k, n)).orElseThrow();
            double p = Double.parseDouble(r.get("probability"));
            ReferenceCsv.check(r, "quantile", p < 0.5 ? i.lower() : i.upper());
            assertThat(i.confidence()).isCloseTo(0.68269, within(1e-12));
        }
    }

    @Test
    void scoreIsTheQuantileOfCommonsMathsBeta() {
        // Reference: Commons Math BetaDistribution(α + H, β + T − H).inverseCumulativeProbability(q).
        BayesianLowerQuantile rule = new BayesianLowerQuantile(PRIOR, 0.05);
        for (long t = 1; t <= 500; t += 37) {
            for (long h = 0; h <= t; h += Math.max(1, t / 9)) {
                BetaDistribution post = new BetaDistribution(null, PRIOR.alpha() + h, PRIOR.beta() + t - h, 1e-14);
                assertThat(rule.score(Evidence.of(h, t))).isCloseTo(post.inverseCumulativeProbability(0.05), within(1e-12));
            }
        }
    }

    @Test
    void ratsSeventyFirstSitsBelowItsMean() {
        // Gelman et al., BDA3 5.1: Beta(5.4, 18.6) has mean 0.223, sd 0.083; its 5 % quantile lies well below the mean.
        BayesianLowerQuantile rule = new BayesianLowerQuantile(new BetaPrior(1.4, 8.6), 0.05);
        double q = rule.score(Evidence.of(4, 14));
        assertThat(q).isLessThan(0.223 - 0.083).isGreaterThan(0.223 - 3 * 0.083);
    }

    @Test
    void namesAndChecks() {
        BayesianLowerQuantile rule = new BayesianLowerQuantile(PRIOR, 0.05);
        assertThat(rule.name()).isEqualTo("bayes-lower");
        assertThat(rule.label()).isEqualTo("Bayesian lower quantile (5 %, prior Beta(2.30, 14.08))");
        assertThat(rule.quantile()).isEqualTo(0.05);
        assertThat(rule.prior()).isEqualTo(PRIOR);
        assertThat(rule.interval(Evidence.of(3, 9)).orElseThrow().confidence()).isCloseTo(0.9, within(1e-15));
        assertThatThrownBy(() -> new BayesianLowerQuantile(PRIOR, 0.5)).hasMessageContaining("0.5");
    }
}
