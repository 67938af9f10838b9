package org.voteworth.tally;

import java.io.BufferedReader;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.StringJoiner;
import java.util.TreeMap;

/**
 * The reviewer table as a CSV file: what {@code voteworth tally} writes and what {@code rank} can
 * read instead of re-reading a dump. One row per reviewer, ordered by id; the columns are
 * {@link #HEADER}. Categories are written as {@code name:count} pairs joined by {@code ;}.
 */
public final class ReviewerTableFile {
    public static final List<String> HEADER = List.of("reviewer_id", "reviews", "helpful_votes", "total_votes",
            "helpful_share", "voted_reviews", "majority_reviews", "max_review_votes", "max_review_share",
            "sum_squared_votes", "herfindahl", "verified", "incentivised", "stars_1", "stars_2", "stars_3",
            "stars_4", "stars_5", "first_date", "last_date", "categories");

    private ReviewerTableFile() {
    }

    /** Whether {@code file} starts with the reviewer-table header. */
    public static boolean looksLikeReviewerTable(Path file) {
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String first = r.readLine();
            return first != null && first.startsWith(HEADER.get(0) + "," + HEADER.get(1));
        } catch (IOException | UncheckedIOException e) {
            return false;
        }
    }

    public static void write(TallyTable table, Path file) throws IOException {
        int[] order = table.sortedById();
        write(java.util.Arrays.stream(order).mapToObj(table::get).iterator(), file);
    }

    /** Writes tallies already ordered by id (streamed from sorted partitions); returns how many. */
    public static long write(java.util.Iterator<ReviewerTally> sorted, Path file) throws IOException {
        long n = 0;
        try (BufferedWriter w = new BufferedWriter(new java.io.OutputStreamWriter(Files.newOutputStream(file),
                StandardCharsets.UTF_8), 1 << 16)) {
            w.write(String.join(",", HEADER));
            w.write('\n');
            while (sorted.hasNext()) {
                w.write(row(sorted.next()));
                w.write('\n');
                n++;
            }
        }
        return n;
    }

    static String row(ReviewerTally t) {
        StringJoiner cats = new StringJoiner(";");
        t.reviewsByCategory().forEach((c, n) -> cats.add(c.replace(";", "_").replace(":", "_") + ":" + n));
        StringJoiner j = new StringJoiner(",");
        j.add(Csv.text(t.id())).add(Long.toString(t.reviews())).add(Long.toString(t.helpfulVotes()))
                .add(Long.toString(t.totalVotes()))
                .add(t.totalVotes() == 0 ? "" : decimal(t.helpfulShare()))
                .add(Long.toString(t.votedReviews())).add(Long.toString(t.majorityReviews()))
                .add(Long.toString(t.maxReviewVotes())).add(decimal(t.maxReviewShare()))
                .add(Long.toString(t.sumSquaredVotes())).add(decimal(t.herfindahl()))
                .add(Long.toString(t.verified())).add(Long.toString(t.incentivised()));
        for (int s = 1; s <= 5; s++) {
            j.add(Long.toString(t.stars().of(s)));
        }
        j.add(date(t.firstDay())).add(date(t.lastDay())).add(Csv.text(cats.toString()));
        return j.toString();
    }

    /** Reads a reviewer table written by {@link #write}; errors name the file, line and column. */
    public static TallyTable read(Path file) throws IOException {
        TallyTable table = new TallyTable();
        forEach(file, table::add);
        return table;
    }

    /** Hands each tally of a reviewer table written by {@link #write} to {@code each}, in file order, without holding them. */
    public static void forEach(Path file, java.util.function.Consumer<ReviewerTally> each) throws IOException {
        try (BufferedReader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            String header = r.readLine();
            if (header == null || !Csv.parseLine(header).equals(HEADER)) {
                throw new IOException(file + ": line 1: not a reviewer table (expected the header " + String.join(",", HEADER) + ")");
            }
            String line;
            long n = 1;
            while ((line = r.readLine()) != null) {
                n++;
                if (line.isEmpty()) {
                    continue;
                }
                ReviewerTally t;
                try {
                    t = parse(Csv.parseLine(line));
                } catch (RuntimeException e) {
                    throw new IOException(file + ": line " + n + ": " + e.getMessage(), e);
                }
                each.accept(t);
            }
        }
    }

    private static ReviewerTally parse(List<String> c) {
        if (c.size() != HEADER.size()) {
            throw new IllegalArgumentException("expected " + HEADER.size() + " columns, found " + c.size());
        }
        TreeMap<String, Long> cats = new TreeMap<>();
        if (!c.get(20).isEmpty()) {
            for (String pair : c.get(20).split(";")) {
                int at = pair.lastIndexOf(':');
                if (at < 0) {
                    throw new IllegalArgumentException("column categories: expected name:count, found '" + pair + "'");
                }
                cats.put(pair.substring(0, at), number(pair.substring(at + 1), "categories"));
            }
        }
        return new ReviewerTally(c.get(0), number(c.get(1), "reviews"), number(c.get(2), "helpful_votes"),
                number(c.get(3), "total_votes"), number(c.get(5), "voted_reviews"), number(c.get(6), "majority_reviews"),
                number(c.get(7), "max_review_votes"), number(c.get(9), "sum_squared_votes"), number(c.get(11), "verified"),
                number(c.get(12), "incentivised"),
                new StarCounts(number(c.get(13), "stars_1"), number(c.get(14), "stars_2"), number(c.get(15), "stars_3"),
                        number(c.get(16), "stars_4"), number(c.get(17), "stars_5")),
                cats, day(c.get(18)), day(c.get(19)));
    }

    private static long number(String v, String column) {
        try {
            return Long.parseLong(v);
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("column " + column + ": not a whole number: '" + v + "'");
        }
    }

    private static int day(String v) {
        return v.isEmpty() ? ReviewerTally.NO_DATE : Math.toIntExact(LocalDate.parse(v).toEpochDay());
    }

    private static String date(int epochDay) {
        return epochDay == ReviewerTally.NO_DATE ? "" : LocalDate.ofEpochDay(epochDay).toString();
    }

    /** {@code %.6f}; shares in [0, 1] take a fast path that gives the same digits (ties fall back to the formatter). */
    static String decimal(double v) {
        if (v >= 0 && v <= 1) {
            double x = v * 1e6;
            double frac = x - Math.floor(x);
            if (Math.abs(frac - 0.5) > 1e-6) {
                long m = Math.round(x);
                if (m >= 1_000_000) {
                    return "1.000000";
                }
                String d = Long.toString(1_000_000 + m);
                return "0." + d.substring(1);
            }
        }
        return String.format(Locale.ROOT, "%.6f", v);
    }
}
