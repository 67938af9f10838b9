package org.voteworth.score;

import java.util.Objects;

/**
 * The parameters {@link Rules#byName} builds a rule with.
 *
 * @param confidence two-sided confidence of the Wilson rules, strictly between 0 and 1
 * @param quantile the lower quantile of {@code bayes-lower}, strictly between 0 and 0.5
 * @param prior the Beta prior of the Bayesian rules
 */
public record RuleSettings(double confidence, double quantile, BetaPrior prior) {
    /** The default confidence, two-sided 95 %. */
    public static final double DEFAULT_CONFIDENCE = 0.95;

    public RuleSettings {
        Percent.checkOpenUnit("confidence", confidence);
        if (!(quantile > 0 && quantile < 0.5)) {
            throw new IllegalArgumentException("the lower quantile must lie strictly between 0 and 0.5 (e.g. 0.05), got "
                    + quantile);
        }
        Objects.requireNonNull(prior, "prior");
    }

    /** Confidence 0.95 and quantile 0.05 with the given prior. */
    public static RuleSettings defaults(BetaPrior prior) {
        return new RuleSettings(DEFAULT_CONFIDENCE, BayesianLowerQuantile.DEFAULT_QUANTILE, prior);
    }
}
