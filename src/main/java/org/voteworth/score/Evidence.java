package org.voteworth.score;

import org.voteworth.tally.TallyTable;

/**
 * The vote counts a ranking rule scores: what one reviewer (or review) has to show.
 *
 * @param helpfulVotes H
 * @param totalVotes T, with 0 &lt;= H &lt;= T
 * @param votedReviews reviews with at least one vote
 * @param majorityReviews voted reviews with helpful votes above half of their votes
 */
public record Evidence(long helpfulVotes, long totalVotes, long votedReviews, long majorityReviews) {
    public Evidence {
        if (helpfulVotes < 0 || helpfulVotes > totalVotes) {
            throw new IllegalArgumentException("need 0 <= helpful <= total, got " + helpfulVotes + "/" + totalVotes);
        }
        if (majorityReviews < 0 || majorityReviews > votedReviews) {
            throw new IllegalArgumentException("need 0 <= majority <= voted reviews, got " + majorityReviews + "/" + votedReviews);
        }
    }

    /** Evidence of a single review, or of a reviewer when the review counts are not needed. */
    public static Evidence of(long helpful, long total) {
        return new Evidence(helpful, total, total > 0 ? 1 : 0, total > 0 && 2 * helpful > total ? 1 : 0);
    }

    public static Evidence of(TallyTable table, int slot) {
        return new Evidence(table.helpfulVotes(slot), table.totalVotes(slot), table.votedReviews(slot),
                table.majorityReviews(slot));
    }

    /** H / T, or NaN when T = 0. */
    public double share() {
        return totalVotes == 0 ? Double.NaN : (double) helpfulVotes / totalVotes;
    }
}
