package org.voteworth.score;

import org.apache.commons.math3.distribution.BetaDistribution;

/**
 * The inverse cumulative distribution function of Beta(a, b), through Commons Math
 * {@link BetaDistribution}, solved to an absolute accuracy of 1e-14 (its default, 1e-9, is too
 * coarse for intervals quoted to ten decimals).
 */
final class BetaQuantile {
    static final double ACCURACY = 1e-14;

    private BetaQuantile() {
    }

    static double of(double a, double b, double p) {
        if (p <= 0) {
            return 0;
        }
        if (p >= 1) {
            return 1;
        }
        // No random generator: only the distribution functions are used, and building one is costly.
        double q = new BetaDistribution(null, a, b, ACCURACY).inverseCumulativeProbability(p);
        return Math.min(1, Math.max(0, q));
    }
}
