package org.voteworth.analysis;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.stream.IntStream;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.Evidence;
import org.voteworth.score.Ranking;
import org.voteworth.tally.TallyTable;
import org.voteworth.score.MarsagliaTsangGamma;

/**
 * How sure each rank is: seeded Monte Carlo over each ranked unit's true share, drawn from the
 * rule's {@link ShareModel} (the posterior under the rule's prior, or under the population prior
 * fitted to the table for rules without one), ranking the draws and counting P(in top k) and
 * rank intervals.
 *
 * <p>Pruning (METHODS.md, "Uncertainty of a rank"): a unit whose 0.999-quantile lies below the
 * k-th largest 0.001-quantile cannot enter the top k in practice and is not drawn; quantiles are
 * computed once per distinct (x, n) pair, so millions of units cost a few thousand inverse CDFs.
 * How many were pruned, and the expected number of them that would pass that threshold in one
 * draw (Σ P(θ &gt; threshold), exact from the Beta CDF), are reported.
 *
 * <p>Determinism: draw d uses its own {@link SplittableRandom} seeded from (seed, d) and draws
 * the kept units in reviewer-id order, so the numbers do not depend on the thread count or on
 * the order the table was read in. Within a draw, equal shares share the better rank.
 */
public final class RankUncertainty {
    /** The default number of draws (METHODS.md). */
    public static final int DEFAULT_DRAWS = 2_000;
    /** Tail probability of the quantiles the pruning compares (METHODS.md). */
    static final double PRUNE_TAIL = 0.001;
    /** Upper limit on draws × kept units: the rank matrix holds one int each. */
    static final long MAX_CELLS = 60_000_000L;

    private RankUncertainty() {
    }

    /**
     * What to compute.
     *
     * @param k the top k of P(in top k)
     * @param draws Monte Carlo draws
     * @param seed random seed
     * @param threads worker threads (results do not depend on it)
     * @param lowQuantile lower end of the rank interval, e.g. 0.05
     * @param highQuantile upper end, e.g. 0.95
     */
    public record Settings(int k, int draws, long seed, int threads, double lowQuantile, double highQuantile) {
        public Settings {
            if (k < 1) {
                throw new IllegalArgumentException("the k of P(in top k) must be at least 1, got " + k);
            }
            if (draws < 10) {
                throw new IllegalArgumentException("rank uncertainty needs at least 10 draws (default " + DEFAULT_DRAWS
                        + "), got " + draws);
            }
            if (threads < 1) {
                throw new IllegalArgumentException("threads must be at least 1, got " + threads);
            }
            if (!(lowQuantile > 0 && lowQuantile < highQuantile && highQuantile < 1)) {
                throw new IllegalArgumentException("the rank interval needs 0 < low < high < 1, got " + lowQuantile + ", "
                        + highQuantile);
            }
        }

        /** 2,000 draws, 5 %-95 % rank intervals, all available processors. */
        public static Settings defaults(int k, long seed) {
            return new Settings(k, DEFAULT_DRAWS, seed, Runtime.getRuntime().availableProcessors(), 0.05, 0.95);
        }

        public Settings withDraws(int n) {
            return new Settings(k, n, seed, threads, lowQuantile, highQuantile);
        }

        public Settings withThreads(int n) {
            return new Settings(k, draws, seed, n, lowQuantile, highQuantile);
        }
    }

    /**
     * One unit's rank spread.
     *
     * @param slot table slot
     * @param probabilityTopK P(in top k), 0 for a pruned unit
     * @param standardError Monte Carlo standard error sqrt(P(1 − P)/draws)
     * @param rankLow rank at the low quantile (0 for a pruned unit)
     * @param rankMedian median rank (0 for a pruned unit)
     * @param rankHigh rank at the high quantile (0 for a pruned unit); ranks are among the kept
     *     units, so deep ranks are lower bounds
     * @param pruned whether the unit was pruned rather than drawn
     */
    public record Spread(int slot, double probabilityTopK, double standardError, int rankLow, int rankMedian, int rankHigh,
                         boolean pruned) {
    }

    /**
     * The result.
     *
     * @param rule the rule's name
     * @param model the share model drawn from
     * @param settings what was computed
     * @param ranked units the ranking ranked
     * @param kept units drawn
     * @param pruned units pruned
     * @param threshold the k-th largest 0.001-quantile (NaN without pruning)
     * @param prunedExpectedEntrants Σ over pruned units of P(θ &gt; threshold)
     * @param bySlot spreads of ranked units by table slot
     */
    public record Result(String rule, ShareModel model, Settings settings, int ranked, int kept, int pruned, double threshold,
                         double prunedExpectedEntrants, Map<Integer, Spread> bySlot) {
        public Result {
            bySlot = Map.copyOf(bySlot);
        }

        /** The spread of a ranked slot; a pruned (or unranked) slot reads as P = 0. */
        public Spread of(int slot) {
            Spread s = bySlot.get(slot);
            return s != null ? s : new Spread(slot, 0, 0, 0, 0, 0, true);
        }

        /** The largest Monte Carlo standard error of any P(in top k): the error bound to quote. */
        public double maxStandardError() {
            return bySlot.values().stream().mapToDouble(Spread::standardError).max().orElse(0);
        }
    }

    /** The spread of every unit {@code ranking} ranks, drawing from the rule's model given the population prior. */
    public static Result of(Ranking ranking, BetaPrior population, Settings s) {
        return of(ranking, ShareModel.forRule(ranking.rule(), population), s);
    }

    /** The spread of every unit {@code ranking} ranks, drawing from {@code model}. */
    public static Result of(Ranking ranking, ShareModel model, Settings s) {
        TallyTable table = ranking.table();
        int m = ranking.size();
        long[] x = new long[m];
        long[] n = new long[m];
        for (int r = 1; r <= m; r++) {
            Evidence e = Evidence.of(table, ranking.slotAt(r));
            x[r - 1] = model.successes(e);
            n[r - 1] = model.trials(e);
        }
        // Pruning, per distinct (x, n) pair.
        boolean[] keep = new boolean[m];
        Arrays.fill(keep, true);
        double threshold = Double.NaN;
        double expectedEntrants = 0;
        int pruned = 0;
        if (m > s.k()) {
            Map<Pair, double[]> q = new HashMap<>();
            double[] lows = new double[m];
            double[] highs = new double[m];
            for (int i = 0; i < m; i++) {
                final long xi = x[i];
                final long ni = n[i];
                double[] lh = q.computeIfAbsent(key(xi, ni), kk -> quantiles(model, xi, ni));
                lows[i] = lh[0];
                highs[i] = lh[1];
            }
            double[] sorted = lows.clone();
            Arrays.sort(sorted);
            threshold = sorted[m - s.k()];
            Map<Pair, Double> tail = new HashMap<>();
            for (int i = 0; i < m; i++) {
                if (highs[i] < threshold) {
                    keep[i] = false;
                    pruned++;
                    final long xi = x[i];
                    final long ni = n[i];
                    final double t = threshold;
                    expectedEntrants += tail.computeIfAbsent(key(xi, ni), kk -> 1 - distribution(model, xi, ni).cumulativeProbability(t));
                }
            }
        }
        // Kept units in id order, so draws do not depend on input order.
        int kept = m - pruned;
        Integer[] order = new Integer[kept];
        String[] ids = new String[kept];
        int j = 0;
        for (int i = 0; i < m; i++) {
            if (keep[i]) {
                order[j] = i;
                ids[j] = table.id(ranking.slotAt(i + 1));
                j++;
            }
        }
        Integer[] byId = new Integer[kept];
        for (int i = 0; i < kept; i++) {
            byId[i] = i;
        }
        Arrays.sort(byId, (p, r) -> ids[p].compareTo(ids[r]));
        int[] unit = new int[kept];   // index into x/n (rank − 1) of the i-th kept unit in id order
        double[] a = new double[kept];
        double[] b = new double[kept];
        for (int i = 0; i < kept; i++) {
            unit[i] = order[byId[i]];
            a[i] = model.alpha() + x[unit[i]];
            b[i] = model.beta() + (n[unit[i]] - x[unit[i]]);
        }
        if ((long) kept * s.draws() > MAX_CELLS) {
            throw new IllegalArgumentException("rank uncertainty would hold " + kept + " units x " + s.draws()
                    + " draws; lower the draws or the k of P(in top k) (now " + s.k() + ") so that fewer units survive pruning");
        }
        int[][] ranks = new int[s.draws()][];
        ForkJoinPool pool = new ForkJoinPool(s.threads());
        try {
            pool.submit(() -> IntStream.range(0, s.draws()).parallel().forEach(d -> ranks[d] = oneDraw(s.seed(), d, a, b)))
                    .get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("rank uncertainty was interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("rank uncertainty failed: " + e.getCause(), e.getCause());
        } finally {
            pool.shutdown();
        }
        Map<Integer, Spread> out = new HashMap<>();
        int[] column = new int[s.draws()];
        for (int i = 0; i < kept; i++) {
            int top = 0;
            for (int d = 0; d < s.draws(); d++) {
                column[d] = ranks[d][i];
                if (column[d] <= s.k()) {
                    top++;
                }
            }
            Arrays.sort(column);
            double p = (double) top / s.draws();
            int slot = ranking.slotAt(unit[i] + 1);
            out.put(slot, new Spread(slot, p, Math.sqrt(p * (1 - p) / s.draws()), nearestRank(column, s.lowQuantile()),
                    nearestRank(column, 0.5), nearestRank(column, s.highQuantile()), false));
        }
        for (int i = 0; i < m; i++) {
            if (!keep[i]) {
                int slot = ranking.slotAt(i + 1);
                out.put(slot, new Spread(slot, 0, 0, 0, 0, 0, true));
            }
        }
        return new Result(ranking.rule().name(), model, s, m, kept, pruned, threshold, expectedEntrants, out);
    }

    /** Ranks (1 = best) of every unit in one draw; equal draws share the better rank. */
    static int[] oneDraw(long seed, int d, double[] a, double[] b) {
        SplittableRandom rng = new SplittableRandom(mix(seed, d));
        int k = a.length;
        long[] bits = new long[k];
        for (int i = 0; i < k; i++) {
            // Non-negative doubles order like their bit patterns.
            bits[i] = Double.doubleToLongBits(MarsagliaTsangGamma.beta(rng, a[i], b[i]) + 0.0);
        }
        long[] sorted = bits.clone();
        Arrays.sort(sorted);
        int[] rank = new int[k];
        for (int i = 0; i < k; i++) {
            rank[i] = k - lastIndexOf(sorted, bits[i]);
        }
        return rank;
    }

    private static int lastIndexOf(long[] sorted, long v) {
        int lo = 0;
        int hi = sorted.length; // first index with sorted[i] > v
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] <= v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo - 1;
    }

    /** The ceil(q·N)-th smallest of N sorted values (the nearest-rank quantile). */
    static int nearestRank(int[] sorted, double q) {
        int i = (int) Math.ceil(q * sorted.length) - 1;
        return sorted[Math.max(0, Math.min(sorted.length - 1, i))];
    }

    /** A stream seed per draw: SplitMix64's finaliser over seed and draw index (Steele et al. 2014). */
    static long mix(long seed, long d) {
        long z = seed + 0x9E3779B97F4A7C15L * (d + 1);
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    private record Pair(long x, long n) {
    }

    private static Pair key(long x, long n) {
        return new Pair(x, n);
    }

    private static double[] quantiles(ShareModel model, long x, long n) {
        BetaDistribution d = distribution(model, x, n);
        return new double[] {d.inverseCumulativeProbability(PRUNE_TAIL), d.inverseCumulativeProbability(1 - PRUNE_TAIL)};
    }

    private static BetaDistribution distribution(ShareModel model, long x, long n) {
        return new BetaDistribution(null, model.alpha() + x, model.beta() + (n - x), 1e-10);
    }
}
