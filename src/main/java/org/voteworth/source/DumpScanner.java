package org.voteworth.source;

import java.io.EOFException;
import java.io.FilterInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.NoSuchFileException;
import java.util.List;
import java.util.Objects;
import java.util.zip.GZIPInputStream;
import java.util.zip.ZipException;

/**
 * Scans one dump file, or one byte range of it, byte by byte: finds line ends in a large
 * reusable buffer, hands each line to a {@link RowParser}, passes valid rows to a
 * {@link ReviewSink} and bad ones to a {@link RejectSink}, and counts both. No line is turned
 * into a String. A line longer than the buffer grows it (up to {@value #MAX_LINE} bytes).
 *
 * <p>The header is read and resolved once per file. A final line without LF is still a row. An
 * empty file gives an empty report flagged {@link FileReport#noHeader()}; a file with only a
 * header gives 0 rows. The {@link RejectRateLimit} is enforced during and at the end of the scan.
 *
 * <p>One scanner per thread: it reuses its buffer and row between files.
 */
public final class DumpScanner {
    static final int DEFAULT_BUFFER = 2 << 20;
    static final int MAX_LINE = 1 << 30;
    private static final int GZIP_BUFFER = 1 << 16;
    private static final byte LF = '\n';
    private static final long LFS = ByteScan.pattern(LF);

    private final SourceOptions options;
    private final RejectRateLimit limit;
    private final ReviewRow row = new ReviewRow();
    private byte[] buf;
    private ProgressListener progress = ProgressListener.NONE;
    private boolean pipelined;

    public DumpScanner(SourceOptions options) {
        this(options, DEFAULT_BUFFER);
    }

    /** With a given buffer size; tests use tiny ones so rows straddle buffer ends. */
    DumpScanner(SourceOptions options, int bufferSize) {
        this.options = Objects.requireNonNull(options, "options");
        this.limit = options.rejectRateLimit();
        if (bufferSize < 1) {
            throw new IllegalArgumentException("buffer size " + bufferSize);
        }
        this.buf = new byte[bufferSize];
    }

    /**
     * Whether compressed files are decompressed on a thread of their own while this thread
     * parses (a pipeline of large buffers): decompression alone is the bottleneck there.
     */
    void pipelined(boolean on) {
        this.pipelined = on;
    }

    /** Told (bytes of this file consumed, its size, rows of it read) after every buffer fill. */
    void onProgress(ProgressListener listener) {
        this.progress = Objects.requireNonNull(listener, "listener");
    }

    /**
     * Scans a whole file, decompressing {@code .gz}.
     *
     * @throws DumpFormatException naming the file: header problems, truncated or corrupt gzip,
     *     too many rejects
     * @throws IOException naming the file when it cannot be read
     */
    public FileReport scan(DumpFile file, ReviewSink sink, RejectSink rejects) throws IOException {
        return scan(file, open(file), sink, rejects);
    }

    /**
     * Scans a whole file whose stored bytes (compressed as its name says) come from {@code stored},
     * for files on another file system (a cluster job); {@code file} names it in reports and errors.
     *
     * @throws DumpFormatException naming the file, as for {@link #scan(DumpFile, ReviewSink, RejectSink)}
     * @throws IOException naming the file when it cannot be read; {@code stored} is closed
     */
    public FileReport scan(DumpFile file, InputStream stored, ReviewSink sink, RejectSink rejects) throws IOException {
        try (Counting counted = new Counting(stored); InputStream in = piped(file, decompressed(file, counted))) {
            return run(file, in, counted, 1, null, sink, rejects);
        }
    }

    /**
     * Scans one byte range of a file (already decompressed, positioned at a line start), for
     * scanning a large file in parallel.
     *
     * @param in the bytes of the range, ending at a line end or the end of the file
     * @param firstLine the 1-based line number of the range's first line
     * @param startsWithHeader whether the range's first line is the header; if not, the header
     *     is read from the start of {@code file}
     * @throws DumpFormatException naming the file, as for a whole-file scan; {@code in} is not closed
     */
    public FileReport scan(DumpFile file, InputStream in, long firstLine, boolean startsWithHeader,
                           ReviewSink sink, RejectSink rejects) throws IOException {
        ColumnMapping mapping = startsWithHeader ? null : readMapping(file);
        Counting counted = new Counting(in);
        return run(file, counted, counted, firstLine, mapping, sink, rejects);
    }

    /**
     * Reads the header line of {@code file} and resolves the options' mapping against it.
     *
     * @throws DumpFormatException when the file is empty or the header lacks a required field
     */
    public ColumnMapping readMapping(DumpFile file) throws IOException {
        try (Counting counted = new Counting(open(file)); InputStream in = decompressed(file, counted)) {
            byte[] b = new byte[8192];
            int n = 0;
            while (true) {
                int lf = ByteScan.indexOf(b, 0, n, LF, LFS);
                if (lf >= 0) {
                    return resolve(file, b, 0, lf);
                }
                if (n == b.length) {
                    if (n >= MAX_LINE / 2) {
                        throw new DumpFormatException(file.toString(), 1, "the header line is longer than " + n + " bytes");
                    }
                    b = java.util.Arrays.copyOf(b, n * 2);
                }
                int r = readSome(file, in, b, n, b.length - n);
                if (r < 0) {
                    if (n == 0) {
                        throw new DumpFormatException(file.toString(), 0,
                                "the file is empty: expected a header line naming the columns");
                    }
                    return resolve(file, b, 0, n);
                }
                n += r;
            }
        }
    }

    private ColumnMapping resolve(DumpFile file, byte[] b, int s, int e) {
        if (file.compression() == DumpFile.Compression.NONE && e - s >= 2 && b[s] == (byte) 0x1f && b[s + 1] == (byte) 0x8b) {
            throw new DumpFormatException(file.toString(), 1, "the file looks gzip-compressed but its name does not"
                    + " end in .gz: rename it to " + file.path().getFileName() + ".gz");
        }
        List<String> header = RowParser.splitHeader(b, s, e, options.format());
        return options.mapping().resolve(header, file.path());
    }

    private FileReport run(DumpFile file, InputStream in, Counting counted, long firstLine, ColumnMapping known,
                           ReviewSink sink, RejectSink rejects) throws IOException {
        Format format = options.format();
        RowParser parser = known == null ? null : new RowParser(known, format);
        ScanCounts counts = new ScanCounts();
        row.file = file;
        long line = firstLine;
        int len = 0;
        int pos = 0;
        int scanFrom = 0;
        boolean eof = false;
        boolean headerSeen = known != null;
        while (true) {
            // TSV rows: the line end and the fields in one pass; otherwise the line end first.
            boolean scanned = headerSeen && parser.tsv();
            int lf = scanned ? parser.scanTsv(buf, pos, len) : ByteScan.indexOf(buf, scanFrom, len, LF, LFS);
            scanned &= lf >= 0;
            int lineEnd;
            if (lf >= 0) {
                lineEnd = lf;
            } else if (!eof) {
                if (pos > 0) {
                    System.arraycopy(buf, pos, buf, 0, len - pos);
                    len -= pos;
                    pos = 0;
                }
                if (len == buf.length) {
                    grow(file, line);
                }
                scanFrom = len;
                int r = readSome(file, in, buf, len, buf.length - len);
                if (r < 0) {
                    eof = true;
                } else {
                    len += r;
                }
                progress.progress(counted.count, file.sizeBytes(), counts.rowsRead);
                continue;
            } else if (pos < len) {
                lineEnd = len;
            } else {
                break;
            }
            if (!headerSeen) {
                parser = new RowParser(resolve(file, buf, pos, lineEnd), format);
                headerSeen = true;
            } else {
                row.line = line;
                counts.rowsRead++;
                Reject r = scanned ? parser.parseScanned(buf, pos, lineEnd, row) : parser.parse(buf, pos, lineEnd, row);
                if (r.isNone()) {
                    counts.accepted++;
                    sink.accept(row);
                } else {
                    counts.reject(line, r, buf, pos, lineEnd);
                    rejects.reject(file, line, r, buf, pos, lineEnd);
                    limit.checkEarly(file, counts, format);
                }
                if (counts.rowsRead == RejectRateLimit.MIN_ROWS) {
                    limit.checkEarly(file, counts, format);
                }
            }
            line++;
            pos = lineEnd + 1;
            scanFrom = pos;
        }
        limit.checkAtEnd(file, counts, format);
        return counts.report(file, !headerSeen);
    }

    /** Makes room for a line longer than the buffer. */
    private void grow(DumpFile file, long line) {
        if (buf.length >= MAX_LINE) {
            throw new DumpFormatException(file.toString(), line, "the line is longer than " + MAX_LINE
                    + " bytes without a line break: this does not look like a text dump (is it compressed without a .gz name?)");
        }
        buf = java.util.Arrays.copyOf(buf, (int) Math.min(MAX_LINE, 2L * buf.length));
    }

    /** Reads until {@code room} bytes are in or the input ends; -1 at the end with nothing read. */
    private static int readSome(DumpFile file, InputStream in, byte[] b, int off, int room) throws IOException {
        int n = 0;
        try {
            while (n < room) {
                int r = in.read(b, off + n, room - n);
                if (r < 0) {
                    return n == 0 ? -1 : n;
                }
                n += r;
            }
            return n;
        } catch (EOFException | ZipException e) {
            if (file.compression() != DumpFile.Compression.NONE) {
                throw corruptGzip(file, e);
            }
            throw new IOException(file + ": " + e.getMessage(), e);
        } catch (DumpFormatException e) {
            throw e;
        } catch (IOException e) {
            if (file.compression() == DumpFile.Compression.ZSTD || file.compression() == DumpFile.Compression.BZIP2) {
                throw corruptGzip(file, e);
            }
            throw new IOException("cannot read " + file + ": " + e.getMessage(), e);
        }
    }

    private static InputStream open(DumpFile file) throws IOException {
        try {
            return RangeStream.open(file.path());
        } catch (NoSuchFileException e) {
            throw new IOException(file + ": no such file", e);
        } catch (IOException e) {
            throw new IOException("cannot open " + file + ": " + e.getMessage(), e);
        }
    }

    private InputStream piped(DumpFile file, InputStream in) {
        return pipelined && file.compression() != DumpFile.Compression.NONE ? new DecompressingPipe(in, file.toString()) : in;
    }

    static InputStream decompressed(DumpFile file, InputStream in) throws IOException {
        try {
            return switch (file.compression()) {
                case NONE -> in;
                case GZIP -> new GZIPInputStream(in, GZIP_BUFFER);
                // ZstdInputStreamNoFinalizer: closed explicitly, so no finalizer cost per stream.
                case ZSTD -> new com.github.luben.zstd.ZstdInputStreamNoFinalizer(new java.io.BufferedInputStream(in, GZIP_BUFFER));
                // true: read every stream of a concatenated file, as bzip2 -d does (pbzip2 writes such files).
                case BZIP2 -> new org.apache.commons.compress.compressors.bzip2.BZip2CompressorInputStream(
                        new java.io.BufferedInputStream(in, GZIP_BUFFER), true);
            };
        } catch (DumpFormatException e) {
            throw e;
        } catch (IOException e) {
            throw corruptGzip(file, e);
        }
    }

    private static DumpFormatException corruptGzip(DumpFile file, IOException e) {
        return new DumpFormatException(file.toString(), 0, "the " + file.compression().label()
                + " data is truncated or corrupt (" + e.getMessage()
                + "); copy the file again or re-compress it, or remove it from the input", e);
    }

    /** Counts the bytes taken from the stream below, for progress in on-disk bytes. */
    private static final class Counting extends FilterInputStream {
        long count;

        Counting(InputStream in) {
            super(in);
        }

        @Override
        public int read() throws IOException {
            int b = super.read();
            if (b >= 0) {
                count++;
            }
            return b;
        }

        @Override
        public int read(byte[] b, int off, int len) throws IOException {
            int n = super.read(b, off, len);
            if (n > 0) {
                count += n;
            }
            return n;
        }

        @Override
        public long skip(long n) throws IOException {
            long s = super.skip(n);
            count += s;
            return s;
        }
    }
}
