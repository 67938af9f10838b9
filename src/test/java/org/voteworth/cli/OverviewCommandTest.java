package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.HashMap;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/**
 * {@code overview} checked against another engine: DuckDB (JDBC, test scope) reading the same
 * files with an explicit column list, tab delimiter and quoting off, as the benchmark does.
 */
class OverviewCommandTest {
    @TempDir
    static Path dir;
    static Path dump;
    static JsonNode overview;

    private static final String COLUMNS = "'reviewer_id': 'VARCHAR', 'review_id': 'VARCHAR', 'item_id': 'VARCHAR', "
            + "'category': 'VARCHAR', 'star_rating': 'INTEGER', 'helpful_votes': 'BIGINT', 'total_votes': 'BIGINT', "
            + "'verified_purchase': 'VARCHAR', 'incentivised': 'VARCHAR', 'headline': 'VARCHAR', 'body': 'VARCHAR', "
            + "'review_date': 'DATE'";

    static CliTest.Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(out), new PrintWriter(err), args);
        return new CliTest.Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void generate() throws IOException {
        dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(8_000).withGzip(false).withCategories(3)
                .withMalformedRows(false).withSeed(5));
        // Invented rows with what the generator never writes: empty stars, flags and dates, and votes past the dense counts.
        StringBuilder b = new StringBuilder("reviewer_id\treview_id\titem_id\tcategory\tstar_rating\thelpful_votes\ttotal_votes"
                + "\tverified_purchase\tincentivised\theadline\tbody\treview_date\n");
        Random rnd = new Random(8);
        for (int i = 0; i < 600; i++) {
            long total = i % 50 == 0 ? 4000 + rnd.nextInt(20_000) : rnd.nextInt(12);
            b.append("odd-").append(rnd.nextInt(150)).append("\tRX").append(i).append("\tIX\tOdd Lots\t")
                    .append(i % 3 == 0 ? "" : Integer.toString(1 + rnd.nextInt(5))).append('\t')
                    .append(total / 2).append('\t').append(total).append('\t')
                    .append(i % 4 == 0 ? "" : i % 4 == 1 ? "yes" : "N").append('\t').append(i % 5 == 0 ? "" : "n").append('\t')
                    .append("Fine\tIt works.\t").append(i % 7 == 0 ? "" : "2019-0" + (1 + i % 9) + "-1" + (i % 9)).append('\n');
        }
        Files.writeString(dump.resolve("odd-lots.tsv"), b);
        CliTest.Run r = run("overview", dump.toString(), "--format", "json", "--threads", "2", "--quiet",
                "--rejects", dir.resolve("rejects.tsv").toString());
        assertThat(r.code()).as(r.err()).isZero();
        overview = new ObjectMapper().readTree(r.out());
    }

    private static String source() throws IOException {
        StringBuilder files = new StringBuilder();
        try (var s = Files.list(dump)) {
            for (Path p : s.filter(p -> p.toString().endsWith(".tsv")).sorted().toList()) {
                files.append(files.length() == 0 ? "" : ", ").append('\'').append(p.toString().replace("'", "''")).append('\'');
            }
        }
        return "read_csv([" + files + "], delim = '\\t', quote = '', escape = '', header = true, columns = {" + COLUMNS + "})";
    }

    private static JsonNode section(String category) {
        for (JsonNode c : overview.get("categories")) {
            if (c.get("category").asText().equals(category)) {
                return c;
            }
        }
        throw new AssertionError("no category " + category + " in " + overview.get("categories"));
    }

    @Test
    void countsPerCategoryAgreeWithDuckDb() throws SQLException, IOException {
        String sql = "SELECT category, count(*), count(DISTINCT reviewer_id), "
                + "count(*) FILTER (star_rating = 1), count(*) FILTER (star_rating = 2), count(*) FILTER (star_rating = 3), "
                + "count(*) FILTER (star_rating = 4), count(*) FILTER (star_rating = 5), count(*) FILTER (star_rating IS NULL), "
                + "count(*) FILTER (total_votes = 0), "
                + "count(*) FILTER (upper(verified_purchase) IN ('Y', 'YES')), count(*) FILTER (upper(verified_purchase) IN ('N', 'NO')), "
                + "count(*) FILTER (upper(incentivised) IN ('Y', 'YES')), count(*) FILTER (upper(incentivised) IN ('N', 'NO')), "
                + "count(*) FILTER (review_date IS NULL), "
                + "min(total_votes), max(total_votes), avg(total_votes), stddev_samp(total_votes), "
                + "quantile_cont(CAST(total_votes AS DOUBLE), 0.5), quantile_cont(CAST(total_votes AS DOUBLE), 0.9), "
                + "quantile_cont(CAST(helpful_votes AS DOUBLE), 0.25), quantile_cont(CAST(helpful_votes AS DOUBLE), 0.99) "
                + "FROM " + source() + " GROUP BY category ORDER BY category";
        int seen = 0;
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement();
             ResultSet r = s.executeQuery(sql)) {
            while (r.next()) {
                seen++;
                JsonNode j = section(r.getString(1));
                assertThat(j.get("rows").asLong()).isEqualTo(r.getLong(2));
                assertThat(j.get("reviewers").asLong()).isEqualTo(r.getLong(3));
                for (int k = 1; k <= 5; k++) {
                    assertThat(j.get("stars").get(Integer.toString(k)).asLong()).as("%s stars %d", r.getString(1), k)
                            .isEqualTo(r.getLong(3 + k));
                }
                assertThat(j.get("stars").get("unrated").asLong()).isEqualTo(r.getLong(9));
                assertThat(j.get("zero_vote_reviews").asLong()).isEqualTo(r.getLong(10));
                assertThat(j.get("verified").get("yes").asLong()).isEqualTo(r.getLong(11));
                assertThat(j.get("verified").get("no").asLong()).isEqualTo(r.getLong(12));
                assertThat(j.get("incentivised").get("yes").asLong()).isEqualTo(r.getLong(13));
                assertThat(j.get("incentivised").get("no").asLong()).isEqualTo(r.getLong(14));
                assertThat(j.get("undated").asLong()).isEqualTo(r.getLong(15));
                JsonNode t = j.get("total_votes");
                assertThat(t.get("min").asLong()).isEqualTo(r.getLong(16));
                assertThat(t.get("max").asLong()).isEqualTo(r.getLong(17));
                assertThat(t.get("mean").asDouble()).isCloseTo(r.getDouble(18), within(1e-9));
                assertThat(t.get("sd").asDouble()).isCloseTo(r.getDouble(19), within(1e-9));
                // DuckDB's quantile_cont interpolates linearly between order statistics (type 7; from its documentation, as
                // remembered), the definition the overview uses.
                assertThat(t.get("median").asDouble()).isEqualTo(r.getDouble(20));
                assertThat(t.get("p90").asDouble()).isCloseTo(r.getDouble(21), within(1e-9));
                assertThat(j.get("helpful_votes").get("q1").asDouble()).isCloseTo(r.getDouble(22), within(1e-9));
                assertThat(j.get("helpful_votes").get("p99").asDouble()).isCloseTo(r.getDouble(23), within(1e-9));
            }
        }
        assertThat(seen).isEqualTo(4).isEqualTo(overview.get("categories").size());
        assertThat(section("Odd Lots").get("total_votes").get("max").asLong()).isGreaterThan(4095);
    }

    @Test
    void reviewsPerMonthAndPerReviewerAgreeWithDuckDb() throws SQLException, IOException {
        Map<String, Long> months = new HashMap<>();
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement()) {
            try (ResultSet r = s.executeQuery("SELECT strftime(review_date, '%Y-%m'), count(*) FROM " + source()
                    + " WHERE review_date IS NOT NULL GROUP BY 1")) {
                while (r.next()) {
                    months.put(r.getString(1), r.getLong(2));
                }
            }
            Map<String, Long> ours = new HashMap<>();
            overview.get("overall").get("reviews_per_month").fields().forEachRemaining(e -> ours.put(e.getKey(), e.getValue().asLong()));
            assertThat(ours).isEqualTo(months);

            try (ResultSet r = s.executeQuery("SELECT count(*), min(n), max(n), avg(n), quantile_cont(CAST(n AS DOUBLE), 0.5), "
                    + "quantile_cont(CAST(n AS DOUBLE), 0.99) FROM (SELECT reviewer_id, count(*) n FROM " + source()
                    + " GROUP BY reviewer_id)")) {
                r.next();
                JsonNode j = overview.get("overall").get("reviews_per_reviewer");
                assertThat(overview.get("overall").get("reviewers").asLong()).isEqualTo(r.getLong(1));
                assertThat(j.get("count").asLong()).isEqualTo(r.getLong(1));
                assertThat(j.get("min").asLong()).isEqualTo(r.getLong(2));
                assertThat(j.get("max").asLong()).isEqualTo(r.getLong(3));
                assertThat(j.get("mean").asDouble()).isCloseTo(r.getDouble(4), within(1e-9));
                assertThat(j.get("median").asDouble()).isEqualTo(r.getDouble(5));
                assertThat(j.get("p99").asDouble()).isCloseTo(r.getDouble(6), within(1e-9));
            }
        }
    }

    @Test
    void everyFormatAndThreadCountGivesTheSameNumbers() throws IOException {
        CliTest.Run one = run("overview", dump.toString(), "--format", "json", "--threads", "1", "--memory", "64KB", "--quiet",
                "--rejects", dir.resolve("rejects-1.tsv").toString(), "--tmp", dir.resolve("tmp").toString());
        JsonNode j = new ObjectMapper().readTree(one.out());
        assertThat(j.get("overall")).isEqualTo(overview.get("overall"));
        assertThat(j.get("categories")).isEqualTo(overview.get("categories"));

        CliTest.Run md = run("overview", dump.toString(), "--format", "md", "--rejects", dir.resolve("rejects-2.tsv").toString());
        assertThat(md.code()).isZero();
        assertThat(md.out()).startsWith("# Data set overview: 8,600 reviews").contains("## Reviews per month")
                .contains("| Odd Lots |").contains("## Notes");
        assertThat(md.err()).contains("read = accepted + rejected");

        CliTest.Run table = run("overview", dump.toString(), "--rejects", dir.resolve("rejects-3.tsv").toString(), "--quiet");
        assertThat(table.out()).contains("Rows, stars and flags:").contains("reviews per reviewer");

        CliTest.Run csv = run("overview", dump.toString(), "--format", "csv", "--quiet", "--out", dir.resolve("o").toString());
        assertThat(csv.out()).contains("overview.csv");
        assertThat(Files.readString(dir.resolve("o").resolve("overview.csv"))).startsWith("category,measure,value\n")
                .contains("(all),rows,8600\n");
    }

    @Test
    void refusesAReviewerTable() throws IOException {
        Path out = dir.resolve("t");
        assertThat(run("tally", dump.toString(), "--out", out.toString(), "--quiet").code()).isZero();
        CliTest.Run r = run("overview", out.resolve("reviewers.csv").toString());
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("is a reviewer table").contains("give the dump");
    }
}
