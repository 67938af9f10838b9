package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.apache.commons.math3.stat.descriptive.rank.Percentile.EstimationType;
import org.junit.jupiter.api.Test;

class FrequencyCountsTest {
    /** Vote-like values: mostly small, a heavy tail that reaches past the dense array into the overflow map. */
    private static long[] votes(Random rnd, int n) {
        long[] v = new long[n];
        for (int i = 0; i < n; i++) {
            double u = rnd.nextDouble();
            v[i] = u < 0.4 ? 0 : u < 0.98 ? rnd.nextInt(40) : (long) (FrequencyCounts.DENSE * 0.5 + rnd.nextInt(3 * FrequencyCounts.DENSE));
        }
        return v;
    }

    private static FrequencyCounts counted(long[] values, int from, int to) {
        FrequencyCounts f = new FrequencyCounts();
        for (int i = from; i < to; i++) {
            f.add(values[i]);
        }
        return f;
    }

    private static double[] doubles(long[] v) {
        double[] d = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            d[i] = v[i];
        }
        return d;
    }

    @Test
    void quantilesAreThoseOfCommonsMathPercentileTypeSeven() {
        // Reference: Commons Math 3.6.1 Percentile with EstimationType.R_7 (Hyndman and Fan type 7,
        // the R and NumPy default) on the same values, held in full.
        for (int n : new int[] {1, 2, 3, 10, 11, 1000, 1001, 20_000}) {
            long[] v = votes(new Random(n), n);
            FrequencyCounts f = counted(v, 0, n);
            Percentile r7 = new Percentile().withEstimationType(EstimationType.R_7);
            r7.setData(doubles(v));
            for (double p : new double[] {0, 0.01, 0.1, 0.25, 0.5, 0.75, 0.9, 0.99, 1}) {
                double expected = p == 0 ? r7.evaluate(1e-9) : r7.evaluate(100 * p);
                assertThat(f.quantile(p)).as("n=%d p=%s", n, p).isCloseTo(expected, within(1e-9 * Math.max(1, expected)));
            }
        }
    }

    @Test
    void medianOfAnEvenCountIsTheMeanOfTheTwoMiddleValues() {
        // The usual definition of the median (common practice); DescriptiveStatistics.getPercentile(50),
        // whose default estimation (Commons Math's LEGACY, position p(n+1)) interpolates the same way at 50 %.
        FrequencyCounts f = new FrequencyCounts();
        for (long x : new long[] {10, 1, 3, 2}) {
            f.add(x);
        }
        assertThat(f.median()).isEqualTo(2.5);
        DescriptiveStatistics d = new DescriptiveStatistics(new double[] {10, 1, 3, 2});
        assertThat(d.getPercentile(50)).isEqualTo(2.5);
        f.add(7);
        assertThat(f.median()).isEqualTo(3.0);

        long[] v = votes(new Random(5), 5000);
        DescriptiveStatistics all = new DescriptiveStatistics(doubles(v));
        assertThat(counted(v, 0, v.length).median()).isEqualTo(all.getPercentile(50));
    }

    @Test
    void momentsAndExtremesMatchDescriptiveStatistics() {
        // Reference: Commons Math DescriptiveStatistics (mean; standard deviation with divisor n - 1).
        long[] v = votes(new Random(17), 30_000);
        FrequencyCounts f = counted(v, 0, v.length);
        DescriptiveStatistics d = new DescriptiveStatistics(doubles(v));
        assertThat(f.count()).isEqualTo(v.length);
        assertThat((double) f.min()).isEqualTo(d.getMin());
        assertThat((double) f.max()).isEqualTo(d.getMax());
        assertThat((double) f.sum()).isEqualTo(d.getSum());
        assertThat(f.mean()).isCloseTo(d.getMean(), within(1e-9));
        assertThat(f.standardDeviation()).isCloseTo(d.getStandardDeviation(), within(1e-7));
        assertThat(f.countOf(0)).isEqualTo(java.util.Arrays.stream(v).filter(x -> x == 0).count());
    }

    @Test
    void mergeIsAssociativeAndOrderIndependent() {
        long[] v = votes(new Random(3), 9000);
        FrequencyCounts whole = counted(v, 0, v.length);
        FrequencyCounts a = counted(v, 0, 2000);
        FrequencyCounts b = counted(v, 2000, 7000);
        FrequencyCounts c = counted(v, 7000, 9000);

        FrequencyCounts left = a.copy();
        left.mergeFrom(b);
        left.mergeFrom(c);
        FrequencyCounts bc = b.copy();
        bc.mergeFrom(c);
        FrequencyCounts right = a.copy();
        right.mergeFrom(bc);
        FrequencyCounts reversed = c.copy();
        reversed.mergeFrom(b);
        reversed.mergeFrom(a);

        assertThat(left).isEqualTo(whole);
        assertThat(right).isEqualTo(whole);
        assertThat(reversed).isEqualTo(whole);
        assertThat(reversed.quantile(0.99)).isEqualTo(whole.quantile(0.99));
        FrequencyCounts withEmpty = whole.copy();
        withEmpty.mergeFrom(new FrequencyCounts());
        assertThat(withEmpty).isEqualTo(whole);
    }

    @Test
    void countsManyAtOnceAndListsValuesAscending() {
        FrequencyCounts f = new FrequencyCounts();
        f.add(5_000_000, 2);
        f.add(3, 4);
        f.add(0, 0);
        StringBuilder seen = new StringBuilder();
        f.forEach((value, n) -> seen.append(value).append('x').append(n).append(' '));
        assertThat(seen.toString()).isEqualTo("3x4 5000000x2 ");
        assertThat(f.max()).isEqualTo(5_000_000);
        assertThat(f.valueAt(3)).isEqualTo(3);
        assertThat(f.valueAt(4)).isEqualTo(5_000_000);
    }

    @Test
    void refusesWhatIsNotACount() {
        FrequencyCounts f = new FrequencyCounts();
        assertThatThrownBy(() -> f.add(-1)).hasMessageContaining("0 or more");
        assertThatThrownBy(() -> f.add(1, -2)).hasMessageContaining("negative");
        assertThatThrownBy(f::median).hasMessageContaining("no values");
        f.add(1);
        assertThatThrownBy(() -> f.quantile(1.5)).hasMessageContaining("[0, 1]");
        assertThat(f.standardDeviation()).isNaN();
        assertThat(new FrequencyCounts().mean()).isNaN();
    }
}
