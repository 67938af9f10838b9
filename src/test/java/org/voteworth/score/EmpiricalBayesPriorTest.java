package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.random.Well19937c;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

class EmpiricalBayesPriorTest {

    /** Rat tumour experiments (Gelman et al., BDA3 Table 5.1), from reference-checks/rat_tumours.csv. */
    static long[][] rats(int first) {
        List<Map<String, String>> rows = ReferenceCsv.read("rat_tumours.csv");
        int n = Math.min(first, rows.size());
        long[] y = new long[n];
        long[] m = new long[n];
        for (int i = 0; i < n; i++) {
            y[i] = Long.parseLong(rows.get(i).get("tumours"));
            m[i] = Long.parseLong(rows.get(i).get("rats"));
        }
        return new long[][] {y, m};
    }

    /** Males among the first 12 children of 6,115 Saxony families, from reference-checks/saxony_males_of_12.csv. */
    static VoteFrequencyTable saxony() {
        List<Map<String, String>> rows = ReferenceCsv.read("saxony_males_of_12.csv");
        long[] h = new long[rows.size()];
        long[] t = new long[rows.size()];
        long[] c = new long[rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            h[i] = Long.parseLong(rows.get(i).get("males"));
            t[i] = 12;
            c[i] = Long.parseLong(rows.get(i).get("families"));
        }
        return VoteFrequencyTable.ofCounts(h, t, c);
    }

    static VoteFrequencyTable ratsTable(int first) {
        long[][] r = rats(first);
        return VoteFrequencyTable.of(r[0], r[1]);
    }

    @Test
    void everyPublishedBetaBinomialValue() {
        // reference-checks/beta_binomial_fits.csv: Gelman et al. BDA3 5.1, the BayesGOF vignette, the encyclopedia
        // article on the beta-binomial distribution, and independently computed values; sources and status per row.
        VoteFrequencyTable rats70 = ratsTable(70);
        VoteFrequencyTable sax = saxony();
        PriorFit ratsMl = EmpiricalBayesPrior.fit(rats70);
        PriorFit ratsMom = EmpiricalBayesPrior.methodOfMoments(rats70);
        PriorFit saxMl = EmpiricalBayesPrior.fit(sax);
        PriorFit saxMom = EmpiricalBayesPrior.methodOfMomentsBinomial(sax);
        long[][] all = rats(1000);
        BetaPrior posterior71 = ratsMom.prior().posterior(all[0][70], all[1][70]);
        List<Map<String, String>> rows = ReferenceCsv.read("beta_binomial_fits.csv");
        assertThat(rows).hasSize(29);
        for (Map<String, String> r : rows) {
            String key = r.get("dataset") + "/" + r.get("units") + "/" + r.get("method") + "/" + r.get("quantity");
            double actual = switch (key) {
                case "rats/all71/data/experiments" -> all[0].length;
                case "rats/all71/data/sum_tumours" -> sum(all[0]);
                case "rats/all71/data/sum_rats" -> sum(all[1]);
                case "rats/all71/data/last_tumours" -> all[0][70];
                case "rats/all71/data/last_rats" -> all[1][70];
                case "rats/first70/moments/mean_of_ratios" -> ratsMom.mu();
                case "rats/first70/moments/sd_of_ratios" -> sdOfRatios(rats70);
                case "rats/first70/moments/alpha" -> ratsMom.prior().alpha();
                case "rats/first70/moments/beta" -> ratsMom.prior().beta();
                case "rats/first70/posterior/alpha" -> posterior71.alpha();
                case "rats/first70/posterior/beta" -> posterior71.beta();
                case "rats/first70/posterior/mean" -> posterior71.mean();
                case "rats/first70/posterior/sd" -> posterior71.sd();
                case "rats/first70/ml/alpha" -> ratsMl.prior().alpha();
                case "rats/first70/ml/beta" -> ratsMl.prior().beta();
                case "rats/first70/ml/loglik_with_coefficients" -> ratsMl.logLikelihood() + rats70.logBinomialCoefficients();
                case "saxony/all/data/families" -> sax.units();
                case "saxony/all/moments-binomial/alpha" -> saxMom.prior().alpha();
                case "saxony/all/moments-binomial/beta" -> saxMom.prior().beta();
                case "saxony/all/ml/alpha" -> saxMl.prior().alpha();
                case "saxony/all/ml/beta" -> saxMl.prior().beta();
                case "saxony/all/ml/loglik_with_coefficients" -> saxMl.logLikelihood() + sax.logBinomialCoefficients();
                case "saxony/all/ml/mean" -> saxMl.mu();
                default -> throw new IllegalStateException(r.get("#line") + ": no computation for " + key);
            };
            ReferenceCsv.check(r, "value", actual);
        }
        assertThat(ratsMl.method()).isEqualTo(PriorFit.Method.MAXIMUM_LIKELIHOOD);
        assertThat(ratsMl.converged()).isTrue();
        assertThat(ratsMl.warnings()).isEmpty();
        assertThat(ratsMl.unitsUsed()).isEqualTo(70);
        assertThat(saxMl.method()).isEqualTo(PriorFit.Method.MAXIMUM_LIKELIHOOD);
        assertThat(saxMl.unitsUsed()).isEqualTo(6115);
        assertThat(saxMl.distinctPairs()).isEqualTo(13);
        assertThat(ratsMom.method()).isEqualTo(PriorFit.Method.METHOD_OF_MOMENTS);
    }

    @Test
    void theMaximumIsAMaximum() {
        // The fitted point beats its neighbours in every direction (a fact of any interior maximum).
        for (VoteFrequencyTable t : List.of(ratsTable(70), saxony())) {
            PriorFit f = EmpiricalBayesPrior.fit(t);
            double best = EmpiricalBayesPrior.logLikelihood(t, f.prior());
            assertThat(best).isEqualTo(f.logLikelihood());
            for (double da : new double[] {-1e-3, 0, 1e-3}) {
                for (double db : new double[] {-1e-3, 0, 1e-3}) {
                    BetaPrior p = new BetaPrior(f.prior().alpha() * (1 + da), f.prior().beta() * (1 + db));
                    assertThat(EmpiricalBayesPrior.logLikelihood(t, p)).isLessThanOrEqualTo(best + 1e-9);
                }
            }
        }
    }

    @Test
    void logLikelihoodAgainstGammaFunctions() {
        // ln B(a, b) = lnΓ(a) + lnΓ(b) − lnΓ(a + b) (Commons Math Gamma.logGamma as the reference).
        VoteFrequencyTable t = ratsTable(70);
        double a = 2.3;
        double b = 14.1;
        double expected = 0;
        for (int i = 0; i < t.distinctPairs(); i++) {
            long h = t.helpful(i);
            long n = t.total(i);
            expected += t.count(i) * (Gamma.logGamma(h + a) + Gamma.logGamma(n - h + b) - Gamma.logGamma(n + a + b)
                    - Gamma.logGamma(a) - Gamma.logGamma(b) + Gamma.logGamma(a + b));
        }
        assertThat(EmpiricalBayesPrior.logLikelihood(t, new BetaPrior(a, b))).isCloseTo(expected, within(1e-9));
    }

    @Test
    void noOverDispersionFallsBackToMomentsWithAWarning() {
        // Shares spread less than binomial noise would spread them: the likelihood rises without end as κ grows.
        VoteFrequencyTable t = VoteFrequencyTable.ofCounts(new long[] {4, 5, 6}, new long[] {10, 10, 10},
                new long[] {30, 40, 30});
        PriorFit f = EmpiricalBayesPrior.fit(t);
        assertThat(f.method()).isEqualTo(PriorFit.Method.METHOD_OF_MOMENTS);
        assertThat(f.converged()).isFalse();
        assertThat(f.warnings()).anySatisfy(w -> assertThat(w).contains("no over-dispersion").contains("infinity"));
        assertThat(f.prior()).isEqualTo(EmpiricalBayesPrior.methodOfMoments(t).prior());
        assertThat(f.mu()).isCloseTo(0.5, within(1e-12));
    }

    @Test
    void edgeTablesStillGiveAUsablePrior() {
        PriorFit allHelpful = EmpiricalBayesPrior.fit(VoteFrequencyTable.of(new long[] {3, 5, 1}, new long[] {3, 5, 1}));
        assertThat(allHelpful.method()).isEqualTo(PriorFit.Method.METHOD_OF_MOMENTS);
        assertThat(allHelpful.warnings()).anySatisfy(w -> assertThat(w).contains("every vote"));
        assertThat(allHelpful.mu()).isBetween(0.9, 1.0);

        PriorFit one = EmpiricalBayesPrior.methodOfMoments(VoteFrequencyTable.of(new long[] {3}, new long[] {7}));
        assertThat(one.warnings()).anySatisfy(w -> assertThat(w).contains("single unit"));
        assertThat(one.kappa()).isEqualTo(EmpiricalBayesPrior.KAPPA_LIMIT, within(1e-6));

        // One vote each: shares are only 0 or 1, as spread as shares can be.
        PriorFit ones = EmpiricalBayesPrior.methodOfMoments(VoteFrequencyTable.of(new long[] {0, 1, 1}, new long[] {1, 1, 1}));
        assertThat(ones.kappa()).isEqualTo(EmpiricalBayesPrior.KAPPA_FLOOR, within(1e-12));

        // Beta-binomial with one trial is a Bernoulli(μ): κ is not identified, so the fit must not pretend to estimate it.
        PriorFit single = EmpiricalBayesPrior.fit(VoteFrequencyTable.of(new long[] {0, 1, 1, 0, 1}, new long[] {1, 1, 1, 1, 1}));
        assertThat(single.method()).isEqualTo(PriorFit.Method.METHOD_OF_MOMENTS);
        assertThat(single.warnings()).anySatisfy(w -> assertThat(w).contains("single vote"));
        assertThat(single.mu()).isCloseTo(0.6, within(1e-12));

        // All-or-nothing shares: the likelihood rises as κ falls to 0, no interior maximum.
        PriorFit split = EmpiricalBayesPrior.fit(VoteFrequencyTable.of(new long[] {0, 1, 1, 0, 1, 2, 0},
                new long[] {1, 1, 1, 1, 1, 2, 2}));
        assertThat(split.method()).isEqualTo(PriorFit.Method.METHOD_OF_MOMENTS);
        assertThat(split.converged()).isFalse();
        assertThat(split.warnings()).anySatisfy(w -> assertThat(w).contains("falls to 0"));

        assertThatThrownBy(() -> EmpiricalBayesPrior.fit(VoteFrequencyTable.empty()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("floor");
    }

    @Test
    @Timeout(value = 20, unit = TimeUnit.SECONDS)
    void aLargeSeededTableRecoversItsPrior() {
        // A few thousand distinct pairs drawn (seeded) from a known Beta(3, 7) and binomial T up to ~3,000 votes:
        // the fit lands near the truth (sampling error only) and beats the noise-blind moments.
        Well19937c rng = new Well19937c(314159);
        BetaDistribution truth = new BetaDistribution(rng, 3, 7);
        int n = 40_000;
        long[] h = new long[n];
        long[] t = new long[n];
        Random sizes = new Random(2718);
        for (int i = 0; i < n; i++) {
            t[i] = 1 + (long) Math.floor(Math.exp(sizes.nextDouble() * Math.log(3000)));
            h[i] = new BinomialDistribution(rng, (int) t[i], truth.sample()).sample();
        }
        VoteFrequencyTable table = VoteFrequencyTable.of(h, t);
        assertThat(table.distinctPairs()).isBetween(3_000, 40_000);
        long start = System.nanoTime();
        PriorFit f = EmpiricalBayesPrior.fit(table);
        long millis = (System.nanoTime() - start) / 1_000_000;
        System.out.println("fit of " + table.distinctPairs() + " distinct pairs took " + millis + " ms");
        assertThat(f.method()).isEqualTo(PriorFit.Method.MAXIMUM_LIKELIHOOD);
        assertThat(f.mu()).isCloseTo(0.3, within(0.01));
        assertThat(f.kappa()).isCloseTo(10, within(1.0));
    }

    private static double sdOfRatios(VoteFrequencyTable t) {
        double m = 0;
        for (int i = 0; i < t.distinctPairs(); i++) {
            m += t.count(i) * (double) t.helpful(i) / t.total(i);
        }
        m /= t.units();
        double ss = 0;
        for (int i = 0; i < t.distinctPairs(); i++) {
            double d = (double) t.helpful(i) / t.total(i) - m;
            ss += t.count(i) * d * d;
        }
        return Math.sqrt(ss / (t.units() - 1));
    }

    private static long sum(long[] a) {
        long s = 0;
        for (long v : a) {
            s += v;
        }
        return s;
    }
}
