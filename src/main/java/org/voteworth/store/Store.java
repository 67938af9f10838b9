package org.voteworth.store;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Future;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.parquet.ParquetReadOptions;
import org.apache.parquet.conf.PlainParquetConfiguration;
import org.apache.parquet.filter2.compat.FilterCompat;
import org.apache.parquet.filter2.predicate.FilterApi;
import org.apache.parquet.hadoop.ParquetFileReader;
import org.apache.parquet.hadoop.ParquetReader;
import org.apache.parquet.io.api.Binary;
import org.voteworth.source.DumpFile;
import org.voteworth.source.FileReport;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;
import org.voteworth.source.ScanSummary;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

/**
 * A store written by {@code voteworth tally --store DIR} or {@code voteworth spark-tally}, opened
 * for reading: the reviewer table, every review, or one reviewer's reviews. {@link #open} checks the
 * manifest against the files' footers, and every read names the file that is damaged instead of
 * giving a wrong answer.
 *
 * <p>{@code reviewers.parquet} is one file ({@code tally --store}) or a folder of part files
 * ({@code spark-tally}: Spark's {@code part-NNNNN-*.parquet}, NNNNN the partition, beside
 * {@code _SUCCESS} and {@code .crc} side files, which are skipped). Parts are read in partition
 * order; the cluster job range-partitions by reviewer id, so that is id order. A store without
 * per-review parts (manifest {@code reviewParts} 0) serves everything that needs only the reviewer
 * table; asking it for reviews stops with an error saying so.
 */
public final class Store {
    public static final String MANIFEST = "manifest.json";
    public static final String REVIEWERS = "reviewers.parquet";
    public static final String REVIEWS = "reviews";
    public static final String REJECTS = "rejects.tsv";
    /** A Spark part file's name starts with its partition number. */
    private static final Pattern PART = Pattern.compile("part-(\\d{1,18})");

    private final Path dir;
    private final StoreManifest manifest;

    private Store(Path dir, StoreManifest manifest) {
        this.dir = dir;
        this.manifest = manifest;
    }

    /** Whether {@code p} is a store folder (it has a manifest). */
    public static boolean isStore(Path p) {
        return Files.isDirectory(p) && Files.isRegularFile(p.resolve(MANIFEST));
    }

    /**
     * Opens the store in {@code dir} and checks that its files are there and hold the rows the
     * manifest counts.
     *
     * @throws IOException naming the file that is missing, damaged or disagrees with the manifest
     */
    public static Store open(Path dir) throws IOException {
        Path m = dir.resolve(MANIFEST);
        if (!Files.isRegularFile(m)) {
            throw new IOException(dir + ": not a store (no " + MANIFEST + "); write one with 'voteworth tally DUMP --store " + dir + "'");
        }
        StoreManifest manifest = StoreManifest.read(m);
        Store s = new Store(dir, manifest);
        long reviewers = 0;
        for (Path f : s.reviewerFiles()) {
            reviewers += rows(f);
        }
        if (reviewers != manifest.reviewers()) {
            throw new IOException(s.reviewersFile() + ": holds " + reviewers + " reviewers, but " + m + " says "
                    + manifest.reviewers() + ": the store is inconsistent; rebuild it with 'voteworth tally --store'");
        }
        long reviews = 0;
        for (int p = 0; p < manifest.reviewParts(); p++) {
            reviews += rows(s.part(p));
        }
        // A store of the reviewer table only counts its reviews in the manifest and holds none of them.
        if (manifest.reviewParts() > 0 && reviews != manifest.accepted()) {
            throw new IOException(s.dir.resolve(REVIEWS) + ": the parts hold " + reviews + " reviews, but " + m + " says "
                    + manifest.accepted() + " rows were accepted: the store is inconsistent; rebuild it with 'voteworth tally --store'");
        }
        return s;
    }

    private static long rows(Path file) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new IOException(file + ": missing from the store; rebuild it with 'voteworth tally --store'");
        }
        try (ParquetFileReader r = ParquetFileReader.open(MappedInputFile.of(file),
                ParquetReadOptions.builder(new PlainParquetConfiguration()).withCodecFactory(new ZstdCodecs()).build())) {
            return r.getRecordCount();
        } catch (IOException | RuntimeException e) {
            throw damaged(file, e);
        }
    }

    private static IOException damaged(Path file, Exception e) {
        return new IOException(file + ": cannot be read as a store file, it is damaged or truncated (" + e.getMessage()
                + "); rebuild the store with 'voteworth tally --store'", e);
    }

    public Path dir() {
        return dir;
    }

    public StoreManifest manifest() {
        return manifest;
    }

    Path reviewersFile() {
        return dir.resolve(REVIEWERS);
    }

    /**
     * The files of the reviewer table: {@code reviewers.parquet} itself, or, when it is a folder, its
     * Parquet part files in partition order (the number after {@code part-}, then the name).
     */
    List<Path> reviewerFiles() throws IOException {
        Path t = reviewersFile();
        if (!Files.isDirectory(t)) {
            return List.of(t);
        }
        List<Path> parts;
        try (java.util.stream.Stream<Path> s = Files.list(t)) {
            parts = s.filter(p -> isPart(p.getFileName().toString()) && Files.isRegularFile(p))
                    .sorted(Comparator.comparingLong(Store::partition).thenComparing(p -> p.getFileName().toString()))
                    .toList();
        }
        if (parts.isEmpty()) {
            throw new IOException(t + ": the folder holds no Parquet part files; rerun the job that wrote the store");
        }
        return parts;
    }

    private static boolean isPart(String name) {
        return !name.startsWith("_") && !name.startsWith(".") && !name.endsWith(".crc");
    }

    /** The partition number of a part file named {@code part-NNNNN...}, or -1 (first) for another name. */
    private static long partition(Path p) {
        Matcher m = PART.matcher(p.getFileName().toString());
        return m.lookingAt() ? Long.parseLong(m.group(1)) : -1;
    }

    /** Whether the store holds every review (per-review parts), as {@code tally --store} writes it. */
    public boolean hasReviews() {
        return manifest.reviewParts() > 0;
    }

    /** Stops a read of reviews from a store that holds the reviewer table only. */
    private void requireReviews() throws IOException {
        if (!hasReviews()) {
            throw new IOException(dir + ": the per-review parts are missing (" + MANIFEST + " has reviewParts 0, as"
                    + " 'voteworth spark-tally' writes it): this store holds the reviewer table only, which serves rank, sweep,"
                    + " compare, audit and report; overview, profiles, --cap-votes and --unit review need each review:"
                    + " build a store with 'voteworth tally DUMP... --store DIR' on the dump files");
        }
    }

    Path part(int p) {
        return partFile(dir.resolve(REVIEWS), p);
    }

    static Path partFile(Path reviewsDir, int p) {
        return reviewsDir.resolve(String.format(Locale.ROOT, "part-%05d.parquet", p));
    }

    /** The rejects file of the runs that built the store. */
    public Path rejectsFile() {
        return dir.resolve(REJECTS);
    }

    /** The reconciliation of the runs that built the store, per file, as the manifest records it. */
    public ScanSummary summary() {
        List<FileReport> reports = new ArrayList<>();
        for (StoreManifest.StoreFile f : manifest.files()) {
            reports.add(new FileReport(dumpFile(f), f.rowsRead(), f.accepted(), f.rejected(), f.rejectsByReason()));
        }
        return new ScanSummary(reports);
    }

    private static DumpFile dumpFile(StoreManifest.StoreFile f) {
        Path p = Path.of(f.path());
        return new DumpFile(p, f.category(), DumpFile.Compression.of(p), f.size());
    }

    /** Every reviewer's tally, in id order. */
    public void forEachReviewer(Consumer<ReviewerTally> each) throws IOException {
        for (Path f : reviewerFiles()) {
            read(f, ReviewerColumns.reading(), FilterCompat.NOOP, each);
        }
    }

    /** The reviewer table, as {@code tally} built it. */
    public TallyTable reviewerTable() throws IOException {
        TallyTable t = new TallyTable();
        forEachReviewer(t::add);
        if (t.size() != manifest.reviewers()) {
            throw new IOException(reviewersFile() + ": read " + t.size() + " reviewers, the manifest says " + manifest.reviewers());
        }
        return t;
    }

    /** One reviewer's tally, read through the row group that can hold it. */
    public Optional<ReviewerTally> reviewer(String id) throws IOException {
        List<ReviewerTally> found = new ArrayList<>(1);
        for (Path f : reviewerFiles()) {
            read(f, ReviewerColumns.reading(), byReviewer(id), t -> {
                if (t.id().equals(id)) {
                    found.add(t);
                }
            });
        }
        return found.stream().findFirst();
    }

    /** One reviewer's reviews in store order (date, then input order), from the one part that holds them. */
    public List<StoredReview> reviewsOf(String id) throws IOException {
        requireReviews();
        List<StoredReview> found = new ArrayList<>();
        read(part(ReviewerHash.part(id, manifest.reviewParts())), ReviewColumns.reading(Binary.fromString(id)),
                byReviewer(id), r -> {
                    if (r != ReviewColumns.SKIPPED) {
                        found.add(r);
                    }
                });
        return found;
    }

    private static FilterCompat.Filter byReviewer(String id) {
        return FilterCompat.get(FilterApi.eq(FilterApi.binaryColumn("reviewer_id"), Binary.fromString(id)));
    }

    /** Every review, part by part (each part in reviewer order). */
    public void forEachReview(Consumer<StoredReview> each) throws IOException {
        requireReviews();
        for (int p = 0; p < manifest.reviewParts(); p++) {
            read(part(p), ReviewColumns.reading(null), FilterCompat.NOOP, each);
        }
    }

    /**
     * Hands every review to {@code sink} as the scanner would (one reused {@link ReviewRow}), so the
     * tallies, vote caps and review units that read a dump read a store the same way.
     */
    public void scan(ReviewSink sink) throws IOException {
        requireReviews();
        Map<String, DumpFile> files = new HashMap<>();
        for (StoreManifest.StoreFile f : manifest.files()) {
            files.put(f.path(), dumpFile(f));
        }
        ReviewRow row = new ReviewRow();
        byte[][] buf = {new byte[256]};
        forEachReview(r -> {
            byte[] a = r.reviewer().getBytes(StandardCharsets.UTF_8);
            byte[] b = r.review().getBytes(StandardCharsets.UTF_8);
            byte[] c = r.item().getBytes(StandardCharsets.UTF_8);
            byte[] cat = r.category().getBytes(StandardCharsets.UTF_8);
            int n = a.length + b.length + c.length;
            if (buf[0].length < n) {
                buf[0] = new byte[2 * n];
            }
            System.arraycopy(a, 0, buf[0], 0, a.length);
            System.arraycopy(b, 0, buf[0], a.length, b.length);
            System.arraycopy(c, 0, buf[0], a.length + b.length, c.length);
            row.buf = buf[0];
            row.reviewerOff = 0;
            row.reviewerLen = a.length;
            row.reviewOff = a.length;
            row.reviewLen = b.length;
            row.itemOff = a.length + b.length;
            row.itemLen = c.length;
            row.categoryBuf = cat;
            row.categoryOff = 0;
            row.categoryLen = cat.length;
            row.file = files.get(r.file());
            if (row.file == null) {
                throw new UncheckedIOException(new IOException(dir.resolve(REVIEWS) + ": a review names the file " + r.file()
                        + ", which " + MANIFEST + " does not list: the store is inconsistent"));
            }
            row.line = r.line();
            row.helpful = r.helpfulVotes();
            row.total = r.totalVotes();
            row.stars = r.stars();
            row.verified = r.verified();
            row.incentivised = r.incentivised();
            row.epochDay = r.epochDay();
            sink.accept(row);
        });
    }

    private static <T> void read(Path file, org.apache.parquet.hadoop.api.ReadSupport<T> support, FilterCompat.Filter filter,
                                 Consumer<T> each) throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new IOException(file + ": missing from the store; rebuild it with 'voteworth tally --store'");
        }
        try (ParquetReader<T> r = open(file, support, filter)) {
            T t;
            while ((t = read(r, file)) != null) {
                each.accept(t);
            }
        }
    }

    private static <T> ParquetReader<T> open(Path file, org.apache.parquet.hadoop.api.ReadSupport<T> support,
                                             FilterCompat.Filter filter) throws IOException {
        try {
            return ParquetFiles.reader(file, support, filter);
        } catch (IOException | RuntimeException e) {
            throw damaged(file, e);
        }
    }

    /** The next row of {@code r}, or null at the end; a damaged file gives an error naming it. */
    static <T> T read(ParquetReader<T> r, Path file) throws IOException {
        try {
            return r.read();
        } catch (IOException | RuntimeException e) {
            throw damaged(file, e);
        }
    }

    static <T> T await(Future<T> f) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new java.io.InterruptedIOException("interrupted while writing the store");
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof IOException io) {
                throw io;
            }
            if (c instanceof UncheckedIOException u) {
                throw u.getCause();
            }
            if (c instanceof RuntimeException r) {
                throw r;
            }
            throw new IOException(c);
        }
    }
}
