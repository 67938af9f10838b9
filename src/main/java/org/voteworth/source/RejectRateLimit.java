package org.voteworth.source;

import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The share of a file's rows that may be rejected before the run stops (option
 * {@code --max-reject-rate}, default 0.05). Checked as soon as {@value #MIN_ROWS} rows of a file
 * have been read, so that a wrong delimiter or mapping stops the run early instead of producing
 * nonsense, and again at the end of every file, whatever its size. 1 turns the check off.
 *
 * @param maxRate the largest allowed rejected / read, in [0, 1]
 */
public record RejectRateLimit(double maxRate) {
    /** Rows of a file read before the rate is checked during the scan. */
    public static final int MIN_ROWS = 1000;
    public static final double DEFAULT_RATE = 0.05;

    public RejectRateLimit {
        if (!(maxRate >= 0 && maxRate <= 1)) {
            throw new IllegalArgumentException("--max-reject-rate must be between 0 and 1 (e.g. 0.05 for 5 %), got " + maxRate);
        }
    }

    /** Whether {@code rejected} of {@code read} rows is over the limit. */
    public boolean exceeded(long read, long rejected) {
        return read > 0 && rejected > maxRate * read;
    }

    /** During a scan: fails once {@value #MIN_ROWS} rows are read and the rate is over the limit. */
    void checkEarly(DumpFile file, ScanCounts c, Format format) {
        if (c.rowsRead >= MIN_ROWS && exceeded(c.rowsRead, c.rejected)) {
            throw failure(file, c, format, false);
        }
    }

    /** At the end of a file, for any number of rows. */
    void checkAtEnd(DumpFile file, ScanCounts c, Format format) {
        if (exceeded(c.rowsRead, c.rejected)) {
            throw failure(file, c, format, true);
        }
    }

    private RejectRateExceeded failure(DumpFile file, ScanCounts c, Format format, boolean atEnd) {
        StringBuilder b = new StringBuilder();
        b.append(String.format(Locale.ROOT, "%.1f %% of rows rejected (%,d of %,d read%s), over the limit of %.1f %%"
                        + " (--max-reject-rate %s); stopping.%n  Top reasons:%n",
                100.0 * c.rejected / c.rowsRead, c.rejected, c.rowsRead, atEnd ? "" : " so far", 100 * maxRate,
                stripped(maxRate)));
        List<Map.Entry<String, long[]>> top = c.byReason.entrySet().stream()
                .sorted((x, y) -> Long.compare(y.getValue()[0], x.getValue()[0])).limit(3).toList();
        for (Map.Entry<String, long[]> e : top) {
            ScanCounts.Example ex = c.examples.get(e.getKey());
            b.append(String.format(Locale.ROOT, "    %s: %,d rows, e.g. line %d: %s%s%n      row: %s%n", e.getKey(),
                    e.getValue()[0], ex.line(), ex.reject().message(),
                    ex.reject().field().equals(Reject.ROW) ? "" : " (field " + ex.reject().field() + ")", ex.row()));
        }
        ScanCounts.Example first = c.examples.get(top.get(0).getKey());
        b.append("  Likely fix: ").append(likelyFix(format, top.get(0).getKey(), first))
                .append(" To let this many rows through, raise --max-reject-rate.");
        return new RejectRateExceeded(file.toString(), b.toString());
    }

    private static String likelyFix(Format format, String reason, ScanCounts.Example ex) {
        String field = ex.reject().field();
        return switch (reason) {
            case Reject.FIELD_COUNT -> {
                if (format == Format.TSV && ex.commas() > 0 && ex.tabs() == 0) {
                    yield "the rows have commas and no tabs: the file looks comma-separated; read it with --csv.";
                }
                if (format == Format.CSV && ex.tabs() > 0 && ex.commas() == 0) {
                    yield "the rows have tabs and no commas: the file looks tab-separated; drop --csv.";
                }
                yield "the rows do not have as many fields as the header: check the delimiter (--csv for"
                        + " comma-separated files) and that the header belongs to these rows.";
            }
            case Reject.BAD_QUOTE -> format == Format.CSV && ex.tabs() > 0
                    ? "the rows have tabs: if the file is tab-separated, drop --csv (in TSV quotes are plain text)."
                    : "quoted fields are broken or span lines, which is not supported; if the file is tab-separated, drop --csv.";
            case Reject.HELPFUL_ABOVE_TOTAL -> "helpful and total may be swapped: name their columns with"
                    + " --map helpful=<header>,total=<header>.";
            case Reject.EMPTY_ROW -> "the file has many blank lines: check that it is a review dump.";
            default -> "the column read as " + field + " seems to hold something else: name the right column with --map "
                    + field + "=<header>" + (format == Format.TSV && ex.commas() > 0 && ex.tabs() == 0 ? ", or read the file with --csv." : ".");
        };
    }

    private static String stripped(double d) {
        return java.math.BigDecimal.valueOf(d).stripTrailingZeros().toPlainString();
    }
}
