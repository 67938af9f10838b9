package org.voteworth.source;

import java.io.FileInputStream;
import java.io.FileNotFoundException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * The bytes {@code [start, end)} of a file, read with plain sequential reads from its own file
 * descriptor, so ranges share no state.
 *
 * <p>Reads go through {@link FileInputStream} at most {@link #READ} bytes at a time: on the machines
 * measured, a positional channel read into a heap buffer of a megabyte or more (the path of
 * {@code Files.newInputStream} and {@code FileChannel.read}) spent about six times the kernel time of
 * these reads (see docs/benchmarks.md, "Plain reads").
 */
public final class RangeStream extends InputStream {
    /** Most bytes asked of the kernel per read. */
    static final int READ = 1 << 19;
    private final FileInputStream in;
    private long pos;
    private final long end;

    private RangeStream(FileInputStream in, long start, long end) {
        this.in = in;
        this.pos = start;
        this.end = end;
    }

    /** The bytes {@code [start, end)} of {@code file} (a dump file's byte range, or one section of a spill file). */
    public static RangeStream open(Path file, long start, long end) throws IOException {
        FileInputStream in = openFile(file);
        try {
            if (start > 0) {
                in.getChannel().position(start);
            }
            return new RangeStream(in, start, end);
        } catch (IOException | RuntimeException e) {
            in.close();
            throw e;
        }
    }

    /** The whole of {@code file}. */
    static RangeStream open(Path file) throws IOException {
        return open(file, 0, Long.MAX_VALUE);
    }

    private static FileInputStream openFile(Path file) throws IOException {
        try {
            return new FileInputStream(file.toFile());
        } catch (FileNotFoundException e) {
            // The same exceptions as Files.newInputStream, so callers can tell a missing file from an unreadable one.
            if (!Files.exists(file)) {
                throw new NoSuchFileException(file.toString());
            }
            throw new AccessDeniedException(file.toString(), null, e.getMessage());
        }
    }

    @Override
    public int read() throws IOException {
        byte[] one = new byte[1];
        return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        if (pos >= end) {
            return -1;
        }
        int want = (int) Math.min(Math.min(len, READ), end - pos);
        int n = in.read(b, off, want);
        if (n < 0) {
            return -1;
        }
        pos += n;
        return n;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }

    /**
     * Where a range that should start near {@code at} starts: the first offset {@code p >= at}
     * that begins a line (p is 0 or the byte before p is LF); {@code size} when none does.
     */
    static long lineStartFrom(FileChannel channel, long at, long size) throws IOException {
        if (at <= 0) {
            return 0;
        }
        ByteBuffer b = ByteBuffer.allocate(1 << 16);
        long p = at - 1;
        while (p < size) {
            b.clear();
            int n = channel.read(b, p);
            if (n <= 0) {
                return size;
            }
            for (int i = 0; i < n; i++) {
                if (b.get(i) == '\n') {
                    return p + i + 1;
                }
            }
            p += n;
        }
        return size;
    }
}
