package org.voteworth.tally;

import java.util.Arrays;
import java.util.Map;
import java.util.TreeMap;

/**
 * Exact frequency counts of non-negative integers (the votes on a review, the reviews of a
 * reviewer): a primitive array for values below {@link #DENSE} and a sorted overflow map for the
 * rare larger ones, so the median and every quantile are exact without holding the values.
 *
 * <p>A mergeable value: {@link #mergeFrom} adds counts value by value, so it is associative and
 * commutative and counts built per file, byte range or partition combine into the same counts in
 * any order. Not thread-safe: one instance per thread, merged at the end.
 */
public final class FrequencyCounts {
    /** Values below this are counted in a primitive array; larger ones in the overflow map. */
    public static final int DENSE = 4096;

    private final long[] dense = new long[DENSE];
    private final TreeMap<Long, Long> overflow = new TreeMap<>();
    private long count;

    /** What {@link #forEach} hands out: one distinct value and how often it occurred. */
    @FunctionalInterface
    public interface ValueCount {
        void accept(long value, long count);
    }

    /** Counts one occurrence of {@code value} (0 or more). */
    public void add(long value) {
        if (value >= 0 && value < DENSE) {
            dense[(int) value]++;
            count++;
        } else {
            add(value, 1);
        }
    }

    /** Counts {@code times} occurrences of {@code value}. */
    public void add(long value, long times) {
        if (value < 0) {
            throw new IllegalArgumentException("frequency counts take values of 0 or more, got " + value);
        }
        if (times < 0) {
            throw new IllegalArgumentException("cannot count a value a negative number of times, got " + times);
        }
        if (times == 0) {
            return;
        }
        if (value < DENSE) {
            dense[(int) value] += times;
        } else {
            overflow.merge(value, times, Long::sum);
        }
        count += times;
    }

    /** Adds every count of {@code other} into these counts. */
    public void mergeFrom(FrequencyCounts other) {
        for (int v = 0; v < DENSE; v++) {
            dense[v] += other.dense[v];
        }
        other.overflow.forEach((v, n) -> overflow.merge(v, n, Long::sum));
        count += other.count;
    }

    /** A copy that no later {@code add} or {@code mergeFrom} on this instance changes. */
    public FrequencyCounts copy() {
        FrequencyCounts c = new FrequencyCounts();
        c.mergeFrom(this);
        return c;
    }

    /** How many values were counted. */
    public long count() {
        return count;
    }

    public boolean isEmpty() {
        return count == 0;
    }

    /** How often {@code value} occurred. */
    public long countOf(long value) {
        if (value < 0) {
            return 0;
        }
        return value < DENSE ? dense[(int) value] : overflow.getOrDefault(value, 0L);
    }

    /** The distinct values in ascending order with their counts. */
    public void forEach(ValueCount action) {
        for (int v = 0; v < DENSE; v++) {
            if (dense[v] > 0) {
                action.accept(v, dense[v]);
            }
        }
        for (Map.Entry<Long, Long> e : overflow.entrySet()) {
            action.accept(e.getKey(), e.getValue());
        }
    }

    /** The smallest value counted; throws when empty. */
    public long min() {
        return valueAt(0);
    }

    /** The largest value counted; throws when empty. */
    public long max() {
        requireValues();
        if (!overflow.isEmpty()) {
            return overflow.lastKey();
        }
        for (int v = DENSE - 1; v >= 0; v--) {
            if (dense[v] > 0) {
                return v;
            }
        }
        throw new IllegalStateException("unreachable: count " + count + " but no value");
    }

    /** Sum of all values counted (exact; throws {@link ArithmeticException} past {@code Long.MAX_VALUE}). */
    public long sum() {
        long s = 0;
        for (int v = 1; v < DENSE; v++) {
            s = Math.addExact(s, v * dense[v]);
        }
        for (Map.Entry<Long, Long> e : overflow.entrySet()) {
            s = Math.addExact(s, Math.multiplyExact(e.getKey(), e.getValue()));
        }
        return s;
    }

    /** The arithmetic mean; NaN when empty. */
    public double mean() {
        if (count == 0) {
            return Double.NaN;
        }
        double[] sum = {0};
        forEach((v, n) -> sum[0] += (double) v * n);
        return sum[0] / count;
    }

    /**
     * The sample standard deviation (divisor n - 1, the bias-corrected estimate); NaN below two
     * values. Computed in two passes over the distinct values, around the mean.
     */
    public double standardDeviation() {
        if (count < 2) {
            return Double.NaN;
        }
        double m = mean();
        double[] ss = {0};
        forEach((v, n) -> ss[0] += n * (v - m) * (v - m));
        return Math.sqrt(ss[0] / (count - 1));
    }

    /** The value at 0-based position {@code rank} of the values sorted ascending (an order statistic). */
    public long valueAt(long rank) {
        requireValues();
        if (rank < 0 || rank >= count) {
            throw new IndexOutOfBoundsException("rank " + rank + " of " + count + " values");
        }
        long seen = 0;
        for (int v = 0; v < DENSE; v++) {
            seen += dense[v];
            if (seen > rank) {
                return v;
            }
        }
        for (Map.Entry<Long, Long> e : overflow.entrySet()) {
            seen += e.getValue();
            if (seen > rank) {
                return e.getKey();
            }
        }
        throw new IllegalStateException("unreachable: rank " + rank + " past " + seen + " values");
    }

    /**
     * The {@code p}-quantile by linear interpolation between order statistics (Hyndman and Fan's
     * type 7, the default of R's {@code quantile} and NumPy's "linear"): with the values sorted as
     * x[0..n-1] and h = (n - 1) p, the quantile is x[floor h] + (h - floor h)(x[floor h + 1] -
     * x[floor h]). At p = 0.5 this is the middle value, or for an even count the mean of the two
     * middle values. Throws when empty.
     *
     * @param p in [0, 1]
     */
    public double quantile(double p) {
        if (!(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("a quantile's p must be in [0, 1], got " + p);
        }
        requireValues();
        double h = (count - 1) * p;
        long lo = (long) Math.floor(h);
        long a = valueAt(lo);
        if (lo + 1 >= count || h == lo) {
            return a;
        }
        long b = valueAt(lo + 1);
        return a + (h - lo) * (b - a);
    }

    /** The median: {@code quantile(0.5)}. */
    public double median() {
        return quantile(0.5);
    }

    private void requireValues() {
        if (count == 0) {
            throw new IllegalStateException("no values counted");
        }
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof FrequencyCounts f && count == f.count && Arrays.equals(dense, f.dense)
                && overflow.equals(f.overflow);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(dense) + overflow.hashCode();
    }

    @Override
    public String toString() {
        StringBuilder b = new StringBuilder("FrequencyCounts{");
        forEach((v, n) -> b.append(b.length() > 16 ? ", " : "").append(v).append('x').append(n));
        return b.append('}').toString();
    }
}
