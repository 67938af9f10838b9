package org.voteworth.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.apache.commons.math3.analysis.integration.RombergIntegrator;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.junit.jupiter.api.Test;
import org.voteworth.score.BayesianAverage;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.EntryBar;
import org.voteworth.score.RawShare;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.tally.TallyTable;

/**
 * P(in top k) against exact values by numerical integration (Commons Math Romberg integration
 * over the Beta densities of Commons Math), the same numbers whatever the thread count, and the
 * pruning of METHODS.md on a large table.
 */
class RankUncertaintyTest {
    /** Beta(1, 1): the population prior under which the draws are the textbook Beta(1 + H, 1 + T - H). */
    private static final BetaPrior UNIFORM = new BetaPrior(1, 1);

    private static TallyTable table(long[][] votes) {
        TallyTable t = new TallyTable();
        for (int i = 0; i < votes.length; i++) {
            t.add(String.format("r%06d", i), votes[i][0], votes[i][1], 5, true, false, "Books", 0);
        }
        return t;
    }

    @Test
    void topOneOfTwoMatchesTheIntegralOfOneDensityAgainstTheOtherCdf() {
        // Raw share under a uniform population prior draws Beta(1 + H, 1 + T - H): A ~ Beta(9, 3), B ~ Beta(7, 5).
        Ranking r = Ranker.rank(table(new long[][] {{8, 10}, {6, 10}}), new RawShare(), EntryBar.NONE);
        RankUncertainty.Result u = RankUncertainty.of(r, UNIFORM, new RankUncertainty.Settings(1, 40_000, 7, 2, 0.05, 0.95));
        BetaDistribution a = new BetaDistribution(9, 3);
        BetaDistribution b = new BetaDistribution(7, 5);
        double exact = new RombergIntegrator(1e-10, 1e-12, 5, 20).integrate(1_000_000,
                x -> a.density(x) * b.cumulativeProbability(x), 0, 1);
        RankUncertainty.Spread s = u.of(r.table().find("r000000"));
        assertThat(s.standardError()).isCloseTo(Math.sqrt(exact * (1 - exact) / 40_000), within(1e-3));
        assertThat(s.probabilityTopK()).isCloseTo(exact, within(4 * s.standardError()));
        // Computed check of the integration itself: P(X > Y) by Legendre-Gauss quadrature agrees.
        assertThat(BetaComparison.probabilityGreater(new BetaPrior(9, 3), new BetaPrior(7, 5))).isCloseTo(exact, within(1e-8));
    }

    @Test
    void topTwoOfThreeUnderAPriorMatchesOneMinusTheChanceOfBeingLast() {
        BetaPrior prior = new BetaPrior(2, 1.5);
        Ranking r = Ranker.rank(table(new long[][] {{3, 5}, {10, 12}, {1, 1}}), new BayesianAverage(prior), EntryBar.NONE);
        RankUncertainty.Result u = RankUncertainty.of(r, UNIFORM, new RankUncertainty.Settings(2, 40_000, 11, 3, 0.05, 0.95));
        BetaDistribution a = new BetaDistribution(5, 3.5);
        BetaDistribution b = new BetaDistribution(12, 3.5);
        BetaDistribution c = new BetaDistribution(3, 1.5);
        double last = new RombergIntegrator(1e-10, 1e-12, 5, 20).integrate(1_000_000,
                x -> a.density(x) * (1 - b.cumulativeProbability(x)) * (1 - c.cumulativeProbability(x)), 0, 1);
        RankUncertainty.Spread s = u.of(r.table().find("r000000"));
        assertThat(s.probabilityTopK()).isCloseTo(1 - last, within(4 * s.standardError() + 1e-9));
        // The three P(in top 2) add up to 2 in every draw.
        double sum = 0;
        for (int i = 0; i < 3; i++) {
            sum += u.of(r.table().find(String.format("r%06d", i))).probabilityTopK();
        }
        assertThat(sum).isCloseTo(2.0, within(1e-12));
    }

    @Test
    void betaComparisonMatchesTheClosedFormForBetaAOne() {
        // By hand: X ~ Beta(a, 1), Y ~ Beta(c, 1): P(X > Y) = ∫ a x^(a-1) x^c dx = a / (a + c).
        assertThat(BetaComparison.probabilityGreater(new BetaPrior(3, 1), new BetaPrior(2, 1))).isCloseTo(0.6, within(1e-9));
        assertThat(BetaComparison.probabilityGreater(new BetaPrior(1, 1), new BetaPrior(1, 1))).isCloseTo(0.5, within(1e-9));
    }

    @Test
    void betaComparisonConvergesWhenTheDensityIsSteepAtAnEnd() {
        // By hand: Y ~ Beta(c, 1) has F_Y(y) = y^c, so P(X > Y) = E[X^c] = B(a + c, b) / B(a, b) for X ~ Beta(a, b).
        // b < 2 is a reviewer with every vote helpful under a prior with beta < 2 (the demo data's prior has 1.46).
        double[][] cases = {{53.095, 1.458, 900}, {5, 0.6, 40}, {1.3, 9, 0.5}, {0.7, 0.8, 3}};
        for (double[] k : cases) {
            double exact = Math.exp(org.apache.commons.math3.special.Beta.logBeta(k[0] + k[2], k[1])
                    - org.apache.commons.math3.special.Beta.logBeta(k[0], k[1]));
            assertThat(BetaComparison.probabilityGreater(new BetaPrior(k[0], k[1]), new BetaPrior(k[2], 1)))
                    .as("Beta(%s, %s) > Beta(%s, 1)", k[0], k[1], k[2]).isCloseTo(exact, within(1e-8));
        }
    }

    @Test
    void theSameSeedGivesTheSameNumbersWhateverTheThreadCount() {
        SplittableRandom rng = new SplittableRandom(3);
        long[][] v = new long[300][];
        for (int i = 0; i < v.length; i++) {
            long t = 1 + rng.nextInt(200);
            v[i] = new long[] {(long) (t * (0.6 + 0.4 * rng.nextDouble())), t};
        }
        Ranking r = Ranker.rank(table(v), new RawShare(), EntryBar.NONE);
        RankUncertainty.Settings s = new RankUncertainty.Settings(10, 500, 99, 1, 0.05, 0.95);
        RankUncertainty.Result one = RankUncertainty.of(r, UNIFORM, s);
        RankUncertainty.Result four = RankUncertainty.of(r, UNIFORM, s.withThreads(4));
        assertThat(four.bySlot()).isEqualTo(one.bySlot());
        assertThat(RankUncertainty.of(r, UNIFORM, new RankUncertainty.Settings(10, 500, 100, 1, 0.05, 0.95)).bySlot())
                .isNotEqualTo(one.bySlot());
    }

    @Test
    void pruningKeepsALargeTableCheap() {
        SplittableRandom rng = new SplittableRandom(5);
        long[][] v = new long[200_000][];
        for (int i = 0; i < v.length; i++) {
            long t = 1 + rng.nextInt(300);
            // Invented crowd with shares of 30 % to 90 %, and twenty clear leaders.
            v[i] = i < 20 ? new long[] {990 + rng.nextInt(10), 1000} : new long[] {Math.round(t * (0.3 + 0.6 * rng.nextDouble())), t};
        }
        Ranking r = Ranker.rank(table(v), new RawShare(), EntryBar.NONE);
        RankUncertainty.Result u = RankUncertainty.of(r, UNIFORM, RankUncertainty.Settings.defaults(10, 1));
        assertThat(u.pruned()).isGreaterThan(190_000);
        assertThat(u.kept() + u.pruned()).isEqualTo(u.ranked());
        assertThat(u.prunedExpectedEntrants()).isLessThan(u.pruned() * RankUncertainty.PRUNE_TAIL);
        // P(in top k) over all units sums to k in each draw (pruned units contribute 0).
        double sum = u.bySlot().values().stream().mapToDouble(RankUncertainty.Spread::probabilityTopK).sum();
        assertThat(sum).isCloseTo(10, within(1e-9));
    }
}
