package org.voteworth.store;

import java.util.Arrays;

/**
 * Where each scanned piece of a file starts counting lines (see
 * {@link org.voteworth.source.PieceListener}): the line in the file of a row is its piece's base
 * plus its line in the piece. Pieces not reported have base 0 (whole files, and rows read back
 * from a store, whose lines are already lines in the file).
 */
final class LineBases {
    private long[][] starts = new long[0][];
    private long[][] bases = new long[0][];

    synchronized void put(int file, long start, long base) {
        if (file >= starts.length) {
            starts = Arrays.copyOf(starts, file + 1);
            bases = Arrays.copyOf(bases, file + 1);
        }
        long[] s = starts[file] == null ? new long[0] : starts[file];
        long[] b = bases[file] == null ? new long[0] : bases[file];
        int i = Arrays.binarySearch(s, start);
        if (i >= 0) {
            b[i] = base;
            return;
        }
        int at = -i - 1;
        long[] s2 = new long[s.length + 1];
        long[] b2 = new long[s.length + 1];
        System.arraycopy(s, 0, s2, 0, at);
        System.arraycopy(b, 0, b2, 0, at);
        s2[at] = start;
        b2[at] = base;
        System.arraycopy(s, at, s2, at + 1, s.length - at);
        System.arraycopy(b, at, b2, at + 1, s.length - at);
        starts[file] = s2;
        bases[file] = b2;
    }

    /** Called only after the scan, when no more pieces are reported. */
    long base(int file, long start) {
        if (start == 0 || file >= starts.length || starts[file] == null) {
            return 0;
        }
        int i = Arrays.binarySearch(starts[file], start);
        if (i < 0) {
            throw new IllegalStateException("no line numbering was reported for the piece at byte " + start + " of file " + file);
        }
        return bases[file][i];
    }
}
