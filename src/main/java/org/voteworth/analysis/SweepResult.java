package org.voteworth.analysis;

import java.util.List;
import org.voteworth.score.EntryBar;

/**
 * What a {@link ThresholdSweep} found: for each rule, the top k at each entry bar, the overlaps,
 * who entered and left and why, and the threshold artefacts.
 *
 * @param on which count the bars apply to
 * @param bars the bars, ascending
 * @param k the size of the lists
 * @param rules one sweep per rule, in the order asked
 */
public record SweepResult(EntryBar.On on, List<Long> bars, int k, List<RuleSweep> rules) {
    public SweepResult {
        bars = List.copyOf(bars);
        rules = List.copyOf(rules);
    }

    /**
     * One rule across the bars.
     *
     * @param rule the rule's name
     * @param label the rule with its parameters
     * @param steps one step per bar
     * @param artefacts reviewers with far more evidence missing at the lowest bar yet present at a higher one
     * @param minJaccardWhereNoneExcluded the smallest consecutive Jaccard over steps whose bar excluded
     *     none of the previous list's members (NaN when every step excluded some)
     */
    public record RuleSweep(String rule, String label, List<Step> steps, List<Artefact> artefacts,
                            double minJaccardWhereNoneExcluded) {
        public RuleSweep {
            steps = List.copyOf(steps);
            artefacts = List.copyOf(artefacts);
        }

        /** The smallest Jaccard overlap between consecutive lists (1 with a single bar). */
        public double minJaccardConsecutive() {
            return steps.stream().skip(1).mapToDouble(Step::jaccardPrevious).min().orElse(1);
        }

        /** The smallest Jaccard overlap with the lowest bar's list (1 with a single bar). */
        public double minJaccardLowest() {
            return steps.stream().mapToDouble(Step::jaccardLowest).min().orElse(1);
        }
    }

    /**
     * The top k at one bar.
     *
     * @param bar the bar
     * @param ranked reviewers the bar admits and the rule ranks
     * @param top the top k, best first
     * @param jaccardPrevious overlap with the previous bar's list (NaN at the first bar)
     * @param jaccardLowest overlap with the lowest bar's list
     * @param excludedNone whether this bar excluded none of the previous list's members
     * @param entered reviewers in this list but not the previous one, with why
     * @param left reviewers in the previous list but not this one, with why
     */
    public record Step(long bar, int ranked, List<Member> top, double jaccardPrevious, double jaccardLowest,
                       boolean excludedNone, List<Change> entered, List<Change> left) {
        public Step {
            top = List.copyOf(top);
            entered = List.copyOf(entered);
            left = List.copyOf(left);
        }
    }

    /**
     * One list member.
     *
     * @param rank 1-based rank
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param score the rule's score
     */
    public record Member(int rank, String reviewer, long helpfulVotes, long totalVotes, double score) {
    }

    /**
     * A reviewer entering or leaving a list between two bars.
     *
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param rankBefore rank at the previous bar (0 = not ranked there)
     * @param rankAfter rank at this bar (0 = not ranked)
     * @param reason why, in words
     */
    public record Change(String reviewer, long helpfulVotes, long totalVotes, int rankBefore, int rankAfter, String reason) {
    }

    /**
     * A threshold artefact: a reviewer with far more evidence than the lowest bar's list, missing
     * from it, yet in the list at a higher bar.
     *
     * @param reviewer id (masked if asked)
     * @param helpfulVotes H
     * @param totalVotes T
     * @param rankAtLowest rank at the lowest bar
     * @param outrankedWithLessEvidence reviewers above it at the lowest bar with fewer total votes
     * @param medianTotalOfLowestList median total votes of the lowest bar's list
     * @param firstBar the lowest bar at which it is in the list
     * @param rankAtFirstBar its rank there
     * @param sentence the effect in words
     */
    public record Artefact(String reviewer, long helpfulVotes, long totalVotes, int rankAtLowest, int outrankedWithLessEvidence,
                           double medianTotalOfLowestList, long firstBar, int rankAtFirstBar, String sentence) {
    }
}
