package org.voteworth.demo;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/** A growable byte buffer that one output row is assembled in, so no row costs a String. */
final class RowBytes {
    private byte[] buf = new byte[8192];
    private int len;

    void clear() {
        len = 0;
    }

    int length() {
        return len;
    }

    byte[] array() {
        return buf;
    }

    byte byteAt(int i) {
        return buf[i];
    }

    void setByteAt(int i, byte b) {
        buf[i] = b;
    }

    /** Cuts the buffer back to {@code newLength} bytes. */
    void truncate(int newLength) {
        len = newLength;
    }

    RowBytes put(byte b) {
        ensure(1);
        buf[len++] = b;
        return this;
    }

    RowBytes put(byte[] b) {
        ensure(b.length);
        System.arraycopy(b, 0, buf, len, b.length);
        len += b.length;
        return this;
    }

    /** ASCII text only (ids, markers); review text arrives as prepared UTF-8 bytes. */
    RowBytes put(String ascii) {
        return put(ascii.getBytes(StandardCharsets.UTF_8));
    }

    RowBytes tab() {
        return put((byte) '\t');
    }

    /** A non-negative decimal number without leading zeros. */
    RowBytes putLong(long v) {
        if (v < 0) {
            put((byte) '-');
            v = -v;
        }
        return putDigits(v, digitCount(v));
    }

    /** {@code v} written with exactly {@code width} digits, zero-padded on the left. */
    RowBytes putDigits(long v, int width) {
        ensure(width);
        for (int i = len + width - 1; i >= len; i--) {
            buf[i] = (byte) ('0' + v % 10);
            v /= 10;
        }
        len += width;
        return this;
    }

    /** Inserts {@code b} at {@code at}, shifting the rest right (used to plant defects). */
    void insert(int at, byte[] b) {
        ensure(b.length);
        System.arraycopy(buf, at, buf, at + b.length, len - at);
        System.arraycopy(b, 0, buf, at, b.length);
        len += b.length;
    }

    /** Index of the {@code n}-th (0-based) tab, or -1. */
    int tabIndex(int n) {
        for (int i = 0; i < len; i++) {
            if (buf[i] == '\t' && n-- == 0) {
                return i;
            }
        }
        return -1;
    }

    /** Replaces bytes [from, to) with {@code b}. */
    void replace(int from, int to, byte[] b) {
        int tail = len - to;
        ensure(b.length - (to - from));
        System.arraycopy(buf, to, buf, from + b.length, tail);
        System.arraycopy(b, 0, buf, from, b.length);
        len = from + b.length + tail;
    }

    private static int digitCount(long v) {
        int d = 1;
        while (v >= 10) {
            v /= 10;
            d++;
        }
        return d;
    }

    private void ensure(int extra) {
        if (len + extra > buf.length) {
            buf = Arrays.copyOf(buf, Math.max(buf.length * 2, len + extra));
        }
    }
}
