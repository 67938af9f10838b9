package org.voteworth.tally;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.voteworth.source.RangeStream;

/**
 * The byte format of spilled tallies: numbers as unsigned LEB128 varints (signed ones zig-zag
 * encoded first), so that the small counts of most reviewers take a byte each, written and read
 * through plain buffers without a lock or a call per byte.
 */
final class SpillFile {
    private static final int BUFFER = 1 << 16;

    private SpillFile() {
    }

    static Out create(Path file) throws IOException {
        return new Out(Files.newOutputStream(file));
    }

    static In open(Path file) throws IOException {
        return new In(Files.newInputStream(file));
    }

    /** Writes to memory, into an array that grows as needed; {@link Out#append} copies the bytes into a file. */
    static Out inMemory() {
        return new Out(null);
    }

    /** Reads the bytes {@code [start, end)} of {@code file}: one section of a spill file that holds several. */
    static In open(Path file, long start, long end) throws IOException {
        return new In(RangeStream.open(file, start, end));
    }

    /** Writes to a file through a buffer, or (made by {@link #inMemory()}) to memory. */
    static final class Out implements AutoCloseable {
        /** Null in memory: the buffer then grows and holds every byte written. */
        private final OutputStream out;
        private byte[] buf;
        private int len;

        /** Bytes handed to the stream below so far. */
        private long flushed;

        private Out(OutputStream out) {
            this.out = out;
            // In memory a section starts small: a spill keeps one per range partition at once.
            buf = new byte[out == null ? 256 : BUFFER];
        }

        /** Appends everything written to {@code memory} (made by {@link #inMemory()}), which is then empty. */
        void append(Out memory) throws IOException {
            if (out == null || memory.out != null) {
                throw new IllegalArgumentException("append copies an in-memory Out into one that writes to a file");
            }
            flush();
            out.write(memory.buf, 0, memory.len);
            flushed += memory.len;
            memory.len = 0;
        }

        /** Room for {@code n} more bytes in the buffer: flushed to the file, or grown in memory. */
        private void room(int n) throws IOException {
            if (len + n <= buf.length) {
                return;
            }
            if (out == null) {
                buf = Arrays.copyOf(buf, Math.max(2 * buf.length, len + n));
            } else {
                flush();
            }
        }

        /** Bytes written so far (the offset of the next byte in the file). */
        long position() {
            return flushed + len;
        }

        void write(int b) throws IOException {
            room(1);
            buf[len++] = (byte) b;
        }

        /** A non-negative number. */
        void number(long v) throws IOException {
            room(10);
            while ((v & ~0x7FL) != 0) {
                buf[len++] = (byte) ((v & 0x7F) | 0x80);
                v >>>= 7;
            }
            buf[len++] = (byte) v;
        }

        /** Any int, zig-zag encoded so small negative numbers stay short. */
        void signed(int v) throws IOException {
            number(((v << 1) ^ (v >> 31)) & 0xFFFFFFFFL);
        }

        void bytes(byte[] b, int off, int n) throws IOException {
            number(n);
            if (out != null && n > buf.length) {
                flush();
                out.write(b, off, n);
                flushed += n;
                return;
            }
            room(n);
            System.arraycopy(b, off, buf, len, n);
            len += n;
        }

        void text(String s) throws IOException {
            byte[] b = s.getBytes(StandardCharsets.UTF_8);
            bytes(b, 0, b.length);
        }

        private void flush() throws IOException {
            if (out == null) {
                return;
            }
            out.write(buf, 0, len);
            flushed += len;
            len = 0;
        }

        @Override
        public void close() throws IOException {
            if (out == null) {
                return;
            }
            try (out) {
                flush();
            }
        }
    }

    /** Reads a file written by {@link Out} through a buffer. */
    static final class In implements AutoCloseable {
        private final InputStream in;
        private final byte[] buf = new byte[BUFFER];
        private int pos;
        private int len;

        private In(InputStream in) {
            this.in = in;
        }

        int read() throws IOException {
            if (pos == len) {
                fill();
            }
            return buf[pos++] & 0xFF;
        }

        long number() throws IOException {
            long v = 0;
            for (int shift = 0; ; shift += 7) {
                int b = read();
                v |= (long) (b & 0x7F) << shift;
                if (b < 0x80) {
                    return v;
                }
            }
        }

        int signed() throws IOException {
            int z = (int) number();
            return (z >>> 1) ^ -(z & 1);
        }

        /** Reads a byte string into {@code into} (grown when short); returns it, length in {@code length[0]}. */
        byte[] bytes(byte[] into, int[] length) throws IOException {
            int n = (int) number();
            byte[] b = into.length >= n ? into : new byte[Math.max(n, 2 * into.length)];
            for (int done = 0; done < n; ) {
                if (pos == len) {
                    fill();
                }
                int k = Math.min(n - done, len - pos);
                System.arraycopy(buf, pos, b, done, k);
                pos += k;
                done += k;
            }
            length[0] = n;
            return b;
        }

        String text() throws IOException {
            int[] n = new int[1];
            byte[] b = bytes(new byte[0], n);
            return new String(b, 0, n[0], StandardCharsets.UTF_8);
        }

        private void fill() throws IOException {
            len = in.read(buf, 0, buf.length);
            pos = 0;
            if (len <= 0) {
                len = 0;
                throw new EOFException("a spilled tally file ends early");
            }
        }

        @Override
        public void close() throws IOException {
            in.close();
        }
    }
}
