package org.voteworth.source;

import java.io.IOException;
import java.io.InputStream;
import java.io.InterruptedIOException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;

/**
 * Runs a decompressing stream on a thread of its own and hands its output over in large buffers,
 * so that decompression and parsing of one compressed file use two cores. The bytes read are
 * exactly the bytes of the stream below; an error on the decompressing thread is thrown from
 * {@link #read} as it was raised. {@link #close()} stops the thread and closes the stream below.
 */
final class DecompressingPipe extends InputStream {
    static final int CHUNK = 1 << 20;
    private static final int DEPTH = 4;
    private static final Chunk END = new Chunk(new byte[0], -1, null);

    private record Chunk(byte[] bytes, int length, Throwable error) {
    }

    private final BlockingQueue<Chunk> full = new ArrayBlockingQueue<>(DEPTH + 1);
    private final BlockingQueue<byte[]> free = new ArrayBlockingQueue<>(DEPTH + 2);
    private final Thread worker;
    private final InputStream source;
    private Chunk current;
    private int pos;
    private boolean ended;

    DecompressingPipe(InputStream source, String name) {
        this.source = source;
        for (int i = 0; i < DEPTH + 1; i++) {
            free.add(new byte[CHUNK]);
        }
        worker = new Thread(this::pump, "decompress " + name);
        worker.setDaemon(true);
        worker.start();
    }

    private void pump() {
        try {
            while (!Thread.currentThread().isInterrupted()) {
                byte[] b = free.take();
                int n = 0;
                while (n < b.length) {
                    int r = source.read(b, n, b.length - n);
                    if (r < 0) {
                        break;
                    }
                    n += r;
                }
                if (n > 0) {
                    full.put(new Chunk(b, n, null));
                }
                if (n < b.length) {
                    full.put(END);
                    return;
                }
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } catch (IOException | RuntimeException | Error e) {
            try {
                full.put(new Chunk(null, -1, e));
            } catch (InterruptedException ie) {
                Thread.currentThread().interrupt();
            }
        }
    }

    @Override
    public int read() throws IOException {
        byte[] one = new byte[1];
        int n = read(one, 0, 1);
        return n < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        if (len == 0) {
            return 0;
        }
        if (current == null || pos == current.length) {
            if (ended) {
                return -1;
            }
            if (current != null) {
                free.offer(current.bytes);
            }
            try {
                current = full.take();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while waiting for decompressed data");
            }
            pos = 0;
            if (current.error != null) {
                ended = true;
                Throwable t = current.error;
                current = null;
                if (t instanceof IOException io) {
                    throw io;
                }
                if (t instanceof RuntimeException re) {
                    throw re;
                }
                throw (Error) t;
            }
            if (current == END) {
                ended = true;
                current = null;
                return -1;
            }
        }
        int n = Math.min(len, current.length - pos);
        System.arraycopy(current.bytes, pos, b, off, n);
        pos += n;
        return n;
    }

    @Override
    public void close() throws IOException {
        worker.interrupt();
        full.clear();
        try {
            worker.join(10_000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        source.close();
    }
}
