package org.voteworth.score;

import java.util.Locale;
import java.util.Objects;
import java.util.Optional;

/**
 * Ranks by the posterior mean of the helpful share under a Beta(α, β) prior:
 * <pre>
 *   score = (H + α) / (T + α + β) = w·(H/T) + (1 − w)·μ,  w = T / (T + α + β)
 * </pre>
 * the mean of Beta(α + H, β + T − H) (Gelman et al., Bayesian Data Analysis, 3rd ed., 2.4 and
 * 5.3). Few votes are pulled towards the prior mean μ, many votes speak for themselves. The
 * prior usually comes from {@link EmpiricalBayesPrior}. The interval is the central 95 %
 * posterior interval: the 0.025 and 0.975 quantiles of the posterior.
 */
public final class BayesianAverage implements RankingRule {
    static final double INTERVAL_CONFIDENCE = 0.95;
    private final BetaPrior prior;

    public BayesianAverage(BetaPrior prior) {
        this.prior = Objects.requireNonNull(prior, "prior");
    }

    public BetaPrior prior() {
        return prior;
    }

    @Override
    public String name() {
        return "bayes-mean";
    }

    @Override
    public String label() {
        return "Bayesian average (prior " + prior.label() + ")";
    }

    @Override
    public String describe() {
        return "The helpful share expected after blending the reviewer's votes with a prior worth "
                + String.format(Locale.ROOT, "%.1f", prior.strength()) + " votes at the typical share of "
                + String.format(Locale.ROOT, "%.3f", prior.mean()) + ", so that a few votes move a reviewer only a little.";
    }

    @Override
    public double score(Evidence e) {
        return (e.helpfulVotes() + prior.alpha()) / (e.totalVotes() + prior.alpha() + prior.beta());
    }

    @Override
    public Optional<Interval> interval(Evidence e) {
        double a = prior.alpha() + e.helpfulVotes();
        double b = prior.beta() + (e.totalVotes() - e.helpfulVotes());
        double tail = (1 - INTERVAL_CONFIDENCE) / 2;
        return Optional.of(new Interval(BetaQuantile.of(a, b, tail), BetaQuantile.of(a, b, 1 - tail), INTERVAL_CONFIDENCE));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof BayesianAverage b && b.prior.equals(prior);
    }

    @Override
    public int hashCode() {
        return prior.hashCode();
    }

    @Override
    public String toString() {
        return name() + "(" + prior.label() + ")";
    }
}
