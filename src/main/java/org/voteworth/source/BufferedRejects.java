package org.voteworth.source;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * The rejects of one scanned unit (a file or a byte range of one), kept until the units before it
 * are written, so that the rejects file comes out in file and line order whatever the thread
 * count. Held in memory up to {@value #IN_MEMORY} bytes, then in a temporary file.
 */
final class BufferedRejects implements RejectSink, AutoCloseable {
    static final int IN_MEMORY = 8 << 20;

    /** Receives the buffered rejects again, in the order they were scanned. */
    interface Replay {
        void reject(long line, Reject reject, byte[] row, int start, int end) throws IOException;
    }

    private final Path tmpDir;
    private final ByteArrayOutputStream memory = new ByteArrayOutputStream(1 << 10);
    private DataOutputStream out = new DataOutputStream(memory);
    private Path file;
    private long count;

    BufferedRejects(Path tmpDir) {
        this.tmpDir = tmpDir;
    }

    long count() {
        return count;
    }

    @Override
    public void reject(DumpFile f, long line, Reject reject, byte[] row, int start, int end) {
        try {
            out.writeLong(line);
            text(reject.reason());
            text(reject.field());
            text(reject.value());
            text(reject.message());
            out.writeInt(end - start);
            out.write(row, start, end - start);
            count++;
            if (file == null && memory.size() > IN_MEMORY) {
                file = Files.createTempFile(tmpDir, "voteworth-rejects-", ".bin");
                OutputStream fo = new BufferedOutputStream(Files.newOutputStream(file), 1 << 16);
                memory.writeTo(fo);
                memory.reset();
                out = new DataOutputStream(fo);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot buffer rejected rows in " + tmpDir + ": " + e.getMessage()
                    + " (free some space there or point --tmp elsewhere)", e);
        }
    }

    private void text(String s) throws IOException {
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        out.writeInt(b.length);
        out.write(b);
    }

    void replay(Replay to) throws IOException {
        out.flush();
        try (InputStream raw = file == null ? new ByteArrayInputStream(memory.toByteArray())
                : new BufferedInputStream(Files.newInputStream(file), 1 << 16);
             DataInputStream in = new DataInputStream(raw)) {
            byte[] row = new byte[256];
            for (long i = 0; i < count; i++) {
                long line = in.readLong();
                Reject r = new Reject(text(in), text(in), text(in), text(in));
                int n = in.readInt();
                if (n > row.length) {
                    row = new byte[Math.max(n, 2 * row.length)];
                }
                in.readFully(row, 0, n);
                to.reject(line, r, row, 0, n);
            }
        } catch (EOFException e) {
            throw new IOException("the buffered rejects ended early: " + e.getMessage(), e);
        }
    }

    private static String text(DataInputStream in) throws IOException {
        byte[] b = new byte[in.readInt()];
        in.readFully(b);
        return new String(b, StandardCharsets.UTF_8);
    }

    @Override
    public void close() throws IOException {
        out.close();
        if (file != null) {
            Files.deleteIfExists(file);
        }
    }
}
