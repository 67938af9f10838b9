package org.voteworth.store;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.cli.Main;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.tally.ReviewerTally;

/**
 * The store's Parquet files read by another engine (DuckDB, through JDBC) give the same counts and
 * sums as voteworth's own reading, the declared types, ZSTD pages and reviewer-sorted row groups;
 * and a profile's figures match the same questions asked of DuckDB.
 */
class StoreInteropTest {
    @TempDir
    static Path dir;
    static Path store;
    static Connection duck;

    @BeforeAll
    static void build() throws IOException, SQLException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(6_000).withSeed(9).withCategories(5));
        store = dir.resolve("store");
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(new StringWriter()), new PrintWriter(err), "tally", dir.resolve("dump").toString(),
                "--store", store.toString(), "--quiet");
        assertThat(code).as(err.toString()).isZero();
        duck = DriverManager.getConnection("jdbc:duckdb:");
    }

    @AfterAll
    static void close() throws SQLException {
        duck.close();
    }

    private static String reviews() {
        return "read_parquet('" + store.resolve("reviews").toString().replace("'", "''") + "/*.parquet')";
    }

    private static String reviewers() {
        return "read_parquet('" + store.resolve("reviewers.parquet").toString().replace("'", "''") + "')";
    }

    private static List<List<Object>> query(String sql) throws SQLException {
        List<List<Object>> rows = new ArrayList<>();
        try (Statement s = duck.createStatement(); ResultSet r = s.executeQuery(sql)) {
            int n = r.getMetaData().getColumnCount();
            while (r.next()) {
                List<Object> row = new ArrayList<>();
                for (int i = 1; i <= n; i++) {
                    row.add(r.getObject(i));
                }
                rows.add(row);
            }
        }
        return rows;
    }

    private static long one(String sql) throws SQLException {
        return ((Number) query(sql).get(0).get(0)).longValue();
    }

    @Test
    void duckDbCountsAndSumsTheSameAsTheStore() throws IOException, SQLException {
        Store s = Store.open(store);
        long[] own = new long[4];
        s.forEachReviewer(t -> {
            own[0] += t.reviews();
            own[1] += t.helpfulVotes();
            own[2] += t.totalVotes();
            own[3]++;
        });
        assertThat(own[0]).isEqualTo(s.manifest().accepted());
        List<Object> got = query("SELECT count(*), sum(helpful_votes), sum(total_votes), count(DISTINCT reviewer_id) FROM "
                + reviews()).get(0);
        assertThat(got.stream().map(o -> ((Number) o).longValue()).toList()).containsExactly(own[0], own[1], own[2], own[3]);
        assertThat(one("SELECT count(*) FROM " + reviewers())).isEqualTo(s.manifest().reviewers());
        assertThat(one("SELECT sum(c.reviews) FROM (SELECT unnest(categories) AS c FROM " + reviewers() + ")"))
                .isEqualTo(s.manifest().accepted());

        // Every reviewer's row equals what DuckDB groups from the reviews themselves.
        String grouped = "SELECT reviewer_id, count(*) n, sum(helpful_votes) h, sum(total_votes) t, "
                + "count(*) FILTER (WHERE total_votes > 0) voted, count(*) FILTER (WHERE 2 * helpful_votes > total_votes) maj, "
                + "max(total_votes) mx, sum(total_votes * total_votes) sq, count(*) FILTER (WHERE verified) ver, "
                + "count(*) FILTER (WHERE incentivised) inc, count(*) FILTER (WHERE stars = 1) s1, count(*) FILTER (WHERE stars = 5) s5, "
                + "min(review_date) first_date, max(review_date) last_date FROM " + reviews() + " GROUP BY reviewer_id";
        long mismatches = one("SELECT count(*) FROM (" + grouped + ") g FULL OUTER JOIN " + reviewers() + " r USING (reviewer_id) "
                + "WHERE g.n IS DISTINCT FROM r.reviews OR g.h IS DISTINCT FROM r.helpful_votes OR g.t IS DISTINCT FROM r.total_votes "
                + "OR g.voted IS DISTINCT FROM r.voted_reviews OR g.maj IS DISTINCT FROM r.majority_reviews "
                + "OR g.mx IS DISTINCT FROM r.max_review_votes OR g.sq IS DISTINCT FROM r.sum_squared_votes "
                + "OR g.ver IS DISTINCT FROM r.verified OR g.inc IS DISTINCT FROM r.incentivised OR g.s1 IS DISTINCT FROM r.stars_1 "
                + "OR g.s5 IS DISTINCT FROM r.stars_5 OR g.first_date IS DISTINCT FROM r.first_date "
                + "OR g.last_date IS DISTINCT FROM r.last_date");
        assertThat(mismatches).isZero();

        // The manifest's per-category star histograms.
        for (List<Object> row : query("SELECT category, count(*), count(*) FILTER (WHERE stars = 4) FROM " + reviews()
                + " GROUP BY category")) {
            StoreManifest.CategoryStats c = s.manifest().categories().get((String) row.get(0));
            assertThat(c.reviews()).as("%s", row.get(0)).isEqualTo(((Number) row.get(1)).longValue());
            assertThat(c.stars().four()).isEqualTo(((Number) row.get(2)).longValue());
        }
    }

    @Test
    void typesCompressionAndSortOrderAreAsDocumented() throws SQLException {
        Map<String, String> types = new LinkedHashMap<>();
        for (List<Object> row : query("DESCRIBE SELECT * FROM " + reviews())) {
            types.put((String) row.get(0), (String) row.get(1));
        }
        assertThat(types).containsEntry("reviewer_id", "VARCHAR").containsEntry("category", "VARCHAR")
                .containsEntry("stars", "INTEGER").containsEntry("helpful_votes", "BIGINT").containsEntry("verified", "BOOLEAN")
                .containsEntry("review_date", "DATE").containsEntry("line", "BIGINT");
        Map<String, String> table = new LinkedHashMap<>();
        for (List<Object> row : query("DESCRIBE SELECT * FROM " + reviewers())) {
            table.put((String) row.get(0), (String) row.get(1));
        }
        assertThat(table).containsEntry("first_date", "DATE").containsEntry("stars_5", "BIGINT")
                .containsEntry("categories", "STRUCT(category VARCHAR, reviews BIGINT)[]");
        assertThat(query("SELECT DISTINCT compression FROM parquet_metadata('" + store.resolve("reviews") + "/*.parquet')"))
                .containsExactly(List.of("ZSTD"));
        // Sorted by reviewer within each part (DuckDB's reading order of one file is the file's row order).
        long unsorted = one("SELECT count(*) FROM (SELECT reviewer_id, lag(reviewer_id) OVER (PARTITION BY filename ORDER BY rn) prev "
                + "FROM (SELECT reviewer_id, filename, row_number() OVER (PARTITION BY filename) rn FROM read_parquet('"
                + store.resolve("reviews") + "/*.parquet', filename = true))) WHERE prev > reviewer_id");
        assertThat(unsorted).isZero();
    }

    @Test
    void aProfileMatchesTheSameQuestionsAskedOfDuckDb() throws IOException, SQLException {
        Store s = Store.open(store);
        String id = "planted-expert";
        ReviewerProfile p = ReviewerProfile.of(id, s.reviewsOf(id), s.manifest().categories());
        ReviewerTally t = s.reviewer(id).orElseThrow();
        assertThat((long) p.reviews().size()).isEqualTo(t.reviews());
        String where = " FROM " + reviews() + " WHERE reviewer_id = '" + id + "'";
        Map<String, Long> byCategory = new TreeMap<>();
        for (List<Object> row : query("SELECT category, count(*)" + where + " GROUP BY category")) {
            byCategory.put((String) row.get(0), ((Number) row.get(1)).longValue());
        }
        Map<String, Long> ours = new TreeMap<>();
        p.categories().forEach(c -> ours.put(c.category(), c.reviews()));
        assertThat(ours).isEqualTo(byCategory);
        Map<YearMonth, Long> months = new TreeMap<>();
        for (List<Object> row : query("SELECT strftime(review_date, '%Y-%m'), count(*)" + where + " AND review_date IS NOT NULL GROUP BY 1")) {
            months.put(YearMonth.parse((String) row.get(0)), ((Number) row.get(1)).longValue());
        }
        assertThat(p.perMonth()).isEqualTo(months);
        List<Object> busiest = query("SELECT review_date::VARCHAR, count(*) n" + where
                + " GROUP BY review_date HAVING count(*) >= 2 ORDER BY n DESC, review_date LIMIT 1").stream().findFirst()
                .orElse(List.of());
        if (busiest.isEmpty()) {
            assertThat(p.busiestDays()).isEmpty();
        } else {
            assertThat(p.busiestDays().get(0).day().toString()).isEqualTo(busiest.get(0));
            assertThat(p.busiestDays().get(0).reviews()).isEqualTo(((Number) busiest.get(1)).longValue());
        }
        assertThat(p.verified()).isEqualTo(one("SELECT count(*)" + where + " AND verified"));
        assertThat(p.stars().three()).isEqualTo(one("SELECT count(*)" + where + " AND stars = 3"));
        assertThat(p.helpfulVotes()).isEqualTo(one("SELECT sum(helpful_votes)" + where));
    }
}
