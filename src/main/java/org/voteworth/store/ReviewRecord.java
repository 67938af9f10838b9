package org.voteworth.store;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import org.voteworth.source.ReviewRow;

/**
 * One review as the store sorts it: a compact byte record, so that millions of them sit in a few
 * arrays and spill to disk as they are. Layout (big-endian): part, review date (epoch day or
 * {@link ReviewRow#NO_DATE}), file number, piece start, line within the piece, then the reviewer,
 * review and item ids (unsigned 16-bit length and UTF-8 bytes; length 0 = absent), category number,
 * stars, verified and incentivised (-1 when absent), helpful and total votes.
 *
 * <p>The order is the store's: part, reviewer id (unsigned bytes, as Parquet's statistics
 * compare), date (undated first), then input order (file, piece, line).
 */
final class ReviewRecord {
    private static final VarHandle INT = MethodHandles.byteArrayViewVarHandle(int[].class, ByteOrder.BIG_ENDIAN);
    private static final VarHandle LONG = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.BIG_ENDIAN);
    private static final int MAX_ID = 0xFFFF;
    static final int DAY = 4;
    static final int FILE = 8;
    static final int PIECE = 12;
    static final int LINE = 20;
    static final int REVIEWER = 28;
    private static final int FIXED_TAIL = 4 + 3 + 16;

    private ReviewRecord() {
    }

    /** Bytes {@link #encode} needs for {@code row}. */
    static int size(ReviewRow row) {
        return REVIEWER + 6 + row.reviewerLen + row.reviewLen + row.itemLen + FIXED_TAIL;
    }

    /** Writes {@code row} at {@code b[at]}; returns the offset after it. */
    static int encode(ReviewRow row, int part, int file, long piece, int category, byte[] b, int at) {
        return encode(part, row.epochDay, file, piece, row.line, row.buf, row.reviewerOff, row.reviewerLen, row.reviewOff,
                row.reviewLen, row.itemOff, row.itemLen, category, row.stars, row.verified, row.incentivised, row.helpful,
                row.total, b, at, row.file.toString());
    }

    static int encode(int part, int day, int file, long piece, long line, byte[] ids, int reviewerOff, int reviewerLen,
                      int reviewOff, int reviewLen, int itemOff, int itemLen, int category, int stars, int verified,
                      int incentivised, long helpful, long total, byte[] b, int at, String where) {
        INT.set(b, at, part);
        INT.set(b, at + DAY, day);
        INT.set(b, at + FILE, file);
        LONG.set(b, at + PIECE, piece);
        LONG.set(b, at + LINE, line);
        int p = at + REVIEWER;
        p = id(ids, reviewerOff, reviewerLen, b, p, "reviewer", where, line);
        p = id(ids, reviewOff, reviewLen, b, p, "review", where, line);
        p = id(ids, itemOff, itemLen, b, p, "item", where, line);
        INT.set(b, p, category);
        b[p + 4] = (byte) stars;
        b[p + 5] = (byte) verified;
        b[p + 6] = (byte) incentivised;
        LONG.set(b, p + 7, helpful);
        LONG.set(b, p + 15, total);
        return p + 23;
    }

    private static int id(byte[] src, int off, int len, byte[] b, int p, String field, String where, long line) {
        if (len > MAX_ID) {
            throw new IllegalArgumentException(where + ": line " + line + ": field " + field + ": an id of " + len
                    + " bytes is longer than the store keeps (" + MAX_ID + ")");
        }
        b[p] = (byte) (len >>> 8);
        b[p + 1] = (byte) len;
        System.arraycopy(src, off, b, p + 2, len);
        return p + 2 + len;
    }

    /** The record's length in bytes. */
    static int length(byte[] b, int at) {
        int p = at + REVIEWER;
        for (int k = 0; k < 3; k++) {
            p += 2 + idLength(b, p);
        }
        return p + 23 - at;
    }

    static int idLength(byte[] b, int p) {
        return (b[p] & 0xFF) << 8 | (b[p + 1] & 0xFF);
    }

    static int part(byte[] b, int at) {
        return (int) INT.get(b, at);
    }

    static int day(byte[] b, int at) {
        return (int) INT.get(b, at + DAY);
    }

    static int file(byte[] b, int at) {
        return (int) INT.get(b, at + FILE);
    }

    static long piece(byte[] b, int at) {
        return (long) LONG.get(b, at + PIECE);
    }

    static long line(byte[] b, int at) {
        return (long) LONG.get(b, at + LINE);
    }

    /** Offset of the reviewer id's length; the review id follows it, then the item id. */
    static int reviewerAt(int at) {
        return at + REVIEWER;
    }

    static int next(byte[] b, int idAt) {
        return idAt + 2 + idLength(b, idAt);
    }

    static String text(byte[] b, int idAt) {
        return new String(b, idAt + 2, idLength(b, idAt), StandardCharsets.UTF_8);
    }

    /** Offset of the category number, after the three ids. */
    static int tailAt(byte[] b, int at) {
        return next(b, next(b, next(b, reviewerAt(at))));
    }

    static int category(byte[] b, int tail) {
        return (int) INT.get(b, tail);
    }

    static int stars(byte[] b, int tail) {
        return b[tail + 4];
    }

    static int verified(byte[] b, int tail) {
        return b[tail + 5];
    }

    static int incentivised(byte[] b, int tail) {
        return b[tail + 6];
    }

    static long helpful(byte[] b, int tail) {
        return (long) LONG.get(b, tail + 7);
    }

    static long total(byte[] b, int tail) {
        return (long) LONG.get(b, tail + 15);
    }

    /**
     * The part (high 16 bits) and the reviewer id's first six bytes (zero-padded): compared as
     * unsigned numbers, two records' keys are ordered as the records are, or equal.
     */
    static long prefixKey(byte[] b, int at) {
        long k = (long) part(b, at) << 48;
        int r = at + REVIEWER;
        int len = idLength(b, r);
        for (int i = 0; i < 6; i++) {
            k |= (long) (i < len ? b[r + 2 + i] & 0xFF : 0) << (40 - 8 * i);
        }
        return k;
    }

    /** The store's order of two records. */
    static int compare(byte[] a, int ao, byte[] b, int bo) {
        int c = Integer.compare(part(a, ao), part(b, bo));
        if (c != 0) {
            return c;
        }
        int ar = ao + REVIEWER;
        int br = bo + REVIEWER;
        c = Arrays.compareUnsigned(a, ar + 2, ar + 2 + idLength(a, ar), b, br + 2, br + 2 + idLength(b, br));
        if (c != 0) {
            return c;
        }
        c = Integer.compare(day(a, ao), day(b, bo));
        if (c != 0) {
            return c;
        }
        c = Integer.compare(file(a, ao), file(b, bo));
        if (c != 0) {
            return c;
        }
        c = Long.compare(piece(a, ao), piece(b, bo));
        return c != 0 ? c : Long.compare(line(a, ao), line(b, bo));
    }
}
