package org.voteworth.source;

/**
 * Learns how {@link ParallelDumpReader} cut the dump into pieces, for sinks that keep rows with
 * their exact line numbers. A piece is a whole file or a byte range of a large plain one; rows of
 * a range that does not start the file carry {@link ReviewRow#line} counted from 1 at the range's
 * first line, so their line in the file is {@code lineBase + line}.
 */
public interface PieceListener {
    /** Listens to nothing. */
    PieceListener NONE = new PieceListener() {
        @Override
        public void started(int worker, int fileIndex, long start) {
        }

        @Override
        public void lineBase(int fileIndex, long start, long lineBase) {
        }
    };

    /**
     * On the scanning thread, before the first row of a piece reaches the sink of {@code worker}
     * (the number the sink was asked for with): the rows that follow come from file
     * {@code fileIndex} (of the list read), starting at byte {@code start}.
     */
    void started(int worker, int fileIndex, long start);

    /**
     * Called once per piece, in file order, from the reading thread: add {@code lineBase} to the
     * {@link ReviewRow#line} of the piece's rows (0 for a piece that starts its file).
     */
    void lineBase(int fileIndex, long start, long lineBase);
}
