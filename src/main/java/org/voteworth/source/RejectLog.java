package org.voteworth.source;

import java.io.BufferedOutputStream;
import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Writes every rejected row to a tab-separated rejects file with the header
 * {@code file line field reason value row}. {@code row} is the raw row, byte for byte, with
 * backslash, tab, CR and LF written as {@code \\}, {@code \t}, {@code \r}, {@code \n}, so nothing
 * is lost and the file stays one row per line; the other text columns are escaped the same way.
 * Thread-safe and buffered; {@link #close()} flushes.
 */
public final class RejectLog implements RejectSink, Closeable {
    /** The header line's column names. */
    public static final String HEADER = "file\tline\tfield\treason\tvalue\trow";

    private final String name;
    private final OutputStream out;
    private long written;

    /**
     * Creates (or replaces) {@code file} and writes the header.
     *
     * @throws IOException naming the file when it cannot be created
     */
    public RejectLog(Path file) throws IOException {
        this(file.toString(), open(file));
    }

    RejectLog(String name, OutputStream out) throws IOException {
        this.name = name;
        this.out = out instanceof BufferedOutputStream ? out : new BufferedOutputStream(out, 1 << 16);
        this.out.write((HEADER + "\n").getBytes(StandardCharsets.UTF_8));
    }

    private static OutputStream open(Path file) throws IOException {
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
            return new BufferedOutputStream(Files.newOutputStream(file), 1 << 16);
        } catch (IOException e) {
            throw new IOException("cannot write the rejects file " + file + ": " + e, e);
        }
    }

    @Override
    public synchronized void reject(DumpFile file, long line, Reject reject, byte[] row, int start, int end) {
        try {
            text(String.valueOf(file));
            out.write('\t');
            text(Long.toString(line));
            out.write('\t');
            text(reject.field());
            out.write('\t');
            text(reject.reason());
            out.write('\t');
            text(reject.value());
            out.write('\t');
            escaped(row, start, end);
            out.write('\n');
            written++;
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the rejects file " + name + ": " + e.getMessage(), e);
        }
    }

    /** Rows written so far. */
    public synchronized long written() {
        return written;
    }

    private void text(String s) throws IOException {
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        escaped(b, 0, b.length);
    }

    private void escaped(byte[] b, int s, int e) throws IOException {
        int run = s;
        for (int i = s; i < e; i++) {
            byte c = b[i];
            byte esc = c == '\\' ? (byte) '\\' : c == '\t' ? (byte) 't' : c == '\r' ? (byte) 'r' : c == '\n' ? (byte) 'n' : 0;
            if (esc != 0) {
                out.write(b, run, i - run);
                out.write('\\');
                out.write(esc);
                run = i + 1;
            }
        }
        out.write(b, run, e - run);
    }

    /**
     * The inverse of the escaping in the {@code row} column, for readers of the rejects file.
     *
     * @throws IllegalArgumentException on a backslash that starts no known escape
     */
    public static byte[] unescape(byte[] b, int s, int e) {
        byte[] out = new byte[e - s];
        int n = 0;
        for (int i = s; i < e; i++) {
            if (b[i] != '\\') {
                out[n++] = b[i];
                continue;
            }
            if (++i >= e) {
                throw new IllegalArgumentException("a lone backslash ends the escaped text");
            }
            out[n++] = switch (b[i]) {
                case '\\' -> '\\';
                case 't' -> '\t';
                case 'r' -> '\r';
                case 'n' -> '\n';
                default -> throw new IllegalArgumentException("unknown escape \\" + (char) b[i]);
            };
        }
        return java.util.Arrays.copyOf(out, n);
    }

    @Override
    public synchronized void close() throws IOException {
        try {
            out.close();
        } catch (IOException e) {
            throw new IOException("cannot finish the rejects file " + name + ": " + e, e);
        }
    }
}
