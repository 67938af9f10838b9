package org.voteworth.source;

import java.nio.charset.StandardCharsets;

/**
 * One accepted review row, as the scanner hands it to a {@link ReviewSink}.
 *
 * <p>A flyweight: the scanner reuses one instance for every row and its byte slices point into
 * the scanner's buffer, so a sink copies what it keeps before returning. Optional fields that the
 * dump does not map carry the documented "absent" sentinel.
 */
public final class ReviewRow {
    /** {@link #stars}, {@link #verified} and {@link #incentivised} when the field is absent. */
    public static final int ABSENT = -1;
    /** {@link #epochDay} when the dump has no date column. */
    public static final int NO_DATE = Integer.MIN_VALUE;

    /** The dump file and its category; never null while a row is handed out. */
    public DumpFile file;
    /** 1-based physical line number in {@link #file} (the header is line 1). */
    public long line;

    public byte[] buf;
    public int reviewerOff, reviewerLen;
    public int reviewOff, reviewLen;
    public int itemOff, itemLen;
    /** The category bytes: a slice of {@link #buf}, or of the file's category name. */
    public byte[] categoryBuf;
    public int categoryOff, categoryLen;

    public long helpful;
    public long total;
    /** 1 to 5, or {@link #ABSENT}. */
    public int stars;
    /** 1 yes, 0 no, or {@link #ABSENT}. */
    public int verified;
    /** 1 yes, 0 no, or {@link #ABSENT}. */
    public int incentivised;
    /** Days since 1970-01-01, or {@link #NO_DATE}. */
    public int epochDay;

    public String reviewer() {
        return new String(buf, reviewerOff, reviewerLen, StandardCharsets.UTF_8);
    }

    public String review() {
        return new String(buf, reviewOff, reviewLen, StandardCharsets.UTF_8);
    }

    public String item() {
        return new String(buf, itemOff, itemLen, StandardCharsets.UTF_8);
    }

    public String category() {
        return new String(categoryBuf, categoryOff, categoryLen, StandardCharsets.UTF_8);
    }
}
