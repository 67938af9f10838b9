package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.voteworth.source.ReviewRow;

/** The per-review vote cap: helpful' = round(helpful × cap / total), half up, for total above the cap. */
class VoteCapTest {
    private static ReviewRow row(String reviewer, long h, long t) {
        ReviewRow r = new ReviewRow();
        byte[] b = (reviewer + "\tRV1\tIT1").getBytes(StandardCharsets.UTF_8);
        r.buf = b;
        r.reviewerOff = 0;
        r.reviewerLen = reviewer.length();
        r.reviewOff = reviewer.length() + 1;
        r.reviewLen = 3;
        r.itemOff = reviewer.length() + 5;
        r.itemLen = 3;
        byte[] cat = "Books".getBytes(StandardCharsets.UTF_8);
        r.categoryBuf = cat;
        r.categoryOff = 0;
        r.categoryLen = cat.length;
        r.helpful = h;
        r.total = t;
        r.stars = 5;
        r.verified = 1;
        r.incentivised = 0;
        r.epochDay = ReviewRow.NO_DATE;
        return r;
    }

    @Test
    void scalesHelpfulInProportionAndRestoresTheRow() {
        TallyTable t = new TallyTable();
        VoteCap cap = new VoteCap(100, t);
        ReviewRow viral = row("v", 1150, 1200);
        cap.accept(viral);
        cap.accept(row("v", 9, 14)); // under the cap: unchanged
        int s = t.find("v");
        // 1150 × 100 / 1200 = 95.83 -> 96, plus 9 of 14.
        assertThat(t.helpfulVotes(s)).isEqualTo(96 + 9);
        assertThat(t.totalVotes(s)).isEqualTo(100 + 14);
        assertThat(viral.helpful).isEqualTo(1150);
        assertThat(viral.total).isEqualTo(1200);
    }

    @Test
    void roundsHalfUpInIntegers() {
        assertThat(VoteCap.cappedHelpful(5, 20, 10)).isEqualTo(3);  // 2.5 -> 3
        assertThat(VoteCap.cappedHelpful(3, 20, 10)).isEqualTo(2);  // 1.5 -> 2
        assertThat(VoteCap.cappedHelpful(1, 30, 10)).isEqualTo(0);  // 0.33 -> 0
        assertThat(VoteCap.cappedHelpful(30, 30, 10)).isEqualTo(10);
    }

    @Test
    void refusesACapBelowOne() {
        assertThatThrownBy(() -> new VoteCap(0, new TallyTable())).hasMessageContaining("--cap-votes");
    }

}
