package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HeaderMappingTest {
    private static final Path FILE = Path.of("dump", "garden.tsv");

    @TempDir
    Path dir;

    @Test
    void recognisedNamesMatchIgnoringCaseSpacesDashesUnderscoresAndBom() {
        List<String> header = List.of("\uFEFFMarketplace", "Reviewer ID", "Product-Id", "Star_Rating", "Helpful Votes",
                "TOTAL_VOTES", "Verified-Purchase", "Review Date", "Review Body");
        ColumnMapping m = HeaderMapping.defaults().resolve(header, FILE);
        assertThat(m.columnCount()).isEqualTo(9);
        assertThat(m.column(Field.REVIEWER)).isEqualTo(1);
        assertThat(m.column(Field.ITEM)).isEqualTo(2);
        assertThat(m.column(Field.STARS)).isEqualTo(3);
        assertThat(m.column(Field.HELPFUL)).isEqualTo(4);
        assertThat(m.column(Field.TOTAL)).isEqualTo(5);
        assertThat(m.column(Field.VERIFIED)).isEqualTo(6);
        assertThat(m.column(Field.DATE)).isEqualTo(7);
        assertThat(m.column(Field.CATEGORY)).isEqualTo(ColumnMapping.UNMAPPED);
        assertThat(m.isMapped(Field.INCENTIVISED)).isFalse();
    }

    @Test
    void everyRecognisedNameOfEveryFieldIsFound() {
        for (Field f : Field.values()) {
            for (String name : f.recognisedNames()) {
                List<String> header = new java.util.ArrayList<>(List.of("reviewer", "helpful", "total"));
                int at = header.indexOf(f.key());
                if (at >= 0) {
                    header.set(at, name.toUpperCase(java.util.Locale.ROOT));
                } else {
                    header.add(name);
                    at = header.size() - 1;
                }
                assertThat(HeaderMapping.defaults().resolve(header, FILE).column(f)).as(f + " " + name).isEqualTo(at);
            }
        }
    }

    @Test
    void mapOptionOverridesRecognisedNames() {
        HeaderMapping m = HeaderMapping.parse("helpful=Up Votes, total = All Votes,reviewer=shopper");
        assertThat(m.overrides()).containsExactlyInAnyOrderEntriesOf(
                Map.of(Field.HELPFUL, "Up Votes", Field.TOTAL, "All Votes", Field.REVIEWER, "shopper"));
        ColumnMapping c = m.resolve(List.of("shopper", "helpful_votes", "up_votes", "all votes", "reviewer_id"), FILE);
        assertThat(c.column(Field.REVIEWER)).isZero();
        // Exact name first, else the normalised one: "Up Votes" finds "up_votes".
        assertThat(c.column(Field.HELPFUL)).isEqualTo(2);
        assertThat(c.column(Field.TOTAL)).isEqualTo(3);
    }

    @Test
    void anExplicitColumnIsNotAlsoTakenByRecognisedNames() {
        // "id" is a recognised name of review; mapped to reviewer, review must not take it too.
        ColumnMapping c = HeaderMapping.parse("reviewer=id").resolve(List.of("id", "helpful", "total"), FILE);
        assertThat(c.column(Field.REVIEWER)).isZero();
        assertThat(c.isMapped(Field.REVIEW)).isFalse();
    }

    @Test
    void mappingFileLinesWithCommentsAndBlankLines() throws IOException {
        Path f = Files.writeString(dir.resolve("columns.map"), "\uFEFF# our export\n\nhelpful = Up, votes\n  # the rest\ntotal=All\n");
        HeaderMapping m = HeaderMapping.load(f);
        assertThat(m.overrides()).containsExactlyInAnyOrderEntriesOf(Map.of(Field.HELPFUL, "Up, votes", Field.TOTAL, "All"));
        ColumnMapping c = m.resolve(List.of("reviewer", "All", "Up, votes"), FILE);
        assertThat(c.column(Field.HELPFUL)).isEqualTo(2);
        assertThat(c.column(Field.TOTAL)).isEqualTo(1);
    }

    @Test
    void withOverridesLetsTheLaterMappingWin() {
        HeaderMapping fromFile = HeaderMapping.parse("helpful=a,total=b");
        HeaderMapping both = fromFile.withOverrides(HeaderMapping.parse("helpful=c,date=d"));
        assertThat(both.overrides()).containsExactlyInAnyOrderEntriesOf(Map.of(Field.HELPFUL, "c", Field.TOTAL, "b", Field.DATE, "d"));
        assertThat(HeaderMapping.defaults().withOverrides(fromFile)).isEqualTo(fromFile);
    }

    @Test
    void unknownFieldListsTheValidOnes() {
        assertThatThrownBy(() -> HeaderMapping.parse("helpfull=Up"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("unknown field 'helpfull'")
                .hasMessageContaining("reviewer, review, item, category, stars, helpful, total, verified, incentivised, date");
    }

    @Test
    void malformedMapEntriesSayWhatIsWrong() {
        assertThatThrownBy(() -> HeaderMapping.parse("helpful")).hasMessageContaining("'helpful' is not field=header");
        assertThatThrownBy(() -> HeaderMapping.parse("helpful=")).hasMessageContaining("no header name given for helpful");
        assertThatThrownBy(() -> HeaderMapping.parse("helpful=a,helpful=b")).hasMessageContaining("helpful is mapped twice");
    }

    @Test
    void mappingFileErrorsNameTheFileAndLine() throws IOException {
        Path f = Files.writeString(dir.resolve("bad.map"), "# comment\nhelpful=Up\nstarz=Rating\n");
        assertThatThrownBy(() -> HeaderMapping.load(f))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("bad.map: line 3: unknown field 'starz'")
                .satisfies(e -> assertThat(((DumpFormatException) e).line()).isEqualTo(3));
        assertThatThrownBy(() -> HeaderMapping.load(dir.resolve("missing.map")))
                .isInstanceOf(IOException.class).hasMessageContaining("missing.map");
    }

    @Test
    void aMappedHeaderNotPresentNamesTheFileAndListsTheHeaders() {
        assertThatThrownBy(() -> HeaderMapping.parse("helpful=Up Votes").resolve(List.of("reviewer", "helpful", "total"), FILE))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining(FILE.toString())
                .hasMessageContaining("--map helpful=Up Votes: no column named 'Up Votes'")
                .hasMessageContaining("the header has 'reviewer', 'helpful', 'total'");
    }

    @Test
    void aMissingRequiredFieldSaysWhichAndSuggestsMap() {
        assertThatThrownBy(() -> HeaderMapping.defaults().resolve(List.of("reviewer", "ups", "downs"), FILE))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining(FILE.toString())
                .hasMessageContaining("no column for required fields helpful")
                .hasMessageContaining("total (recognised names")
                .hasMessageContaining("'ups', 'downs'")
                .hasMessageContaining("--map helpful=<header>,total=<header>");
    }

    @Test
    void aOneColumnHeaderWithCommasSuggestsCsv() {
        assertThatThrownBy(() -> HeaderMapping.defaults().resolve(List.of("reviewer,helpful,total"), FILE))
                .hasMessageContaining("add --csv");
        assertThatThrownBy(() -> HeaderMapping.defaults().resolve(List.of("reviewer\thelpful\ttotal"), FILE))
                .hasMessageContaining("drop --csv");
        assertThatThrownBy(() -> HeaderMapping.defaults().resolve(List.of(""), FILE))
                .hasMessageContaining("the first line is blank");
    }

    @Test
    void twoFieldsOnOneColumnIsAnError() {
        assertThatThrownBy(() -> HeaderMapping.parse("helpful=votes,total=Votes").resolve(List.of("reviewer", "votes"), FILE))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("both helpful and total on column 2 ('votes')");
    }

    @Test
    void columnMappingOfChecksItsIndices() {
        assertThatThrownBy(() -> ColumnMapping.of(2, Map.of(Field.REVIEWER, 2))).hasMessageContaining("outside 0..1");
        assertThatThrownBy(() -> ColumnMapping.of(2, Map.of(Field.REVIEWER, 1, Field.TOTAL, 1))).hasMessageContaining("both map to column 1");
        assertThat(ColumnMapping.of(3, Map.of(Field.REVIEWER, 0, Field.HELPFUL, 1, Field.TOTAL, 2)))
                .isEqualTo(HeaderMapping.defaults().resolve(List.of("reviewer", "helpful", "total"), FILE));
    }
}
