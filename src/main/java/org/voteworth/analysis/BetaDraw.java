package org.voteworth.analysis;

import java.util.SplittableRandom;

/**
 * Beta(a, b) variates as X / (X + Y) with X ~ Gamma(a), Y ~ Gamma(b) (Devroye 1986,
 * Non-Uniform Random Variate Generation, IX.3), each gamma by Marsaglia &amp; Tsang (2000), ACM TOMS
 * 26(3):363-372, with the boost Gamma(a) = Gamma(a + 1)·U^(1/a) for a &lt; 1. Primitive and
 * allocation-free, because rank uncertainty draws millions of them.
 */
final class BetaDraw {
    private BetaDraw() {
    }

    static double beta(SplittableRandom rng, double a, double b) {
        double x = gamma(rng, a);
        double y = gamma(rng, b);
        double s = x + y;
        // Both gammas underflow only for tiny shapes; the mean is the honest answer then.
        return s > 0 ? x / s : a / (a + b);
    }

    static double gamma(SplittableRandom rng, double shape) {
        if (shape < 1) {
            double u = 1.0 - rng.nextDouble(); // (0, 1]: keeps the power finite
            return gamma(rng, shape + 1) * StrictMath.pow(u, 1.0 / shape);
        }
        double d = shape - 1.0 / 3.0;
        double c = 1.0 / StrictMath.sqrt(9.0 * d);
        while (true) {
            double x = normal(rng);
            double v = 1.0 + c * x;
            if (v <= 0) {
                continue;
            }
            v = v * v * v;
            double u = rng.nextDouble();
            if (u < 1.0 - 0.0331 * x * x * x * x) {
                return d * v;
            }
            if (u > 0 && StrictMath.log(u) < 0.5 * x * x + d * (1.0 - v + StrictMath.log(v))) {
                return d * v;
            }
        }
    }

    /** A standard normal by the Marsaglia polar method. */
    private static double normal(SplittableRandom rng) {
        while (true) {
            double u = 2 * rng.nextDouble() - 1;
            double v = 2 * rng.nextDouble() - 1;
            double s = u * u + v * v;
            if (s > 0 && s < 1) {
                return u * StrictMath.sqrt(-2 * StrictMath.log(s) / s);
            }
        }
    }
}
