package org.voteworth.api;

import java.util.Objects;
import java.util.Optional;
import org.voteworth.score.BayesianLowerQuantile;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.EntryBar;
import org.voteworth.score.RankingRule;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;

/**
 * A ranking rule with its parameters, written as it reads:
 * {@code Rule.wilson().confidence(0.95)}, {@code Rule.rawShare().bar(5)},
 * {@code Rule.bayesMean().prior(2.3, 14.1)}. Immutable; each {@code with} step returns a new rule.
 * The rules themselves and their sources are in {@code docs/methods.md}.
 *
 * @param name the rule's command-line name (see {@link Rules#names()})
 * @param confidence two-sided confidence of the Wilson rules and intervals
 * @param quantile the lower posterior quantile of {@code bayes-lower}
 * @param prior the Beta prior of the Bayesian rules; empty = fitted by empirical Bayes on the table
 * @param entryBar the evidence a reviewer needs before being ranked
 */
public record Rule(String name, double confidence, double quantile, Optional<BetaPrior> prior, EntryBar entryBar) {
    public Rule {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(prior, "prior");
        Objects.requireNonNull(entryBar, "entryBar");
        if (!Rules.names().contains(name)) {
            throw new IllegalArgumentException("unknown ranking rule '" + name + "': use one of " + String.join(", ", Rules.names()));
        }
        // Checks confidence and quantile with the messages every command gives.
        new RuleSettings(confidence, quantile, new BetaPrior(1, 1));
    }

    /** The rule called {@code name} (raw-share, wilson, wilson-cc, bayes-mean, bayes-lower, review-majority), default parameters. */
    public static Rule named(String name) {
        return new Rule(name, RuleSettings.DEFAULT_CONFIDENCE, BayesianLowerQuantile.DEFAULT_QUANTILE, Optional.empty(),
                EntryBar.NONE);
    }

    /** The raw helpful share H / T: the baseline, usually with an entry bar. */
    public static Rule rawShare() {
        return named("raw-share");
    }

    /** The Wilson score interval's lower bound. */
    public static Rule wilson() {
        return named("wilson");
    }

    /** The continuity-corrected Wilson lower bound. */
    public static Rule wilsonCorrected() {
        return named("wilson-cc");
    }

    /** The posterior mean under the empirical-Bayes Beta prior. */
    public static Rule bayesMean() {
        return named("bayes-mean");
    }

    /** A lower posterior quantile under the empirical-Bayes Beta prior. */
    public static Rule bayesLower() {
        return named("bayes-lower");
    }

    /** The Wilson lower bound over reviews rather than votes: the share of voted reviews with a helpful majority. */
    public static Rule reviewMajority() {
        return named("review-majority");
    }

    /** The same rule at another two-sided confidence, e.g. 0.9. */
    public Rule confidence(double c) {
        return new Rule(name, c, quantile, prior, entryBar);
    }

    /** The same rule with another lower quantile (bayes-lower). */
    public Rule quantile(double q) {
        return new Rule(name, confidence, q, prior, entryBar);
    }

    /** The same rule with a given Beta(alpha, beta) prior instead of the fitted one. */
    public Rule prior(double alpha, double beta) {
        return new Rule(name, confidence, quantile, Optional.of(new BetaPrior(alpha, beta)), entryBar);
    }

    /** The same rule ranking only reviewers with at least {@code helpfulVotes} helpful votes. */
    public Rule bar(long helpfulVotes) {
        return new Rule(name, confidence, quantile, prior, EntryBar.helpful(helpfulVotes));
    }

    /** The same rule ranking only reviewers with at least {@code totalVotes} votes. */
    public Rule barOnTotal(long totalVotes) {
        return new Rule(name, confidence, quantile, prior, EntryBar.total(totalVotes));
    }

    /** The scoring rule itself, built with {@code fitted} when no prior was given. */
    RankingRule build(BetaPrior fitted) {
        return Rules.byName(name, new RuleSettings(confidence, quantile, prior.orElse(fitted)));
    }

    @Override
    public String toString() {
        return name + " (confidence " + confidence + ", " + entryBar.describe()
                + prior.map(p -> ", prior Beta(" + p.alpha() + ", " + p.beta() + ")").orElse("") + ")";
    }
}
