package org.voteworth.bench;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.Collectors;

/**
 * Benchmark baseline: the per-reviewer tally as a user would write it for an embedded SQL engine
 * (DuckDB through JDBC): explicit column list, tab delimiter, quoting off, group by reviewer.
 *
 * <p>Two forms. By default only the sums: prints {@code rows reviewers helpful total} and writes
 * nothing (the least work an engine can do for the job, so a lower bound on its time). With
 * {@code --table OUT.csv} first, the same reviewer table {@code voteworth tally} writes (every
 * column of {@code reviewers.csv}, ordered by id) is written to {@code OUT.csv} with {@code COPY};
 * the caller checks its sums from the file.
 */
public final class DuckDbTally {
    private DuckDbTally() {
    }

    public static void main(String[] args) throws SQLException {
        List<String> rest = new ArrayList<>(Arrays.asList(args));
        String table = null;
        if (!rest.isEmpty() && rest.get(0).equals("--table")) {
            table = rest.get(1);
            rest = rest.subList(2, rest.size());
        }
        String files = rest.stream().map(DuckDbTally::quoted).collect(Collectors.joining(", "));
        String read = "read_csv([" + files + "], delim = '\\t', quote = '', escape = '', header = true, columns = {"
                + "'reviewer_id': 'VARCHAR', 'review_id': 'VARCHAR', 'item_id': 'VARCHAR', 'category': 'VARCHAR', "
                + "'star_rating': 'INTEGER', 'helpful_votes': 'BIGINT', 'total_votes': 'BIGINT', "
                + "'verified_purchase': 'VARCHAR', 'incentivised': 'VARCHAR', 'headline': 'VARCHAR', 'body': 'VARCHAR', "
                + "'review_date': 'VARCHAR'})";
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement()) {
            s.execute("SET threads = " + Runtime.getRuntime().availableProcessors());
            if (table != null) {
                s.execute("COPY (" + tableQuery(read) + ") TO " + quoted(table) + " (HEADER, DELIMITER ',')");
                return;
            }
            String sql = "SELECT sum(n), count(*), sum(h), sum(t) FROM (SELECT reviewer_id, count(*) n, sum(helpful_votes) h, "
                    + "sum(total_votes) t FROM " + read + " GROUP BY reviewer_id)";
            try (ResultSet r = s.executeQuery(sql)) {
                r.next();
                System.out.println(r.getLong(1) + " " + r.getLong(2) + " " + r.getLong(3) + " " + r.getLong(4));
            }
        }
    }

    /** Every column of the reviewer table, as the tally defines them, one row per reviewer in id order. */
    static String tableQuery(String read) {
        StringBuilder stars = new StringBuilder();
        for (int k = 1; k <= 5; k++) {
            stars.append("count(*) FILTER (star_rating = ").append(k).append(") stars_").append(k).append(", ");
        }
        return "WITH r AS (SELECT reviewer_id, category, star_rating, helpful_votes, total_votes, verified_purchase, "
                + "incentivised, review_date FROM " + read + "), "
                + "t AS (SELECT reviewer_id, count(*) reviews, sum(helpful_votes) helpful_votes, sum(total_votes) total_votes, "
                + "count(*) FILTER (total_votes > 0) voted_reviews, "
                + "count(*) FILTER (total_votes > 0 AND 2 * helpful_votes > total_votes) majority_reviews, "
                + "max(total_votes) max_review_votes, sum(total_votes * total_votes) sum_squared_votes, "
                + "count(*) FILTER (verified_purchase = 'Y') verified, count(*) FILTER (incentivised = 'Y') incentivised, "
                + stars + "min(review_date) first_date, max(review_date) last_date, "
                + "array_to_string(list_transform(map_entries(histogram(replace(replace(category, ';', '_'), ':', '_'))), "
                + "e -> e.key || ':' || e.value), ';') categories FROM r GROUP BY reviewer_id) "
                + "SELECT reviewer_id, reviews, helpful_votes, total_votes, "
                + "CASE WHEN total_votes > 0 THEN round(helpful_votes / total_votes, 6) END helpful_share, "
                + "voted_reviews, majority_reviews, max_review_votes, "
                + "round(CASE WHEN total_votes > 0 THEN max_review_votes / total_votes ELSE 0 END, 6) max_review_share, "
                + "sum_squared_votes, "
                + "round(CASE WHEN total_votes > 0 THEN sum_squared_votes / (total_votes * total_votes) ELSE 0 END, 6) herfindahl, "
                + "verified, incentivised, stars_1, stars_2, stars_3, stars_4, stars_5, first_date, last_date, categories "
                + "FROM t ORDER BY reviewer_id";
    }

    private static String quoted(String s) {
        return "'" + s.replace("'", "''") + "'";
    }
}
