package org.voteworth.score;

/**
 * The Clopper-Pearson "exact" interval for a binomial proportion: the limits that make each tail
 * of the binomial distribution hold (1 − c)/2, written with Beta quantiles (Clopper CJ &amp;
 * Pearson ES (1934), Biometrika 26:404-413; Beta form as in Newcombe (1998), method 5):
 * <pre>
 *   L = B⁻¹((1 − c)/2; x, n − x + 1),  L = 0 when x = 0
 *   U = B⁻¹(1 − (1 − c)/2; x + 1, n − x),  U = 1 when x = n
 * </pre>
 * Beta quantiles come from Commons Math {@code BetaDistribution} solved to 1e-14. Returns
 * [0, 1] when n = 0. (Commons Math's own {@code ClopperPearsonInterval} goes through the F
 * distribution and fails with zero degrees of freedom at x = 0 and x = n.)
 */
public final class ClopperPearson {
    private ClopperPearson() {
    }

    public static Interval interval(long x, long n, double confidence) {
        Percent.checkOpenUnit("confidence", confidence);
        WilsonScore.check(x, n);
        if (n == 0) {
            return new Interval(0, 1, confidence);
        }
        double tail = (1 - confidence) / 2;
        double lower = x == 0 ? 0 : BetaQuantile.of(x, n - x + 1, tail);
        double upper = x == n ? 1 : BetaQuantile.of(x + 1, n - x, 1 - tail);
        return new Interval(lower, upper, confidence);
    }
}
