package org.voteworth.source;

/** Receives accepted rows from a scan. Called from one thread per sink. */
@FunctionalInterface
public interface ReviewSink {
    /** The row is reused after this returns: copy what you keep. */
    void accept(ReviewRow row);
}
