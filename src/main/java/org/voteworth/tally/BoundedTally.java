package org.voteworth.tally;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.PriorityQueue;
import java.util.stream.Stream;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * Per-reviewer tallies in bounded memory: one {@link TallyTable} per scanning worker, and when the
 * tables together would pass the memory budget, a worker writes its table to a temporary spill
 * file, one section per range of the id order, and starts afresh. At the end each range partition
 * is merged (with the same meaning as {@link TallyTable#mergeFrom}) and sorted by id on one of the
 * threads, and the partitions are written one after another, so the output is the same as
 * without spilling.
 *
 * <p>Temporary files live in one folder under the given temp folder; {@link #close()} deletes it,
 * on success and on failure. Not thread-safe except that each worker sink runs on its own thread.
 */
public final class BoundedTally implements AutoCloseable {
    /**
     * Range partitions aimed at: the merge holds about 1/PARTITIONS of the reviewers at a time per
     * thread. At 256, a partition's table of a few million reviewers stays within a megabyte or two,
     * near the CPU's own cache, where merging and sorting it costs less than at 64.
     */
    static final int PARTITIONS = 256;
    /** Ids sampled to place the partition boundaries. */
    private static final int SAMPLE = 1 << 16;
    /** Tallies in memory up to which an unspilled table is merged and written on one thread. */
    private static final long SMALL = 1 << 18;
    /** Heap a partition may take while merged, however small the budget: below it, merging in pieces costs more than it saves. */
    private static final long MIN_ROOM = 4L << 20;
    private final long minRoom;
    private final long small;
    private final java.util.concurrent.atomic.AtomicInteger mergedInPieces = new java.util.concurrent.atomic.AtomicInteger();
    /** Most pieces one partition is merged in (each piece reads the partition's spill files once). */
    private static final int MAX_PIECES = 64;
    /** Heap per tally in a table being merged, with its id index and sort keys (rough, from {@link TallyTable#memoryBytes()}). */
    private static final long BYTES_PER_TALLY = 200;
    private static final int CHECK_EVERY = 1 << 14;

    private final TallyUnit unit;
    private final long budget;
    private final Path tmpRoot;
    private final List<Worker> workers = new ArrayList<>();
    private Path spillDir;
    private int spills;
    /** Fixed at the first spill (every spill file uses the same boundaries), or when writing. */
    private RangePartitioner partitioner;
    /** Tallies spilled to each partition so far. */
    private long[] spilledPerPartition = new long[0];
    /** Per partition: the sections of spill files holding its tallies. */
    private final List<List<Section>> spillFiles = new ArrayList<>();
    /** Per spill file: how many of its sections are not merged yet (it is deleted at none). */
    private final java.util.Map<Path, Integer> sectionsLeft = new java.util.HashMap<>();

    /** The bytes {@code [start, end)} of a spill file: one partition's tallies from one spill. */
    private record Section(Path file, long start, long end) {
    }
    private long reviewers = -1;
    private boolean liveMerged;

    /**
     * @param budgetBytes heap the tallies may take in all (rough, from {@link TallyTable#memoryBytes()})
     * @param tmpDir where the spill folder is made
     */
    public BoundedTally(TallyUnit unit, long budgetBytes, Path tmpDir) {
        this(unit, budgetBytes, tmpDir, MIN_ROOM, SMALL);
    }

    /**
     * With the least heap a partition may take while merged, and the size up to which an unspilled
     * table is written on one thread, set (tests make both tiny, to take the partitioned paths).
     */
    BoundedTally(TallyUnit unit, long budgetBytes, Path tmpDir, long minMergeRoom, long smallTable) {
        this.minRoom = minMergeRoom;
        this.small = smallTable;
        this.unit = Objects.requireNonNull(unit, "unit");
        if (budgetBytes < 1) {
            throw new IllegalArgumentException("--memory must be positive, got " + budgetBytes + " bytes");
        }
        this.budget = budgetBytes;
        this.tmpRoot = Objects.requireNonNull(tmpDir, "tmpDir");
    }

    /** A sink for one scanning worker; ask for all of them before scanning starts. */
    public synchronized ReviewSink newSink() {
        Worker w = new Worker(workers.size());
        workers.add(w);
        return w;
    }

    /** Whether any tallies went to disk. */
    public synchronized boolean spilled() {
        return spills > 0;
    }

    /** How many times a worker's table was written to disk. */
    public synchronized int spills() {
        return spills;
    }

    /** Reviewers (or reviews) in the table written by {@link #write}; -1 before it ran. */
    public long reviewers() {
        return reviewers;
    }

    /** Whether the tables left in memory after the scan went straight into the partition merge (tests check both ways). */
    boolean mergedLiveTables() {
        return liveMerged;
    }

    /** How many partitions were too large to merge in memory at once (tests check both ways). */
    int partitionsMergedInPieces() {
        return mergedInPieces.get();
    }

    /** The spill folder, when one was made (tests check that it is gone after {@link #close()}). */
    Optional<Path> spillDir() {
        return Optional.ofNullable(spillDir);
    }

    /**
     * Writes the reviewer table (ordered by id) to {@code file}; call once, after scanning. The
     * tallies are merged one range partition at a time on as many threads as scanned, and the
     * partitions written one after another: they are ranges of the id order.
     */
    public void write(Path file) throws IOException {
        write(file, null);
    }

    /**
     * As {@link #write(Path)}, counting every reviewer written into {@code overview} (reviews per
     * reviewer, overall and per category) straight from the writer's records, without an object
     * per reviewer; the same counts as {@link OverviewCounts#addReviewer} for each.
     */
    public void write(Path file, OverviewCounts overview) throws IOException {
        int threads = Math.max(1, workers.size());
        long inMemory = workers.stream().mapToLong(w -> w.table.memoryBytes()).sum();
        long liveSlots = workers.stream().mapToLong(w -> w.table.size()).sum();
        if (!spilled() && liveSlots <= small && 2 * inMemory <= budget) {
            // A small table: merged and written on this thread, sooner than partitions could be set up.
            TallyTable all = mergedInMemory();
            reviewers = all.size();
            ReviewerTableFile.write(all, file, overview == null ? WrittenTally.NONE : overview::addWritten);
            return;
        }
        RangePartitioner partitioner = partitionerOf(workers.stream().map(w -> w.table).toArray(TallyTable[]::new));
        long partitionBytes = (spilledTallies() + liveSlots) / partitioner.parts() * BYTES_PER_TALLY;
        // The tables still in memory join each partition directly, rather than going to disk first, when
        // they and the partitions being merged fit the budget together.
        boolean keepLive = inMemory + threads * partitionBytes <= budget;
        liveMerged = keepLive && spilled();
        if (!keepLive) {
            Parallel.forEach(workers.size(), threads, w -> workers.get(w).spill());
        }
        List<TallyTable> live = new ArrayList<>();
        List<int[][]> livePartitions = new ArrayList<>();
        long[] sizes = spilledPerPartition(partitioner.parts());
        if (keepLive) {
            for (Worker w : workers) {
                int[][] of = w.table.slotsByPartition(partitioner);
                live.add(w.table);
                livePartitions.add(of);
                for (int p = 0; p < of.length; p++) {
                    sizes[p] += of[p].length;
                }
            }
        }
        // A partition whose tallies would not fit beside the others is merged in hash pieces through sorted runs.
        long room = Math.max(minRoom, (budget - (keepLive ? inMemory : 0)) / threads);
        Partitions parts = new Partitions(live, livePartitions, sizes, room, overview != null);
        try (OutputStream out = Files.newOutputStream(file)) {
            out.write(ReviewerTableFile.HEADER_LINE.getBytes(java.nio.charset.StandardCharsets.US_ASCII));
            long[] written = new long[1];
            Parallel.inOrder(partitioner.parts(), threads, parts::merge, piece -> {
                piece.writeTo(out);
                written[0] += piece.rows;
                if (overview != null) {
                    overview.mergeFrom(piece.overview);
                }
            });
            reviewers = written[0];
        }
    }

    /** The partitioner fixed at the first spill, or one made now from {@code tables} when nothing was spilled. */
    private synchronized RangePartitioner partitionerOf(TallyTable... tables) {
        if (partitioner == null) {
            TallyTable[] rest = java.util.Arrays.copyOfRange(tables, Math.min(1, tables.length), tables.length);
            partitioner = (tables.length == 0 ? new TallyTable(unit) : tables[0]).rangePartitioner(PARTITIONS, SAMPLE, rest);
        }
        return partitioner;
    }

    /** One merged partition, formatted, waiting to be written in its place. */
    private static final class Piece {
        final java.io.ByteArrayOutputStream bytes;
        final Path file;
        final long rows;
        final OverviewCounts overview;

        Piece(java.io.ByteArrayOutputStream bytes, Path file, long rows, OverviewCounts overview) {
            this.bytes = bytes;
            this.file = file;
            this.rows = rows;
            this.overview = overview;
        }

        void writeTo(OutputStream out) throws IOException {
            if (bytes != null) {
                bytes.writeTo(out);
            } else {
                Files.copy(file, out);
                Files.delete(file);
            }
        }
    }

    /** The merge of each range partition: spilled tallies read back, plus those of the tables kept in memory. */
    private final class Partitions {
        private final List<TallyTable> live;
        private final List<int[][]> livePartitions;
        private final long[] sizes;
        private final long room;
        private final boolean countReviewers;

        Partitions(List<TallyTable> live, List<int[][]> livePartitions, long[] sizes, long room, boolean countReviewers) {
            this.live = live;
            this.livePartitions = livePartitions;
            this.sizes = sizes;
            this.room = room;
            this.countReviewers = countReviewers;
        }

        Piece merge(int p) throws IOException {
            OverviewCounts counts = countReviewers ? new OverviewCounts() : null;
            WrittenTally each = counts == null ? WrittenTally.NONE : counts::addWritten;
            long bytes = sizes[p] * BYTES_PER_TALLY;
            if (bytes <= room) {
                TallyTable t = mergedPiece(p, 1, 0);
                java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream((int) Math.min(1 << 30, 16 + sizes[p] * 120));
                long rows = ReviewerTableFile.writeSorted(t, new ReviewerTableFile.Rows(out, t.categoryDictionary(), each, false));
                releasePartition(p);
                return new Piece(out, null, rows, counts);
            }
            // Too large for memory at once: split it by id hash into pieces that fit, sort each to a run, merge the runs.
            mergedInPieces.incrementAndGet();
            int pieces = (int) Math.min(MAX_PIECES, (bytes + room - 1) / room);
            List<Path> runs = new ArrayList<>();
            for (int q = 0; q < pieces; q++) {
                Path run = spillFolder().resolve("run-p" + p + "-" + q + ".bin");
                runs.add(run);
                TallyTable t = mergedPiece(p, pieces, q);
                try (SpillFile.Out out = SpillFile.create(run)) {
                    t.writeRun(t.sortedById(), out);
                }
            }
            releasePartition(p);
            Path file = spillFolder().resolve("piece-p" + p + ".csv");
            long rows;
            Categories dictionary = new Categories();
            try (ReviewerTableFile.Rows out = new ReviewerTableFile.Rows(Files.newOutputStream(file), dictionary, each, false)) {
                rows = mergeRuns(runs, dictionary, out);
            }
            for (Path run : runs) {
                Files.delete(run);
            }
            return new Piece(null, file, rows, counts);
        }

        /** The tallies of piece {@code q} of {@code pieces} (by id hash) of partition {@code p}, merged into one table. */
        private TallyTable mergedPiece(int p, int pieces, int q) throws IOException {
            TallyTable t = new TallyTable(unit);
            for (Section f : partitionFiles(p)) {
                try (SpillFile.In in = SpillFile.open(f.file(), f.start(), f.end())) {
                    t.readSpill(in, pieces, q);
                }
            }
            for (int k = 0; k < live.size(); k++) {
                t.mergeSlots(live.get(k), livePartitions.get(k)[p], pieces, q);
            }
            return t;
        }

        private void releasePartition(int p) throws IOException {
            merged(partitionFiles(p));
        }
    }

    /** The workers' tables merged into one, ignoring the budget (for commands that rank in memory). */
    public TallyTable mergedInMemory() {
        if (spilled()) {
            throw new IllegalStateException("tallies were spilled to disk; use write(file) instead");
        }
        TallyTable all = workers.isEmpty() ? new TallyTable(unit) : workers.get(0).table;
        for (int i = 1; i < workers.size(); i++) {
            all.mergeFrom(workers.get(i).table);
            workers.get(i).table = new TallyTable(unit);
        }
        return all;
    }

    /** The spill file sections of partition {@code p} that hold tallies, in file name order. */
    private synchronized List<Section> partitionFiles(int p) {
        return p < spillFiles.size()
                ? spillFiles.get(p).stream().sorted(java.util.Comparator.comparing(Section::file)).toList()
                : List.of();
    }

    /** Keeps the sections of a spill file that hold tallies for the merge; deletes the file when none does. */
    private synchronized void spilled(Path file, TallyTable.Sections written) throws IOException {
        long[] perPartition = written.tallies();
        while (spillFiles.size() < perPartition.length) {
            spillFiles.add(new ArrayList<>());
        }
        int sections = 0;
        for (int p = 0; p < perPartition.length; p++) {
            if (perPartition[p] > 0) {
                spillFiles.get(p).add(new Section(file, written.start()[p], written.end()[p]));
                sections++;
            }
        }
        if (sections == 0) {
            Files.delete(file);
        } else {
            sectionsLeft.put(file, sections);
        }
        spilled(perPartition);
    }

    /** Marks {@code sections} as merged, deleting each spill file once all its sections are. */
    private synchronized void merged(List<Section> sections) throws IOException {
        for (Section s : sections) {
            int left = sectionsLeft.merge(s.file(), -1, Integer::sum);
            if (left == 0) {
                sectionsLeft.remove(s.file());
                Files.delete(s.file());
            }
        }
    }

    /** One sorted run being merged: its stream, its category ids in the merge's dictionary, its current tally. */
    private static final class Cursor {
        final SpillFile.In in;
        final int[] categoryMap;
        final TallyRecord current = new TallyRecord();

        Cursor(Path run, Categories dictionary) throws IOException {
            in = SpillFile.open(run);
            categoryMap = TallyTable.readCategoryNames(in, dictionary);
        }

        boolean advance() throws IOException {
            return current.read(in, categoryMap);
        }
    }

    /** Merges runs sorted by id whose ids are disjoint (hash pieces) into {@code rows}, whose names are {@code dictionary}; returns the rows written. */
    private static long mergeRuns(List<Path> runs, Categories dictionary, ReviewerTableFile.Rows rows) throws IOException {
        List<Cursor> cursors = new ArrayList<>();
        try {
            for (Path r : runs) {
                cursors.add(new Cursor(r, dictionary));
            }
            PriorityQueue<Cursor> heads = new PriorityQueue<>((x, y) -> IdOrder.compare(x.current.idBytes(),
                    x.current.idLength(), y.current.idBytes(), y.current.idLength()));
            for (Cursor c : cursors) {
                if (c.advance()) {
                    heads.add(c);
                }
            }
            long before = rows.count();
            while (!heads.isEmpty()) {
                Cursor c = heads.poll();
                rows.write(c.current);
                if (c.advance()) {
                    heads.add(c);
                }
            }
            return rows.count() - before;
        } finally {
            for (Cursor c : cursors) {
                c.in.close();
            }
        }
    }

    private synchronized Path spillFolder() throws IOException {
        if (spillDir == null) {
            Files.createDirectories(tmpRoot);
            spillDir = Files.createTempDirectory(tmpRoot, "voteworth-spill-");
        }
        return spillDir;
    }

    private synchronized int nextSpill() {
        return spills++;
    }

    private long spilledTallies;

    private synchronized void spilled(long[] perPartition) {
        if (spilledPerPartition.length < perPartition.length) {
            spilledPerPartition = java.util.Arrays.copyOf(spilledPerPartition, perPartition.length);
        }
        for (int p = 0; p < perPartition.length; p++) {
            spilledPerPartition[p] += perPartition[p];
            spilledTallies += perPartition[p];
        }
    }

    private synchronized long spilledTallies() {
        return spilledTallies;
    }

    /** Tallies spilled to each of {@code parts} partitions. */
    private synchronized long[] spilledPerPartition(int parts) {
        return java.util.Arrays.copyOf(spilledPerPartition, parts);
    }

    private synchronized long othersBytes(Worker self) {
        long sum = 0;
        for (Worker w : workers) {
            if (w != self) {
                sum += w.bytes;
            }
        }
        return sum;
    }

    /** Deletes the spill folder and everything in it. */
    @Override
    public synchronized void close() throws IOException {
        if (spillDir == null || !Files.exists(spillDir)) {
            return;
        }
        try (Stream<Path> s = Files.list(spillDir)) {
            for (Path f : s.toList()) {
                Files.deleteIfExists(f);
            }
        }
        Files.deleteIfExists(spillDir);
    }

    private final class Worker implements ReviewSink {
        private final int number;
        private TallyTable table = new TallyTable(unit);
        private int sinceCheck;
        /** Last measured footprint, read by other workers under the outer lock. */
        private volatile long bytes;

        Worker(int number) {
            this.number = number;
        }

        @Override
        public void accept(ReviewRow row) {
            table.accept(row);
            if (++sinceCheck == CHECK_EVERY) {
                sinceCheck = 0;
                // Room for the table's next growth too: for a moment it holds an old and a new array.
                long mine = table.memoryBytes() + table.growthBytes();
                bytes = mine;
                if (mine + othersBytes(this) > budget) {
                    try {
                        spill();
                    } catch (IOException e) {
                        throw new UncheckedIOException("cannot spill tallies to " + tmpRoot + ": " + e.getMessage()
                                + " (free some space there, point --tmp elsewhere, or raise --memory)", e);
                    }
                }
            }
        }

        void spill() throws IOException {
            if (table.size() == 0) {
                return;
            }
            Path dir = spillFolder();
            int n = nextSpill();
            RangePartitioner ranges = partitionerOf(table);
            // One file per spill, a section per partition: fewer files to create than one per partition.
            Path file = dir.resolve(String.format(java.util.Locale.ROOT, "spill-w%03d-%06d.bin", number, n));
            TallyTable.Sections sections;
            try (SpillFile.Out out = SpillFile.create(file)) {
                sections = table.spill(out, ranges);
            }
            spilled(file, sections);
            table = new TallyTable(unit);
            bytes = 0;
        }
    }
}
