package org.voteworth.analysis;

import java.util.List;
import java.util.Map;
import org.voteworth.score.Flag;

/**
 * A promotion list held to a bar (see {@link PromotionAudit}).
 *
 * @param list where the list came from
 * @param bar the bar in words
 * @param model the posterior the probabilities come from, in words
 * @param topKRule the rule of P(in top k) and of the statistical top k
 * @param k the k of P(in top k)
 * @param members each listed reviewer found in the data, in list order
 * @param missing listed ids not in the data
 * @param duplicates ids listed more than once
 * @param overlooked reviewers not on the list who beat its weakest members with high probability
 * @param summary the figures a policy is checked against
 */
public record AuditResult(String list, String bar, String model, String topKRule, int k, List<Member> members,
                          List<String> missing, List<String> duplicates, List<Overlooked> overlooked, Summary summary) {
    public AuditResult {
        members = List.copyOf(members);
        missing = List.copyOf(missing);
        duplicates = List.copyOf(duplicates);
        overlooked = List.copyOf(overlooked);
    }

    /**
     * One listed reviewer.
     *
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param share H / T (NaN without votes)
     * @param probabilityMeetsBar P(meets the bar)
     * @param wilsonLower the Wilson lower bound at the audit's confidence
     * @param posteriorMean the posterior mean of the share
     * @param ranks rank under each rule, by name; 0 = not ranked
     * @param probabilityTopK P(in top k) under {@link #topKRule}
     * @param topKError its Monte Carlo standard error
     * @param inStatisticalTopK whether the reviewer is in the top k of {@link #topKRule}
     * @param flags cautions
     * @param smallSample whether T is less than 1/{@value PromotionAudit#SMALL_SAMPLE_FACTOR} of the median T of the
     *     statistical top k: too little evidence to stand beside them
     */
    public record Member(String reviewer, long helpfulVotes, long totalVotes, double share, double probabilityMeetsBar,
                         double wilsonLower, double posteriorMean, Map<String, Integer> ranks, double probabilityTopK,
                         double topKError, boolean inStatisticalTopK, List<Flag> flags, boolean smallSample) {
        public Member {
            flags = List.copyOf(flags);
        }
    }

    /**
     * A reviewer not on the list with a strong claim to be on it.
     *
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param posteriorMean posterior mean of the share
     * @param rank rank under the top-k rule
     * @param beats listed reviewers it beats with at least the beat probability
     * @param minProbability the smallest P(its share &gt; theirs) over {@code beats}
     */
    public record Overlooked(String reviewer, long helpfulVotes, long totalVotes, double posteriorMean, int rank,
                             List<String> beats, double minProbability) {
        public Overlooked {
            beats = List.copyOf(beats);
        }
    }

    /**
     * The summary figures.
     *
     * @param listed distinct ids on the list
     * @param found of them, in the data
     * @param missing not in the data
     * @param expectedBelow Σ(1 − P(meets the bar)) over the found
     * @param likelyBelow found reviewers with P(meets the bar) &lt; 0.5
     * @param minProbability the smallest P(meets the bar) (1 with nobody found)
     * @param precision found reviewers in the statistical top k, as a share of the found
     * @param overlooked reviewers in {@link #overlooked} (before any display limit)
     * @param maxMonteCarloError the largest Monte Carlo standard error of a probability shown
     */
    public record Summary(int listed, int found, int missing, double expectedBelow, int likelyBelow, double minProbability,
                          double precision, int overlooked, double maxMonteCarloError) {
    }
}
