package org.voteworth.demo;

import java.util.SplittableRandom;

/**
 * Exact Binomial(n, p) variates: helpful votes of a review with n votes and helpful chance p.
 *
 * <p>Small n: n Bernoulli trials. Larger n: the waiting-time method (Devroye 1986,
 * Non-Uniform Random Variate Generation, Springer, on the binomial distribution): with
 * q = min(p, 1 − p), add geometric gaps G = ⌊ln U / ln(1 − q)⌋ + 1 until their sum passes n; the
 * number of gaps that fit is Binomial(n, q), and n minus it is Binomial(n, 1 − q). Expected cost
 * n·q + 1 steps, so the rare reviews with thousands of votes stay cheap.
 */
final class WaitingTimeBinomial {
    private static final int DIRECT_TRIALS = 24;

    private WaitingTimeBinomial() {
    }

    static long draw(SplittableRandom rng, long n, double p) {
        if (n < 0 || !(p >= 0 && p <= 1)) {
            throw new IllegalArgumentException("binomial needs n >= 0 and 0 <= p <= 1, was n=" + n + " p=" + p);
        }
        if (n <= DIRECT_TRIALS) {
            long x = 0;
            for (long i = 0; i < n; i++) {
                if (rng.nextDouble() < p) {
                    x++;
                }
            }
            return x;
        }
        boolean flip = p > 0.5;
        double q = flip ? 1 - p : p;
        if (q == 0) {
            return flip ? n : 0;
        }
        double logNot = StrictMath.log1p(-q);
        long x = 0;
        long sum = 0;
        while (true) {
            double u = 1.0 - rng.nextDouble(); // (0, 1]
            long gap = (long) (StrictMath.log(u) / logNot) + 1;
            sum += gap;
            if (sum > n || sum < 0) {
                break;
            }
            x++;
        }
        return flip ? n - x : x;
    }
}
