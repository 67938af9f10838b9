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

    /**
     * Each row as an independent formatter builds it from the tally's values: java.util.Formatter's
     * {@code %.6f} for shares, {@link java.time.LocalDate#toString} for dates, {@link Csv#text} for
     * text cells, categories in String order.
     */
    private static String expectedRow(ReviewerTally t) {
        java.util.StringJoiner cats = new java.util.StringJoiner(";");
        t.reviewsByCategory().forEach((c, n) -> cats.add(c.replace(";", "_").replace(":", "_") + ":" + n));
        java.util.function.DoubleFunction<String> f = v -> String.format(java.util.Locale.ROOT, "%.6f", v);
        java.util.function.IntFunction<String> day = d -> d == ReviewerTally.NO_DATE ? "" : java.time.LocalDate.ofEpochDay(d).toString();
        return String.join(",", Csv.text(t.id()), "" + t.reviews(), "" + t.helpfulVotes(), "" + t.totalVotes(),
                t.totalVotes() == 0 ? "" : f.apply(t.helpfulShare()), "" + t.votedReviews(), "" + t.majorityReviews(),
                "" + t.maxReviewVotes(), f.apply(t.maxReviewShare()), "" + t.sumSquaredVotes(), f.apply(t.herfindahl()),
                "" + t.verified(), "" + t.incentivised(), "" + t.stars().one(), "" + t.stars().two(), "" + t.stars().three(),
                "" + t.stars().four(), "" + t.stars().five(), day.apply(t.firstDay()), day.apply(t.lastDay()),
                Csv.text(cats.toString()));
    }

    @Test
    void rowsAreFormattedAsAnIndependentFormatterWritesThem() throws IOException {
        TallyTable t = TallyTableTest.tableOf(TallyTableTest.randomReviews(new Random(11), 3000));
        t.add("=cmd", 1, 1, 5, true, false, "a;b:c", 18000);
        t.add("-7", 0, 0, 5, true, false, "=sum", -800_000);
        t.add("r\u00e9vieuse", 3, 7, 2, false, true, "caf\u00e9, th\u00e9", 3_000_000);
        t.add("r\u00e9vieuse", 1, 2, 1, false, true, "caf\u00e9", 2_932_897);
        t.add("q\"uote", 2, 2, 5, false, false, "\"quoted\"", ReviewerTally.NO_DATE);
        t.add("8", 0, 3, 4, true, false, "books", 0);
        t.add("8", 3, 3, 4, true, false, "'@x", 0);
        Path f = dir.resolve("reviewers.csv");
        ReviewerTableFile.write(t, f);
        List<String> expected = new java.util.ArrayList<>();
        expected.add(String.join(",", ReviewerTableFile.HEADER));
        t.toSortedList().forEach(r -> expected.add(expectedRow(r)));
        assertThat(Files.readAllLines(f)).containsExactlyElementsOf(expected);
    }

    @Test
    void talliesGivenInIdOrderAreWrittenAsTheTableIs() throws IOException {
        TallyTable t = TallyTableTest.tableOf(TallyTableTest.randomReviews(new Random(12), 2000));
        t.add("x", 1, 2, 3, true, false, "a,b", 18000);
        Path fromTable = dir.resolve("table.csv");
        Path fromTallies = dir.resolve("tallies.csv");
        ReviewerTableFile.write(t, fromTable);
        assertThat(ReviewerTableFile.write(t.toSortedList().iterator(), fromTallies)).isEqualTo(t.size());
        assertThat(Files.mismatch(fromTable, fromTallies)).isEqualTo(-1L);
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
