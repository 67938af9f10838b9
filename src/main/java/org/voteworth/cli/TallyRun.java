package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.DumpFile;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.DumpReader;
import org.voteworth.source.Format;
import org.voteworth.source.HeaderMapping;
import org.voteworth.source.ProgressListener;
import org.voteworth.source.RejectLog;
import org.voteworth.source.ScanSummary;
import org.voteworth.source.SourceOptions;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;

/** Reads a dump into a reviewer table, with progress on stderr and the rejects in a file. */
final class TallyRun {
    /**
     * What a tally produced.
     *
     * @param table the reviewer (or review) table
     * @param summary reconciliation per file; empty when the input was a reviewer table file
     * @param rejectsFile where rejected rows went
     * @param seconds wall time
     * @param bytes input bytes on disk
     */
    record Result(TallyTable table, ScanSummary summary, Path rejectsFile, double seconds, long bytes) {
        String throughput() {
            return String.format(Locale.ROOT, "%,.0f rows/s, %.1f MB/s", summary.rowsRead() / Math.max(seconds, 1e-9),
                    bytes / 1e6 / Math.max(seconds, 1e-9));
        }
    }

    private TallyRun() {
    }

    static SourceOptions sourceOptions(DumpOptions o) throws IOException {
        HeaderMapping mapping = HeaderMapping.defaults();
        if (o.mapFile != null) {
            mapping = mapping.withOverrides(HeaderMapping.load(o.mapFile));
        }
        if (o.map != null) {
            mapping = mapping.withOverrides(HeaderMapping.parse(o.map));
        }
        SourceOptions s = SourceOptions.defaults().withMapping(mapping).withMaxRejectRate(o.maxRejectRate);
        if (o.csv) {
            s = s.withFormat(Format.CSV);
        }
        if (o.categoryPattern != null) {
            s = s.withCategories(CategoryFromName.of(o.categoryPattern));
        }
        return s;
    }

    /**
     * Tallies the dump named by {@code o}; a single input that is a reviewer table written by
     * {@code tally} is read back instead (no rows, no rejects).
     */
    static Result run(DumpOptions o, TallyUnit unit, Path rejectsFile, boolean quiet, PrintWriter err) throws IOException {
        long start = System.nanoTime();
        if (o.inputs.size() == 1 && Files.isRegularFile(Path.of(o.inputs.get(0)))
                && ReviewerTableFile.looksLikeReviewerTable(Path.of(o.inputs.get(0)))) {
            Path p = Path.of(o.inputs.get(0));
            TallyTable t = ReviewerTableFile.read(p);
            return new Result(t, new ScanSummary(List.of()), rejectsFile, (System.nanoTime() - start) / 1e9, Files.size(p));
        }
        SourceOptions options = sourceOptions(o);
        List<DumpFile> files = DumpFinder.find(o.inputs, options.categories());
        TallyTable table = new TallyTable(unit);
        if (rejectsFile.getParent() != null) {
            Files.createDirectories(rejectsFile.getParent());
        }
        ScanSummary summary;
        try (RejectLog rejects = new RejectLog(rejectsFile)) {
            summary = new DumpReader(options).read(files, table, rejects, quiet ? ProgressListener.NONE : new Progress(err, start));
        }
        long bytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        double seconds = (System.nanoTime() - start) / 1e9;
        if (!quiet) {
            err.printf(Locale.ROOT, "tally: done, %,d rows from %d files in %.1f s%n", summary.rowsRead(), files.size(), seconds);
            err.flush();
        }
        return new Result(table, summary, rejectsFile, seconds, bytes);
    }

    /** A plain progress line on stderr every few seconds: done of total, rows per second, time left. */
    static final class Progress implements ProgressListener {
        private static final long EVERY_NANOS = 3_000_000_000L;
        private final PrintWriter err;
        private final long start;
        private long last;

        Progress(PrintWriter err, long start) {
            this.err = err;
            this.start = start;
            this.last = start;
        }

        @Override
        public void progress(long bytesConsumed, long bytesTotal, long rowsRead) {
            long now = System.nanoTime();
            if (now - last < EVERY_NANOS) {
                return;
            }
            last = now;
            double secs = (now - start) / 1e9;
            double frac = bytesTotal == 0 ? 1 : (double) bytesConsumed / bytesTotal;
            double left = frac > 0 ? secs / frac - secs : Double.NaN;
            err.printf(Locale.ROOT, "tally: %s of %s (%.0f %%), %,d rows, %,.0f rows/s, about %.0f s left%n",
                    mb(bytesConsumed), mb(bytesTotal), 100 * frac, rowsRead, rowsRead / secs, left);
            err.flush();
        }

        private static String mb(long b) {
            return String.format(Locale.ROOT, "%.1f MB", b / 1e6);
        }
    }
}
