package org.voteworth.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.stat.inference.ChiSquareTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Draws checked against Commons Math's binomial probabilities with a chi-square test (seeded). */
class WaitingTimeBinomialTest {
    @ParameterizedTest
    @CsvSource({"8, 0.75", "24, 0.5", "25, 0.75", "60, 0.2", "300, 0.97", "2000, 0.4"})
    void matchesTheBinomialDistribution(int n, double p) {
        SplittableRandom rng = new SplittableRandom(n * 31L);
        int draws = 40_000;
        long[] observed = new long[n + 1];
        for (int i = 0; i < draws; i++) {
            long x = WaitingTimeBinomial.draw(rng, n, p);
            assertThat(x).isBetween(0L, (long) n);
            observed[(int) x]++;
        }
        // Pool the sparse tails into cells with at least 5 expected draws, as the test requires.
        BinomialDistribution ref = new BinomialDistribution(null, n, p);
        java.util.List<double[]> cells = new java.util.ArrayList<>();
        double e = 0;
        long o = 0;
        for (int k = 0; k <= n; k++) {
            e += ref.probability(k) * draws;
            o += observed[k];
            if (e >= 5 && ref.cumulativeProbability(k) < 1 - 5.0 / draws) {
                cells.add(new double[] {e, o});
                e = 0;
                o = 0;
            }
        }
        cells.add(new double[] {e, o});
        double[] expected = cells.stream().mapToDouble(c -> c[0]).toArray();
        long[] counts = cells.stream().mapToLong(c -> (long) c[1]).toArray();
        double pValue = new ChiSquareTest().chiSquareTest(expected, counts);
        assertThat(pValue).as("chi-square p-value, n=%d p=%s", n, p).isGreaterThan(0.001);
    }

    @Test
    void edgesAndErrors() {
        SplittableRandom rng = new SplittableRandom(1);
        assertThat(WaitingTimeBinomial.draw(rng, 0, 0.5)).isZero();
        assertThat(WaitingTimeBinomial.draw(rng, 500, 0.0)).isZero();
        assertThat(WaitingTimeBinomial.draw(rng, 500, 1.0)).isEqualTo(500);
        assertThatThrownBy(() -> WaitingTimeBinomial.draw(rng, 5, 1.5)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("1.5");
    }
}
