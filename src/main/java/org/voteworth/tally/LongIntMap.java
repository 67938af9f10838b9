package org.voteworth.tally;

import java.util.Arrays;

/**
 * Open-addressing map from non-negative {@code long} keys to {@code int} values, linear probing,
 * no boxing. Absent keys read as {@code -1}. Used for numeric reviewer ids and for the
 * (slot, category) counters of a {@link TallyTable}.
 */
final class LongIntMap {
    private static final long EMPTY = -1L;
    private long[] keys;
    private int[] values;
    private int size;
    private int mask;

    LongIntMap(int expected) {
        int cap = Integer.highestOneBit(Math.max(16, expected * 2 - 1)) << 1;
        keys = new long[cap];
        Arrays.fill(keys, EMPTY);
        values = new int[cap];
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
            long k = keys[i];
            if (k == key) {
                return values[i];
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
            long k = keys[i];
            if (k == key) {
                return values[i];
            }
            if (k == EMPTY) {
                keys[i] = key;
                values[i] = valueIfAbsent;
                if (++size * 2 > keys.length) {
                    grow();
                }
                return valueIfAbsent;
            }
            i = (i + 1) & mask;
        }
    }

    /** Adds {@code delta} to the value of {@code key}, treating an absent key as 0. */
    void add(long key, int delta) {
        int i = mix(key) & mask;
        while (true) {
            long k = keys[i];
            if (k == key) {
                values[i] += delta;
                return;
            }
            if (k == EMPTY) {
                keys[i] = key;
                values[i] = delta;
                if (++size * 2 > keys.length) {
                    grow();
                }
                return;
            }
            i = (i + 1) & mask;
        }
    }

    /** Calls {@code visitor} for every entry, in no particular order. */
    void forEach(Visitor visitor) {
        for (int i = 0; i < keys.length; i++) {
            if (keys[i] != EMPTY) {
                visitor.visit(keys[i], values[i]);
            }
        }
    }

    long memoryBytes() {
        return keys.length * 12L;
    }

    interface Visitor {
        void visit(long key, int value);
    }

    private void grow() {
        long[] oldKeys = keys;
        int[] oldValues = values;
        keys = new long[oldKeys.length * 2];
        Arrays.fill(keys, EMPTY);
        values = new int[oldKeys.length * 2];
        mask = keys.length - 1;
        for (int j = 0; j < oldKeys.length; j++) {
            long k = oldKeys[j];
            if (k != EMPTY) {
                int i = mix(k) & mask;
                while (keys[i] != EMPTY) {
                    i = (i + 1) & mask;
                }
                keys[i] = k;
                values[i] = oldValues[j];
            }
        }
    }
}
