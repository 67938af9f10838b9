package org.voteworth.source;

/**
 * Receives every row a scan does not accept, with why. May be called from several scanning
 * threads at once, so implementations are thread-safe.
 */
public interface RejectSink {
    /**
     * @param file the dump file
     * @param line 1-based physical line of the row (the header is line 1)
     * @param reject why; never {@link Reject#NONE}
     * @param row the buffer holding the raw row, LF excluded (a CR of a CRLF line is kept)
     * @param start first byte of the row in {@code row}
     * @param end end (exclusive) of the row in {@code row}; the bytes are reused after this returns
     */
    void reject(DumpFile file, long line, Reject reject, byte[] row, int start, int end);
}
