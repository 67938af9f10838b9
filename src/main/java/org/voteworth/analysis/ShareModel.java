package org.voteworth.analysis;

import java.util.Locale;
import org.voteworth.score.BayesianAverage;
import org.voteworth.score.BayesianLowerQuantile;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.Evidence;
import org.voteworth.score.RankingRule;
import org.voteworth.score.ReviewMajority;

/**
 * The Beta distribution that stands for a unit's true share when ranks are resampled: the
 * posterior Beta(α + x, β + n − x) of x successes in n trials under a Beta(α, β) prior
 * (Gelman et al., Bayesian Data Analysis, 3rd ed., 2.4). The Bayesian rules use their own
 * prior over votes. The other vote rules (raw share, Wilson) use the population prior fitted by
 * empirical Bayes: what the whole table says about how true shares spread. A uniform prior
 * would instead let every 5-of-5 reviewer draw shares near 1 as often as a 896-of-900 one, so
 * thousands of small samples would crowd the top k in every draw and the question "how sure is
 * this rank" would be answered by the prior, not by the votes. Review majority counts reviews,
 * not votes, and has no fitted prior over reviews: it uses the uniform Beta(1, 1).
 *
 * @param alpha prior α
 * @param beta prior β
 * @param overReviews whether trials are voted reviews (x = majority reviews) instead of votes
 * @param describe the model in words, for reports
 */
public record ShareModel(double alpha, double beta, boolean overReviews, String describe) {
    public ShareModel {
        new BetaPrior(alpha, beta); // checks the parameters with its message
    }

    /**
     * The model that goes with a rule, as the class comment says.
     *
     * @param population the prior fitted to the whole table (empirical Bayes), used by the
     *     vote rules that carry no prior of their own
     */
    public static ShareModel forRule(RankingRule rule, BetaPrior population) {
        if (rule instanceof BayesianAverage b) {
            return posterior(b.prior());
        }
        if (rule instanceof BayesianLowerQuantile b) {
            return posterior(b.prior());
        }
        if (rule instanceof ReviewMajority) {
            return new ShareModel(1, 1, true, "Beta(1 + x, 1 + n - x) over voted reviews (x judged helpful by most voters"
                    + " of n): a parametric bootstrap under a uniform prior");
        }
        return new ShareModel(population.alpha(), population.beta(), false, String.format(Locale.ROOT,
                "the posterior Beta(%.4f + H, %.4f + T - H) under the population prior fitted to the table",
                population.alpha(), population.beta()));
    }

    /** The posterior under a given prior, over votes. */
    public static ShareModel posterior(BetaPrior prior) {
        return new ShareModel(prior.alpha(), prior.beta(), false, String.format(Locale.ROOT,
                "the posterior Beta(%.4f + H, %.4f + T - H) under the rule's prior", prior.alpha(), prior.beta()));
    }

    /** Successes x of the evidence: H, or the majority reviews. */
    public long successes(Evidence e) {
        return overReviews ? e.majorityReviews() : e.helpfulVotes();
    }

    /** Trials n of the evidence: T, or the voted reviews. */
    public long trials(Evidence e) {
        return overReviews ? e.votedReviews() : e.totalVotes();
    }

    /** The unit's distribution. */
    public BetaPrior of(Evidence e) {
        long x = successes(e);
        return new BetaPrior(alpha + x, beta + (trials(e) - x));
    }
}
