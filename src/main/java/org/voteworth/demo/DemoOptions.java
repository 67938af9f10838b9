package org.voteworth.demo;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * What the demo generator writes: a dump sized by rows or by approximate uncompressed bytes.
 *
 * @param seed the random seed; the same seed and options give byte-identical files
 * @param rows logical rows to write (planted and malformed ones included), or 0 when sized by
 *     bytes; a row broken by a stray newline counts once here
 * @param targetBytes approximate uncompressed size of all files, or 0 when sized by rows; the
 *     dump stops at the first row that reaches it
 * @param categories how many product categories, 1 to {@link #MAX_CATEGORIES}, largest first;
 *     the first is split into numbered part files
 * @param gzip write {@code .tsv.gz} (true) or plain {@code .tsv}
 * @param plantCases add the reviewers of {@link PlantedCases}
 * @param malformedRows add the rows of every {@link MalformedKind}
 */
public record DemoOptions(long seed, long rows, long targetBytes, int categories, boolean gzip,
                          boolean plantCases, boolean malformedRows) {
    public static final long DEFAULT_SEED = 20261202L;
    public static final int MAX_CATEGORIES = MarketCategory.ALL.size();
    public static final int DEFAULT_CATEGORIES = MAX_CATEGORIES;

    private static final Pattern SIZE = Pattern.compile("\\s*(\\d+(?:\\.\\d+)?)\\s*([A-Za-z]*)\\s*");

    public DemoOptions {
        if (rows < 0 || targetBytes < 0 || (rows > 0) == (targetBytes > 0)) {
            throw new IllegalArgumentException("Give the demo dump either a row count or a size, not both and not"
                    + " neither (rows=" + rows + ", targetBytes=" + targetBytes + "); e.g. --rows 40000 or --size 500MB");
        }
        if (categories < 1 || categories > MAX_CATEGORIES) {
            throw new IllegalArgumentException("The demo marketplace has 1 to " + MAX_CATEGORIES
                    + " categories; " + categories + " was asked for");
        }
    }

    /** {@code n} rows with the defaults: seed {@value #DEFAULT_SEED}, all categories, gzip, planted and malformed rows. */
    public static DemoOptions rows(long n) {
        return new DemoOptions(DEFAULT_SEED, n, 0, DEFAULT_CATEGORIES, true, true, true);
    }

    /** About {@code bytes} uncompressed bytes with the defaults of {@link #rows(long)}. */
    public static DemoOptions size(long bytes) {
        return new DemoOptions(DEFAULT_SEED, 0, bytes, DEFAULT_CATEGORIES, true, true, true);
    }

    public DemoOptions withSeed(long s) {
        return new DemoOptions(s, rows, targetBytes, categories, gzip, plantCases, malformedRows);
    }

    public DemoOptions withCategories(int n) {
        return new DemoOptions(seed, rows, targetBytes, n, gzip, plantCases, malformedRows);
    }

    public DemoOptions withGzip(boolean on) {
        return new DemoOptions(seed, rows, targetBytes, categories, on, plantCases, malformedRows);
    }

    public DemoOptions withPlantCases(boolean on) {
        return new DemoOptions(seed, rows, targetBytes, categories, gzip, on, malformedRows);
    }

    public DemoOptions withMalformedRows(boolean on) {
        return new DemoOptions(seed, rows, targetBytes, categories, gzip, plantCases, on);
    }

    /** Whether the dump is sized by {@link #rows()} (else by {@link #targetBytes()}). */
    public boolean sizedByRows() {
        return rows > 0;
    }

    /**
     * Parses a size such as {@code 500MB}, {@code 4GB}, {@code 1.5GiB}, {@code 800k} or
     * {@code 123456}. Units, case-insensitive: none or B bytes; k/KB, M/MB, G/GB, T/TB powers of
     * 1000; KiB, MiB, GiB, TiB powers of 1024.
     *
     * @throws IllegalArgumentException naming the text and the accepted forms
     */
    public static long parseSize(String text) {
        Matcher m = SIZE.matcher(text == null ? "" : text);
        if (!m.matches()) {
            throw sizeError(text, "write a number and a unit");
        }
        long unit = switch (m.group(2).toLowerCase(Locale.ROOT)) {
            case "", "b" -> 1L;
            case "k", "kb" -> 1_000L;
            case "m", "mb" -> 1_000_000L;
            case "g", "gb" -> 1_000_000_000L;
            case "t", "tb" -> 1_000_000_000_000L;
            case "ki", "kib" -> 1L << 10;
            case "mi", "mib" -> 1L << 20;
            case "gi", "gib" -> 1L << 30;
            case "ti", "tib" -> 1L << 40;
            default -> throw sizeError(text, "the unit '" + m.group(2) + "' is not one of B, k, MB, GB, TB, KiB, MiB, GiB, TiB");
        };
        BigDecimal bytes = new BigDecimal(m.group(1)).multiply(BigDecimal.valueOf(unit))
                .setScale(0, RoundingMode.HALF_UP);
        if (bytes.signum() <= 0 || bytes.compareTo(BigDecimal.valueOf(Long.MAX_VALUE)) > 0) {
            throw sizeError(text, "it must be at least one byte and below 8 EiB");
        }
        return bytes.longValueExact();
    }

    private static IllegalArgumentException sizeError(String text, String why) {
        return new IllegalArgumentException("Size '" + text + "' is not understood: " + why
                + "; e.g. 500MB, 4GB, 1.5GiB or 800k");
    }
}
