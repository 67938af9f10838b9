package org.voteworth.tally;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.function.IntBinaryOperator;

/**
 * The one order of reviewer ids in every output: {@link String#compareTo} order, computed on the
 * ids' bytes without making Strings where that gives the same answer. For ASCII ids byte order is
 * String order; ids with other bytes are compared as decoded Strings.
 */
final class IdOrder {
    private static final int SMALL = 48;

    private IdOrder() {
    }

    /** The slots of {@code index} ordered by id. */
    static int[] sortedSlots(KeyIndex index) {
        int n = index.size();
        int[] slots = new int[n];
        for (int i = 0; i < n; i++) {
            slots[i] = i;
        }
        if (!index.allAscii()) {
            String[] ids = new String[n];
            for (int i = 0; i < n; i++) {
                ids[i] = index.id(i);
            }
            mergeSort(slots, 0, n, new int[n], (a, b) -> ids[a].compareTo(ids[b]));
            return slots;
        }
        new ChunkSort(index, n).sort(slots, 0, n, 0);
        return slots;
    }

    /** Compares two ids given as UTF-8 bytes in {@link String#compareTo} order. */
    static int compare(byte[] a, int aLength, byte[] b, int bLength) {
        int i = Arrays.mismatch(a, 0, aLength, b, 0, bLength);
        if (i < 0) {
            return 0;
        }
        boolean asciiPrefix = true;
        for (int k = 0; k < i && asciiPrefix; k++) {
            asciiPrefix = a[k] >= 0;
        }
        if (asciiPrefix) {
            if (i == aLength || i == bLength) {
                return aLength - bLength;
            }
            if (a[i] >= 0 && b[i] >= 0) {
                return a[i] - b[i];
            }
        }
        return new String(a, 0, aLength, StandardCharsets.UTF_8).compareTo(new String(b, 0, bLength, StandardCharsets.UTF_8));
    }

    /**
     * Sorts ASCII ids eight bytes at a time: a radix sort on the first eight bytes, then each run
     * of ids that agree on them by the next eight, and so on (a shorter id that is a prefix of a
     * longer one comes first, as in String order).
     */
    private static final class ChunkSort {
        private final KeyIndex index;
        private final long[] keys;
        private final long[] keyRoom;
        private final int[] slotRoom;
        private final byte[] digits = new byte[20];

        ChunkSort(KeyIndex index, int n) {
            this.index = index;
            keys = new long[n];
            keyRoom = new long[n];
            slotRoom = new int[n];
        }

        void sort(int[] slots, int from, int to, int depth) {
            for (int i = from; i < to; i++) {
                keys[i] = index.chunk(slots[i], 8 * depth, digits);
            }
            if (to - from < SMALL) {
                insertionSort(slots, from, to);
            } else {
                radixSort(slots, from, to);
            }
            for (int i = from; i < to; ) {
                int j = i + 1;
                while (j < to && keys[j] == keys[i]) {
                    j++;
                }
                if (j - i > 1) {
                    ties(slots, i, j, depth);
                }
                i = j;
            }
        }

        /** Ids in [from, to) agree on their first 8 * (depth + 1) bytes (zero-padded). */
        private void ties(int[] slots, int from, int to, int depth) {
            int limit = 8 * (depth + 1);
            // Ids that end within the chunk are prefixes of the others: they come first, shortest first.
            int w = from;
            for (int i = from; i < to; i++) {
                if (index.idLength(slots[i]) <= limit) {
                    int s = slots[i];
                    slots[i] = slots[w];
                    slots[w++] = s;
                }
            }
            mergeSort(slots, from, w, slotRoom, (a, b) -> Integer.compare(index.idLength(a), index.idLength(b)));
            if (to - w > 1) {
                sort(slots, w, to, depth + 1);
            }
        }

        private void insertionSort(int[] slots, int from, int to) {
            for (int i = from + 1; i < to; i++) {
                long k = keys[i];
                int s = slots[i];
                int j = i - 1;
                while (j >= from && keys[j] > k) {
                    keys[j + 1] = keys[j];
                    slots[j + 1] = slots[j];
                    j--;
                }
                keys[j + 1] = k;
                slots[j + 1] = s;
            }
        }

        /** LSD radix sort of keys[from, to) with their slots, 16 bits a pass; passes where all keys agree are skipped. */
        private void radixSort(int[] slots, int from, int to) {
            int[][] counts = new int[4][1 << 16];
            for (int i = from; i < to; i++) {
                long k = keys[i];
                for (int p = 0; p < 4; p++) {
                    counts[p][(int) (k >>> (16 * p)) & 0xFFFF]++;
                }
            }
            int n = to - from;
            for (int p = 0; p < 4; p++) {
                int[] c = counts[p];
                if (c[(int) (keys[from] >>> (16 * p)) & 0xFFFF] == n) {
                    continue;
                }
                int sum = from;
                for (int d = 0; d < c.length; d++) {
                    int v = c[d];
                    c[d] = sum;
                    sum += v;
                }
                for (int i = from; i < to; i++) {
                    int at = c[(int) (keys[i] >>> (16 * p)) & 0xFFFF]++;
                    keyRoom[at] = keys[i];
                    slotRoom[at] = slots[i];
                }
                System.arraycopy(keyRoom, from, keys, from, n);
                System.arraycopy(slotRoom, from, slots, from, n);
            }
        }
    }

    /** Stable merge sort of a[from, to) by {@code order}; {@code room} has at least {@code to} places. */
    static void mergeSort(int[] a, int from, int to, int[] room, IntBinaryOperator order) {
        if (to - from < 2) {
            return;
        }
        if (to - from <= 16) {
            for (int i = from + 1; i < to; i++) {
                int v = a[i];
                int j = i - 1;
                while (j >= from && order.applyAsInt(a[j], v) > 0) {
                    a[j + 1] = a[j];
                    j--;
                }
                a[j + 1] = v;
            }
            return;
        }
        int mid = (from + to) >>> 1;
        mergeSort(a, from, mid, room, order);
        mergeSort(a, mid, to, room, order);
        if (order.applyAsInt(a[mid - 1], a[mid]) <= 0) {
            return;
        }
        System.arraycopy(a, from, room, from, to - from);
        int i = from;
        int j = mid;
        for (int k = from; k < to; k++) {
            if (j >= to || i < mid && order.applyAsInt(room[i], room[j]) <= 0) {
                a[k] = room[i++];
            } else {
                a[k] = room[j++];
            }
        }
    }
}
