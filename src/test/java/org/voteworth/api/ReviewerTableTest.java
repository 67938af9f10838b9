package org.voteworth.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.PlantedCases;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;
import tech.tablesaw.api.Table;

class ReviewerTableTest {
    @TempDir
    Path dir;

    @Test
    void theTablesawViewHasTheReviewerTableColumnsAndItsNumbers() throws IOException {
        ReviewerTable demo = Dump.open(DumpTest.PROJECT.resolve("demo-data")).rejects(dir.resolve("r.tsv")).tally();
        Table t = demo.toTablesaw();
        assertThat(t.columnNames()).isEqualTo(ReviewerTableFile.HEADER);
        assertThat(t.rowCount()).isEqualTo(demo.size());
        assertThat((long) t.longColumn("reviews").sum()).isEqualTo(demo.summary().accepted());
        assertThat((long) demo.categoriesToTablesaw().longColumn("reviews").sum()).isEqualTo(demo.summary().accepted());
        ReviewerTally expert = demo.reviewer(PlantedCases.EXPERT).orElseThrow();
        Table row = t.where(t.stringColumn("reviewer_id").isEqualTo(PlantedCases.EXPERT));
        assertThat(row.longColumn("helpful_votes").get(0)).isEqualTo(expert.helpfulVotes());
        assertThat(row.doubleColumn("helpful_share").get(0)).isEqualTo(expert.helpfulShare());
        assertThat(row.dateColumn("first_date").get(0).toEpochDay()).isEqualTo(expert.firstDay());

        // Round trip through the reviewer table CSV.
        demo.write(dir.resolve("reviewers.csv"));
        ReviewerTable back = ReviewerTable.read(dir.resolve("reviewers.csv"));
        assertThat(back.tallyTable().toSortedList()).isEqualTo(demo.tallyTable().toSortedList());
        assertThat(back.reconciliation()).contains("no rows to reconcile");
        assertThat(back.rank(Rule.wilson()).topIds(5)).isEqualTo(demo.rank(Rule.wilson()).topIds(5));
        assertThatThrownBy(() -> Dump.open(dir.resolve("reviewers.csv")).tally()).hasMessageContaining("is a reviewer table")
                .hasMessageContaining("ReviewerTable.read");
    }

    @Test
    void historyNamesAnUnknownReviewer() throws IOException {
        ReviewerTable demo = Dump.open(DumpTest.PROJECT.resolve("demo-data")).rejects(dir.resolve("r.tsv")).tally();
        assertThat(demo.history(PlantedCases.EXPERT).result().reviews()).isEqualTo(150);
        assertThatThrownBy(() -> demo.history("nobody")).hasMessageContaining("'nobody' is not in the table");
    }

    @Test
    void aRuleChecksItsNameAndParameters() {
        assertThatThrownBy(() -> Rule.named("best")).hasMessageContaining("unknown ranking rule 'best'")
                .hasMessageContaining("wilson");
        assertThatThrownBy(() -> Rule.wilson().confidence(1.5)).hasMessageContaining("confidence");
        assertThatThrownBy(() -> Rule.rawShare().bar(-1)).hasMessageContaining("negative");
        assertThat(Rule.wilson().confidence(0.9).bar(5).toString()).isEqualTo("wilson (confidence 0.9, at least 5 helpful votes)");
    }
}
