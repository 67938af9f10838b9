package org.voteworth.tally;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.OutputStream;
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
    /** {@link #HEADER} as the table's first line, with its LF. */
    static final String HEADER_LINE = String.join(",", HEADER) + "\n";

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
        write(table, file, WrittenTally.NONE);
    }

    /** As {@link #write(TallyTable, Path)}, telling {@code each} every tally written, in id order. */
    static void write(TallyTable table, Path file, WrittenTally each) throws IOException {
        writeSorted(table, new Rows(Files.newOutputStream(file), table.categoryDictionary(), each));
    }

    /** Writes every tally of {@code table} in id order to {@code rows}, and closes them; returns the rows written. */
    static long writeSorted(TallyTable table, Rows rows) throws IOException {
        try (rows) {
            TallyRecord r = new TallyRecord();
            for (int s : table.sortedById()) {
                table.load(s, r, null);
                rows.write(r);
            }
            return rows.count();
        }
    }

    /** Writes tallies already ordered by id (streamed from sorted partitions); returns how many. */
    public static long write(java.util.Iterator<ReviewerTally> sorted, Path file) throws IOException {
        Categories dictionary = new Categories();
        try (Rows rows = new Rows(Files.newOutputStream(file), dictionary, WrittenTally.NONE)) {
            TallyRecord r = new TallyRecord();
            while (sorted.hasNext()) {
                r.set(sorted.next(), dictionary);
                rows.write(r);
            }
            return rows.count();
        }
    }

    /**
     * Writes the reviewer table row by row from {@link TallyRecord}s given in id order, formatting
     * straight into a byte buffer. Category ids of the records refer to the names given.
     */
    static final class Rows implements AutoCloseable {
        private static final int FLUSH_AT = 1 << 16;
        /** Most bytes of a row between its id and its categories: 17 numbers of up to 20 characters, 3 shares, 2 dates, commas. */
        private static final int FIXED_PART = 17 * 21 + 3 * 9 + 2 * 11 + 8;
        private final OutputStream out;
        private final WrittenTally each;
        /** Category names by id; may grow while rows are written. */
        private final Categories names;
        /** Per category id seen so far: the name with ';' and ':' made '_', as UTF-8. */
        private byte[][] cell = new byte[0][];
        /** Per category id seen so far: whether the name can go into the cell without quoting or neutralising. */
        private boolean[] plain = new boolean[0];
        private byte[] buf = new byte[FLUSH_AT + 4096];
        private int len;
        private long count;
        private int[] order = new int[8];

        /** With {@code each} told every tally written ({@link WrittenTally#NONE} to skip). */
        Rows(OutputStream out, Categories categoryNames, WrittenTally each) throws IOException {
            this(out, categoryNames, each, true);
        }

        /** As {@link #Rows(OutputStream, Categories, WrittenTally)}; without the header line when {@code header} is false (one piece of a table written in pieces). */
        Rows(OutputStream out, Categories categoryNames, WrittenTally each, boolean header) {
            this.out = out;
            this.each = each;
            names = categoryNames;
            if (header) {
                ascii(HEADER_LINE);
            }
        }

        /** Makes the cell text of every category id below {@code n} ready. */
        private void known(int n) {
            if (n <= cell.length) {
                return;
            }
            int from = cell.length;
            cell = java.util.Arrays.copyOf(cell, Math.max(n, names.size()));
            plain = java.util.Arrays.copyOf(plain, cell.length);
            for (int c = from; c < cell.length; c++) {
                String v = cellName(names.name(c));
                cell[c] = v.getBytes(StandardCharsets.UTF_8);
                // The pair as the first of a cell: no quoting needed and nothing to neutralise.
                plain[c] = Csv.text(v + ":1").equals(v + ":1");
            }
        }

        private static String cellName(String category) {
            return category.replace(";", "_").replace(":", "_");
        }

        /** Rows written so far. */
        long count() {
            return count;
        }

        void write(TallyRecord r) throws IOException {
            id(r);
            // Room for every number, share and date of the row at once: the writes below do not check.
            room(FIXED_PART);
            cell(r.reviews);
            cell(r.helpful);
            cell(r.total);
            put((byte) ',');
            if (r.total != 0) {
                decimal((double) r.helpful / r.total);
            }
            cell(r.voted);
            cell(r.majority);
            cell(r.maxVotes);
            put((byte) ',');
            decimal(r.total == 0 ? 0 : (double) r.maxVotes / r.total);
            cell(r.sumSquares);
            put((byte) ',');
            decimal(r.total == 0 ? 0 : r.sumSquares / ((double) r.total * r.total));
            cell(r.verified);
            cell(r.incentivised);
            for (int k = 0; k < 5; k++) {
                cell(r.stars[k]);
            }
            put((byte) ',');
            date(r.firstDay);
            put((byte) ',');
            date(r.lastDay);
            put((byte) ',');
            categories(r);
            room(1);
            put((byte) '\n');
            count++;
            each.written(r, names);
            if (len >= FLUSH_AT) {
                out.write(buf, 0, len);
                len = 0;
            }
        }

        private void id(TallyRecord r) {
            byte[] id = r.idBytes();
            int n = r.idLength();
            boolean raw = r.numeric;
            if (!raw && n > 0) {
                byte first = id[0];
                raw = first != '=' && first != '+' && first != '-' && first != '@' && first != '\t' && first != '\r'
                        && first != '\'';
                for (int i = 0; i < n && raw; i++) {
                    byte c = id[i];
                    raw = c >= 0 && c != ',' && c != '"' && c != '\n' && c != '\r';
                }
            }
            if (raw) {
                room(n);
                System.arraycopy(id, 0, buf, len, n);
                len += n;
            } else {
                utf8(Csv.text(r.idString()));
            }
        }

        /** The categories as name:count pairs in name order, joined by ';', as one text cell. */
        private void categories(TallyRecord r) {
            int n = r.categories;
            if (n == 1) {
                // Most reviewers review in one category: nothing to sort or join.
                int c = r.categoryIds[0];
                known(c + 1);
                if (plain[c]) {
                    byte[] name = cell[c];
                    room(name.length + 24);
                    System.arraycopy(name, 0, buf, len, name.length);
                    len += name.length;
                    put((byte) ':');
                    number(r.categoryCounts[0]);
                    return;
                }
            }
            if (order.length < n) {
                order = new int[2 * n];
            }
            // A reviewer has a few categories: insertion sort by name.
            for (int j = 0; j < n; j++) {
                known(r.categoryIds[j] + 1);
                String name = names.name(r.categoryIds[j]);
                int k = j - 1;
                while (k >= 0 && names.name(r.categoryIds[order[k]]).compareTo(name) > 0) {
                    order[k + 1] = order[k];
                    k--;
                }
                order[k + 1] = j;
            }
            boolean fast = true;
            for (int j = 0; j < n && fast; j++) {
                fast = plain[r.categoryIds[order[j]]]
                        && (j == 0 || !names.name(r.categoryIds[order[j]]).equals(names.name(r.categoryIds[order[j - 1]])));
            }
            if (fast) {
                for (int j = 0; j < n; j++) {
                    int at = order[j];
                    byte[] name = cell[r.categoryIds[at]];
                    room(name.length + 24);
                    if (j > 0) {
                        put((byte) ';');
                    }
                    System.arraycopy(name, 0, buf, len, name.length);
                    len += name.length;
                    put((byte) ':');
                    number(r.categoryCounts[at]);
                }
                return;
            }
            TreeMap<String, Long> byName = new TreeMap<>();
            for (int j = 0; j < n; j++) {
                byName.merge(names.name(r.categoryIds[j]), (long) r.categoryCounts[j], Long::sum);
            }
            StringJoiner cats = new StringJoiner(";");
            byName.forEach((c, k) -> cats.add(cellName(c) + ":" + k));
            utf8(Csv.text(cats.toString()));
        }

        /** A comma, then the number. */
        private void cell(long v) {
            put((byte) ',');
            number(v);
        }

        private void number(long v) {
            if (v < 0) {
                ascii(Long.toString(v));
                return;
            }
            if (v < 10) {
                // Most counts of most reviewers are one digit.
                buf[len++] = (byte) ('0' + v);
            } else {
                len += KeyIndex.digits(v, buf, len);
            }
        }

        /** {@code %.6f}; shares in [0, 1] take a fast path that gives the same digits (ties fall back to the formatter). */
        void decimal(double v) {
            if (v >= 0 && v <= 1) {
                room(8);
                // Most shares of most reviewers are exactly 0 or 1 (one review, or none voted on).
                if (v == 0 || v == 1) {
                    System.arraycopy(v == 0 ? ZERO : ONE, 0, buf, len, 8);
                    len += 8;
                    return;
                }
                double x = v * 1e6;
                int whole = (int) x;
                double frac = x - whole;
                if (Math.abs(frac - 0.5) > 1e-6) {
                    int m = frac > 0.5 ? whole + 1 : whole;
                    if (m >= 1_000_000) {
                        System.arraycopy(ONE, 0, buf, len, 8);
                        len += 8;
                        return;
                    }
                    buf[len++] = '0';
                    buf[len++] = '.';
                    for (int i = 5; i >= 0; i--) {
                        buf[len + i] = (byte) ('0' + m % 10);
                        m /= 10;
                    }
                    len += 6;
                    return;
                }
            }
            ascii(String.format(Locale.ROOT, "%.6f", v));
        }

        private static final byte[] ZERO = "0.000000".getBytes(StandardCharsets.US_ASCII);
        private static final byte[] ONE = "1.000000".getBytes(StandardCharsets.US_ASCII);

        private void date(int epochDay) {
            if (epochDay == ReviewerTally.NO_DATE) {
                return;
            }
            // Civil date from days since 1970-01-01 (the days-to-civil algorithm of H. Hinnant's
            // "chrono-Compatible Low-Level Date Algorithms"), for years 0 to 9999.
            long z = epochDay + 719468L;
            long era = (z >= 0 ? z : z - 146096) / 146097;
            long doe = z - era * 146097;
            long yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
            long doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
            long mp = (5 * doy + 2) / 153;
            int d = (int) (doy - (153 * mp + 2) / 5 + 1);
            int m = (int) (mp < 10 ? mp + 3 : mp - 9);
            long y = yoe + era * 400 + (m <= 2 ? 1 : 0);
            if (y < 0 || y > 9999) {
                ascii(LocalDate.ofEpochDay(epochDay).toString());
                return;
            }
            fixed((int) y, 4);
            buf[len++] = '-';
            fixed(m, 2);
            buf[len++] = '-';
            fixed(d, 2);
        }

        private void fixed(int v, int width) {
            for (int i = width - 1; i >= 0; i--) {
                buf[len + i] = (byte) ('0' + v % 10);
                v /= 10;
            }
            len += width;
        }

        private void ascii(String s) {
            room(s.length());
            for (int i = 0; i < s.length(); i++) {
                buf[len++] = (byte) s.charAt(i);
            }
        }

        private void utf8(String s) {
            byte[] b = s.getBytes(StandardCharsets.UTF_8);
            room(b.length);
            System.arraycopy(b, 0, buf, len, b.length);
            len += b.length;
        }

        /** One byte; only where {@link #write} made room for it, or after {@link #room}. */
        private void put(byte b) {
            buf[len++] = b;
        }

        private void room(int n) {
            if (len + n > buf.length) {
                buf = java.util.Arrays.copyOf(buf, Math.max(2 * buf.length, len + n));
            }
        }

        @Override
        public void close() throws IOException {
            try (out) {
                out.write(buf, 0, len);
                len = 0;
            }
        }
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
}
