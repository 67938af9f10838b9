package org.voteworth.score;

import java.util.Objects;
import java.util.Optional;

/**
 * Ranks by a low quantile of the posterior of the helpful share: the q-quantile (default 0.05)
 * of Beta(α + H, β + T − H), the share the reviewer exceeds with posterior probability 1 − q.
 * It is the Bayesian counterpart of the Wilson lower bound (Gelman et al., Bayesian Data
 * Analysis, 3rd ed., 2.4: posterior intervals from quantiles). The interval is the central
 * posterior interval between the q and 1 − q quantiles, with confidence 1 − 2q; with the
 * prior Beta(1/2, 1/2) it is the Jeffreys interval.
 */
public final class BayesianLowerQuantile implements RankingRule {
    /** The default quantile. */
    public static final double DEFAULT_QUANTILE = 0.05;
    private final BetaPrior prior;
    private final double quantile;

    /**
     * @param prior the Beta prior
     * @param quantile q, strictly between 0 and 0.5
     */
    public BayesianLowerQuantile(BetaPrior prior, double quantile) {
        this.prior = Objects.requireNonNull(prior, "prior");
        if (!(quantile > 0 && quantile < 0.5)) {
            throw new IllegalArgumentException("the lower quantile must lie strictly between 0 and 0.5 (e.g. 0.05), got "
                    + quantile);
        }
        this.quantile = quantile;
    }

    public BetaPrior prior() {
        return prior;
    }

    public double quantile() {
        return quantile;
    }

    @Override
    public String name() {
        return "bayes-lower";
    }

    @Override
    public String label() {
        return "Bayesian lower quantile (" + Percent.of(quantile) + ", prior " + prior.label() + ")";
    }

    @Override
    public String describe() {
        return "The helpful share that the reviewer beats with probability " + Percent.of(1 - quantile)
                + " after blending their votes with the prior " + prior.label()
                + ", so that both few votes and a low typical share hold a score down.";
    }

    @Override
    public double score(Evidence e) {
        return BetaQuantile.of(a(e), b(e), quantile);
    }

    @Override
    public Optional<Interval> interval(Evidence e) {
        double a = a(e);
        double b = b(e);
        return Optional.of(new Interval(BetaQuantile.of(a, b, quantile), BetaQuantile.of(a, b, 1 - quantile), 1 - 2 * quantile));
    }

    private double a(Evidence e) {
        return prior.alpha() + e.helpfulVotes();
    }

    private double b(Evidence e) {
        return prior.beta() + (e.totalVotes() - e.helpfulVotes());
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof BayesianLowerQuantile b && b.prior.equals(prior) && b.quantile == quantile;
    }

    @Override
    public int hashCode() {
        return prior.hashCode() * 31 + Double.hashCode(quantile);
    }

    @Override
    public String toString() {
        return name() + "(" + quantile + ", " + prior.label() + ")";
    }
}
