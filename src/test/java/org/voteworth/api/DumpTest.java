package org.voteworth.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import tech.tablesaw.api.Row;
import tech.tablesaw.api.Table;

class DumpTest {
    static final Path PROJECT = Path.of(System.getProperty("voteworth.projectDir", "."));

    @TempDir
    Path dir;

    @Test
    void theGeneratedDemoDumpIsTheBundledSampleAndEveryRowIsAccountedFor() throws IOException {
        // Equality test: Dump.demo generates with the settings the bundled demo-data/ was made with.
        ReviewerTable generated = Dump.demo(dir.resolve("dump")).rejects(dir.resolve("rejects.tsv")).tally();
        ReviewerTable bundled = Dump.open(PROJECT.resolve("demo-data")).rejects(dir.resolve("bundled-rejects.tsv")).tally();
        assertThat(generated.tallyTable().toSortedList()).isEqualTo(bundled.tallyTable().toSortedList());
        assertThat(generated.reconciles()).isTrue();
        assertThat(generated.summary().rowsRead())
                .isEqualTo(generated.summary().accepted() + generated.summary().rejected());
        // Each rejected row is one line of the rejects file, under its header.
        assertThat(Files.readAllLines(dir.resolve("rejects.tsv"))).hasSize((int) generated.summary().rejected() + 1);
        assertThat(generated.toString()).contains("Quarrendale Market demo dump", "read = accepted + rejected holds");
    }

    @Test
    void theTallyAgreesWithAnSqlEngineReadingTheSameFiles() throws IOException, SQLException {
        // Another engine: DuckDB groups the same plain TSV files by reviewer (no malformed rows, so nothing is rejected).
        Path d = dir.resolve("clean");
        new DemoDumpGenerator().generate(d, DemoOptions.rows(3_000).withSeed(7).withGzip(false).withMalformedRows(false));
        Table api = Dump.open(d).rejects(dir.resolve("r.tsv")).tally().toTablesaw();
        List<String> ours = new ArrayList<>();
        for (Row r : api) {
            ours.add(r.getString("reviewer_id") + " " + r.getLong("reviews") + " " + r.getLong("helpful_votes") + " "
                    + r.getLong("total_votes"));
        }
        List<String> sql = new ArrayList<>();
        String glob = d.resolve("*.tsv").toString().replace("'", "''");
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement();
             ResultSet r = s.executeQuery("SELECT CAST(reviewer_id AS VARCHAR), count(*), sum(helpful_votes), sum(total_votes) "
                     + "FROM read_csv('" + glob + "', delim = '\\t', quote = '', escape = '', header = true, all_varchar = false) "
                     + "GROUP BY 1 ORDER BY 1")) {
            while (r.next()) {
                sql.add(r.getString(1) + " " + r.getLong(2) + " " + r.getLong(3) + " " + r.getLong(4));
            }
        }
        // Both in reviewer-id order by UTF-8 bytes; demo ids are ASCII, so String order is the same.
        assertThat(ours).hasSizeGreaterThan(500).isEqualTo(sql);
    }

    @Test
    void aMissingInputOrABadMappingIsAClearError() throws IOException {
        assertThatThrownBy(() -> Dump.open(dir.resolve("nowhere")).tally()).hasMessageContaining("nowhere");
        assertThatThrownBy(() -> Dump.open(dir).map("reviewer")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("reviewer");
        assertThatThrownBy(() -> Dump.open(new String[0])).hasMessageContaining("at least one input");
        assertThatThrownBy(() -> Dump.open(dir).threads(0)).hasMessageContaining("threads");
    }

    @Test
    void aDefaultRejectsFileIsKeptOnlyWhenItHoldsRejects() throws IOException {
        Path clean = dir.resolve("clean-small");
        new DemoDumpGenerator().generate(clean, DemoOptions.rows(3_000).withSeed(3).withGzip(false).withMalformedRows(false));
        ReviewerTable none = Dump.open(clean).tally();
        assertThat(none.summary().rejected()).isZero();
        assertThat(none.rejectsFile()).isEmpty();
        ReviewerTable some = Dump.demo(dir.resolve("demo")).tally();
        assertThat(some.summary().rejected()).isPositive();
        assertThat(some.rejectsFile()).hasValueSatisfying(f -> assertThat(f).isRegularFile());
    }
}
