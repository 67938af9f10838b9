package org.voteworth.analysis;

import java.util.List;
import java.util.Map;

/**
 * Two or more rules side by side (see {@link RuleComparison}).
 *
 * @param k the size of each compared list
 * @param rules rule names, in the order asked
 * @param labels rule labels with their parameters, same order
 * @param rows the union of the top-k lists, ordered by best rank under any rule, then id
 * @param pairs statistics for every pair of rules
 * @param disagreements one sentence per large disagreement
 * @param unrankedRank how a reviewer a rule does not rank is ranked in the correlations, in words
 */
public record ComparisonResult(int k, List<String> rules, List<String> labels, List<Row> rows, List<PairStats> pairs,
                               List<String> disagreements, String unrankedRank) {
    public ComparisonResult {
        rules = List.copyOf(rules);
        labels = List.copyOf(labels);
        rows = List.copyOf(rows);
        pairs = List.copyOf(pairs);
        disagreements = List.copyOf(disagreements);
    }

    /**
     * One reviewer of the union.
     *
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param share H / T
     * @param topReviewShare the largest single review's share of T
     * @param ranks full-ranking rank under each rule, by name, in rule order; 0 = not ranked
     */
    public record Row(String reviewer, long helpfulVotes, long totalVotes, double share, double topReviewShare,
                      Map<String, Integer> ranks) {
    }

    /**
     * Agreement of two rules.
     *
     * @param ruleA first rule
     * @param ruleB second rule
     * @param jaccard Jaccard overlap of the two top-k sets
     * @param kendallTauB Kendall's tau-b over the union of all compared top-k lists
     * @param spearmanRho Spearman's rho over the same union
     * @param rbo extrapolated rank-biased overlap of the two top-k lists
     * @param persistence the RBO persistence p
     */
    public record PairStats(String ruleA, String ruleB, double jaccard, double kendallTauB, double spearmanRho, double rbo,
                            double persistence) {
    }
}
