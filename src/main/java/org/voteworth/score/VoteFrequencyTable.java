package org.voteworth.score;

import java.util.Arrays;
import org.apache.commons.math3.special.Gamma;
import org.voteworth.tally.TallyTable;

/**
 * Reviewers collapsed into a frequency table of distinct (H, T) pairs with their counts: millions
 * of reviewers share far fewer pairs, so the empirical-Bayes fit costs a few thousand terms.
 *
 * <p>An immutable value, sorted by (T, H), so its iteration order, and every sum over it, does
 * not depend on the order reviewers arrived in. {@link #merge} adds counts pair by pair: it is
 * associative and commutative, so tables built per partition (or per cluster task) combine into
 * the same table in any order. Units with T = 0 carry no evidence about a share and are never
 * kept.
 */
public final class VoteFrequencyTable {
    private static final VoteFrequencyTable EMPTY = new VoteFrequencyTable(new long[0], new long[0], new long[0]);

    private final long[] helpful;
    private final long[] total;
    private final long[] count;
    private final long units;

    private VoteFrequencyTable(long[] helpful, long[] total, long[] count) {
        this.helpful = helpful;
        this.total = total;
        this.count = count;
        long u = 0;
        for (long c : count) {
            u += c;
        }
        this.units = u;
    }

    /** One (H, T, count) entry of the table. */
    @FunctionalInterface
    public interface PairConsumer {
        void accept(long helpfulVotes, long totalVotes, long count);
    }

    /** The empty table. */
    public static VoteFrequencyTable empty() {
        return EMPTY;
    }

    /**
     * The reviewers (or reviews) of {@code table} with T &gt;= {@code minTotalVotes}.
     *
     * @param minTotalVotes the fitting floor, at least 1
     */
    public static VoteFrequencyTable of(TallyTable table, long minTotalVotes) {
        if (minTotalVotes < 1) {
            throw new IllegalArgumentException("the fitting floor on total votes must be at least 1 (units without votes say"
                    + " nothing about a share), got " + minTotalVotes);
        }
        PairCounter counter = new PairCounter();
        for (int s = 0; s < table.size(); s++) {
            long t = table.totalVotes(s);
            if (t >= minTotalVotes) {
                counter.add(table.helpfulVotes(s), t, 1);
            }
        }
        return counter.toTable();
    }

    /** One unit per index; units with T = 0 are left out (as with a floor of 1). */
    public static VoteFrequencyTable of(long[] helpful, long[] total) {
        if (helpful.length != total.length) {
            throw new IllegalArgumentException("need as many helpful counts as total counts, got " + helpful.length + " and "
                    + total.length);
        }
        PairCounter counter = new PairCounter();
        for (int i = 0; i < helpful.length; i++) {
            check(helpful[i], total[i], 1, i);
            if (total[i] > 0) {
                counter.add(helpful[i], total[i], 1);
            }
        }
        return counter.toTable();
    }

    /** A table already in frequency form: {@code counts[i]} units with helpful[i] of total[i] votes. */
    public static VoteFrequencyTable ofCounts(long[] helpful, long[] total, long[] counts) {
        if (helpful.length != total.length || helpful.length != counts.length) {
            throw new IllegalArgumentException("need equally long helpful, total and count arrays, got " + helpful.length + ", "
                    + total.length + " and " + counts.length);
        }
        PairCounter counter = new PairCounter();
        for (int i = 0; i < helpful.length; i++) {
            check(helpful[i], total[i], counts[i], i);
            if (total[i] > 0 && counts[i] > 0) {
                counter.add(helpful[i], total[i], counts[i]);
            }
        }
        return counter.toTable();
    }

    /** This table and {@code other} together: counts of equal pairs add up. */
    public VoteFrequencyTable merge(VoteFrequencyTable other) {
        int n = distinctPairs();
        int m = other.distinctPairs();
        long[] h = new long[n + m];
        long[] t = new long[n + m];
        long[] c = new long[n + m];
        int i = 0;
        int j = 0;
        int k = 0;
        while (i < n || j < m) {
            int cmp = i == n ? 1 : j == m ? -1 : compare(total[i], helpful[i], other.total[j], other.helpful[j]);
            if (cmp <= 0) {
                h[k] = helpful[i];
                t[k] = total[i];
                c[k] = count[i++];
                if (cmp == 0) {
                    c[k] = Math.addExact(c[k], other.count[j++]);
                }
            } else {
                h[k] = other.helpful[j];
                t[k] = other.total[j];
                c[k] = other.count[j++];
            }
            k++;
        }
        return new VoteFrequencyTable(Arrays.copyOf(h, k), Arrays.copyOf(t, k), Arrays.copyOf(c, k));
    }

    /** How many distinct (H, T) pairs. */
    public int distinctPairs() {
        return count.length;
    }

    /** How many units (reviewers or reviews) in all: the sum of the counts. */
    public long units() {
        return units;
    }

    /** H of the i-th pair, in (T, H) order. */
    public long helpful(int i) {
        return helpful[i];
    }

    /** T of the i-th pair, in (T, H) order. */
    public long total(int i) {
        return total[i];
    }

    /** How many units share the i-th pair. */
    public long count(int i) {
        return count[i];
    }

    /** Every (H, T, count), in (T, H) order. */
    public void forEach(PairConsumer consumer) {
        for (int i = 0; i < count.length; i++) {
            consumer.accept(helpful[i], total[i], count[i]);
        }
    }

    /** Σ count·H over the table. */
    public long helpfulVotes() {
        long s = 0;
        for (int i = 0; i < count.length; i++) {
            s += count[i] * helpful[i];
        }
        return s;
    }

    /** Σ count·T over the table. */
    public long totalVotes() {
        long s = 0;
        for (int i = 0; i < count.length; i++) {
            s += count[i] * total[i];
        }
        return s;
    }

    /**
     * Σ count·ln C(T, H): the binomial coefficients the beta-binomial log-likelihood leaves out
     * (they do not depend on α, β). Add it to {@link PriorFit#logLikelihood()} to compare with
     * published log-likelihoods that include them.
     */
    public double logBinomialCoefficients() {
        double s = 0;
        for (int i = 0; i < count.length; i++) {
            long t = total[i];
            long h = helpful[i];
            s += count[i] * (Gamma.logGamma(t + 1.0) - Gamma.logGamma(h + 1.0) - Gamma.logGamma(t - h + 1.0));
        }
        return s;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof VoteFrequencyTable v && Arrays.equals(v.helpful, helpful) && Arrays.equals(v.total, total)
                && Arrays.equals(v.count, count);
    }

    @Override
    public int hashCode() {
        return (Arrays.hashCode(helpful) * 31 + Arrays.hashCode(total)) * 31 + Arrays.hashCode(count);
    }

    @Override
    public String toString() {
        return "VoteFrequencyTable(" + distinctPairs() + " distinct (H, T) pairs, " + units + " units)";
    }

    private static int compare(long t1, long h1, long t2, long h2) {
        int c = Long.compare(t1, t2);
        return c != 0 ? c : Long.compare(h1, h2);
    }

    private static void check(long h, long t, long c, int i) {
        if (h < 0 || h > t) {
            throw new IllegalArgumentException("entry " + i + ": need 0 <= helpful <= total votes, got " + h + " of " + t);
        }
        if (c < 0) {
            throw new IllegalArgumentException("entry " + i + ": a count cannot be negative, got " + c);
        }
    }

    /** Open-addressing hash of (H, T) to a count, on primitives; T = 0 marks an empty slot. */
    private static final class PairCounter {
        private long[] h = new long[1 << 10];
        private long[] t = new long[1 << 10];
        private long[] c = new long[1 << 10];
        private int size;

        void add(long hv, long tv, long cv) {
            int mask = t.length - 1;
            int i = slot(hv, tv) & mask;
            while (t[i] != 0 && (t[i] != tv || h[i] != hv)) {
                i = (i + 1) & mask;
            }
            if (t[i] == 0) {
                h[i] = hv;
                t[i] = tv;
                size++;
            }
            c[i] = Math.addExact(c[i], cv);
            if (2 * size > t.length) {
                grow();
            }
        }

        private void grow() {
            long[] oh = h;
            long[] ot = t;
            long[] oc = c;
            h = new long[ot.length * 2];
            t = new long[ot.length * 2];
            c = new long[ot.length * 2];
            size = 0;
            for (int i = 0; i < ot.length; i++) {
                if (ot[i] != 0) {
                    add(oh[i], ot[i], oc[i]);
                }
            }
        }

        private static int slot(long hv, long tv) {
            long k = (tv * 0x9E3779B97F4A7C15L) ^ (hv + 0x632BE59BD9B4E019L);
            k ^= k >>> 31;
            k *= 0xBF58476D1CE4E5B9L;
            return (int) (k ^ (k >>> 29));
        }

        VoteFrequencyTable toTable() {
            if (size == 0) {
                return EMPTY;
            }
            long[] sh = new long[size];
            long[] st = new long[size];
            long[] sc = new long[size];
            int k = 0;
            for (int i = 0; i < t.length; i++) {
                if (t[i] != 0) {
                    sh[k] = h[i];
                    st[k] = t[i];
                    sc[k] = c[i];
                    k++;
                }
            }
            Integer[] order = new Integer[size];
            for (int i = 0; i < size; i++) {
                order[i] = i;
            }
            // Distinct pairs are few (thousands), so sorting their indices costs little.
            Arrays.sort(order, (a, b) -> compare(st[a], sh[a], st[b], sh[b]));
            long[] rh = new long[size];
            long[] rt = new long[size];
            long[] rc = new long[size];
            for (int i = 0; i < size; i++) {
                rh[i] = sh[order[i]];
                rt[i] = st[order[i]];
                rc[i] = sc[order[i]];
            }
            return new VoteFrequencyTable(rh, rt, rc);
        }
    }
}
