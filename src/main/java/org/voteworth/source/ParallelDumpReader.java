package org.voteworth.source;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Function;
import java.util.function.IntFunction;

/**
 * Reads a whole dump on several threads, with the same result as {@link DumpReader} on one:
 * files are scanned in parallel, a large plain file is cut into byte ranges that start and end on
 * line boundaries (its header read once per range from the file's start), and a compressed file
 * is decompressed on a thread of its own while a worker parses it.
 *
 * <p>Each worker has its own {@link ReviewSink} (asked for once per worker, before the scan), so
 * sinks need no locking; the caller merges them afterwards. Rejects are buffered per range and
 * written to the {@link RejectSink} in file and line order with exact line numbers, and the
 * {@link RejectRateLimit} is checked on that ordered stream, so the rejects file, the
 * reconciliation and any stop for too many rejects are identical whatever the thread count.
 * {@link ReviewRow#line} is exact only for rows of a file's first range: sinks should not rely on it.
 */
public final class ParallelDumpReader {
    /** Plain files at least this large are cut into byte ranges. */
    static final long SPLIT_MIN = 64L << 20;
    private static final long PIECE_MIN = 32L << 20;
    private static final long PIECE_MAX = 256L << 20;

    private final SourceOptions options;
    private final int threads;
    private Path tmpDir = Path.of(System.getProperty("java.io.tmpdir"));
    private Function<DumpFile, long[]> cuts;
    private PieceListener pieces = PieceListener.NONE;

    /**
     * @param threads scanning workers (1 or more); each compressed file being read adds one
     *     decompressing thread
     */
    public ParallelDumpReader(SourceOptions options, int threads) {
        this.options = Objects.requireNonNull(options, "options");
        if (threads < 1) {
            throw new IllegalArgumentException("--threads must be 1 or more, got " + threads);
        }
        this.threads = threads;
    }

    /** Where rejects of a range overflow to when there are very many (default: java.io.tmpdir). */
    public ParallelDumpReader withTempDir(Path dir) {
        this.tmpDir = Objects.requireNonNull(dir, "dir");
        return this;
    }

    /**
     * Tells {@code listener} where each piece of work starts and, once its turn in file order has
     * come, the line number its rows count from, so that a sink which keeps rows can number them
     * exactly (see {@link PieceListener}).
     */
    public ParallelDumpReader withPieceListener(PieceListener listener) {
        this.pieces = Objects.requireNonNull(listener, "listener");
        return this;
    }

    /** Cuts plain files at the given nominal offsets instead of by size (tests cut at awkward places). */
    ParallelDumpReader withCuts(Function<DumpFile, long[]> nominalCuts) {
        this.cuts = nominalCuts;
        return this;
    }

    /** One piece of work: a whole file, or the bytes [start, end) of a plain one. */
    private record Unit(int fileIndex, DumpFile file, long start, long end, boolean first, boolean whole, boolean last) {
    }

    /** What scanning one unit left for the ordered writer. */
    private static final class Done {
        final CountDownLatch latch = new CountDownLatch(1);
        volatile FileReport report;
        volatile BufferedRejects rejects;
        volatile Throwable error;
    }

    /**
     * Reads {@code files}; rows go to the worker's sink, rejects in order to {@code rejects}.
     *
     * @param sinkPerWorker called with 0, 1, ... once per worker on the calling thread
     * @param progress told the bytes consumed and rows read over all files; called from any thread
     * @throws DumpFormatException naming the file (and line) that cannot be read as asked
     * @throws IOException naming the file when reading fails
     */
    public ScanSummary read(List<DumpFile> files, IntFunction<? extends ReviewSink> sinkPerWorker, RejectSink rejects,
                            ProgressListener progress) throws IOException {
        Objects.requireNonNull(rejects, "rejects");
        Objects.requireNonNull(progress, "progress");
        List<Unit> units = plan(files);
        int workers = Math.max(1, Math.min(threads, units.size()));
        List<ReviewSink> sinks = new ArrayList<>(workers);
        for (int w = 0; w < workers; w++) {
            sinks.add(Objects.requireNonNull(sinkPerWorker.apply(w), "sink"));
        }
        long totalBytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        AtomicLong bytesDone = new AtomicLong();
        AtomicLong rowsDone = new AtomicLong();
        ProgressListener overall = (b, t, r) -> progress.progress(bytesDone.get(), totalBytes, rowsDone.get());
        Done[] done = new Done[units.size()];
        for (int i = 0; i < done.length; i++) {
            done[i] = new Done();
        }
        AtomicInteger next = new AtomicInteger();
        java.util.concurrent.atomic.AtomicBoolean abort = new java.util.concurrent.atomic.AtomicBoolean();
        SourceOptions unlimited = options.withMaxRejectRate(1.0);
        List<Thread> pool = new ArrayList<>();
        for (int w = 0; w < workers; w++) {
            ReviewSink sink = sinks.get(w);
            int number = w;
            Thread t = new Thread(() -> work(number, units, done, next, abort, new DumpScanner(unlimited), sink, bytesDone, rowsDone,
                    overall), "scan-" + w);
            t.setDaemon(true);
            pool.add(t);
        }
        pool.forEach(Thread::start);
        try {
            return emit(files, units, done, rejects);
        } finally {
            abort.set(true);
            for (Thread t : pool) {
                try {
                    t.join();
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            for (Done d : done) {
                if (d.rejects != null) {
                    d.rejects.close();
                }
            }
        }
    }

    private void work(int worker, List<Unit> units, Done[] done, AtomicInteger next, java.util.concurrent.atomic.AtomicBoolean abort,
                      DumpScanner scanner, ReviewSink sink, AtomicLong bytesDone, AtomicLong rowsDone,
                      ProgressListener overall) {
        scanner.pipelined(true);
        int i;
        while (!abort.get() && (i = next.getAndIncrement()) < units.size()) {
            Unit u = units.get(i);
            Done d = done[i];
            BufferedRejects buffered = new BufferedRejects(tmpDir);
            d.rejects = buffered;
            long[] seen = new long[2];
            scanner.onProgress((bytes, size, rows) -> {
                if (abort.get()) {
                    throw new CancellationException("stopped");
                }
                bytesDone.addAndGet(bytes - seen[0]);
                rowsDone.addAndGet(rows - seen[1]);
                seen[0] = bytes;
                seen[1] = rows;
                overall.progress(0, 0, 0);
            });
            try {
                pieces.started(worker, u.fileIndex, u.start);
                if (u.whole) {
                    d.report = scanner.scan(u.file, sink, buffered);
                } else {
                    try (RangeStream in = RangeStream.open(u.file.path(), u.start, u.end)) {
                        d.report = scanner.scan(u.file, in, 1, u.first, sink, buffered);
                    }
                }
            } catch (Throwable t) {
                d.error = t;
                abort.set(true);
            } finally {
                d.latch.countDown();
            }
        }
        // Units nobody will take after an abort still release the writer.
        while ((i = next.getAndIncrement()) < units.size()) {
            done[i].error = new CancellationException("stopped");
            done[i].latch.countDown();
        }
    }

    /** Writes the buffered rejects in unit order with exact line numbers, checking the reject rate as one scan would. */
    private ScanSummary emit(List<DumpFile> files, List<Unit> units, Done[] done, RejectSink rejects) throws IOException {
        RejectRateLimit limit = options.rejectRateLimit();
        Format format = options.format();
        List<FileReport> reports = new ArrayList<>(files.size());
        ScanCounts counts = null;
        long accepted = 0;
        long linesBefore = 0;
        boolean[] checkedAtMin = new boolean[1];
        boolean noHeader = false;
        for (int k = 0; k < units.size(); k++) {
            Unit u = units.get(k);
            Done d = done[k];
            try {
                d.latch.await();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while reading " + u.file);
            }
            if (d.error != null) {
                throw rethrow(d.error instanceof CancellationException ? cause(done, d.error) : d.error);
            }
            if (u.first) {
                counts = new ScanCounts();
                accepted = 0;
                linesBefore = 0;
                checkedAtMin[0] = false;
                noHeader = false;
            }
            ScanCounts c = counts;
            long rowsBefore = c.rowsRead;
            // Rows of the first range are numbered after the header (line 1); other ranges from line 1 of their own.
            long rowBase = u.first ? -1 : 0;
            long lineBase = linesBefore;
            pieces.lineBase(u.fileIndex, u.start, lineBase);
            DumpFile file = u.file;
            d.rejects.replay((line, r, row, s, e) -> {
                long g = rowsBefore + line + rowBase;
                if (!checkedAtMin[0] && g > RejectRateLimit.MIN_ROWS) {
                    c.rowsRead = RejectRateLimit.MIN_ROWS;
                    limit.checkEarly(file, c, format);
                    checkedAtMin[0] = true;
                }
                long abs = lineBase + line;
                c.rowsRead = g;
                c.reject(abs, r, row, s, e);
                rejects.reject(file, abs, r, row, s, e);
                limit.checkEarly(file, c, format);
                if (g == RejectRateLimit.MIN_ROWS) {
                    checkedAtMin[0] = true;
                }
            });
            FileReport rep = d.report;
            c.rowsRead = rowsBefore + rep.rowsRead();
            accepted += rep.accepted();
            noHeader |= rep.noHeader();
            linesBefore += rep.rowsRead() + (u.first && !rep.noHeader() ? 1 : 0);
            if (!checkedAtMin[0] && c.rowsRead >= RejectRateLimit.MIN_ROWS) {
                long all = c.rowsRead;
                c.rowsRead = RejectRateLimit.MIN_ROWS;
                limit.checkEarly(file, c, format);
                c.rowsRead = all;
                checkedAtMin[0] = true;
            }
            d.rejects.close();
            d.rejects = null;
            if (u.last) {
                c.accepted = accepted;
                limit.checkAtEnd(file, c, format);
                reports.add(c.report(file, noHeader));
            }
        }
        return new ScanSummary(reports);
    }

    /**
     * A unit stopped because another one failed: waits for every unit to finish and returns the
     * first real failure, so that the user reads what went wrong instead of "stopped".
     */
    private static Throwable cause(Done[] done, Throwable stopped) throws InterruptedIOException {
        for (Done d : done) {
            try {
                d.latch.await();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while stopping the scan");
            }
        }
        for (Done d : done) {
            if (d.error != null && !(d.error instanceof CancellationException)) {
                return d.error;
            }
        }
        return stopped;
    }

    private static RuntimeException rethrow(Throwable t) throws IOException {
        if (t instanceof IOException io) {
            throw io;
        }
        if (t instanceof UncheckedIOException u) {
            throw u.getCause();
        }
        if (t instanceof RuntimeException r) {
            return r;
        }
        if (t instanceof Error e) {
            throw e;
        }
        return new IllegalStateException(t);
    }

    private List<Unit> plan(List<DumpFile> files) throws IOException {
        long total = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        long piece = Math.max(PIECE_MIN, Math.min(PIECE_MAX, total / (4L * threads)));
        List<Unit> units = new ArrayList<>();
        for (int f = 0; f < files.size(); f++) {
            DumpFile file = files.get(f);
            long size = file.sizeBytes();
            long[] nominal;
            if (file.compression() != DumpFile.Compression.NONE) {
                nominal = new long[0];
            } else if (cuts != null) {
                nominal = cuts.apply(file);
            } else if (threads > 1 && size >= SPLIT_MIN) {
                int n = (int) Math.min(10_000, (size + piece - 1) / piece);
                nominal = new long[n - 1];
                for (int i = 1; i < n; i++) {
                    nominal[i - 1] = size * i / n;
                }
            } else {
                nominal = new long[0];
            }
            if (nominal.length == 0) {
                units.add(new Unit(f, file, 0, size, true, true, true));
                continue;
            }
            List<Long> starts = new ArrayList<>();
            starts.add(0L);
            try (FileChannel ch = FileChannel.open(file.path(), StandardOpenOption.READ)) {
                for (long at : nominal) {
                    long s = RangeStream.lineStartFrom(ch, Math.max(0, Math.min(at, size)), size);
                    if (s > starts.get(starts.size() - 1) && s < size) {
                        starts.add(s);
                    }
                }
            } catch (IOException e) {
                throw new IOException("cannot open " + file + ": " + e.getMessage(), e);
            }
            for (int i = 0; i < starts.size(); i++) {
                long end = i + 1 < starts.size() ? starts.get(i + 1) : size;
                units.add(new Unit(f, file, starts.get(i), end, i == 0, false, i + 1 == starts.size()));
            }
        }
        return units;
    }
}
