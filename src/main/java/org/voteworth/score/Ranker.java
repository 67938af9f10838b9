package org.voteworth.score;

import java.util.Arrays;
import org.voteworth.tally.TallyTable;

/**
 * Ranks a reviewer table under a rule. Every rule is ranked here, with one tie order: higher score
 * first, then larger total votes T, then reviewer id ascending, so a ranking is a total and
 * reproducible order.
 */
public final class Ranker {
    private Ranker() {
    }

    public static Ranking rank(TallyTable table, RankingRule rule, EntryBar bar) {
        int n = table.size();
        int[] slots = new int[n];
        double[] scores = new double[n];
        int m = 0;
        for (int s = 0; s < n; s++) {
            Evidence e = Evidence.of(table, s);
            if (rule.eligible(e) && bar.admits(e)) {
                double v = rule.score(e);
                if (Double.isNaN(v)) {
                    throw new IllegalStateException(rule.name() + " scored NaN for " + table.id(s) + " (" + e + ")");
                }
                slots[m] = s;
                scores[s] = v;
                m++;
            }
        }
        Integer[] order = new Integer[m];
        for (int i = 0; i < m; i++) {
            order[i] = slots[i];
        }
        String[] ids = new String[n];
        Arrays.sort(order, (a, b) -> {
            int c = Double.compare(scores[b], scores[a]);
            if (c != 0) {
                return c;
            }
            c = Long.compare(table.totalVotes(b), table.totalVotes(a));
            if (c != 0) {
                return c;
            }
            return id(ids, table, a).compareTo(id(ids, table, b));
        });
        int[] slotAtRank = new int[m];
        double[] scoreAtRank = new double[m];
        for (int r = 0; r < m; r++) {
            slotAtRank[r] = order[r];
            scoreAtRank[r] = scores[order[r]];
        }
        return new Ranking(table, rule, bar, slotAtRank, scoreAtRank);
    }

    private static String id(String[] cache, TallyTable table, int slot) {
        String s = cache[slot];
        if (s == null) {
            s = table.id(slot);
            cache[slot] = s;
        }
        return s;
    }
}
