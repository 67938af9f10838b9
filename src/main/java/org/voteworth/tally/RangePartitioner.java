package org.voteworth.tally;

import java.util.Arrays;

/**
 * Splits reviewer ids into ranges of the output order, so that partitions merged one at a time
 * can be written one after another with no merge between them: every id of partition {@code p}
 * comes before every id of partition {@code p + 1} in {@link IdOrder}.
 *
 * <p>An id's partition is decided by its first eight bytes read as an unsigned big-endian number
 * ({@link #key}): zero past the id's end, and from the first byte outside ASCII on all ones, so
 * that the key never contradicts String order (it may tie ids that differ later). The boundaries
 * are quantiles of a sample of keys taken from the tallies themselves; a sample whose keys mostly
 * tie gives fewer, larger partitions, which {@link BoundedTally} then merges in smaller pieces.
 */
final class RangePartitioner {
    private static final long HIGH_BITS = 0x8080808080808080L;

    /** Sorted (unsigned) distinct lower bounds of partitions 1 .. n-1; partition 0 starts at the lowest key. */
    private final long[] bounds;

    private RangePartitioner(long[] bounds) {
        this.bounds = bounds;
    }

    /**
     * Boundaries at the quantiles of {@code sample} (keys from {@link #key}), aiming at {@code parts}
     * partitions of about equal size; {@code sample} is sorted in place.
     */
    static RangePartitioner fromSample(long[] sample, int count, int parts) {
        if (parts < 1 || parts > 256) {
            throw new IllegalArgumentException("1 to 256 partitions, not " + parts);
        }
        long[] keys = Arrays.copyOf(sample, count);
        // Unsigned order: flip the sign bit, sort signed, flip back.
        for (int i = 0; i < count; i++) {
            keys[i] ^= Long.MIN_VALUE;
        }
        Arrays.sort(keys);
        long[] b = new long[parts - 1];
        int n = 0;
        for (int p = 1; p < parts && count > 0; p++) {
            long k = keys[(int) ((long) p * count / parts)] ^ Long.MIN_VALUE;
            // A boundary equal to the previous one, or to the smallest key, would make an empty partition.
            if ((n == 0 && Long.compareUnsigned(k, keys[0] ^ Long.MIN_VALUE) > 0)
                    || (n > 0 && Long.compareUnsigned(k, b[n - 1]) > 0)) {
                b[n++] = k;
            }
        }
        return new RangePartitioner(Arrays.copyOf(b, n));
    }

    /** Number of partitions. */
    int parts() {
        return bounds.length + 1;
    }

    /** The partition of the id whose key is {@code key}: how many boundaries are at or below it. */
    int of(long key) {
        long[] b = bounds;
        int lo = 0;
        int hi = b.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (Long.compareUnsigned(b[mid], key) <= 0) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * The partition key of an id of which {@code chunk} holds the first eight bytes, big-endian and
     * zero-padded ({@link KeyIndex#chunk}): the same with every byte from the first non-ASCII one
     * set to 0xFF. Non-ASCII ids are ordered by their decoded Strings, whose order can differ from
     * that of their bytes; all ones makes them tie instead.
     */
    static long key(long chunk) {
        long high = chunk & HIGH_BITS;
        if (high == 0) {
            return chunk;
        }
        int firstHigh = Long.numberOfLeadingZeros(high) & ~7;
        return chunk | (-1L >>> firstHigh);
    }

    /** {@link #key} of the id whose UTF-8 bytes are {@code b[off, off+len)}. */
    static long keyOf(byte[] b, int off, int len) {
        long k = 0;
        for (int i = 0; i < 8; i++) {
            k = k << 8 | (i < len ? b[off + i] & 0xFF : 0);
        }
        return key(k);
    }

    @Override
    public String toString() {
        return "RangePartitioner[" + parts() + " parts]";
    }
}
