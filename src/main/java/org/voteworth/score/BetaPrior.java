package org.voteworth.score;

import java.util.Locale;

/**
 * A Beta(α, β) distribution for a reviewer's true helpful share: the prior that the Bayesian
 * rules shrink towards, and (after {@link #posterior}) what a reviewer's votes say about it.
 *
 * <p>Mean μ = α/(α+β) and strength κ = α+β, which counts as κ pseudo-votes of which α are
 * helpful. After H helpful of T votes the posterior is Beta(α + H, β + T − H) (conjugacy of
 * the beta and binomial distributions; Gelman et al., Bayesian Data Analysis, 3rd ed., 2.4).
 *
 * @param alpha α &gt; 0, finite
 * @param beta β &gt; 0, finite
 */
public record BetaPrior(double alpha, double beta) {
    public BetaPrior {
        if (!(alpha > 0 && beta > 0) || Double.isInfinite(alpha) || Double.isInfinite(beta)) {
            throw new IllegalArgumentException("a Beta prior needs finite alpha > 0 and beta > 0, got Beta(" + alpha
                    + ", " + beta + ")");
        }
    }

    /** The prior with mean μ in (0, 1) and strength κ = α + β &gt; 0: α = μκ, β = (1 − μ)κ. */
    public static BetaPrior ofMeanAndStrength(double mu, double kappa) {
        Percent.checkOpenUnit("the prior mean", mu);
        if (!(kappa > 0) || Double.isInfinite(kappa)) {
            throw new IllegalArgumentException("the prior strength (alpha + beta) must be finite and > 0, got " + kappa);
        }
        return new BetaPrior(mu * kappa, (1 - mu) * kappa);
    }

    /** μ = α / (α + β). */
    public double mean() {
        return alpha / (alpha + beta);
    }

    /** κ = α + β, the prior's weight in votes. */
    public double strength() {
        return alpha + beta;
    }

    /** Standard deviation sqrt(αβ / ((α+β)²(α+β+1))). */
    public double sd() {
        double k = alpha + beta;
        return Math.sqrt(alpha * beta / (k * k * (k + 1)));
    }

    /**
     * The weight of a reviewer's own share in the posterior mean, w = T / (T + α + β): the
     * posterior mean is w·(H/T) + (1 − w)·μ.
     */
    public double shrinkage(long totalVotes) {
        if (totalVotes < 0) {
            throw new IllegalArgumentException("total votes cannot be negative, got " + totalVotes);
        }
        return totalVotes / (totalVotes + alpha + beta);
    }

    /** The posterior after h helpful votes of t: Beta(α + h, β + t − h). */
    public BetaPrior posterior(long h, long t) {
        WilsonScore.check(h, t);
        return new BetaPrior(alpha + h, beta + (t - h));
    }

    /** The q-quantile of this distribution (Commons Math {@code BetaDistribution}, to 1e-14). */
    public double quantile(double q) {
        if (!(q >= 0 && q <= 1)) {
            throw new IllegalArgumentException("a quantile's probability must lie in [0, 1], got " + q);
        }
        return BetaQuantile.of(alpha, beta, q);
    }

    /** e.g. "Beta(2.30, 14.08)". */
    public String label() {
        return "Beta(" + number(alpha) + ", " + number(beta) + ")";
    }

    private static String number(double v) {
        // Two decimals read well for the usual priors; tiny parameters keep three significant digits.
        return String.format(Locale.ROOT, v >= 0.1 ? "%.2f" : "%.3g", v);
    }
}
