package org.voteworth.source;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Reads a whole dump: every file in turn through one {@link DumpScanner}, accepted rows to one
 * sink, rejects to one reject sink, and returns the reconciliation of what was read.
 *
 * <pre>{@code
 * List<DumpFile> files = DumpFinder.find(List.of("dump/"), options.categories());
 * ScanSummary s = new DumpReader(options).read(files, table, new RejectCounter());
 * System.out.print(s.describe());
 * }</pre>
 */
public final class DumpReader {
    private final SourceOptions options;

    public DumpReader(SourceOptions options) {
        this.options = Objects.requireNonNull(options, "options");
    }

    /** {@link #read(List, ReviewSink, RejectSink, ProgressListener)} without progress. */
    public ScanSummary read(List<DumpFile> files, ReviewSink sink, RejectSink rejects) throws IOException {
        return read(files, sink, rejects, ProgressListener.NONE);
    }

    /**
     * Reads {@code files} in the order given.
     *
     * @param progress told the bytes consumed and rows read over all files so far
     * @throws DumpFormatException naming the file (and line) that cannot be read as asked
     * @throws IOException naming the file when reading fails
     */
    public ScanSummary read(List<DumpFile> files, ReviewSink sink, RejectSink rejects, ProgressListener progress)
            throws IOException {
        Objects.requireNonNull(sink, "sink");
        Objects.requireNonNull(rejects, "rejects");
        Objects.requireNonNull(progress, "progress");
        long totalBytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        DumpScanner scanner = new DumpScanner(options);
        List<FileReport> reports = new ArrayList<>(files.size());
        long[] done = new long[2];
        for (DumpFile f : files) {
            scanner.onProgress((bytes, size, rows) -> progress.progress(done[0] + bytes, totalBytes, done[1] + rows));
            FileReport r = scanner.scan(f, sink, rejects);
            reports.add(r);
            done[0] += f.sizeBytes();
            done[1] += r.rowsRead();
            progress.progress(done[0], totalBytes, done[1]);
        }
        return new ScanSummary(reports);
    }
}
