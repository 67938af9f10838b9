package org.voteworth.tally;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * One reviewer's tally as plain fields, reused from reviewer to reviewer: how tallies travel from
 * a {@link TallyTable} to spill files, back into another table, and into the reviewer table file
 * without an object per reviewer. Category ids refer to a dictionary the holder knows (the
 * table's, or the merge's).
 */
final class TallyRecord {
    /** Kind bytes of the spill format: what comes next. */
    static final int NUMERIC_ID = 0;
    static final int BYTES_ID = 1;
    static final int END = 2;

    private byte[] id = new byte[64];
    private int idLength;
    /** Whether the id is a canonical number, held in {@link #number}; its digits are made when asked for. */
    boolean numeric;
    long number;
    private boolean digitsMade;

    int reviews;
    int voted;
    int majority;
    int verified;
    int incentivised;
    final int[] stars = new int[5];
    int firstDay;
    int lastDay;
    long helpful;
    long total;
    long maxVotes;
    long sumSquares;

    int categories;
    int[] categoryIds = new int[8];
    int[] categoryCounts = new int[8];

    void numericId(long n) {
        numeric = true;
        number = n;
        digitsMade = false;
    }

    /** Room for a byte id of {@code len} bytes, to be filled and then confirmed with {@link #bytesId(int)}. */
    byte[] idRoom(int len) {
        if (id.length < len) {
            id = new byte[Math.max(len, 2 * id.length)];
        }
        return id;
    }

    /** The id is the first {@code len} bytes of {@link #idRoom}. */
    void bytesId(int len) {
        numeric = false;
        idLength = len;
    }

    /** The id as UTF-8 bytes, the first {@link #idLength()} of them. */
    byte[] idBytes() {
        if (numeric && !digitsMade) {
            idLength = KeyIndex.digits(number, id, 0);
            digitsMade = true;
        }
        return id;
    }

    int idLength() {
        idBytes();
        return idLength;
    }

    /** Which of {@code pieces} the id falls in by its hash: the same as {@link KeyIndex#partition} for a slot with this id. */
    int pieceOf(int pieces) {
        return numeric ? KeyIndex.pieceOfNumber(number, pieces) : KeyIndex.pieceOfBytes(id, 0, idLength, pieces);
    }

    String idString() {
        return new String(idBytes(), 0, idLength, StandardCharsets.UTF_8);
    }

    /** This tally as a value; category ids are ids of {@code names}. */
    ReviewerTally toTally(Categories names) {
        java.util.TreeMap<String, Long> cats = new java.util.TreeMap<>();
        for (int j = 0; j < categories; j++) {
            cats.merge(names.name(categoryIds[j]), (long) categoryCounts[j], Long::sum);
        }
        return new ReviewerTally(idString(), reviews, helpful, total, voted, majority, maxVotes, sumSquares, verified,
                incentivised, new StarCounts(stars[0], stars[1], stars[2], stars[3], stars[4]), cats, firstDay, lastDay);
    }

    /** Sets this record to the tally {@code t}, its categories as ids of {@code names} (added when new). */
    void set(ReviewerTally t, Categories names) {
        byte[] b = t.id().getBytes(StandardCharsets.UTF_8);
        long n = KeyIndex.canonicalNumber(b, 0, b.length);
        if (n >= 0) {
            numericId(n);
        } else {
            System.arraycopy(b, 0, idRoom(b.length), 0, b.length);
            bytesId(b.length);
        }
        reviews = Math.toIntExact(t.reviews());
        helpful = t.helpfulVotes();
        total = t.totalVotes();
        voted = Math.toIntExact(t.votedReviews());
        majority = Math.toIntExact(t.majorityReviews());
        maxVotes = t.maxReviewVotes();
        sumSquares = t.sumSquaredVotes();
        verified = Math.toIntExact(t.verified());
        incentivised = Math.toIntExact(t.incentivised());
        for (int k = 1; k <= 5; k++) {
            stars[k - 1] = Math.toIntExact(t.stars().of(k));
        }
        firstDay = t.firstDay();
        lastDay = t.lastDay();
        categories = 0;
        t.reviewsByCategory().forEach((c, k) -> addCategory(names.idOf(c), Math.toIntExact(k)));
    }

    void addCategory(int category, int count) {
        if (categories == categoryIds.length) {
            categoryIds = Arrays.copyOf(categoryIds, 2 * categories);
            categoryCounts = Arrays.copyOf(categoryCounts, 2 * categories);
        }
        categoryIds[categories] = category;
        categoryCounts[categories++] = count;
    }

    /** Writes this tally in the spill format ({@link SpillFile}): kind byte, id, the counters, the categories. */
    void write(SpillFile.Out out) throws IOException {
        if (numeric) {
            out.write(NUMERIC_ID);
            out.number(number);
        } else {
            out.write(BYTES_ID);
            out.bytes(id, 0, idLength);
        }
        out.number(reviews);
        out.number(helpful);
        out.number(total);
        out.number(voted);
        out.number(majority);
        out.number(maxVotes);
        out.number(sumSquares);
        out.number(verified);
        out.number(incentivised);
        for (int k = 0; k < 5; k++) {
            out.number(stars[k]);
        }
        out.signed(firstDay);
        out.signed(lastDay);
        out.number(categories);
        for (int j = 0; j < categories; j++) {
            out.number(categoryIds[j]);
            out.number(categoryCounts[j]);
        }
    }

    /**
     * Reads the next tally written by {@link #write}, mapping its category ids through
     * {@code categoryMap}; false at the end mark.
     */
    boolean read(SpillFile.In in, int[] categoryMap) throws IOException {
        int kind = in.read();
        if (kind == END) {
            return false;
        }
        if (kind == NUMERIC_ID) {
            numericId(in.number());
        } else {
            id = in.bytes(id, length);
            bytesId(length[0]);
        }
        reviews = (int) in.number();
        helpful = in.number();
        total = in.number();
        voted = (int) in.number();
        majority = (int) in.number();
        maxVotes = in.number();
        sumSquares = in.number();
        verified = (int) in.number();
        incentivised = (int) in.number();
        for (int k = 0; k < 5; k++) {
            stars[k] = (int) in.number();
        }
        firstDay = in.signed();
        lastDay = in.signed();
        int n = (int) in.number();
        categories = 0;
        for (int j = 0; j < n; j++) {
            int c = (int) in.number();
            addCategory(categoryMap[c], (int) in.number());
        }
        return true;
    }

    private final int[] length = new int[1];
}
