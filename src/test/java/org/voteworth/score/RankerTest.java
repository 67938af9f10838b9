package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

class RankerTest {
    private static TallyTable table(Object... idHelpfulTotal) {
        TallyTable t = new TallyTable();
        for (int i = 0; i < idHelpfulTotal.length; i += 3) {
            t.add((String) idHelpfulTotal[i], (Integer) idHelpfulTotal[i + 1], (Integer) idHelpfulTotal[i + 2], 5, true, false,
                    "books", ReviewerTally.NO_DATE);
        }
        return t;
    }

    private static List<String> order(Ranking r) {
        List<String> ids = new ArrayList<>();
        for (int k = 1; k <= r.size(); k++) {
            ids.add(r.table().id(r.slotAt(k)));
        }
        return ids;
    }

    @Test
    void tiesGoToMoreTotalVotesThenToTheSmallerId() {
        // METHODS.md tie order: higher score, then larger T, then reviewer id ascending.
        TallyTable t = table("b", 2, 2, "a", 2, 2, "c", 9, 9, "d", 1, 2, "e", 0, 0);
        Ranking r = Ranker.rank(t, new RawShare(), EntryBar.NONE);
        assertThat(order(r)).containsExactly("c", "a", "b", "d");   // e has no votes: not ranked
        assertThat(r.rankOf(t.find("e"))).isZero();
        assertThat(r.scoreAt(1)).isEqualTo(1.0);
    }

    @Test
    void theEntryBarDecidesWhoIsRankedAtAll() {
        TallyTable t = table("few", 3, 3, "many", 95, 100, "mid", 9, 10);
        assertThat(order(Ranker.rank(t, new RawShare(), EntryBar.helpful(5)))).containsExactly("many", "mid");
        assertThat(order(Ranker.rank(t, new RawShare(), EntryBar.total(50)))).containsExactly("many");
        assertThat(order(Ranker.rank(t, new RawShare(), EntryBar.NONE))).containsExactly("few", "many", "mid");
    }

    @Test
    void theWilsonBoundPutsMoreEvidenceFirst() {
        // E. Miller (2009) motivates sorting by the lower bound: 2/2 must not beat 100/101 (bounds in
        // reference-checks/wilson_sorting.csv: 0.342380 vs 0.946033).
        TallyTable t = table("two-of-two", 2, 2, "hundred-of-101", 100, 101);
        assertThat(order(Ranker.rank(t, new WilsonLowerBound(0.95, false), EntryBar.NONE)))
                .containsExactly("hundred-of-101", "two-of-two");
        assertThat(order(Ranker.rank(t, new RawShare(), EntryBar.NONE))).containsExactly("two-of-two", "hundred-of-101");
    }

    @Test
    void topIsAPrefixOfTheOrder() {
        TallyTable t = table("a", 1, 1, "b", 1, 2, "c", 1, 3);
        Ranking r = Ranker.rank(t, new RawShare(), EntryBar.NONE);
        assertThat(r.top(2)).containsExactly(t.find("a"), t.find("b"));
        assertThat(r.top(10)).hasSize(3);
    }
}
