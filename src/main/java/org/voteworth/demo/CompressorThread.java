package org.voteworth.demo;

import java.io.IOException;
import java.io.OutputStream;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;

/**
 * Compresses and writes filled chunks on a second thread while the generator fills the next
 * ones: generating and deflating each take about half of a run, so two cores halve its time.
 * One thread runs the chunks in the order they were handed over, so every file's bytes are the
 * same as if written directly. A fixed pool of chunks holds the generator back when the
 * compressor falls behind.
 */
final class CompressorThread implements AutoCloseable {
    static final int CHUNK_BYTES = 1 << 18;
    /** Chunks in flight beyond the one each file is filling. */
    private static final int SPARE_CHUNKS = 6;

    private final ExecutorService exec = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "voteworth-demo-compress");
        t.setDaemon(true);
        return t;
    });
    private final BlockingQueue<byte[]> free;
    private volatile IOException failure;

    /** @param files how many files fill chunks at the same time */
    CompressorThread(int files) {
        free = new ArrayBlockingQueue<>(files + SPARE_CHUNKS);
        for (int i = 0; i < files + SPARE_CHUNKS; i++) {
            free.add(new byte[CHUNK_BYTES]);
        }
    }

    /** An empty chunk to fill; waits while all chunks are queued. */
    byte[] chunk() throws IOException {
        rethrow();
        try {
            return free.take();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while writing the demo dump", e);
        }
    }

    /** Writes {@code len} bytes of {@code chunk} to {@code target} later, then recycles the chunk. */
    void write(OutputStream target, byte[] chunk, int len) throws IOException {
        rethrow();
        exec.execute(() -> {
            try {
                if (failure == null) {
                    target.write(chunk, 0, len);
                }
            } catch (IOException e) {
                failure = e;
            } finally {
                free.add(chunk);
            }
        });
    }

    /** Closes {@code target} later, after everything handed over before. */
    void close(OutputStream target) {
        exec.execute(() -> {
            try {
                target.close();
            } catch (IOException e) {
                if (failure == null) {
                    failure = e;
                }
            }
        });
    }

    /** Waits for all queued work; throws the first write error. */
    @Override
    public void close() throws IOException {
        exec.shutdown();
        try {
            if (!exec.awaitTermination(1, TimeUnit.HOURS)) {
                throw new IOException("compressing the demo dump did not finish within an hour");
            }
        } catch (InterruptedException e) {
            exec.shutdownNow();
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while finishing the demo dump", e);
        }
        rethrow();
    }

    private void rethrow() throws IOException {
        IOException e = failure;
        if (e != null) {
            throw new IOException("writing the demo dump failed: " + e.getMessage(), e);
        }
    }
}
