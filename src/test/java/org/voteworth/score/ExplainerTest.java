package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.stat.interval.WilsonScoreInterval;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

class ExplainerTest {
    private static final BetaPrior PRIOR = new BetaPrior(2.0, 1.0);

    private static TallyTable table() {
        TallyTable t = new TallyTable();
        for (int i = 0; i < 10; i++) {
            t.add("steady", 10, 10, 5, true, false, "books", ReviewerTally.NO_DATE);
            t.add("steady", 9, 10, 4, true, false, "garden", ReviewerTally.NO_DATE);
        }
        t.add("lucky", 4, 4, 5, true, false, "books", ReviewerTally.NO_DATE);
        t.add("lucky-too", 3, 3, 5, true, false, "books", ReviewerTally.NO_DATE);
        t.add("lucky-three", 2, 2, 5, true, false, "books", ReviewerTally.NO_DATE);
        t.add("viral", 450, 500, 5, false, false, "toys", ReviewerTally.NO_DATE);
        t.add("viral", 1, 2, 5, false, false, "toys", ReviewerTally.NO_DATE);
        for (int i = 0; i < 5; i++) {
            t.add("viral", 0, 0, 4, false, false, "toys", ReviewerTally.NO_DATE);
        }
        t.add("middling", 30, 40, 3, true, false, "books", ReviewerTally.NO_DATE);
        return t;
    }

    @Test
    void votesToDrawLevelAgreeWithCommonsMathWilsonBounds() {
        TallyTable t = table();
        Ranking wilson = Ranker.rank(t, new WilsonLowerBound(0.95, false), EntryBar.NONE);
        Explainer ex = new Explainer(wilson, List.of(), Optional.of(PRIOR), 0.8);
        WilsonScoreInterval cm = new WilsonScoreInterval();
        for (int rank = 2; rank <= wilson.size(); rank++) {
            Explanation e = ex.explain(rank);
            long k = e.above().orElseThrow().helpfulVotesToDrawLevel();
            double target = wilson.scoreAt(rank - 1);
            int h = (int) e.helpfulVotes();
            int n = (int) e.totalVotes();
            // Commons Math's Wilson interval is the external reference: k votes reach the target, k - 1 do not.
            assertThat(cm.createInterval(n + (int) k, h + (int) k, 0.95).getLowerBound()).isGreaterThanOrEqualTo(target - 1e-12);
            assertThat(cm.createInterval(n + (int) k - 1, h + (int) k - 1, 0.95).getLowerBound()).isLessThan(target + 1e-12);
        }
    }

    @Test
    void flagsSmallSamplesConcentratedVotesAndFewVerifiedReviews() {
        TallyTable t = table();
        Ranking wilson = Ranker.rank(t, new WilsonLowerBound(0.95, false), EntryBar.NONE);
        Explainer ex = new Explainer(wilson, List.of(), Optional.of(PRIOR), 0.8);
        Explanation lucky = ex.explain(wilson.rankOf(t.find("lucky")));
        Explanation viral = ex.explain(wilson.rankOf(t.find("viral")));
        Explanation steady = ex.explain(wilson.rankOf(t.find("steady")));
        assertThat(lucky.flags()).contains(Flag.LOW_EVIDENCE);
        assertThat(viral.flags()).contains(Flag.VOTE_CONCENTRATION, Flag.LOW_VERIFIED_SHARE);
        assertThat(steady.flags()).isEmpty();
        assertThat(viral.reasons()).anyMatch(s -> s.contains("one review carries"));
    }

    @Test
    void explainsTheRawShareContrastAndTheShrinkage() {
        TallyTable t = table();
        Ranking wilson = Ranker.rank(t, new WilsonLowerBound(0.95, false), EntryBar.NONE);
        Ranking raw = Ranker.rank(t, new RawShare(), EntryBar.NONE);
        Explainer ex = new Explainer(wilson, List.of(raw), Optional.of(PRIOR), 0.8);
        Explanation first = ex.explain(1);
        assertThat(first.reviewer()).isEqualTo("steady");
        assertThat(first.ranksByRule()).containsEntry("raw-share", 4).containsEntry("wilson", 1);
        // Shrinkage weight w = T / (T + alpha + beta) (METHODS.md): 200 / 203.
        assertThat(first.shrinkageWeight().getAsDouble()).isEqualTo(200.0 / 203.0);
        Explanation lucky = ex.explain(wilson.rankOf(t.find("lucky")));
        assertThat(lucky.reasons()).anyMatch(s -> s.contains("ranks higher than its evidence supports"));
        assertThat(first.reasons()).anyMatch(s -> s.contains("All 3 reviewers above it there have fewer votes"));
    }

    @Test
    void idsCanBeShownAsPseudonymsEverywhere() {
        TallyTable t = table();
        Ranking wilson = Ranker.rank(t, new WilsonLowerBound(0.95, false), EntryBar.NONE);
        Explainer ex = new Explainer(wilson, List.of(), Optional.empty(), 0.8).withIds(id -> "x-" + id.length());
        for (Explanation e : ex.explainTop(10)) {
            assertThat(e.reviewer()).startsWith("x-");
            assertThat(String.join(" ", e.reasons())).doesNotContain("steady", "lucky", "viral", "middling");
        }
    }
}
