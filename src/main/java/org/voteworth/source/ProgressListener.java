package org.voteworth.source;

/**
 * Told how far a read has come, after each buffer of input (a few MiB), on the reading thread.
 * Bytes are those taken from disk: compressed bytes for {@code .gz} files, so they compare with
 * the files' sizes.
 */
@FunctionalInterface
public interface ProgressListener {
    ProgressListener NONE = (bytesConsumed, bytesTotal, rowsRead) -> { };

    /**
     * @param bytesConsumed input bytes consumed so far
     * @param bytesTotal size of all input, from the file sizes when the read started
     * @param rowsRead data rows read so far
     */
    void progress(long bytesConsumed, long bytesTotal, long rowsRead);
}
