package org.voteworth.source;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;

/**
 * Finds and counts one byte value in a byte array eight bytes at a time (SWAR: SIMD within a
 * register). The zero-byte test is the exact form from Hacker's Delight, 2nd ed., section 6-1
 * (no false positives, so the mask can also be counted).
 */
final class ByteScan {
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long LOW7 = 0x7F7F7F7F7F7F7F7FL;
    private static final long ONES = 0x0101010101010101L;

    private ByteScan() {
    }

    /** A word with {@code b} in every byte, for {@link #indexOf} and {@link #count}. */
    static long pattern(byte b) {
        return (b & 0xFFL) * ONES;
    }

    /** 0x80 in exactly the bytes of {@code w} that equal the pattern's byte, 0 elsewhere. */
    private static long matches(long w, long pattern) {
        long x = w ^ pattern;
        return ~(((x & LOW7) + LOW7) | x | LOW7);
    }

    /** The eight bytes at {@code a[i...]} as a little-endian word (byte i lowest). */
    static long word(byte[] a, int i) {
        return (long) LONGS.get(a, i);
    }

    /**
     * 0x80 in exactly the bytes of {@code w} that are at most 0x0A (tab, line feed and the rarer
     * control bytes below them), 0 elsewhere: one test finds both a TSV line's delimiters and its end.
     * Adding 0x75 to the low seven bits sets the high bit from 0x0B up, and cannot carry into the next byte.
     */
    static long atMostLineFeed(long w) {
        return ~(((w & LOW7) + 0x7575757575757575L) | w | LOW7);
    }

    /** First index in [from, to) holding {@code b}, or -1. */
    static int indexOf(byte[] a, int from, int to, byte b, long pattern) {
        int i = from;
        for (; i + 8 <= to; i += 8) {
            long m = matches((long) LONGS.get(a, i), pattern);
            if (m != 0) {
                return i + (Long.numberOfTrailingZeros(m) >>> 3);
            }
        }
        for (; i < to; i++) {
            if (a[i] == b) {
                return i;
            }
        }
        return -1;
    }

    /** How many bytes in [from, to) hold {@code b}. */
    static int count(byte[] a, int from, int to, byte b, long pattern) {
        int n = 0;
        int i = from;
        for (; i + 8 <= to; i += 8) {
            n += Long.bitCount(matches((long) LONGS.get(a, i), pattern));
        }
        for (; i < to; i++) {
            if (a[i] == b) {
                n++;
            }
        }
        return n;
    }
}
