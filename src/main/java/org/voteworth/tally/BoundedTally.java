package org.voteworth.tally;

import java.io.IOException;
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
 * tables together would pass the memory budget, a worker writes its table to hash-partitioned
 * temporary files and starts afresh. At the end the partitions are merged one at a time (with the
 * same meaning as {@link TallyTable#mergeFrom}), each sorted by id, and the sorted partitions are
 * merged into the reviewer table, so the output is the same as without spilling.
 *
 * <p>Temporary files live in one folder under the given temp folder; {@link #close()} deletes it,
 * on success and on failure. Not thread-safe except that each worker sink runs on its own thread.
 */
public final class BoundedTally implements AutoCloseable {
    /** Spill partitions: the merge holds about 1/PARTITIONS of the reviewers at a time. */
    static final int PARTITIONS = 32;
    /** Heap per tally in a table being merged, with its id index and sort keys (rough, from {@link TallyTable#memoryBytes()}). */
    private static final long BYTES_PER_TALLY = 200;
    private static final int CHECK_EVERY = 1 << 14;

    private final TallyUnit unit;
    private final long budget;
    private final Path tmpRoot;
    private final List<Worker> workers = new ArrayList<>();
    private Path spillDir;
    private int spills;
    private long reviewers = -1;
    private boolean liveMerged;

    /**
     * @param budgetBytes heap the tallies may take in all (rough, from {@link TallyTable#memoryBytes()})
     * @param tmpDir where the spill folder is made
     */
    public BoundedTally(TallyUnit unit, long budgetBytes, Path tmpDir) {
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

    /** The spill folder, when one was made (tests check that it is gone after {@link #close()}). */
    Optional<Path> spillDir() {
        return Optional.ofNullable(spillDir);
    }

    /**
     * Writes the reviewer table (ordered by id) to {@code file}; call once, after scanning.
     * Without spilling, the workers' tables are merged in memory when that fits the budget.
     */
    public void write(Path file) throws IOException {
        write(file, WrittenTally.NONE);
    }

    /**
     * As {@link #write(Path)}, counting every reviewer written into {@code overview} (reviews per
     * reviewer, overall and per category) straight from the writer's record, without an object per
     * reviewer; the same counts as {@link OverviewCounts#addReviewer} for each.
     */
    public void write(Path file, OverviewCounts overview) throws IOException {
        write(file, overview::addWritten);
    }

    private void write(Path file, WrittenTally each) throws IOException {
        long inMemory = workers.stream().mapToLong(w -> w.table.memoryBytes()).sum();
        // Merging and sorting in memory needs about twice the tables' footprint.
        if (!spilled() && 2 * inMemory <= budget) {
            TallyTable all = mergedInMemory();
            reviewers = all.size();
            ReviewerTableFile.write(all, file, each);
            return;
        }
        // As many threads as scanned: each holds one partition (about 1/PARTITIONS of the reviewers) at a time.
        int threads = Math.max(1, workers.size());
        // The tables still in memory join each partition directly, rather than going to disk first, when
        // they and the partitions being merged fit the budget together.
        long liveSlots = workers.stream().mapToLong(w -> w.table.size()).sum();
        long partitionBytes = (spilledTallies() + liveSlots) / PARTITIONS * BYTES_PER_TALLY;
        boolean keepLive = inMemory + threads * partitionBytes <= budget;
        liveMerged = keepLive;
        List<TallyTable> live = new ArrayList<>();
        if (keepLive) {
            workers.forEach(w -> live.add(w.table));
        } else {
            inParallel(workers.size(), threads, w -> workers.get(w).spill());
        }
        List<byte[]> livePartitions = new ArrayList<>();
        for (TallyTable t : live) {
            livePartitions.add(t.partitions(PARTITIONS));
        }
        List<Path> runs = new ArrayList<>();
        for (int p = 0; p < PARTITIONS; p++) {
            runs.add(spillFolder().resolve("run-" + p + ".bin"));
        }
        inParallel(PARTITIONS, threads, p -> {
            TallyTable t = new TallyTable(unit);
            for (Path f : partitionFiles(p)) {
                try (SpillFile.In in = SpillFile.open(f)) {
                    t.readSpill(in);
                }
                Files.delete(f);
            }
            for (int k = 0; k < live.size(); k++) {
                t.mergePartition(live.get(k), livePartitions.get(k), p);
            }
            try (SpillFile.Out out = SpillFile.create(runs.get(p))) {
                t.writeRun(t.sortedById(), out);
            }
        });
        reviewers = mergeRuns(runs, file, each);
    }

    /** One of several numbered pieces of work. */
    private interface Task {
        void run(int i) throws IOException;
    }

    /** Runs {@code task} for 0 .. n-1 on up to {@code threads} threads; throws the first failure after all stopped. */
    private static void inParallel(int n, int threads, Task task) throws IOException {
        java.util.concurrent.atomic.AtomicInteger next = new java.util.concurrent.atomic.AtomicInteger();
        java.util.concurrent.atomic.AtomicReference<Throwable> failure = new java.util.concurrent.atomic.AtomicReference<>();
        Runnable loop = () -> {
            int i;
            while (failure.get() == null && (i = next.getAndIncrement()) < n) {
                try {
                    task.run(i);
                } catch (Throwable t) {
                    failure.compareAndSet(null, t);
                }
            }
        };
        List<Thread> pool = new ArrayList<>();
        for (int t = 1; t < Math.min(threads, n); t++) {
            Thread th = new Thread(loop, "merge-" + t);
            th.setDaemon(true);
            th.start();
            pool.add(th);
        }
        loop.run();
        for (Thread th : pool) {
            try {
                th.join();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new java.io.InterruptedIOException("interrupted while merging spilled tallies");
            }
        }
        Throwable t = failure.get();
        if (t instanceof IOException io) {
            throw io;
        }
        if (t instanceof RuntimeException r) {
            throw r;
        }
        if (t instanceof Error e) {
            throw e;
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

    private List<Path> partitionFiles(int p) throws IOException {
        String suffix = "-p" + p + ".bin";
        try (Stream<Path> s = Files.list(spillDir)) {
            return s.filter(f -> f.getFileName().toString().startsWith("spill-") && f.getFileName().toString().endsWith(suffix))
                    .sorted().toList();
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

    /** Merges runs sorted by id whose ids are disjoint (hash partitions) into the reviewer table; returns the rows written. */
    private static long mergeRuns(List<Path> runs, Path file, WrittenTally each) throws IOException {
        Categories dictionary = new Categories();
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
            try (ReviewerTableFile.Rows rows = new ReviewerTableFile.Rows(Files.newOutputStream(file), dictionary, each)) {
                while (!heads.isEmpty()) {
                    Cursor c = heads.poll();
                    rows.write(c.current);
                    if (c.advance()) {
                        heads.add(c);
                    }
                }
                return rows.count();
            }
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

    private synchronized void spilledTallies(long n) {
        spilledTallies += n;
    }

    private synchronized long spilledTallies() {
        return spilledTallies;
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
            SpillFile.Out[] parts = new SpillFile.Out[PARTITIONS];
            try {
                for (int p = 0; p < PARTITIONS; p++) {
                    parts[p] = SpillFile.create(dir.resolve(String.format(java.util.Locale.ROOT, "spill-w%03d-%06d-p%d.bin", number, n, p)));
                }
                table.spill(parts);
                spilledTallies(table.size());
            } finally {
                for (SpillFile.Out o : parts) {
                    if (o != null) {
                        o.close();
                    }
                }
            }
            table = new TallyTable(unit);
            bytes = 0;
        }
    }
}
