package org.voteworth.score;

import java.util.SplittableRandom;

/**
 * Gamma, beta and normal variates: primitive and allocation-free, for the demo generator's latent
 * shares and for rank uncertainty, which draws millions of them.
 *
 * <p>Gamma(shape, 1) by Marsaglia &amp; Tsang (2000), "A simple method for generating gamma
 * variables", ACM Transactions on Mathematical Software 26(3):363-372: with d = a − 1/3,
 * c = 1/√(9d), a normal x and v = (1 + cx)³, accept dv when ln u &lt; x²/2 + d − dv + d·ln v;
 * for a &lt; 1 they give Gamma(a) = Gamma(a + 1)·U^(1/a). Normals by Marsaglia's polar method
 * (Marsaglia &amp; Bray 1964, SIAM Review 6(3):260-264). Beta(a, b) = X / (X + Y) with X ~
 * Gamma(a), Y ~ Gamma(b) (a textbook identity).
 *
 * <p>{@link StrictMath} throughout so that a seed gives the same bytes on every JVM.
 */
public final class MarsagliaTsangGamma {
    private MarsagliaTsangGamma() {
    }

    /** One Gamma(shape, 1) variate; shape &gt; 0. */
    public static double gamma(SplittableRandom rng, double shape) {
        if (!(shape > 0)) {
            throw new IllegalArgumentException("gamma shape must be > 0, was " + shape);
        }
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

    /** One Beta(a, b) variate; a, b &gt; 0. */
    public static double beta(SplittableRandom rng, double a, double b) {
        double x = gamma(rng, a);
        double y = gamma(rng, b);
        double s = x + y;
        // Both gammas underflow only for tiny shapes; the mean is the honest answer then.
        return s > 0 ? x / s : a / (a + b);
    }

    /** One standard normal variate (polar method). */
    public static double normal(SplittableRandom rng) {
        while (true) {
            double u = 2.0 * rng.nextDouble() - 1.0;
            double v = 2.0 * rng.nextDouble() - 1.0;
            double s = u * u + v * v;
            if (s > 0 && s < 1) {
                return u * StrictMath.sqrt(-2.0 * StrictMath.log(s) / s);
            }
        }
    }
}
