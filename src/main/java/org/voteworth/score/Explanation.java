package org.voteworth.score;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * Why one reviewer stands where they stand under one rule: the inputs, the score and its interval,
 * the prior's pull, the ranks under the other rules, the margins to the neighbours, flags, and
 * the reasons in words.
 *
 * @param rank 1-based rank under {@code rule}
 * @param reviewer reviewer (or review) id
 * @param rule the rule's name
 * @param ruleLabel the rule with its parameters
 * @param score the rule's score
 * @param interval the interval the score comes from, when the rule has one
 * @param helpfulVotes H
 * @param totalVotes T
 * @param share H / T
 * @param reviews reviews counted
 * @param votedReviews reviews with at least one vote
 * @param maxReviewShare the largest single review's share of T
 * @param herfindahl Herfindahl index of votes over reviews
 * @param verifiedShare share of reviews that are verified purchases
 * @param shrinkageWeight w = T / (T + α + β) under the prior, when one is known
 * @param ranksByRule rank under every compared rule, by rule name; 0 = not ranked there
 * @param above the neighbour one rank higher, if any
 * @param below the neighbour one rank lower, if any
 * @param flags cautions
 * @param reasons the explanation in plain sentences
 */
public record Explanation(
        int rank,
        String reviewer,
        String rule,
        String ruleLabel,
        double score,
        Optional<Interval> interval,
        long helpfulVotes,
        long totalVotes,
        double share,
        long reviews,
        long votedReviews,
        double maxReviewShare,
        double herfindahl,
        double verifiedShare,
        OptionalDouble shrinkageWeight,
        Map<String, Integer> ranksByRule,
        Optional<Neighbour> above,
        Optional<Neighbour> below,
        List<Flag> flags,
        List<String> reasons) {

    public Explanation {
        ranksByRule = Map.copyOf(ranksByRule);
        flags = List.copyOf(flags);
        reasons = List.copyOf(reasons);
    }

    /**
     * A neighbouring rank and the margin to it.
     *
     * @param rank its rank
     * @param reviewer its id
     * @param score its score
     * @param gap |score difference|
     * @param helpfulVotesToDrawLevel how many more helpful votes (each vote helpful) the lower of
     *     the two would need to draw level; -1 when no number of votes would do
     * @param sentence the margin in plain words
     */
    public record Neighbour(int rank, String reviewer, double score, double gap, long helpfulVotesToDrawLevel,
                            String sentence) {
    }
}
