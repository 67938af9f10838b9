package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Draws checked against Commons Math's distributions with a Kolmogorov-Smirnov test (seeded). */
class MarsagliaTsangGammaTest {
    private static final int N = 20_000;

    @ParameterizedTest
    @CsvSource({"0.3", "1.0", "1.8", "5.0", "40.0"})
    void gammaMatchesCommonsMath(double shape) {
        SplittableRandom rng = new SplittableRandom(42);
        double[] x = new double[N];
        for (int i = 0; i < N; i++) {
            x[i] = MarsagliaTsangGamma.gamma(rng, shape);
        }
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new GammaDistribution(null, shape, 1.0), x);
        assertThat(p).as("KS p-value for Gamma(%s)", shape).isGreaterThan(0.001);
    }

    @ParameterizedTest
    @CsvSource({"5.0, 1.8", "0.5, 0.5", "38.0, 2.0", "2.0, 30.0"})
    void betaMatchesCommonsMath(double a, double b) {
        SplittableRandom rng = new SplittableRandom(43);
        double[] x = new double[N];
        for (int i = 0; i < N; i++) {
            x[i] = MarsagliaTsangGamma.beta(rng, a, b);
        }
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new BetaDistribution(null, a, b), x);
        assertThat(p).as("KS p-value for Beta(%s, %s)", a, b).isGreaterThan(0.001);
    }

    @ParameterizedTest
    @CsvSource({"44"})
    void normalMatchesCommonsMath(long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        double[] x = new double[N];
        for (int i = 0; i < N; i++) {
            x[i] = MarsagliaTsangGamma.normal(rng);
        }
        assertThat(new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new NormalDistribution(null, 0, 1), x)).isGreaterThan(0.001);
    }
}
