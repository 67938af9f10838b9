package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.function.LongSupplier;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.DumpFile;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.Format;
import org.voteworth.source.HeaderMapping;
import org.voteworth.source.ParallelDumpReader;
import org.voteworth.source.PieceListener;
import org.voteworth.source.ProgressListener;
import org.voteworth.source.RejectLog;
import org.voteworth.source.RejectRateExceeded;
import org.voteworth.source.ReviewSink;
import org.voteworth.source.ScanSummary;
import org.voteworth.source.SourceOptions;
import org.voteworth.store.StoreWriter;
import org.voteworth.tally.BoundedTally;
import org.voteworth.tally.OverviewCounts;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;
import org.voteworth.tally.VoteCap;

/** Reads a dump into a reviewer table on {@code --threads} threads, with progress on stderr and the rejects in a file. */
final class TallyRun {
    /**
     * What a tally produced.
     *
     * @param table the reviewer (or review) table
     * @param summary reconciliation per file; empty when the input was a reviewer table file
     * @param rejectsFile where rejected rows went
     * @param seconds wall time
     * @param bytes input bytes on disk
     * @param overview the data set overview counts, from the same pass (empty for a reviewer table input)
     */
    record Result(TallyTable table, ScanSummary summary, Path rejectsFile, double seconds, long bytes,
                  OverviewCounts overview) {
        String throughput() {
            return TallyRun.throughput(summary.rowsRead(), bytes, seconds);
        }
    }

    /**
     * What a bounded-memory tally wrote.
     *
     * @param reviewers reviewers (or reviews) in the written table
     * @param spills how often partial tallies went to disk
     * @param overview the data set overview counts, from the same pass (empty for a reviewer table input)
     */
    record Written(long reviewers, TallyUnit unit, ScanSummary summary, Path rejectsFile, double seconds, long bytes,
                   int spills, OverviewCounts overview) {
        String throughput() {
            return TallyRun.throughput(summary.rowsRead(), bytes, seconds);
        }
    }

    private TallyRun() {
    }

    /** The closing line of a tally: rows, reviewers, rejects, wall time, throughput, peak memory and spills. */
    static String doneLine(Written w, String peakMemory) {
        return String.format(Locale.ROOT, "tally: done: %,d rows, %,d %s, %,d rejected, %.1f s wall, %s, %s%s",
                w.summary().rowsRead(), w.reviewers(), w.unit() == TallyUnit.REVIEW ? "reviews" : "reviewers",
                w.summary().rejected(), w.seconds(), w.throughput(), peakMemory,
                w.spills() > 0 ? String.format(Locale.ROOT, ", %d spills", w.spills()) : "");
    }

    static String throughput(long rows, long bytes, double seconds) {
        return String.format(Locale.ROOT, "%,.0f rows/s, %.1f MB/s", rows / Math.max(seconds, 1e-9),
                bytes / 1e6 / Math.max(seconds, 1e-9));
    }

    /** The header mapping of {@code --map-file} and {@code --map} (the latter wins). */
    static HeaderMapping mapping(DumpOptions o) throws IOException {
        HeaderMapping mapping = HeaderMapping.defaults();
        if (o.mapFile != null) {
            mapping = mapping.withOverrides(HeaderMapping.load(o.mapFile));
        }
        if (o.map != null) {
            mapping = mapping.withOverrides(HeaderMapping.parse(o.map));
        }
        return mapping;
    }

    static SourceOptions sourceOptions(DumpOptions o) throws IOException {
        SourceOptions s = SourceOptions.defaults().withMapping(mapping(o)).withMaxRejectRate(o.maxRejectRate);
        if (o.csv) {
            s = s.withFormat(Format.CSV);
        }
        if (o.categoryPattern != null) {
            s = s.withCategories(CategoryFromName.of(o.categoryPattern));
        }
        return s;
    }

    private static boolean isReviewerTable(DumpOptions o) {
        return o.inputs.size() == 1 && Files.isRegularFile(Path.of(o.inputs.get(0)))
                && ReviewerTableFile.looksLikeReviewerTable(Path.of(o.inputs.get(0)));
    }

    /**
     * Tallies the dump named by {@code o} into one table in memory (for commands that rank); a
     * single input that is a reviewer table written by {@code tally} is read back instead.
     */
    static Result run(DumpOptions o, TallyUnit unit, Path rejectsFile, boolean quiet, PrintWriter err) throws IOException {
        return run(o, unit, rejectsFile, quiet, err, 0);
    }

    /**
     * As {@link #run(DumpOptions, TallyUnit, Path, boolean, PrintWriter)}, with each review's votes
     * capped at {@code capVotes} before they are tallied ({@link VoteCap}; 0 = no cap). The cap needs
     * each review's votes, so it refuses a reviewer table read back from CSV.
     */
    static Result run(DumpOptions o, TallyUnit unit, Path rejectsFile, boolean quiet, PrintWriter err, long capVotes)
            throws IOException {
        if (capVotes < 0) {
            throw new IllegalArgumentException("--cap-votes must be at least 1 vote per review (or 0 for no cap), not " + capVotes);
        }
        long start = System.nanoTime();
        if (isReviewerTable(o)) {
            if (capVotes > 0) {
                throw new IllegalArgumentException("--cap-votes needs each review's votes, but " + o.inputs.get(0)
                        + " is a reviewer table (votes already summed per reviewer): give the dump instead");
            }
            Path p = Path.of(o.inputs.get(0));
            TallyTable t = ReviewerTableFile.read(p);
            return new Result(t, new ScanSummary(List.of()), rejectsFile, (System.nanoTime() - start) / 1e9, Files.size(p),
                    new OverviewCounts());
        }
        SourceOptions options = sourceOptions(o);
        List<DumpFile> files = DumpFinder.find(o.inputs, options.categories());
        Files.createDirectories(o.tmpDir());
        Path runDir = Files.createTempDirectory(o.tmpDir(), "voteworth-tally-");
        // Ranking holds the final table; --memory bounds the workers' partial tables while scanning.
        try (TempCleanup cleanup = TempCleanup.register(runDir);
             BoundedTally tally = new BoundedTally(unit, o.memoryBytes(), runDir)) {
            UnaryOperator<ReviewSink> cap = capVotes == 0 ? UnaryOperator.identity() : sink -> new VoteCap(capVotes, sink);
            OverviewCounts overview = new OverviewCounts();
            ScanSummary summary = scan(o, options, files, tally, cap, PieceListener.NONE, overview, rejectsFile, quiet, err, start,
                    runDir);
            TallyTable table;
            if (tally.spilled()) {
                Path merged = runDir.resolve("merged-" + (unit == TallyUnit.REVIEW ? "reviews" : "reviewers") + ".csv");
                if (unit == TallyUnit.REVIEWER) {
                    tally.write(merged, overview);
                } else {
                    tally.write(merged);
                }
                table = readBack(merged, unit);
            } else {
                table = tally.mergedInMemory();
                if (unit == TallyUnit.REVIEWER) {
                    overview.addReviewers(table);
                }
            }
            double seconds = (System.nanoTime() - start) / 1e9;
            long bytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
            if (!quiet) {
                Written w = new Written(table.size(), unit, summary, rejectsFile, seconds, bytes, tally.spills(), overview);
                err.println(doneLine(w, peakMemory()) + (capVotes == 0 ? "" : ", votes capped at " + capVotes + " per review"));
                err.flush();
            }
            return new Result(table, summary, rejectsFile, seconds, bytes, overview);
        }
    }

    /** A table merged on disk read back into memory, keyed by {@code unit}. */
    private static TallyTable readBack(Path merged, TallyUnit unit) throws IOException {
        TallyTable read = ReviewerTableFile.read(merged);
        if (unit == TallyUnit.REVIEWER) {
            return read;
        }
        TallyTable t = new TallyTable(unit);
        for (int s = 0; s < read.size(); s++) {
            t.add(read.get(s));
        }
        return t;
    }

    /**
     * Tallies the dump named by {@code o} within {@code --memory}, writing the reviewer table to
     * {@code table} (spilling partial tallies to {@code --tmp} when they would pass the budget).
     */
    static Written write(DumpOptions o, TallyUnit unit, Path table, Path rejectsFile, boolean quiet, PrintWriter err)
            throws IOException {
        return write(o, unit, table, rejectsFile, quiet, err, Optional.empty());
    }

    /** As {@link #write(DumpOptions, TallyUnit, Path, Path, boolean, PrintWriter)}, every accepted row also going to {@code store} in the same scan. */
    static Written write(DumpOptions o, TallyUnit unit, Path table, Path rejectsFile, boolean quiet, PrintWriter err,
                         Optional<StoreWriter> store) throws IOException {
        long start = System.nanoTime();
        if (isReviewerTable(o)) {
            if (store.isPresent()) {
                throw new IllegalArgumentException("--store keeps every review, but " + o.inputs.get(0)
                        + " is a reviewer table: give the dump instead");
            }
            Path p = Path.of(o.inputs.get(0));
            TallyTable t = ReviewerTableFile.read(p);
            ReviewerTableFile.write(t, table);
            return new Written(t.size(), t.unit(), new ScanSummary(List.of()), rejectsFile, (System.nanoTime() - start) / 1e9,
                    Files.size(p), 0, new OverviewCounts());
        }
        SourceOptions options = sourceOptions(o);
        List<DumpFile> files = DumpFinder.find(o.inputs, options.categories());
        if (store.isPresent()) {
            store.get().begin(files);
        }
        long budget = o.memoryBytes();
        Files.createDirectories(o.tmpDir());
        Path runDir = Files.createTempDirectory(o.tmpDir(), "voteworth-tally-");
        try (TempCleanup cleanup = TempCleanup.register(runDir);
             BoundedTally tally = new BoundedTally(unit, budget, runDir)) {
            OverviewCounts overview = new OverviewCounts();
            UnaryOperator<ReviewSink> tee = store.isPresent() ? store.get()::tee : UnaryOperator.identity();
            ScanSummary summary = scan(o, options, files, tally, tee, store.map(StoreWriter::pieces).orElse(PieceListener.NONE),
                    overview, rejectsFile, quiet, err, start, runDir);
            if (!quiet && tally.spilled()) {
                err.printf(Locale.ROOT, "tally: merging %d spilled partial tallies partition by partition ...%n", tally.spills());
                err.flush();
            }
            if (unit == TallyUnit.REVIEWER) {
                tally.write(table, overview);
            } else {
                tally.write(table);
            }
            double seconds = (System.nanoTime() - start) / 1e9;
            long bytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
            Written w = new Written(tally.reviewers(), unit, summary, rejectsFile, seconds, bytes, tally.spills(), overview);
            if (!quiet) {
                err.println(doneLine(w, peakMemory()));
                err.flush();
            }
            return w;
        }
    }

    /**
     * Scans {@code files} once: each worker's rows go to its overview counts (votes as in the dump)
     * and, through {@code wrap}, to its tally sink; the workers' overview counts are merged into
     * {@code overview} at the end.
     */
    private static ScanSummary scan(DumpOptions o, SourceOptions options, List<DumpFile> files, BoundedTally tally,
                                    UnaryOperator<ReviewSink> wrap, PieceListener pieces, OverviewCounts overview, Path rejectsFile,
                                    boolean quiet,
                                    PrintWriter err, long start, Path tmp) throws IOException {
        if (rejectsFile.toAbsolutePath().getParent() != null) {
            Files.createDirectories(rejectsFile.toAbsolutePath().getParent());
        }
        ParallelDumpReader reader = new ParallelDumpReader(options, o.threads()).withTempDir(tmp).withPieceListener(pieces);
        ProgressListener progress = quiet ? ProgressListener.NONE : new Progress(err, start, Progress.stderrIsTerminal());
        try (RejectLog rejects = new RejectLog(rejectsFile)) {
            List<OverviewCounts> perWorker = new java.util.concurrent.CopyOnWriteArrayList<>();
            ScanSummary s = reader.read(files, w -> {
                OverviewCounts counts = new OverviewCounts();
                perWorker.add(counts);
                ReviewSink tallies = wrap.apply(tally.newSink());
                return row -> {
                    counts.accept(row);
                    tallies.accept(row);
                };
            }, rejects, progress);
            perWorker.forEach(overview::mergeFrom);
            return s;
        } catch (RejectRateExceeded e) {
            // The rejects file is closed (complete up to the stop) by now: it is the user's evidence.
            throw e.keptIn(rejectsFile);
        } finally {
            if (progress instanceof Progress p) {
                p.finish();
            }
        }
    }

    /** Deletes a folder and what is in it; quietly does what it can. */
    static void deleteTree(Path dir) {
        if (!Files.exists(dir)) {
            return;
        }
        try (java.util.stream.Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        } catch (IOException | RuntimeException e) {
            // Best effort: a file still being written when the JVM stops may stay behind.
        }
    }

    /** Peak memory: heap used at most (all pools) and the process's peak resident set (VmHWM) where Linux tells it. */
    static String peakMemory() {
        long heap = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            if (p.getType() == MemoryType.HEAP && p.getPeakUsage() != null) {
                heap += p.getPeakUsage().getUsed();
            }
        }
        String rss = "";
        try {
            for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
                if (line.startsWith("VmHWM:")) {
                    long kb = Long.parseLong(line.replaceAll("[^0-9]", ""));
                    rss = String.format(Locale.ROOT, ", peak resident %.0f MiB", kb / 1024.0);
                }
            }
        } catch (IOException | RuntimeException e) {
            // Not Linux: the heap figure alone.
        }
        return String.format(Locale.ROOT, "peak heap %.0f MiB%s", heap / 1048576.0, rss);
    }

    /**
     * Progress on stderr: on a terminal a bar redrawn in place a few times a second, otherwise a
     * plain line every few seconds; both give bytes done of total, rows per second and time left.
     * Thread-safe.
     */
    static final class Progress implements ProgressListener {
        /** How often the bar is redrawn on a terminal. */
        static final long BAR_EVERY_NANOS = 250_000_000L;
        /** How often a plain line is logged when stderr is not a terminal. */
        static final long LINE_EVERY_NANOS = 3_000_000_000L;
        private static final int WIDTH = 30;
        private final PrintWriter err;
        private final long start;
        private final boolean bar;
        private final long everyNanos;
        private final LongSupplier clock;
        private long last;
        private boolean drawn;

        Progress(PrintWriter err, long start, boolean bar) {
            this(err, start, bar, bar ? BAR_EVERY_NANOS : LINE_EVERY_NANOS, System::nanoTime);
        }

        /**
         * @param start the clock's reading when the run started
         * @param everyNanos least time between two updates
         * @param clock nanoseconds, as {@link System#nanoTime()} (tests pass their own)
         */
        Progress(PrintWriter err, long start, boolean bar, long everyNanos, LongSupplier clock) {
            this.err = err;
            this.start = start;
            this.bar = bar;
            this.everyNanos = everyNanos;
            this.clock = clock;
            this.last = start;
        }

        @Override
        public synchronized void progress(long bytesConsumed, long bytesTotal, long rowsRead) {
            long now = clock.getAsLong();
            if (now - last < everyNanos) {
                return;
            }
            last = now;
            double secs = Math.max((now - start) / 1e9, 1e-9);
            double frac = bytesTotal == 0 ? 1 : Math.min(1, (double) bytesConsumed / bytesTotal);
            String left = frac > 0 ? String.format(Locale.ROOT, "%.0f s", secs / frac - secs) : "?";
            if (bar) {
                int fill = (int) Math.round(frac * WIDTH);
                err.printf(Locale.ROOT, "\r[%s%s] %3.0f %% %s of %s, %,.0f rows/s, %s left   ", "#".repeat(fill),
                        " ".repeat(WIDTH - fill), 100 * frac, mb(bytesConsumed), mb(bytesTotal), rowsRead / secs, left);
                drawn = true;
            } else {
                err.printf(Locale.ROOT, "tally: %s of %s (%.0f %%), %,d rows, %,.0f rows/s, about %s left%n",
                        mb(bytesConsumed), mb(bytesTotal), 100 * frac, rowsRead, rowsRead / secs, left);
            }
            err.flush();
        }

        /** Clears a drawn bar so the summary starts on a clean line. */
        synchronized void finish() {
            if (drawn) {
                err.print("\r" + " ".repeat(100) + "\r");
                err.flush();
                drawn = false;
            }
        }

        /**
         * Whether stderr is a terminal: as the launcher found it (system property
         * {@code voteworth.stderr}, {@code terminal} or {@code plain}), else whether the JVM has a console.
         */
        static boolean stderrIsTerminal() {
            String told = System.getProperty("voteworth.stderr");
            return told != null ? told.equals("terminal") : System.console() != null;
        }

        static String mb(long b) {
            return String.format(Locale.ROOT, "%.1f MB", b / 1e6);
        }
    }

    /**
     * Deletes a run's temporary and partial files when the run ends, and also when the JVM is
     * stopped (Ctrl-C, SIGTERM) before that: the shutdown hook first interrupts the thread that
     * registered it, so the scan stops and closes what it holds, waits a little for that, then
     * deletes the paths, again until none is left (a worker may still be finishing a spill file).
     */
    static final class TempCleanup implements AutoCloseable {
        private static final long STOP_WAIT_MILLIS = 2_000;
        private static final int ATTEMPTS = 40;
        private final List<Path> paths;
        private final Thread owner = Thread.currentThread();
        private final java.util.concurrent.CountDownLatch closed = new java.util.concurrent.CountDownLatch(1);
        private final Thread hook;

        private TempCleanup(List<Path> paths) {
            this.paths = List.copyOf(paths);
            this.hook = new Thread(this::onShutdown, "voteworth-cleanup");
        }

        /** Registers the cleanup of {@code paths} (files or folders) on the calling thread's behalf. */
        static TempCleanup register(List<Path> paths) {
            TempCleanup c = new TempCleanup(paths);
            Runtime.getRuntime().addShutdownHook(c.hook);
            return c;
        }

        static TempCleanup register(Path path) {
            return register(List.of(path));
        }

        private void onShutdown() {
            if (closed.getCount() > 0) {
                owner.interrupt();
                try {
                    closed.await(STOP_WAIT_MILLIS, java.util.concurrent.TimeUnit.MILLISECONDS);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
            for (int i = 0; i < ATTEMPTS && deleteAll(); i++) {
                try {
                    Thread.sleep(50);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    return;
                }
            }
        }

        /** Deletes every path; whether any is still there. */
        private boolean deleteAll() {
            boolean left = false;
            for (Path p : paths) {
                deleteTree(p);
                left |= Files.exists(p);
            }
            return left;
        }

        /** Deletes the paths now and drops the hook. */
        @Override
        public void close() {
            try {
                deleteAll();
            } finally {
                closed.countDown();
            }
            try {
                Runtime.getRuntime().removeShutdownHook(hook);
            } catch (IllegalStateException e) {
                // Already shutting down: the hook runs.
            }
        }
    }
}
