package org.voteworth.score;

import org.apache.commons.math3.distribution.NormalDistribution;

/**
 * The Wilson score interval for a binomial proportion, plain and continuity-corrected.
 *
 * <p>With p = x/n and z the two-sided normal quantile for the confidence (z = 1.959964 at 95 %),
 * Wilson (1927), J. Amer. Statist. Assoc. 22:209-212, gives
 * <pre>
 *   (p + z²/2n ± z·sqrt(p(1−p)/n + z²/4n²)) / (1 + z²/n)
 * </pre>
 * computed here in the equivalent form (2x + z² ± z·sqrt(z² + 4x(n−x)/n)) / (2(n + z²)).
 * The continuity-corrected limits are method 4 of Newcombe RG (1998), "Two-sided confidence
 * intervals for the single proportion: comparison of seven methods", Statistics in Medicine
 * 17:857-872, with q = 1 − p:
 * <pre>
 *   L = (2np + z² − 1 − z·sqrt(z² − 2 − 1/n + 4p(nq + 1))) / (2(n + z²)),  L = 0 when x = 0
 *   U = (2np + z² + 1 + z·sqrt(z² + 2 − 1/n + 4p(nq − 1))) / (2(n + z²)),  U = 1 when x = n
 * </pre>
 * Both return the whole range [0, 1] when n = 0: no trials, no information. Limits are clamped
 * to [0, 1], so x = 0 gives a lower limit of exactly 0 and x = n an upper limit of exactly 1
 * (Commons Math's {@code WilsonScoreInterval} leaves rounding residues such as 1e-17 there).
 */
public final class WilsonScore {
    // No random generator: only the quantile function is used.
    private static final NormalDistribution STANDARD_NORMAL = new NormalDistribution(null, 0, 1);

    private WilsonScore() {
    }

    /**
     * The two-sided standard normal quantile for a confidence c: Φ⁻¹(1 − (1 − c)/2), so
     * 0.95 gives 1.959964 (NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.1).
     */
    public static double z(double confidence) {
        Percent.checkOpenUnit("confidence", confidence);
        return STANDARD_NORMAL.inverseCumulativeProbability(1 - (1 - confidence) / 2);
    }

    /** The Wilson score interval of x successes in n trials; [0, 1] when n = 0. */
    public static Interval interval(long x, long n, double confidence) {
        return interval(x, n, z(confidence), confidence);
    }

    /** Newcombe's (1998) method 4, the continuity-corrected Wilson interval; [0, 1] when n = 0. */
    public static Interval continuityCorrected(long x, long n, double confidence) {
        return continuityCorrected(x, n, z(confidence), confidence);
    }

    static Interval interval(long x, long n, double z, double confidence) {
        check(x, n);
        if (n == 0) {
            return new Interval(0, 1, confidence);
        }
        return new Interval(lower(x, n, z), upper(x, n, z), confidence);
    }

    /** The Wilson lower limit for a z already computed (the rules call this once per reviewer). */
    static double lower(long x, long n, double z) {
        if (x == 0 || n == 0) {
            return 0;
        }
        double z2 = z * z;
        double root = z * Math.sqrt(z2 + 4.0 * x * (n - x) / n);
        return clamp((2.0 * x + z2 - root) / (2 * (n + z2)));
    }

    static double upper(long x, long n, double z) {
        if (x == n) {
            return 1;
        }
        double z2 = z * z;
        double root = z * Math.sqrt(z2 + 4.0 * x * (n - x) / n);
        return clamp((2.0 * x + z2 + root) / (2 * (n + z2)));
    }

    static Interval continuityCorrected(long x, long n, double z, double confidence) {
        check(x, n);
        if (n == 0) {
            return new Interval(0, 1, confidence);
        }
        return new Interval(correctedLower(x, n, z), correctedUpper(x, n, z), confidence);
    }

    static double correctedLower(long x, long n, double z) {
        if (x == 0 || n == 0) {
            return 0;
        }
        double p = (double) x / n;
        double q = 1 - p;
        double z2 = z * z;
        double root = z * Math.sqrt(Math.max(0, z2 - 2 - 1.0 / n + 4 * p * (n * q + 1)));
        return clamp((2 * n * p + z2 - 1 - root) / (2 * (n + z2)));
    }

    static double correctedUpper(long x, long n, double z) {
        if (x == n) {
            return 1;
        }
        double p = (double) x / n;
        double q = 1 - p;
        double z2 = z * z;
        double root = z * Math.sqrt(Math.max(0, z2 + 2 - 1.0 / n + 4 * p * (n * q - 1)));
        return clamp((2 * n * p + z2 + 1 + root) / (2 * (n + z2)));
    }

    static void check(long x, long n) {
        if (n < 0 || x < 0 || x > n) {
            throw new IllegalArgumentException("need 0 <= successes <= trials, got " + x + " of " + n);
        }
    }

    private static double clamp(double v) {
        return Math.min(1, Math.max(0, v));
    }
}
