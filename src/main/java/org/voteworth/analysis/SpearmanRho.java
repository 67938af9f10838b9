package org.voteworth.analysis;

import org.apache.commons.math3.stat.correlation.SpearmansCorrelation;

/**
 * Spearman's rank correlation ρ (Spearman 1904, Amer. J. Psychol. 15:72-101): the Pearson
 * correlation of the ranks, ties given their average rank, so that without ties
 * ρ = 1 − 6 Σd² / (n(n² − 1)). Computed by Commons Math {@link SpearmansCorrelation}, whose
 * default ranking averages ties.
 */
public final class SpearmanRho {
    private SpearmanRho() {
    }

    /** ρ of two equally long samples of at least two values; NaN when either has no spread. */
    public static double of(double[] x, double[] y) {
        KendallTauB.check(x, y);
        return new SpearmansCorrelation().correlation(x, y);
    }
}
