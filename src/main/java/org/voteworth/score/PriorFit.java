package org.voteworth.score;

import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * A Beta prior and how it was obtained, for reports and explanations.
 *
 * @param prior the prior
 * @param method how it was obtained
 * @param logLikelihood the beta-binomial marginal log-likelihood at {@code prior} over the fitted
 *     table, without the binomial coefficients ln C(T, H) (they do not depend on the prior; add
 *     {@link VoteFrequencyTable#logBinomialCoefficients()} for the full value); NaN for a
 *     {@link Method#GIVEN} prior
 * @param unitsUsed reviewers (or reviews) in the fitted table; 0 for a given prior
 * @param distinctPairs distinct (H, T) pairs in the fitted table; 0 for a given prior
 * @param converged for maximum likelihood, whether the optimiser met its convergence test; false
 *     when {@link EmpiricalBayesPrior#fit} had to fall back to moments; true for closed-form
 *     moment estimates and given priors
 * @param warnings what a reader of the prior should know, in plain sentences (empty when all went well)
 */
public record PriorFit(BetaPrior prior, Method method, double logLikelihood, long unitsUsed, int distinctPairs,
                       boolean converged, List<String> warnings) {

    /** How a prior was obtained. */
    public enum Method {
        /** Maximum of the beta-binomial marginal likelihood. */
        MAXIMUM_LIKELIHOOD,
        /** Moments of the observed shares (see {@link EmpiricalBayesPrior}). */
        METHOD_OF_MOMENTS,
        /** Given by the user. */
        GIVEN
    }

    public PriorFit {
        Objects.requireNonNull(prior, "prior");
        Objects.requireNonNull(method, "method");
        warnings = List.copyOf(warnings);
    }

    /** A prior the user gave: nothing fitted, log-likelihood NaN, no units. */
    public static PriorFit given(BetaPrior prior) {
        return new PriorFit(prior, Method.GIVEN, Double.NaN, 0, 0, true, List.of());
    }

    /** μ = α / (α + β). */
    public double mu() {
        return prior.mean();
    }

    /** κ = α + β. */
    public double kappa() {
        return prior.strength();
    }

    /**
     * The prior as reports state it, e.g. "Beta(4.0952, 1.4582), mean 0.7374, strength 5.55 votes;
     * maximum likelihood over 5147 reviewers (489 distinct vote pairs), log-likelihood ...".
     */
    public String describe() {
        String s = String.format(Locale.ROOT, "Beta(%.4f, %.4f), mean %.4f, strength %.2f votes; %s", prior.alpha(),
                prior.beta(), mu(), kappa(), method.name().toLowerCase(Locale.ROOT).replace('_', ' '));
        if (method != Method.GIVEN) {
            s += String.format(Locale.ROOT, " over %d reviewers (%d distinct vote pairs), log-likelihood %.2f%s", unitsUsed,
                    distinctPairs, logLikelihood, converged ? "" : ", NOT converged");
        }
        if (!warnings.isEmpty()) {
            s += "; " + String.join("; ", warnings);
        }
        return s;
    }
}
