package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ReviewerTableFileTest {
    @TempDir
    Path dir;

    @Test
    void roundTripsEveryTally() throws IOException {
        TallyTable t = TallyTableTest.tableOf(TallyTableTest.randomReviews(new Random(3), 500));
        t.add("=cmd|' /C calc'!A0", 1, 1, 5, true, false, "a;b:c", 18000);
        t.add("'=quoted", 0, 2, 4, true, false, "x", ReviewerTally.NO_DATE);
        t.add("with,comma \"and quote\"", 2, 2, 5, false, false, "x", 18001);
        Path f = dir.resolve("reviewers.csv");
        ReviewerTableFile.write(t, f);
        assertThat(ReviewerTableFile.looksLikeReviewerTable(f)).isTrue();
        TallyTable back = ReviewerTableFile.read(f);
        // Category names lose ';' and ':' (the pair separators); everything else is exact.
        List<ReviewerTally> expected = t.toSortedList().stream()
                .map(r -> r.id().startsWith("=cmd") ? withCategory(r, "a_b_c") : r).toList();
        assertThat(back.toSortedList()).isEqualTo(expected);
    }

    private static ReviewerTally withCategory(ReviewerTally r, String cat) {
        return new ReviewerTally(r.id(), r.reviews(), r.helpfulVotes(), r.totalVotes(), r.votedReviews(),
                r.majorityReviews(), r.maxReviewVotes(), r.sumSquaredVotes(), r.verified(), r.incentivised(),
                r.stars(), new java.util.TreeMap<>(java.util.Map.of(cat, 1L)), r.firstDay(), r.lastDay());
    }

    @Test
    void neutralisesSpreadsheetFormulasInTextCells() {
        // Common practice for CSV meant for spreadsheets: cells starting with = + - @ tab or CR are prefixed.
        assertThat(Csv.text("=1+1")).isEqualTo("'=1+1");
        assertThat(Csv.text("@SUM(A1)")).isEqualTo("'@SUM(A1)");
        assertThat(Csv.text("-2")).isEqualTo("'-2");
        assertThat(Csv.text("plain")).isEqualTo("plain");
        assertThat(Csv.text("a,b")).isEqualTo("\"a,b\"");
        assertThat(Csv.parseLine("'=1+1,\"a,\"\"b\",x")).containsExactly("=1+1", "a,\"b", "x");
    }

    @Test
    void badRowsNameTheFileLineAndColumn() throws IOException {
        Path f = dir.resolve("bad.csv");
        Files.writeString(f, String.join(",", ReviewerTableFile.HEADER) + "\n"
                + "r1,1,x,3,,1,1,3,1,9,1,1,0,0,0,0,0,1,,,books:1\n");
        assertThatThrownBy(() -> ReviewerTableFile.read(f))
                .hasMessageContaining("bad.csv: line 2: column helpful_votes: not a whole number: 'x'");
    }
}
