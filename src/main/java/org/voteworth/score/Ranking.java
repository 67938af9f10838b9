package org.voteworth.score;

import java.util.Arrays;
import org.voteworth.tally.TallyTable;

/**
 * The result of ranking a reviewer table under one rule and entry bar: a total order over the
 * eligible reviewers. Ranks are 1-based.
 */
public final class Ranking {
    private final TallyTable table;
    private final RankingRule rule;
    private final EntryBar bar;
    private final int[] slotAtRank;   // index rank-1
    private final double[] scoreAtRank;
    private final int[] rankOfSlot;   // 0 = not ranked

    Ranking(TallyTable table, RankingRule rule, EntryBar bar, int[] slotAtRank, double[] scoreAtRank) {
        this.table = table;
        this.rule = rule;
        this.bar = bar;
        this.slotAtRank = slotAtRank;
        this.scoreAtRank = scoreAtRank;
        this.rankOfSlot = new int[table.size()];
        for (int r = 0; r < slotAtRank.length; r++) {
            rankOfSlot[slotAtRank[r]] = r + 1;
        }
    }

    public TallyTable table() {
        return table;
    }

    public RankingRule rule() {
        return rule;
    }

    public EntryBar bar() {
        return bar;
    }

    /** How many reviewers were ranked (eligible under the rule and admitted by the bar). */
    public int size() {
        return slotAtRank.length;
    }

    /** The table slot of the reviewer at {@code rank} (1-based). */
    public int slotAt(int rank) {
        return slotAtRank[rank - 1];
    }

    /** The score of the reviewer at {@code rank} (1-based). */
    public double scoreAt(int rank) {
        return scoreAtRank[rank - 1];
    }

    /** The rank of a table slot, or 0 when that reviewer is not ranked. */
    public int rankOf(int slot) {
        return rankOfSlot[slot];
    }

    /** Table slots of the first {@code k} ranks (fewer if fewer are ranked). */
    public int[] top(int k) {
        return Arrays.copyOf(slotAtRank, Math.min(k, slotAtRank.length));
    }
}
