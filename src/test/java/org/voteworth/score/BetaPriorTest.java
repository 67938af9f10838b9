package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.junit.jupiter.api.Test;

class BetaPriorTest {

    @Test
    void meanStrengthSdAgainstCommonsMath() {
        // Commons Math BetaDistribution as the reference for the mean and variance formulas.
        BetaPrior p = new BetaPrior(2.304768, 14.079707);
        BetaDistribution d = new BetaDistribution(null, 2.304768, 14.079707);
        assertThat(p.mean()).isCloseTo(d.getNumericalMean(), within(1e-15));
        assertThat(p.sd()).isCloseTo(Math.sqrt(d.getNumericalVariance()), within(1e-15));
        assertThat(p.strength()).isCloseTo(16.384475, within(1e-12));
    }

    @Test
    void posteriorOfTheSeventyFirstRatExperiment() {
        // Gelman et al., BDA3 5.1 (confirmed): prior Beta(1.4, 8.6) and 4 of 14 give Beta(5.4, 18.6).
        BetaPrior post = new BetaPrior(1.4, 8.6).posterior(4, 14);
        assertThat(post.alpha()).isCloseTo(5.4, within(1e-12));
        assertThat(post.beta()).isCloseTo(18.6, within(1e-12));
    }

    @Test
    void shrinkageWeight() {
        // METHODS.md: w = T / (T + α + β), and the posterior mean is w·p + (1 − w)·μ.
        BetaPrior p = BetaPrior.ofMeanAndStrength(0.8, 20);
        assertThat(p.alpha()).isCloseTo(16, within(1e-12));
        assertThat(p.beta()).isCloseTo(4, within(1e-12));
        assertThat(p.shrinkage(0)).isZero();
        assertThat(p.shrinkage(20)).isCloseTo(0.5, within(1e-15));
        BetaPrior post = p.posterior(3, 20);
        double w = p.shrinkage(20);
        assertThat(post.mean()).isCloseTo(w * 3 / 20 + (1 - w) * 0.8, within(1e-15));
    }

    @Test
    void quantilesFromThePublishedTable() {
        // reference-checks/beta_quantiles.csv: SciPy binomtest documentation and Astropy Jeffreys intervals.
        for (Map<String, String> r : ReferenceCsv.read("beta_quantiles.csv")) {
            BetaPrior b = new BetaPrior(Double.parseDouble(r.get("alpha")), Double.parseDouble(r.get("beta")));
            ReferenceCsv.check(r, "quantile", b.quantile(Double.parseDouble(r.get("probability"))));
        }
    }

    @Test
    void labelsAndErrors() {
        assertThat(new BetaPrior(2.304768, 14.079707).label()).isEqualTo("Beta(2.30, 14.08)");
        assertThat(new BetaPrior(0.5, 0.5).label()).isEqualTo("Beta(0.50, 0.50)");
        assertThat(new BetaPrior(0.01234, 3).label()).isEqualTo("Beta(0.0123, 3.00)");
        assertThatThrownBy(() -> new BetaPrior(0, 1)).hasMessageContaining("Beta(0.0, 1.0)");
        assertThatThrownBy(() -> new BetaPrior(1, Double.NaN)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> BetaPrior.ofMeanAndStrength(1.2, 3)).hasMessageContaining("1.2");
        assertThatThrownBy(() -> BetaPrior.ofMeanAndStrength(0.5, -1)).hasMessageContaining("-1");
        assertThatThrownBy(() -> new BetaPrior(1, 1).posterior(3, 2)).hasMessageContaining("3 of 2");
    }
}
