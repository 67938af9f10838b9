package org.voteworth.tally;

/**
 * Open-addressing map from non-negative {@code long} keys to {@code int} values, linear probing,
 * no boxing. Absent keys read as {@code -1}. Key and value of an entry sit side by side in one
 * array, so a lookup in a table far larger than the CPU caches costs one memory access, not two.
 * Used for numeric reviewer ids.
 */
final class LongIntMap {
    private static final long EMPTY = -1L;
    /** Entry i: key at 2i, value at 2i + 1. */
    private long[] table;
    private int size;
    private int mask;

    LongIntMap(int expected) {
        int cap = Integer.highestOneBit(Math.max(16, expected * 2 - 1)) << 1;
        table = emptyTable(cap);
        mask = cap - 1;
    }

    int size() {
        return size;
    }

    static int mix(long k) {
        k ^= k >>> 33;
        k *= 0xff51afd7ed558ccdL;
        k ^= k >>> 33;
        return (int) k;
    }

    /** The value for {@code key}, or -1. */
    int get(long key) {
        int i = mix(key) & mask;
        while (true) {
            long k = table[2 * i];
            if (k == key) {
                return (int) table[2 * i + 1];
            }
            if (k == EMPTY) {
                return -1;
            }
            i = (i + 1) & mask;
        }
    }

    /** The value for {@code key}; when absent, stores {@code valueIfAbsent} and returns it. */
    int getOrPut(long key, int valueIfAbsent) {
        int i = mix(key) & mask;
        while (true) {
            long k = table[2 * i];
            if (k == key) {
                return (int) table[2 * i + 1];
            }
            if (k == EMPTY) {
                table[2 * i] = key;
                table[2 * i + 1] = valueIfAbsent;
                if (++size * 2 > mask + 1) {
                    grow();
                }
                return valueIfAbsent;
            }
            i = (i + 1) & mask;
        }
    }

    long memoryBytes() {
        return table.length * 8L;
    }

    private static long[] emptyTable(int entries) {
        long[] t = new long[2 * entries];
        for (int i = 0; i < t.length; i += 2) {
            t[i] = EMPTY;
        }
        return t;
    }

    private void grow() {
        long[] old = table;
        int cap = 2 * (mask + 1);
        table = emptyTable(cap);
        mask = cap - 1;
        for (int j = 0; j < old.length; j += 2) {
            long k = old[j];
            if (k != EMPTY) {
                int i = mix(k) & mask;
                while (table[2 * i] != EMPTY) {
                    i = (i + 1) & mask;
                }
                table[2 * i] = k;
                table[2 * i + 1] = old[j + 1];
            }
        }
    }
}
