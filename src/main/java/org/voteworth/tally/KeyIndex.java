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

    // Byte ids: arena of [len:int][bytes], and a table of arena offsets (+1; 0 = empty).
    private byte[] arena = new byte[1 << 12];
    private int arenaUsed;
    private int[] table = new int[1 << 10];
    private int[] tableSlot = new int[1 << 10];
    private int byteCount;

    /** Per slot: the numeric id (>= 0), or -(arena offset + 1). */
    private long[] refs = new long[1 << 10];
    private int size;

    int size() {
        return size;
    }

    /** The slot of the id in {@code b[off, off+len)}, created if new. */
    int slotOf(byte[] b, int off, int len) {
        long n = canonicalNumber(b, off, len);
        if (n >= 0) {
            int s = numeric.getOrPut(n, size);
            if (s == size) {
                newSlot(n);
            }
            return s;
        }
        return bytesSlot(b, off, len);
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
        int h = hash(b, 0, b.length);
        int mask = table.length - 1;
        for (int i = h & mask; table[i] != 0; i = (i + 1) & mask) {
            if (equalsArena(table[i] - 1, b, 0, b.length)) {
                return tableSlot[i];
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

    /** Which of {@code parts} spill partitions the id of {@code slot} belongs to; the same in every table. */
    int partition(int slot, int parts) {
        long r = refs[slot];
        int h;
        if (r >= 0) {
            h = LongIntMap.mix(r);
        } else {
            int at = (int) (-r - 1);
            h = hash(arena, at + 4, readInt(arena, at));
        }
        return Math.floorMod(h, parts);
    }

    /** Writes the id of {@code slot}: a kind byte (0 numeric, 1 bytes) and the number or the bytes. */
    void writeId(int slot, java.io.DataOutput out) throws java.io.IOException {
        long r = refs[slot];
        if (r >= 0) {
            out.writeByte(0);
            out.writeLong(r);
        } else {
            int at = (int) (-r - 1);
            int len = readInt(arena, at);
            out.writeByte(1);
            out.writeInt(len);
            out.write(arena, at + 4, len);
        }
    }

    /** The slot of an id written by {@link #writeId}, whose kind byte was already read; created if new. */
    int readId(int kind, java.io.DataInput in, byte[][] scratch) throws java.io.IOException {
        if (kind == 0) {
            long n = in.readLong();
            int s = numeric.getOrPut(n, size);
            if (s == size) {
                newSlot(n);
            }
            return s;
        }
        int len = in.readInt();
        if (scratch[0].length < len) {
            scratch[0] = new byte[Math.max(len, 2 * scratch[0].length)];
        }
        in.readFully(scratch[0], 0, len);
        return bytesSlot(scratch[0], 0, len);
    }

    long memoryBytes() {
        return numeric.memoryBytes() + arena.length + table.length * 8L + refs.length * 8L;
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
        int h = hash(b, off, len);
        int mask = table.length - 1;
        int i = h & mask;
        while (table[i] != 0) {
            if (equalsArena(table[i] - 1, b, off, len)) {
                return tableSlot[i];
            }
            i = (i + 1) & mask;
        }
        int at = append(b, off, len);
        table[i] = at + 1;
        tableSlot[i] = size;
        newSlot(-(long) at - 1);
        if (++byteCount * 2 > table.length) {
            growTable();
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
        int[] oldTable = table;
        int[] oldSlot = tableSlot;
        table = new int[oldTable.length * 2];
        tableSlot = new int[oldTable.length * 2];
        int mask = table.length - 1;
        for (int j = 0; j < oldTable.length; j++) {
            if (oldTable[j] != 0) {
                int at = oldTable[j] - 1;
                int len = readInt(arena, at);
                int i = hash(arena, at + 4, len) & mask;
                while (table[i] != 0) {
                    i = (i + 1) & mask;
                }
                table[i] = oldTable[j];
                tableSlot[i] = oldSlot[j];
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
