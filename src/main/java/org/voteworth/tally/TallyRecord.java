package org.voteworth.tally;

import java.io.DataInput;
import java.io.DataOutput;
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

    byte[] id = new byte[64];
    int idLength;
    /** Whether the id is a canonical number, held in {@link #number} (and as digits in {@link #id}). */
    boolean numeric;
    long number;

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
        if (id.length < 20) {
            id = new byte[64];
        }
        idLength = KeyIndex.digits(n, id, 0);
    }

    void bytesId(byte[] b, int off, int len) {
        numeric = false;
        if (id.length < len) {
            id = new byte[Math.max(len, 2 * id.length)];
        }
        System.arraycopy(b, off, id, 0, len);
        idLength = len;
    }

    String idString() {
        return new String(id, 0, idLength, StandardCharsets.UTF_8);
    }

    void addCategory(int category, int count) {
        if (categories == categoryIds.length) {
            categoryIds = Arrays.copyOf(categoryIds, 2 * categories);
            categoryCounts = Arrays.copyOf(categoryCounts, 2 * categories);
        }
        categoryIds[categories] = category;
        categoryCounts[categories++] = count;
    }

    /** Writes this tally in the spill format: kind byte, id, the counters, the categories. */
    void write(DataOutput out) throws IOException {
        if (numeric) {
            out.writeByte(NUMERIC_ID);
            out.writeLong(number);
        } else {
            out.writeByte(BYTES_ID);
            out.writeInt(idLength);
            out.write(id, 0, idLength);
        }
        out.writeInt(reviews);
        out.writeLong(helpful);
        out.writeLong(total);
        out.writeInt(voted);
        out.writeInt(majority);
        out.writeLong(maxVotes);
        out.writeLong(sumSquares);
        out.writeInt(verified);
        out.writeInt(incentivised);
        for (int k = 0; k < 5; k++) {
            out.writeInt(stars[k]);
        }
        out.writeInt(firstDay);
        out.writeInt(lastDay);
        out.writeInt(categories);
        for (int j = 0; j < categories; j++) {
            out.writeInt(categoryIds[j]);
            out.writeInt(categoryCounts[j]);
        }
    }

    /**
     * Reads the next tally written by {@link #write}, mapping its category ids through
     * {@code categoryMap}; false at the end mark.
     */
    boolean read(DataInput in, int[] categoryMap) throws IOException {
        int kind = in.readByte();
        if (kind == END) {
            return false;
        }
        if (kind == NUMERIC_ID) {
            numericId(in.readLong());
        } else {
            int len = in.readInt();
            if (id.length < len) {
                id = new byte[Math.max(len, 2 * id.length)];
            }
            in.readFully(id, 0, len);
            idLength = len;
            numeric = false;
        }
        reviews = in.readInt();
        helpful = in.readLong();
        total = in.readLong();
        voted = in.readInt();
        majority = in.readInt();
        maxVotes = in.readLong();
        sumSquares = in.readLong();
        verified = in.readInt();
        incentivised = in.readInt();
        for (int k = 0; k < 5; k++) {
            stars[k] = in.readInt();
        }
        firstDay = in.readInt();
        lastDay = in.readInt();
        int n = in.readInt();
        categories = 0;
        for (int j = 0; j < n; j++) {
            int c = in.readInt();
            addCategory(categoryMap[c], in.readInt());
        }
        return true;
    }
}
