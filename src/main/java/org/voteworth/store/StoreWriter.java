package org.voteworth.store;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.apache.parquet.hadoop.ParquetWriter;
import org.voteworth.source.DumpFile;
import org.voteworth.source.FileReport;
import org.voteworth.source.PieceListener;
import org.voteworth.source.ReviewSink;
import org.voteworth.source.ScanSummary;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.StarCounts;
import org.voteworth.tally.TallyTable;

/**
 * Writes a store in the same pass as a tally: {@link #tee} puts a sorting buffer beside each
 * worker's tally, {@link #pieces()} learns how the reader numbered lines, and {@link #finish}
 * writes the review parts, {@code reviewers.parquet} (from the tally's reviewer table), the rejects
 * and, last, the manifest. {@link #append} adds new dump files to an existing store: it refuses a
 * file the store has already seen, merges the new reviews into their parts and the new tallies
 * into the reviewer table with {@link TallyTable#mergeFrom}.
 *
 * <p>Temporary files live in {@code DIR/.tmp-*}; {@link #close()} deletes them.
 */
public final class StoreWriter implements AutoCloseable {
    /** Review parts of a new store. */
    public static final int DEFAULT_PARTS = 16;

    private final Path dir;
    private final Store old;
    private final Map<String, String> mapping;
    private final String categoryFromName;
    private final Path tmp;
    private final Categories categories;
    private final ReviewSorter sorter;
    private final LineBases lines = new LineBases();
    private final List<ReviewSorter.Buffer> buffers = new ArrayList<>();
    private final List<StoreManifest.StoreFile> known = new ArrayList<>();
    private List<StoreManifest.StoreFile> added = List.of();
    private int firstNew;

    private StoreWriter(Path dir, Store old, Map<String, String> mapping, String categoryFromName, long budgetBytes, int parts)
            throws IOException {
        this.dir = dir;
        this.old = old;
        this.mapping = Map.copyOf(mapping);
        this.categoryFromName = Objects.requireNonNull(categoryFromName, "categoryFromName");
        Files.createDirectories(dir);
        this.tmp = Files.createTempDirectory(dir, ".tmp-");
        this.categories = new Categories(old == null ? List.of() : List.copyOf(old.manifest().categories().keySet()));
        this.sorter = new ReviewSorter(parts, budgetBytes, tmp, categories);
        if (old != null) {
            known.addAll(old.manifest().files());
        }
    }

    /**
     * Starts a new store in {@code dir} (which must not hold one already).
     *
     * @param mapping the explicit field → header entries the dump is read with
     * @param categoryFromName the file-name pattern for categories
     * @param budgetBytes memory the sorting buffers may hold together
     */
    public static StoreWriter create(Path dir, Map<String, String> mapping, String categoryFromName, long budgetBytes)
            throws IOException {
        if (Store.isStore(dir)) {
            throw new IllegalArgumentException(dir + " is a store already: add files with --append, or give a new folder");
        }
        return new StoreWriter(dir, null, mapping, categoryFromName, budgetBytes, DEFAULT_PARTS);
    }

    /** Opens the store in {@code dir} to add files read with the same mapping and category pattern. */
    public static StoreWriter append(Path dir, Map<String, String> mapping, String categoryFromName, long budgetBytes)
            throws IOException {
        Store s = Store.open(dir);
        StoreManifest m = s.manifest();
        if (!s.hasReviews()) {
            throw new IllegalArgumentException(dir + " holds the reviewer table only (no per-review parts, as 'voteworth"
                    + " spark-tally' writes it), so files cannot be added to it: run the cluster job again over all the files");
        }
        if (!m.mapping().equals(mapping) || !m.categoryFromName().equals(categoryFromName)) {
            throw new IllegalArgumentException("--append must read the new files as the store's were read: " + dir
                    + " has --map " + new TreeMap<>(m.mapping()) + " and category pattern " + m.categoryFromName() + ", this run has --map "
                    + new TreeMap<>(mapping) + " and " + categoryFromName);
        }
        return new StoreWriter(dir, s, mapping, categoryFromName, budgetBytes, m.reviewParts());
    }

    /**
     * The files about to be scanned, in the reader's order; for an append, refuses one the store
     * has already seen (same path, or same size and head-and-tail checksum).
     */
    public void begin(List<DumpFile> files) throws IOException {
        firstNew = known.size();
        List<StoreManifest.StoreFile> fresh = new ArrayList<>();
        for (DumpFile f : files) {
            StoreManifest.StoreFile fp = StoreManifest.fingerprint(f.path(), f.category());
            for (StoreManifest.StoreFile k : known) {
                if (k.sameAs(fp)) {
                    throw new IllegalArgumentException(f + ": already in the store " + dir + " (tallied as " + k.path()
                            + ", " + k.size() + " bytes, checksum " + k.sha256HeadTail().substring(0, 12)
                            + "...); --append takes only files the store has not seen");
                }
            }
            for (StoreManifest.StoreFile k : fresh) {
                if (k.sameAs(fp)) {
                    throw new IllegalArgumentException(f + ": given twice (also as " + k.path() + ")");
                }
            }
            fresh.add(fp);
        }
        added = fresh;
    }

    /** {@code tally} and this store's sorting buffer side by side, for one scanning worker (ask in worker order). */
    public synchronized ReviewSink tee(ReviewSink tally) {
        ReviewSorter.Buffer b = sorter.newBuffer();
        buffers.add(b);
        return row -> {
            tally.accept(row);
            b.accept(row);
        };
    }

    /** Tells the buffers which file and piece their rows come from, and records the pieces' line numbering. */
    public PieceListener pieces() {
        return new PieceListener() {
            @Override
            public void started(int worker, int fileIndex, long start) {
                ReviewSorter.Buffer b;
                synchronized (StoreWriter.this) {
                    b = buffers.get(worker);
                }
                b.piece(firstNew + fileIndex, start);
            }

            @Override
            public void lineBase(int fileIndex, long start, long lineBase) {
                lines.put(firstNew + fileIndex, start, lineBase);
            }
        };
    }

    /** The folder of temporary files inside the store ({@link #close()} deletes it). */
    public Path tempFolder() {
        return tmp;
    }

    /** Sorted runs the buffers spilled so far. */
    public int spills() {
        return sorter.runs();
    }

    /**
     * Writes the store after the scan.
     *
     * @param reviewerTable the reviewer table the tally wrote (CSV)
     * @param summary the scan's reconciliation, one report per file given to {@link #begin}
     * @param rejects the scan's rejects file (moved into the store, or appended to its rejects)
     * @return the manifest written
     */
    public StoreManifest finish(Path reviewerTable, ScanSummary summary, Path rejects, int threads) throws IOException {
        if (summary.files().size() != added.size()) {
            throw new IllegalStateException("the scan reported " + summary.files().size() + " files, the store expected " + added.size());
        }
        List<StoreManifest.StoreFile> files = new ArrayList<>(known);
        for (int i = 0; i < added.size(); i++) {
            StoreManifest.StoreFile f = added.get(i);
            FileReport r = summary.files().get(i);
            files.add(new StoreManifest.StoreFile(f.path(), f.size(), f.modified(), f.sha256HeadTail(), r.rowsRead(), r.accepted(),
                    r.rejected(), f.category(), r.rejectsByReason()));
        }
        List<String> names = files.stream().map(StoreManifest.StoreFile::path).toList();
        Map<String, Integer> number = new HashMap<>();
        for (int i = 0; i < names.size(); i++) {
            number.put(names.get(i), i);
        }
        Path newReviews = tmp.resolve(Store.REVIEWS);
        long[] written = sorter.writeParts(newReviews, names, lines, p -> old == null ? null : old.part(p), name -> {
            Integer n = number.get(name);
            if (n == null) {
                throw new IllegalStateException(old.dir().resolve(Store.REVIEWS) + ": a review names the file " + name
                        + ", which " + Store.MANIFEST + " does not list: the store is inconsistent");
            }
            return n;
        }, threads);
        long reviews = java.util.Arrays.stream(written).sum();
        long accepted = (old == null ? 0 : old.manifest().accepted()) + summary.accepted();
        if (reviews != accepted) {
            throw new IllegalStateException("the store's parts got " + reviews + " reviews, but " + accepted + " rows were accepted");
        }
        Path newReviewers = tmp.resolve(Store.REVIEWERS);
        long reviewers = writeReviewers(reviewerTable, newReviewers);
        Map<String, StoreManifest.CategoryStats> cats = new TreeMap<>(old == null ? Map.of() : old.manifest().categories());
        long[][] stats = sorter.categoryStats();
        List<String> catNames = categories.names();
        for (int c = 0; c < stats.length; c++) {
            long[] s = stats[c];
            if (s[0] > 0) {
                cats.merge(catNames.get(c), new StoreManifest.CategoryStats(s[0], new StarCounts(s[1], s[2], s[3], s[4], s[5])),
                        StoreManifest.CategoryStats::plus);
            }
        }
        StoreManifest base = old == null ? null : old.manifest();
        StoreManifest m = new StoreManifest(Instant.now(), mapping, categoryFromName, files,
                (base == null ? 0 : base.rowsRead()) + summary.rowsRead(), accepted,
                (base == null ? 0 : base.rejected()) + summary.rejected(), reviewers, written.length, cats);
        // Everything is written beside the store first; the manifest goes last, so a store whose manifest is
        // older than its files is caught by Store.open's counts.
        Path reviewsDir = dir.resolve(Store.REVIEWS);
        Files.createDirectories(reviewsDir);
        try (Stream<Path> s = Files.list(newReviews)) {
            for (Path p : s.toList()) {
                Files.move(p, reviewsDir.resolve(p.getFileName()), StandardCopyOption.REPLACE_EXISTING);
            }
        }
        Files.move(newReviewers, dir.resolve(Store.REVIEWERS), StandardCopyOption.REPLACE_EXISTING);
        moveRejects(rejects);
        m.write(dir.resolve(Store.MANIFEST));
        return m;
    }

    private long writeReviewers(Path csv, Path target) throws IOException {
        long[] n = {0};
        try (ParquetWriter<ReviewerTally> w = ParquetFiles.writer(target, new ReviewerColumns.Writing())) {
            java.util.function.Consumer<ReviewerTally> put = t -> {
                try {
                    w.write(t);
                    n[0]++;
                } catch (IOException e) {
                    throw new java.io.UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
                }
            };
            if (old == null) {
                ReviewerTableFile.forEach(csv, put);
            } else {
                TallyTable all = old.reviewerTable();
                all.mergeFrom(ReviewerTableFile.read(csv));
                for (int s : all.sortedById()) {
                    put.accept(all.get(s));
                }
            }
        } catch (java.io.UncheckedIOException e) {
            throw e.getCause();
        }
        return n[0];
    }

    private void moveRejects(Path rejects) throws IOException {
        Path target = dir.resolve(Store.REJECTS);
        if (rejects.toAbsolutePath().normalize().equals(target.toAbsolutePath().normalize())) {
            return;
        }
        if (old == null || !Files.exists(target)) {
            Files.move(rejects, target, StandardCopyOption.REPLACE_EXISTING);
            return;
        }
        // Append: the new rows after the store's, without the new file's header line.
        try (InputStream in = Files.newInputStream(rejects);
             OutputStream out = Files.newOutputStream(target, StandardOpenOption.APPEND)) {
            int b;
            while ((b = in.read()) != -1 && b != '\n') {
                // skip the header
            }
            in.transferTo(out);
        }
        Files.delete(rejects);
    }

    /** Deletes the temporary folder. */
    @Override
    public void close() throws IOException {
        sorter.close();
    }
}
