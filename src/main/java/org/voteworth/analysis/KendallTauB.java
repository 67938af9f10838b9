package org.voteworth.analysis;

import org.apache.commons.math3.stat.correlation.KendallsCorrelation;

/**
 * Kendall's tau-b, the rank correlation that allows for ties (Kendall 1945, Biometrika
 * 33:239-251): with n_c concordant and n_d discordant pairs, and n_1, n_2 the pairs tied in x
 * and in y, τ_b = (n_c − n_d) / sqrt((n_0 − n_1)(n_0 − n_2)), n_0 = n(n−1)/2. Computed by
 * Commons Math {@link KendallsCorrelation}; {@link #pairs} counts the pairs for reports and checks.
 */
public final class KendallTauB {
    private KendallTauB() {
    }

    /** τ_b of two equally long samples of at least two values; NaN when either has no spread. */
    public static double of(double[] x, double[] y) {
        check(x, y);
        return new KendallsCorrelation().correlation(x, y);
    }

    /**
     * Pair counts: concordant, discordant, and pairs tied in x only, in y only, or in both.
     *
     * @param concordant pairs ordered the same way in x and y
     * @param discordant pairs ordered oppositely
     * @param tiedX pairs tied in x but not in y
     * @param tiedY pairs tied in y but not in x
     * @param tiedBoth pairs tied in both
     */
    public record Pairs(long concordant, long discordant, long tiedX, long tiedY, long tiedBoth) {
    }

    /** Counts the pairs directly, O(n²): for small samples and checks. */
    public static Pairs pairs(double[] x, double[] y) {
        check(x, y);
        long c = 0;
        long d = 0;
        long tx = 0;
        long ty = 0;
        long tb = 0;
        for (int i = 0; i < x.length; i++) {
            for (int j = i + 1; j < x.length; j++) {
                int sx = Double.compare(x[i], x[j]);
                int sy = Double.compare(y[i], y[j]);
                if (sx == 0 && sy == 0) {
                    tb++;
                } else if (sx == 0) {
                    tx++;
                } else if (sy == 0) {
                    ty++;
                } else if (sx == sy) {
                    c++;
                } else {
                    d++;
                }
            }
        }
        return new Pairs(c, d, tx, ty, tb);
    }

    static void check(double[] x, double[] y) {
        if (x.length != y.length) {
            throw new IllegalArgumentException("rank correlation needs two samples of the same length, got " + x.length
                    + " and " + y.length);
        }
        if (x.length < 2) {
            throw new IllegalArgumentException("rank correlation needs at least two values, got " + x.length);
        }
    }
}
