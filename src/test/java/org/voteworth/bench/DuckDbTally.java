package org.voteworth.bench;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * Benchmark baseline: the per-reviewer tally as a user would write it for an embedded SQL engine
 * (DuckDB through JDBC): explicit column list, tab delimiter, quoting off, group by reviewer.
 * Prints {@code rows reviewers helpful total}; the row count is checked against the caller's.
 */
public final class DuckDbTally {
    private DuckDbTally() {
    }

    public static void main(String[] args) throws SQLException {
        String files = Arrays.stream(args).map(f -> "'" + f.replace("'", "''") + "'").collect(Collectors.joining(", "));
        String read = "read_csv([" + files + "], delim = '\\t', quote = '', escape = '', header = true, columns = {"
                + "'reviewer_id': 'VARCHAR', 'review_id': 'VARCHAR', 'item_id': 'VARCHAR', 'category': 'VARCHAR', "
                + "'star_rating': 'INTEGER', 'helpful_votes': 'BIGINT', 'total_votes': 'BIGINT', "
                + "'verified_purchase': 'VARCHAR', 'incentivised': 'VARCHAR', 'headline': 'VARCHAR', 'body': 'VARCHAR', "
                + "'review_date': 'VARCHAR'})";
        String sql = "SELECT sum(n), count(*), sum(h), sum(t) FROM (SELECT reviewer_id, count(*) n, sum(helpful_votes) h, "
                + "sum(total_votes) t FROM " + read + " GROUP BY reviewer_id)";
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement()) {
            s.execute("SET threads = " + Runtime.getRuntime().availableProcessors());
            try (ResultSet r = s.executeQuery(sql)) {
                r.next();
                System.out.println(r.getLong(1) + " " + r.getLong(2) + " " + r.getLong(3) + " " + r.getLong(4));
            }
        }
    }
}
