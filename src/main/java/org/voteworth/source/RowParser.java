package org.voteworth.source;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The one definition of a valid review row: splits the bytes of one line into fields, checks
 * them and fills a {@link ReviewRow} flyweight, without making a String per field. Columns that
 * no {@link Field} is mapped to (headline, review body) are skipped undecoded; only their
 * delimiters are counted, so a stray tab in review text is caught as a wrong field count.
 *
 * <p>A row is valid when, in this order of checks:
 * <ul>
 *   <li>it is not blank (else {@value Reject#EMPTY_ROW});</li>
 *   <li>CSV only: every quoted field closes on the line and is followed by a comma or the line
 *       end (else {@value Reject#BAD_QUOTE}). A line break inside quotes is <b>not supported</b>:
 *       the scanner splits lines at every LF, so such a row and its continuation are rejected;</li>
 *   <li>it has exactly as many fields as the header ({@value Reject#FIELD_COUNT});</li>
 *   <li>the reviewer id is not empty or blank ({@value Reject#EMPTY_REVIEWER});</li>
 *   <li>helpful and total votes are non-negative whole numbers of plain ASCII digits that fit a
 *       {@code long} ({@value Reject#BAD_VOTES}) and helpful &le; total
 *       ({@value Reject#HELPFUL_ABOVE_TOTAL});</li>
 *   <li>stars, when mapped and not empty, is a whole number 1 to 5, {@code 4.0} allowed
 *       ({@value Reject#BAD_STARS});</li>
 *   <li>verified and incentivised, when mapped and not empty, are one of
 *       Y/N/yes/no/true/false/1/0 in any case ({@value Reject#BAD_FLAG});</li>
 *   <li>date, when mapped and not empty, is a real proleptic Gregorian date {@code yyyy-MM-dd},
 *       optionally followed by {@code T} or a space and a time that is ignored
 *       ({@value Reject#BAD_DATE}).</li>
 * </ul>
 * Spaces around numbers, flags and dates are ignored; text fields are kept as they are. A
 * trailing CR (CRLF files) is dropped. Empty optional fields are absent
 * ({@link ReviewRow#ABSENT}, {@link ReviewRow#NO_DATE}). The category is the category column
 * when mapped and not empty, else the category of {@link ReviewRow#file} (empty when that is
 * null). In CSV, {@code ""} in a quoted text field is turned into one quote; the row's text then
 * points into a buffer of the parser rather than the caller's.
 *
 * <p>Not thread-safe: use one parser per thread. Cheap to make.
 */
public final class RowParser {
    private static final byte QUOTE = '"';
    private static final long QUOTES = ByteScan.pattern(QUOTE);
    private static final int VALUE_LIMIT = 200;
    private static final long NOT_A_NUMBER = -1;
    private static final long TOO_LARGE = -2;
    private static final int INVALID = -2;
    private static final int BAD_DATE = Integer.MIN_VALUE + 1;
    private static final int REVIEWER = Field.REVIEWER.ordinal();
    private static final int REVIEW = Field.REVIEW.ordinal();
    private static final int ITEM = Field.ITEM.ordinal();
    private static final int CATEGORY = Field.CATEGORY.ordinal();
    private static final int STARS = Field.STARS.ordinal();
    private static final int HELPFUL = Field.HELPFUL.ordinal();
    private static final int TOTAL = Field.TOTAL.ordinal();
    private static final int VERIFIED = Field.VERIFIED.ordinal();
    private static final int INCENTIVISED = Field.INCENTIVISED.ordinal();
    private static final int DATE = Field.DATE.ordinal();

    private final ColumnMapping mapping;
    private final boolean csv;
    private final byte delimiter;
    private final long delimiters;
    private final int columnCount;
    /** Field ordinal held by each column, -1 for columns that are skipped. */
    private final int[] fieldOfColumn;
    private final int lastMappedColumn;
    /** Per field ordinal: content start and end of the current row; -1 start when unmapped. */
    private final int[] from = new int[Field.values().length];
    private final int[] to = new int[Field.values().length];
    /** CSV: whether the field's content holds {@code ""} escapes. */
    private final boolean[] escaped = new boolean[Field.values().length];
    /** CSV: where the broken quoted field starts, after {@link #splitCsv} reported one. */
    private int brokenAt;
    private byte[] scratch = new byte[256];
    private DumpFile categoryFile;
    private byte[] categoryBytes = new byte[0];

    public RowParser(ColumnMapping mapping, Format format) {
        this.mapping = Objects.requireNonNull(mapping, "mapping");
        for (Field f : Field.values()) {
            if (f.required() && !mapping.isMapped(f)) {
                throw new IllegalArgumentException("the mapping has no column for required field " + f.key());
            }
        }
        this.csv = Objects.requireNonNull(format, "format") == Format.CSV;
        this.delimiter = format.delimiter();
        this.delimiters = ByteScan.pattern(delimiter);
        this.columnCount = mapping.columnCount();
        this.fieldOfColumn = new int[columnCount];
        Field[] byColumn = mapping.fieldOfColumn();
        int last = 0;
        for (int c = 0; c < columnCount; c++) {
            fieldOfColumn[c] = byColumn[c] == null ? -1 : byColumn[c].ordinal();
            if (byColumn[c] != null) {
                last = c;
            }
        }
        this.lastMappedColumn = last;
    }

    public ColumnMapping mapping() {
        return mapping;
    }

    /**
     * Parses the line {@code buf[start, end)} (without its LF; a trailing CR is dropped) into
     * {@code into}. {@code into.file} should be set first: its category is the fallback.
     *
     * @return {@link Reject#NONE} when the row is valid and {@code into} is filled; otherwise the
     *     first problem found, and {@code into} holds nothing usable. Never throws for bad data.
     */
    public Reject parse(byte[] buf, int start, int end, ReviewRow into) {
        if (end > start && buf[end - 1] == '\r') {
            end--;
        }
        if (isBlank(buf, start, end)) {
            return new Reject(Reject.EMPTY_ROW, Reject.ROW, "", "blank line");
        }
        java.util.Arrays.fill(from, -1);
        int found;
        if (csv) {
            found = splitCsv(buf, start, end);
            if (found < 0) {
                return badQuote(buf, end, -found - 1);
            }
        } else {
            found = splitTsv(buf, start, end);
        }
        if (found != columnCount) {
            return new Reject(Reject.FIELD_COUNT, Reject.ROW, Integer.toString(found),
                    "expected " + columnCount + " fields, found " + found);
        }
        return fill(buf, start, end, into);
    }

    /** Fields found by the last {@link #scanTsv}, and where its line ends (without LF and trailing CR). */
    private int scannedFields;
    private int scannedEnd;

    /**
     * TSV only: finds the end of the line that starts at {@code b[start]} and the bounds of its
     * fields in one pass over its bytes, for {@link #parseScanned}. Faster than finding the line
     * end first and then its fields with {@link #parse}, with the same result.
     *
     * @return the index of the line's LF, or -1 when there is none before {@code limit} (the line
     *     goes on past the bytes given; nothing usable is kept)
     */
    public int scanTsv(byte[] b, int start, int limit) {
        if (csv) {
            throw new IllegalStateException("scanTsv is for tab-separated rows");
        }
        java.util.Arrays.fill(from, -1);
        int col = 0;
        int fieldStart = start;
        int i = start;
        for (; i + 8 <= limit; i += 8) {
            long m = ByteScan.atMostLineFeed(ByteScan.word(b, i));
            while (m != 0) {
                int j = i + (Long.numberOfTrailingZeros(m) >>> 3);
                m &= m - 1;
                byte c = b[j];
                if (c == '\t') {
                    scannedField(col++, fieldStart, j);
                    fieldStart = j + 1;
                } else if (c == '\n') {
                    return lineScanned(b, start, j, col, fieldStart);
                }
            }
        }
        for (; i < limit; i++) {
            byte c = b[i];
            if (c == '\t') {
                scannedField(col++, fieldStart, i);
                fieldStart = i + 1;
            } else if (c == '\n') {
                return lineScanned(b, start, i, col, fieldStart);
            }
        }
        return -1;
    }

    private int lineScanned(byte[] b, int start, int lf, int col, int fieldStart) {
        int end = lf > start && b[lf - 1] == '\r' ? lf - 1 : lf;
        scannedField(col, fieldStart, Math.max(fieldStart, end));
        scannedFields = col + 1;
        scannedEnd = end;
        return lf;
    }

    /** The bounds {@code [start, end)} of column {@code col} of the line being scanned, kept when a field is read from it. */
    private void scannedField(int col, int start, int end) {
        if (col < columnCount) {
            int f = fieldOfColumn[col];
            if (f >= 0) {
                from[f] = start;
                to[f] = end;
            }
        }
    }

    /**
     * Parses the line that the last {@link #scanTsv} found, from {@code start} to {@code lf} (its
     * LF), into {@code into}: the same checks, in the same order, and the same result as
     * {@link #parse} of that line.
     */
    public Reject parseScanned(byte[] b, int start, int lf, ReviewRow into) {
        int end = scannedEnd;
        if (isBlank(b, start, end)) {
            return new Reject(Reject.EMPTY_ROW, Reject.ROW, "", "blank line");
        }
        if (scannedFields != columnCount) {
            return new Reject(Reject.FIELD_COUNT, Reject.ROW, Integer.toString(scannedFields),
                    "expected " + columnCount + " fields, found " + scannedFields);
        }
        return fill(b, start, end, into);
    }

    /** Whether rows are tab-separated, so that {@link #scanTsv} applies. */
    public boolean tsv() {
        return !csv;
    }

    private int splitTsv(byte[] b, int start, int end) {
        int p = start;
        for (int col = 0; col <= lastMappedColumn; col++) {
            int t = ByteScan.indexOf(b, p, end, delimiter, delimiters);
            int f = fieldOfColumn[col];
            if (f >= 0) {
                from[f] = p;
                to[f] = t < 0 ? end : t;
            }
            if (t < 0) {
                return col + 1;
            }
            p = t + 1;
        }
        // Past the last mapped column only the delimiters are counted: the rest is never decoded.
        return lastMappedColumn + 2 + ByteScan.count(b, p, end, delimiter, delimiters);
    }

    /** Field count, or -(column + 1) of a quoted field that is broken. */
    private int splitCsv(byte[] b, int start, int end) {
        int p = start;
        int col = 0;
        while (true) {
            int cs;
            int ce;
            int next;
            boolean esc = false;
            if (p < end && b[p] == QUOTE) {
                int q = p + 1;
                int close;
                while (true) {
                    close = ByteScan.indexOf(b, q, end, QUOTE, QUOTES);
                    if (close < 0) {
                        brokenAt = p;
                        return -(col + 1);
                    }
                    if (close + 1 < end && b[close + 1] == QUOTE) {
                        esc = true;
                        q = close + 2;
                    } else {
                        break;
                    }
                }
                cs = p + 1;
                ce = close;
                if (close + 1 == end) {
                    next = -1;
                } else if (b[close + 1] == delimiter) {
                    next = close + 2;
                } else {
                    brokenAt = p;
                    return -(col + 1);
                }
            } else {
                int c = ByteScan.indexOf(b, p, end, delimiter, delimiters);
                cs = p;
                ce = c < 0 ? end : c;
                next = c < 0 ? -1 : c + 1;
            }
            if (col < columnCount) {
                int f = fieldOfColumn[col];
                if (f >= 0) {
                    from[f] = cs;
                    to[f] = ce;
                    escaped[f] = esc;
                }
            }
            col++;
            if (next < 0) {
                return col;
            }
            p = next;
        }
    }

    private Reject badQuote(byte[] b, int end, int column) {
        int f = column < columnCount ? fieldOfColumn[column] : -1;
        String field = f >= 0 ? Field.values()[f].key() : Reject.ROW;
        return new Reject(Reject.BAD_QUOTE, field, text(b, brokenAt, end),
                "the quoted field in column " + (column + 1) + " is not closed on this line, or text follows its"
                        + " closing quote (a line break inside quotes is not supported)");
    }

    private Reject fill(byte[] b, int start, int end, ReviewRow r) {
        int rs = from[REVIEWER];
        int re = to[REVIEWER];
        if (isBlank(b, rs, re)) {
            return new Reject(Reject.EMPTY_REVIEWER, Field.REVIEWER.key(), text(b, rs, re), "the reviewer id is empty");
        }
        long helpful = votes(b, HELPFUL);
        if (helpful < 0) {
            return badVotes(b, Field.HELPFUL, helpful);
        }
        long total = votes(b, TOTAL);
        if (total < 0) {
            return badVotes(b, Field.TOTAL, total);
        }
        if (helpful > total) {
            return new Reject(Reject.HELPFUL_ABOVE_TOTAL, Field.HELPFUL.key(), Long.toString(helpful),
                    "helpful votes " + helpful + " exceed total votes " + total);
        }
        int stars = ReviewRow.ABSENT;
        if (from[STARS] >= 0) {
            int ss = trimStart(b, from[STARS], to[STARS]);
            stars = stars(b, ss, trimEnd(b, ss, to[STARS]));
            if (stars == INVALID) {
                return new Reject(Reject.BAD_STARS, Field.STARS.key(), text(b, from[STARS], to[STARS]),
                        "stars '" + text(b, from[STARS], to[STARS]) + "' is not a whole number from 1 to 5");
            }
        }
        int verified = flag(b, VERIFIED);
        if (verified == INVALID) {
            return badFlag(b, Field.VERIFIED);
        }
        int incentivised = flag(b, INCENTIVISED);
        if (incentivised == INVALID) {
            return badFlag(b, Field.INCENTIVISED);
        }
        int day = ReviewRow.NO_DATE;
        if (from[DATE] >= 0) {
            int ds = trimStart(b, from[DATE], to[DATE]);
            int de = trimEnd(b, ds, to[DATE]);
            if (ds < de) {
                day = epochDay(b, ds, de);
                if (day == BAD_DATE) {
                    String v = text(b, from[DATE], to[DATE]);
                    return new Reject(Reject.BAD_DATE, Field.DATE.key(), v,
                            "date '" + v + "' is not a real calendar date written yyyy-MM-dd");
                }
            }
        }
        r.helpful = helpful;
        r.total = total;
        r.stars = stars;
        r.verified = verified;
        r.incentivised = incentivised;
        r.epochDay = day;
        byte[] text = b;
        int shift = 0;
        if (csv && (escaped(REVIEWER) || escaped(REVIEW) || escaped(ITEM) || escaped(CATEGORY))) {
            text = unescapeCopy(b, start, end);
            shift = -start;
        }
        r.buf = text;
        r.reviewerOff = from[REVIEWER] + shift;
        r.reviewerLen = to[REVIEWER] - from[REVIEWER];
        if (from[REVIEW] >= 0) {
            r.reviewOff = from[REVIEW] + shift;
            r.reviewLen = to[REVIEW] - from[REVIEW];
        } else {
            r.reviewOff = 0;
            r.reviewLen = 0;
        }
        if (from[ITEM] >= 0) {
            r.itemOff = from[ITEM] + shift;
            r.itemLen = to[ITEM] - from[ITEM];
        } else {
            r.itemOff = 0;
            r.itemLen = 0;
        }
        if (from[CATEGORY] >= 0 && to[CATEGORY] > from[CATEGORY]) {
            r.categoryBuf = text;
            r.categoryOff = from[CATEGORY] + shift;
            r.categoryLen = to[CATEGORY] - from[CATEGORY];
        } else {
            if (r.file != categoryFile) {
                categoryFile = r.file;
                categoryBytes = r.file == null ? new byte[0] : r.file.category().getBytes(StandardCharsets.UTF_8);
            }
            r.categoryBuf = categoryBytes;
            r.categoryOff = 0;
            r.categoryLen = categoryBytes.length;
        }
        return Reject.NONE;
    }

    private boolean escaped(int f) {
        return from[f] >= 0 && escaped[f];
    }

    /** Copies the line to the scratch buffer and turns {@code ""} into {@code "} in escaped text fields, in place. */
    private byte[] unescapeCopy(byte[] b, int start, int end) {
        int n = end - start;
        if (scratch.length < n) {
            scratch = new byte[Math.max(n, scratch.length * 2)];
        }
        System.arraycopy(b, start, scratch, 0, n);
        for (int f : new int[] {REVIEWER, REVIEW, ITEM, CATEGORY}) {
            if (escaped(f)) {
                int w = from[f] - start;
                int stop = to[f] - start;
                for (int i = w; i < stop; i++) {
                    scratch[w++] = scratch[i];
                    if (scratch[i] == QUOTE) {
                        i++;
                    }
                }
                to[f] = w + start;
            }
        }
        return scratch;
    }

    private long votes(byte[] b, int f) {
        int s = trimStart(b, from[f], to[f]);
        int e = trimEnd(b, s, to[f]);
        return s == e ? NOT_A_NUMBER : wholeNumber(b, s, e);
    }

    private Reject badVotes(byte[] b, Field f, long code) {
        String v = text(b, from[f.ordinal()], to[f.ordinal()]);
        String what = f == Field.HELPFUL ? "helpful votes" : "total votes";
        String msg = v.isBlank() ? what + " is empty"
                : code == TOO_LARGE ? what + " '" + v + "' is too large (above " + Long.MAX_VALUE + ")"
                : what + " '" + v + "' is not a non-negative whole number";
        return new Reject(Reject.BAD_VOTES, f.key(), v, msg);
    }

    private int flag(byte[] b, int f) {
        if (from[f] < 0) {
            return ReviewRow.ABSENT;
        }
        int s = trimStart(b, from[f], to[f]);
        int e = trimEnd(b, s, to[f]);
        return s == e ? ReviewRow.ABSENT : yesNo(b, s, e);
    }

    private Reject badFlag(byte[] b, Field f) {
        String v = text(b, from[f.ordinal()], to[f.ordinal()]);
        return new Reject(Reject.BAD_FLAG, f.key(), v,
                f.key() + " '" + v + "' is not one of Y/N/yes/no/true/false/1/0");
    }

    /**
     * The non-negative whole number written in ASCII digits in {@code b[s, e)}: -1 when it is
     * not one (empty, a sign, a point, any other byte), -2 when it does not fit a {@code long}.
     */
    static long wholeNumber(byte[] b, int s, int e) {
        if (s >= e) {
            return NOT_A_NUMBER;
        }
        long v = 0;
        for (int i = s; i < e; i++) {
            int d = b[i] - '0';
            if (d < 0 || d > 9) {
                return NOT_A_NUMBER;
            }
            if (v > (Long.MAX_VALUE - d) / 10) {
                for (int j = i + 1; j < e; j++) {
                    if (b[j] < '0' || b[j] > '9') {
                        return NOT_A_NUMBER;
                    }
                }
                return TOO_LARGE;
            }
            v = v * 10 + d;
        }
        return v;
    }

    /** 1 to 5, also written {@code 4.0}; or -2. */
    static int stars(byte[] b, int s, int e) {
        if (s == e) {
            return ReviewRow.ABSENT;
        }
        int dot = e;
        for (int i = s; i < e; i++) {
            if (b[i] == '.') {
                dot = i;
                break;
            }
        }
        if (dot < e) {
            if (dot + 1 == e) {
                return INVALID;
            }
            for (int i = dot + 1; i < e; i++) {
                if (b[i] != '0') {
                    return INVALID;
                }
            }
        }
        long v = wholeNumber(b, s, dot);
        return v >= 1 && v <= 5 ? (int) v : INVALID;
    }

    /** 1 for Y/yes/true/1, 0 for N/no/false/0 (any case), else -2. */
    static int yesNo(byte[] b, int s, int e) {
        int n = e - s;
        if (n == 1) {
            int c = b[s] | 0x20;
            return c == 'y' || b[s] == '1' ? 1 : c == 'n' || b[s] == '0' ? 0 : INVALID;
        }
        if (n == 2 && lower(b[s]) == 'n' && lower(b[s + 1]) == 'o') {
            return 0;
        }
        if (n == 3 && lower(b[s]) == 'y' && lower(b[s + 1]) == 'e' && lower(b[s + 2]) == 's') {
            return 1;
        }
        if (n == 4 && lower(b[s]) == 't' && lower(b[s + 1]) == 'r' && lower(b[s + 2]) == 'u' && lower(b[s + 3]) == 'e') {
            return 1;
        }
        if (n == 5 && lower(b[s]) == 'f' && lower(b[s + 1]) == 'a' && lower(b[s + 2]) == 'l'
                && lower(b[s + 3]) == 's' && lower(b[s + 4]) == 'e') {
            return 0;
        }
        return INVALID;
    }

    private static int lower(byte c) {
        return c >= 'A' && c <= 'Z' ? c + 32 : c;
    }

    /**
     * Days since 1970-01-01 of the date {@code yyyy-MM-dd} at {@code b[s, e)}, which may go on
     * with {@code T} or a space and anything after (a time, ignored); {@link #BAD_DATE} when it
     * is not a real date of the proleptic Gregorian calendar. Computed arithmetically with the
     * days-from-civil algorithm (H. Hinnant, "chrono-Compatible Low-Level Date Algorithms",
     * https://howardhinnant.github.io/date_algorithms.html).
     */
    static int epochDay(byte[] b, int s, int e) {
        if (e - s < 10 || b[s + 4] != '-' || b[s + 7] != '-') {
            return BAD_DATE;
        }
        if (e - s > 10 && b[s + 10] != 'T' && b[s + 10] != ' ') {
            return BAD_DATE;
        }
        int y = digits(b, s, 4);
        int m = digits(b, s + 5, 2);
        int d = digits(b, s + 8, 2);
        if (y < 0 || m < 1 || m > 12 || d < 1 || d > daysInMonth(y, m)) {
            return BAD_DATE;
        }
        int yy = m <= 2 ? y - 1 : y;
        int era = (yy >= 0 ? yy : yy - 399) / 400;
        int yoe = yy - era * 400;
        int doy = (153 * (m > 2 ? m - 3 : m + 9) + 2) / 5 + d - 1;
        int doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
        return era * 146097 + doe - 719468;
    }

    private static int daysInMonth(int y, int m) {
        if (m == 2) {
            return (y % 4 == 0 && (y % 100 != 0 || y % 400 == 0)) ? 29 : 28;
        }
        return m == 4 || m == 6 || m == 9 || m == 11 ? 30 : 31;
    }

    /** The n ASCII digits at b[s...] as a number, or -1 if one is not a digit. */
    private static int digits(byte[] b, int s, int n) {
        int v = 0;
        for (int i = s; i < s + n; i++) {
            int d = b[i] - '0';
            if (d < 0 || d > 9) {
                return -1;
            }
            v = v * 10 + d;
        }
        return v;
    }

    private static boolean isBlank(byte[] b, int s, int e) {
        for (int i = s; i < e; i++) {
            if (b[i] != ' ' && b[i] != '\t') {
                return false;
            }
        }
        return true;
    }

    private static int trimStart(byte[] b, int s, int e) {
        while (s < e && b[s] == ' ') {
            s++;
        }
        return s;
    }

    private static int trimEnd(byte[] b, int s, int e) {
        while (e > s && b[e - 1] == ' ') {
            e--;
        }
        return e;
    }

    /** The bytes as text for a message, cut at {@value #VALUE_LIMIT} bytes. */
    static String text(byte[] b, int s, int e) {
        if (s < 0) {
            return "";
        }
        int n = Math.min(e - s, VALUE_LIMIT);
        String t = new String(b, s, n, StandardCharsets.UTF_8);
        return n < e - s ? t + "..." : t;
    }

    /**
     * The column names of a header line {@code b[s, e)}: a leading UTF-8 byte order mark and a
     * trailing CR are dropped; in CSV, quoted names are unquoted. For callers that resolve a
     * {@link HeaderMapping} themselves.
     */
    public static List<String> splitHeader(byte[] b, int s, int e, Format format) {
        if (e - s >= 3 && b[s] == (byte) 0xEF && b[s + 1] == (byte) 0xBB && b[s + 2] == (byte) 0xBF) {
            s += 3;
        }
        if (e > s && b[e - 1] == '\r') {
            e--;
        }
        List<String> names = new ArrayList<>();
        byte d = format.delimiter();
        int p = s;
        while (true) {
            if (format == Format.CSV && p < e && b[p] == QUOTE) {
                StringBuilder name = new StringBuilder();
                int q = p + 1;
                int runStart = q;
                while (q < e) {
                    if (b[q] == QUOTE) {
                        if (q + 1 < e && b[q + 1] == QUOTE) {
                            name.append(new String(b, runStart, q + 1 - runStart, StandardCharsets.UTF_8));
                            q += 2;
                            runStart = q;
                            continue;
                        }
                        break;
                    }
                    q++;
                }
                name.append(new String(b, runStart, Math.min(q, e) - runStart, StandardCharsets.UTF_8));
                int next = q + 1;
                while (next < e && b[next] != d) {
                    next++;
                }
                names.add(name.toString());
                if (next >= e) {
                    return names;
                }
                p = next + 1;
            } else {
                int c = p;
                while (c < e && b[c] != d) {
                    c++;
                }
                names.add(new String(b, p, c - p, StandardCharsets.UTF_8));
                if (c >= e) {
                    return names;
                }
                p = c + 1;
            }
        }
    }
}
