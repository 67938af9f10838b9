package org.voteworth.tally;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * Maps reviewer (or review) ids, given as bytes, to dense slots 0, 1, 2, ... in order of first
 * appearance.
 *
 * <p>Ids that are canonical decimal numbers (digits only, no leading zero, at most 18 digits) take
 * a fast path through a primitive long map; every other id is kept once, as bytes, in an arena
 * and found through its own open-addressing table. The two paths cannot collide: "007" is not
 * canonical, so it is stored as bytes and stays distinct from "7".
 */
final class KeyIndex {
    private final LongIntMap numeric = new LongIntMap(1 << 12);

    // Byte ids: arena of [len:int][bytes], and a table of entries (arena offset + 1, slot) side by
    // side (offset 0 = empty), so a probe reads one place.
    private byte[] arena = new byte[1 << 12];
    private int arenaUsed;
    private int[] table = new int[2 << 10];
    private int byteCount;
    /** Whether some byte id has a byte outside ASCII (its String order then needs decoding). */
    private boolean nonAscii;

    /** Per slot: the numeric id (>= 0), or -(arena offset + 1). */
    private long[] refs = new long[1 << 10];
    private int size;

    int size() {
        return size;
    }

    /** The slot of the id in {@code b[off, off+len)}, created if new. */
    int slotOf(byte[] b, int off, int len) {
        long n = canonicalNumber(b, off, len);
        return n >= 0 ? slotOfNumber(n) : bytesSlot(b, off, len);
    }

    int slotOf(String id) {
        byte[] b = id.getBytes(StandardCharsets.UTF_8);
        return slotOf(b, 0, b.length);
    }

    /** The slot of an existing id, or -1. */
    int find(String id) {
        byte[] b = id.getBytes(StandardCharsets.UTF_8);
        long n = canonicalNumber(b, 0, b.length);
        if (n >= 0) {
            return numeric.get(n);
        }
        int mask = (table.length >> 1) - 1;
        for (int i = hash(b, 0, b.length) & mask; table[2 * i] != 0; i = (i + 1) & mask) {
            if (equalsArena(table[2 * i] - 1, b, 0, b.length)) {
                return table[2 * i + 1];
            }
        }
        return -1;
    }

    String id(int slot) {
        long r = refs[slot];
        if (r >= 0) {
            return Long.toString(r);
        }
        int at = (int) (-r - 1);
        int len = readInt(arena, at);
        return new String(arena, at + 4, len, StandardCharsets.UTF_8);
    }

    /** Whether the id of {@code slot} is a canonical number (kept as a long, not as bytes). */
    boolean isNumeric(int slot) {
        return refs[slot] >= 0;
    }

    /** The numeric id of {@code slot}; only for {@link #isNumeric} slots. */
    long number(int slot) {
        return refs[slot];
    }

    /** Whether every id is ASCII, so that byte order is String order. */
    boolean allAscii() {
        return !nonAscii;
    }

    /** The UTF-8 bytes of the id of {@code slot} written at {@code into[0...]}; returns their count. */
    int idBytes(int slot, byte[] into) {
        long r = refs[slot];
        if (r >= 0) {
            return digits(r, into, 0);
        }
        int at = (int) (-r - 1);
        int len = readInt(arena, at);
        System.arraycopy(arena, at + 4, into, 0, len);
        return len;
    }

    /** Length in bytes of the id of {@code slot}. */
    int idLength(int slot) {
        long r = refs[slot];
        if (r >= 0) {
            return decimalLength(r);
        }
        return readInt(arena, (int) (-r - 1));
    }

    /**
     * Bytes {@code [from, from + 8)} of the id of {@code slot} as an unsigned big-endian number,
     * zero past the id's end: comparing these keys orders ASCII ids as String order does, up to
     * ties between ids that agree on those bytes. {@code digits} is scratch room for 19 digits.
     */
    long chunk(int slot, int from, byte[] digits) {
        long r = refs[slot];
        byte[] src;
        int off;
        int len;
        if (r >= 0) {
            len = digits(r, digits, 0);
            src = digits;
            off = 0;
        } else {
            int at = (int) (-r - 1);
            len = readInt(arena, at);
            src = arena;
            off = at + 4;
        }
        long k = 0;
        for (int i = from; i < from + 8; i++) {
            k = k << 8 | (i < len ? src[off + i] & 0xFF : 0);
        }
        return k;
    }

    /** Writes the decimal digits of {@code v >= 0} at {@code into[at...]}; returns how many. */
    static int digits(long v, byte[] into, int at) {
        int n = decimalLength(v);
        long x = v;
        int i = at + n;
        while (x >= 100) {
            int pair = (int) (x % 100);
            x /= 100;
            into[--i] = (byte) ('0' + pair % 10);
            into[--i] = (byte) ('0' + pair / 10);
        }
        if (x >= 10) {
            into[--i] = (byte) ('0' + x % 10);
            x /= 10;
        }
        into[--i] = (byte) ('0' + x);
        return n;
    }

    private static final long[] POWERS = new long[19];

    static {
        POWERS[0] = 1;
        for (int i = 1; i < POWERS.length; i++) {
            POWERS[i] = POWERS[i - 1] * 10;
        }
    }

    /** Digits in the decimal form of {@code v >= 0}. */
    static int decimalLength(long v) {
        // log10(2) ~ 1233 / 4096: a first guess from the bit length, off by at most one (the integer-log trick of
        // Hacker's Delight, 2nd ed., section 11-4, cited from memory; the test checks every power of ten).
        int guess = ((64 - Long.numberOfLeadingZeros(v | 1)) * 1233) >>> 12;
        return guess < POWERS.length && v >= POWERS[guess] ? guess + 1 : Math.max(guess, 1);
    }

    /** The slot of the id of {@code other}'s slot {@code o} in this index, created if new. */
    int slotOf(KeyIndex other, int o) {
        long r = other.refs[o];
        if (r >= 0) {
            return slotOfNumber(r);
        }
        int at = (int) (-r - 1);
        return bytesSlot(other.arena, at + 4, readInt(other.arena, at));
    }

    /** Which of {@code parts} pieces the id of {@code slot} falls in by its hash; the same in every table. */
    int partition(int slot, int parts) {
        long r = refs[slot];
        if (r >= 0) {
            return pieceOfNumber(r, parts);
        }
        int at = (int) (-r - 1);
        return pieceOfBytes(arena, at + 4, readInt(arena, at), parts);
    }

    /** {@link #partition} for the canonical number {@code n}. */
    static int pieceOfNumber(long n, int parts) {
        return Math.floorMod(LongIntMap.mix(n), parts);
    }

    /** {@link #partition} for the byte id {@code b[off, off+len)}. */
    static int pieceOfBytes(byte[] b, int off, int len, int parts) {
        return Math.floorMod(hash(b, off, len), parts);
    }

    /** The slot of the canonical number {@code n}, created if new. */
    int slotOfNumber(long n) {
        int s = numeric.getOrPut(n, size);
        if (s == size) {
            newSlot(n);
        }
        return s;
    }

    long memoryBytes() {
        return numeric.memoryBytes() + arena.length + table.length * 4L + refs.length * 8L;
    }

    /** Digits only, no leading zero unless "0", at most 18 digits: the value; otherwise -1. */
    static long canonicalNumber(byte[] b, int off, int len) {
        if (len == 0 || len > 18 || (b[off] == '0' && len > 1)) {
            return -1;
        }
        long v = 0;
        for (int i = off, end = off + len; i < end; i++) {
            int d = b[i] - '0';
            if (d < 0 || d > 9) {
                return -1;
            }
            v = v * 10 + d;
        }
        return v;
    }

    private void newSlot(long ref) {
        if (size == refs.length) {
            refs = Arrays.copyOf(refs, size * 2);
        }
        refs[size++] = ref;
    }

    private int bytesSlot(byte[] b, int off, int len) {
        int mask = (table.length >> 1) - 1;
        int i = hash(b, off, len) & mask;
        while (table[2 * i] != 0) {
            if (equalsArena(table[2 * i] - 1, b, off, len)) {
                return table[2 * i + 1];
            }
            i = (i + 1) & mask;
        }
        int at = append(b, off, len);
        table[2 * i] = at + 1;
        table[2 * i + 1] = size;
        newSlot(-(long) at - 1);
        if (++byteCount * 2 > mask + 1) {
            growTable();
        }
        for (int j = off; j < off + len && !nonAscii; j++) {
            nonAscii = b[j] < 0;
        }
        return size - 1;
    }

    private int append(byte[] b, int off, int len) {
        if (arenaUsed + 4 + len > arena.length) {
            long want = Math.max((long) arena.length * 2, (long) arenaUsed + 4 + len);
            if (want > Integer.MAX_VALUE - 16) {
                throw new IllegalStateException("more than 2 GiB of non-numeric ids in one tally; raise the spill budget split");
            }
            arena = Arrays.copyOf(arena, (int) want);
        }
        int at = arenaUsed;
        writeInt(arena, at, len);
        System.arraycopy(b, off, arena, at + 4, len);
        arenaUsed += 4 + len;
        return at;
    }

    private boolean equalsArena(int at, byte[] b, int off, int len) {
        if (readInt(arena, at) != len) {
            return false;
        }
        return Arrays.equals(arena, at + 4, at + 4 + len, b, off, off + len);
    }

    private void growTable() {
        int[] old = table;
        table = new int[old.length * 2];
        int mask = (table.length >> 1) - 1;
        for (int j = 0; j < old.length; j += 2) {
            if (old[j] != 0) {
                int at = old[j] - 1;
                int i = hash(arena, at + 4, readInt(arena, at)) & mask;
                while (table[2 * i] != 0) {
                    i = (i + 1) & mask;
                }
                table[2 * i] = old[j];
                table[2 * i + 1] = old[j + 1];
            }
        }
    }

    static int hash(byte[] b, int off, int len) {
        int h = 0x9747b28c;
        for (int i = off, end = off + len; i < end; i++) {
            h = (h ^ b[i]) * 0x01000193;
        }
        return LongIntMap.mix(h);
    }

    private static int readInt(byte[] a, int at) {
        return (a[at] & 0xff) << 24 | (a[at + 1] & 0xff) << 16 | (a[at + 2] & 0xff) << 8 | (a[at + 3] & 0xff);
    }

    private static void writeInt(byte[] a, int at, int v) {
        a[at] = (byte) (v >>> 24);
        a[at + 1] = (byte) (v >>> 16);
        a[at + 2] = (byte) (v >>> 8);
        a[at + 3] = (byte) v;
    }
}
