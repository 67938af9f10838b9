package org.voteworth.spark;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.SortedMap;
import java.util.TreeMap;
import org.apache.hadoop.conf.Configuration;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SaveMode;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.storage.StorageLevel;
import org.apache.spark.util.SerializableConfiguration;
import org.voteworth.report.Json;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.PriorFit;
import org.voteworth.score.VoteFrequencyTable;
import org.voteworth.source.DumpFormatException;
import org.voteworth.source.FileReport;
import org.voteworth.source.Reject;
import org.voteworth.source.RejectLog;
import org.voteworth.source.ScanSummary;
import org.voteworth.source.SourceOptions;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;

import static org.apache.spark.sql.functions.col;

/**
 * The tally of {@code voteworth tally --store} as an Apache Spark job, for dumps too large for
 * one machine: the same files, mapping and category options in, the same reviewer table out.
 *
 * <p>Each dump file is one task that runs the project's own scanner (so a valid row, a reject
 * reason and a line number mean the same on both engines) into a partial tally; partial tallies
 * are range-partitioned by reviewer id, sorted, and reduced with {@link ReviewerTally#merge}.
 * The store folder then holds:
 * <ul>
 *   <li>{@code reviewers.parquet/}: the reviewer table in the store layout, written by Spark as a
 *       folder of part files whose names ({@code part-00000-...}) follow reviewer id order;</li>
 *   <li>{@code rejects.tsv}: every rejected row with file, line, field and reason, in file and line
 *       order, in the format of {@code voteworth tally};</li>
 *   <li>{@code reconciliation.txt}: read = accepted + rejected per file;</li>
 *   <li>{@code vote-frequencies.csv}: the (helpful, total) frequency table the prior is fitted on;</li>
 *   <li>{@code reviewers.csv} on request: the reviewer table file that {@code rank} reads;</li>
 *   <li>{@code manifest.json}, written last, so a store without it is unfinished.</li>
 * </ul>
 */
public final class SparkTally {
    static final String REVIEWERS = "reviewers.parquet";
    static final String MANIFEST = "manifest.json";
    /** A task's error as Spark's job failure quotes it: its class, then its message up to the stack trace. */
    private static final java.util.regex.Pattern TASK_ERROR = java.util.regex.Pattern.compile(
            "(?s)(org\\.voteworth\\.source\\.DumpFormatException|java\\.io\\.UncheckedIOException): (.*?)\\R\\s+at ");

    private SparkTally() {
    }

    /**
     * What to tally and where to put it.
     *
     * @param inputs files, folders and globs, on any file system Spark reads
     * @param source how rows are read (mapping, CSV, category pattern, reject limit)
     * @param store the store folder
     * @param partitions parts of the reviewer table; 0 = Spark's default parallelism
     * @param reviewerCsv also write {@code reviewers.csv} (through the driver)
     * @param csvMinVotes only reviewers with at least this many total votes go into the CSV table
     * @param fitFloor the prior is fitted on reviewers with at least this many total votes (1 or more)
     */
    public record Request(List<String> inputs, SourceOptions source, String store, int partitions, boolean reviewerCsv,
                          long csvMinVotes, long fitFloor) {
        public Request {
            inputs = List.copyOf(inputs);
            Objects.requireNonNull(source, "source");
            Objects.requireNonNull(store, "store");
            if (partitions < 0) {
                throw new IllegalArgumentException("--partitions must be 0 (Spark's default) or more, not " + partitions);
            }
            if (csvMinVotes < 0) {
                throw new IllegalArgumentException("--csv-min-votes must be 0 or more, not " + csvMinVotes);
            }
            if (fitFloor < 1) {
                throw new IllegalArgumentException("--fit-floor must be at least 1 total vote, not " + fitFloor);
            }
        }
    }

    /**
     * What the job produced.
     *
     * @param summary the reconciliation per file, in file order
     * @param reviewers rows of the reviewer table
     * @param frequencies the (H, T) frequency table over reviewers at or above the fitting floor
     * @param prior the empirical-Bayes prior fitted on the driver, empty when no reviewer reached the floor
     * @param store the store folder, qualified
     * @param seconds wall time
     */
    public record Result(ScanSummary summary, long reviewers, VoteFrequencyTable frequencies, Optional<PriorFit> prior,
                         String store, double seconds) {
    }

    /**
     * Runs the job in the active Spark session, or, when there is none, in a new one on
     * {@code master} (spark-submit's when empty, else {@code local[*]}), stopped at the end.
     */
    public static Result run(Request request, Optional<String> master) throws IOException {
        scala.Option<SparkSession> running = SparkSession.getActiveSession().orElse(SparkSession::getDefaultSession);
        Optional<SparkSession> active = running.isDefined() ? Optional.of(running.get()) : Optional.empty();
        if (active.isPresent()) {
            return run(active.get(), request);
        }
        SparkSession.Builder b = SparkSession.builder().appName("voteworth spark-tally");
        if (master.isPresent()) {
            b.master(master.get());
        } else if (System.getProperty("spark.master") == null) {
            b.master("local[*]");
        }
        SparkSession spark = b.getOrCreate();
        if (System.getProperty("spark.master") == null) {
            // Outside spark-submit nobody chose a logging setup: progress INFO lines would bury the reconciliation.
            spark.sparkContext().setLogLevel("WARN");
        }
        try {
            return run(spark, request);
        } finally {
            spark.stop();
        }
    }

    /** Runs the job in {@code spark}. */
    public static Result run(SparkSession spark, Request request) throws IOException {
        long start = System.nanoTime();
        Configuration conf = spark.sparkContext().hadoopConfiguration();
        List<DumpUnit> units = SparkInputs.find(request.inputs(), request.source().categories(), conf);
        ReadSettings settings = ReadSettings.of(request.source());
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        Broadcast<SerializableConfiguration> shared = jsc.broadcast(new SerializableConfiguration(conf));
        int parts = request.partitions() > 0 ? request.partitions() : spark.sparkContext().defaultParallelism();
        try (StoreOutput store = StoreOutput.open(request.store(), conf)) {
            store.remove(MANIFEST);
            Dataset<Row> scanned = spark.createDataFrame(
                    jsc.parallelize(units, Math.max(1, units.size())).mapPartitions(new UnitScan(settings, shared)),
                    UnitScan.SCHEMA).persist(StorageLevel.MEMORY_AND_DISK());
            Dataset<Row> merged = null;
            try {
                Reports reports = reports(scanned, units);
                ScanSummary summary = reports.summary();
                writeRejects(scanned, units, store);
                merged = scanned.filter(col("kind").equalTo(UnitScan.TALLY)).select("tally.*")
                        .repartitionByRange(parts, col("reviewer_id")).sortWithinPartitions("reviewer_id")
                        .mapPartitions(new TallyMerge(), Encoders.row(TallyRows.SCHEMA))
                        .persist(StorageLevel.MEMORY_AND_DISK());
                // Counting first fills the cache, so the writes and the frequency table below read the merged tallies from it.
                long reviewers = merged.count();
                merged.select(TallyRows.storeColumns()).write().mode(SaveMode.Overwrite).option("compression", "zstd")
                        .parquet(store.uri(REVIEWERS));
                VoteFrequencyTable frequencies = frequencies(merged, request.fitFloor());
                Optional<PriorFit> prior = frequencies.units() == 0 ? Optional.empty()
                        : Optional.of(EmpiricalBayesPrior.fit(frequencies));
                writeFrequencies(frequencies, store);
                if (request.reviewerCsv()) {
                    writeCsv(merged, request.csvMinVotes(), store);
                } else {
                    store.remove("reviewers.csv");
                }
                Files.writeString(store.staged("reconciliation.txt"), summary.describe());
                store.publish("reconciliation.txt");
                Files.writeString(store.staged(MANIFEST), manifest(settings, units, reports, reviewers));
                store.publish(MANIFEST);
                return new Result(summary, reviewers, frequencies, prior, store.dir(), (System.nanoTime() - start) / 1e9);
            } catch (Exception e) {
                throw failure(e, units);
            } finally {
                if (merged != null) {
                    merged.unpersist();
                }
                scanned.unpersist();
                shared.destroy();
            }
        }
    }

    /**
     * What the one report row of each file's task says, gathered in file order.
     *
     * @param summary the reconciliation
     * @param fingerprints each file's head-and-tail SHA-256
     * @param categories per category over all files: reviews, then stars 1 to 5
     */
    private record Reports(ScanSummary summary, List<String> fingerprints, SortedMap<String, long[]> categories) {
    }

    private static Reports reports(Dataset<Row> scanned, List<DumpUnit> units) {
        List<Row> rows = scanned.filter(col("kind").equalTo(UnitScan.REPORT)).select("unit", "report").collectAsList();
        FileReport[] reports = new FileReport[units.size()];
        String[] fingerprints = new String[units.size()];
        SortedMap<String, long[]> categories = new TreeMap<>();
        for (Row r : rows) {
            int u = r.getInt(0);
            Row p = r.getStruct(1);
            Map<String, Long> reasons = new HashMap<>();
            for (Row c : p.<Row>getList(3)) {
                reasons.put(c.getString(0), c.getLong(1));
            }
            reports[u] = new FileReport(units.get(u).file(), p.getLong(0), p.getLong(1), p.getLong(2), reasons, p.getBoolean(4));
            fingerprints[u] = p.getString(5);
            for (Row c : p.<Row>getList(6)) {
                long[] n = categories.computeIfAbsent(c.getString(0), k -> new long[6]);
                n[0] += c.getLong(1);
                List<Long> stars = c.getList(2);
                for (int s = 1; s <= 5; s++) {
                    n[s] += stars.get(s - 1);
                }
            }
        }
        return new Reports(new ScanSummary(List.of(reports)), List.of(fingerprints), categories);
    }

    /** The rejects file, streamed to the driver in file and line order (one task reads the cached rows in order). */
    private static void writeRejects(Dataset<Row> scanned, List<DumpUnit> units, StoreOutput store) throws IOException {
        Iterator<Row> it = scanned.filter(col("kind").equalTo(UnitScan.REJECT)).select("unit", "reject").coalesce(1)
                .toLocalIterator();
        try (RejectLog log = new RejectLog(store.staged("rejects.tsv"))) {
            while (it.hasNext()) {
                Row r = it.next();
                Row j = r.getStruct(1);
                byte[] row = (byte[]) j.get(5);
                log.reject(units.get(r.getInt(0)).file(), j.getLong(0), new Reject(j.getString(2), j.getString(1),
                        j.getString(3), j.getString(4)), row, 0, row.length);
            }
        }
        store.publish("rejects.tsv");
    }

    /** Per partition a frequency table of (H, T) at or above the floor, merged on the driver. */
    private static VoteFrequencyTable frequencies(Dataset<Row> merged, long floor) {
        int h = TallyRows.SCHEMA.fieldIndex("helpful_votes");
        int t = TallyRows.SCHEMA.fieldIndex("total_votes");
        List<long[][]> perPartition = merged.javaRDD().mapPartitions(rows -> {
            Map<VotePair, Long> counts = new HashMap<>();
            rows.forEachRemaining(r -> {
                if (r.getLong(t) >= floor) {
                    counts.merge(new VotePair(r.getLong(h), r.getLong(t)), 1L, Long::sum);
                }
            });
            long[][] triples = new long[3][counts.size()];
            int i = 0;
            for (Map.Entry<VotePair, Long> e : counts.entrySet()) {
                triples[0][i] = e.getKey().helpful();
                triples[1][i] = e.getKey().total();
                triples[2][i++] = e.getValue();
            }
            return java.util.Collections.singletonList(triples).iterator();
        }).collect();
        VoteFrequencyTable all = VoteFrequencyTable.empty();
        for (long[][] p : perPartition) {
            all = all.merge(VoteFrequencyTable.ofCounts(p[0], p[1], p[2]));
        }
        return all;
    }

    private record VotePair(long helpful, long total) {
    }

    private static void writeFrequencies(VoteFrequencyTable f, StoreOutput store) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(store.staged("vote-frequencies.csv"), StandardCharsets.UTF_8)) {
            w.write("helpful_votes,total_votes,reviewers\n");
            for (int i = 0; i < f.distinctPairs(); i++) {
                w.write(f.helpful(i) + "," + f.total(i) + "," + f.count(i) + "\n");
            }
        }
        store.publish("vote-frequencies.csv");
    }

    /** The reviewer table file, streamed partition by partition (range partitions are in id order). */
    private static void writeCsv(Dataset<Row> merged, long minVotes, StoreOutput store) throws IOException {
        Iterator<Row> rows = merged.filter(col("total_votes").geq(minVotes)).toLocalIterator();
        Iterator<ReviewerTally> tallies = new Iterator<>() {
            @Override
            public boolean hasNext() {
                return rows.hasNext();
            }

            @Override
            public ReviewerTally next() {
                return TallyRows.tally(rows.next());
            }
        };
        ReviewerTableFile.write(tallies, store.staged("reviewers.csv"));
        store.publish("reviewers.csv");
    }

    private static String manifest(ReadSettings settings, List<DumpUnit> units, Reports reports, long reviewers) {
        ScanSummary summary = reports.summary();
        return Json.object(j -> {
            j.field("format", "voteworth-store");
            j.field("version", 1);
            j.field("created", Instant.now().toString());
            j.object("mapping", m -> settings.overrides().forEach(m::field));
            j.field("categoryFromName", settings.categoryPattern());
            List<Integer> order = new ArrayList<>();
            for (int i = 0; i < units.size(); i++) {
                order.add(i);
            }
            j.array("files", order, (f, i) -> {
                DumpUnit u = units.get(i);
                FileReport r = summary.files().get(i);
                f.field("path", u.name());
                f.field("size", u.sizeBytes());
                f.field("modified", Instant.ofEpochMilli(u.modified()).toString());
                f.field("sha256HeadTail", reports.fingerprints().get(i));
                f.field("rowsRead", r.rowsRead());
                f.field("accepted", r.accepted());
                f.field("rejected", r.rejected());
                f.field("category", u.category());
                f.map("rejectsByReason", r.rejectsByReason());
            });
            j.object("rows", r -> {
                r.field("read", summary.rowsRead());
                r.field("accepted", summary.accepted());
                r.field("rejected", summary.rejected());
            });
            j.field("reviewers", reviewers);
            j.field("reviewParts", 0);
            j.field("partitioning", "reviewer-hash-v1 mod 0");
            j.object("categories", all -> reports.categories().forEach((name, n) -> all.object(name, c -> {
                c.field("reviews", n[0]);
                c.stream(g -> {
                    g.writeArrayFieldStart("stars");
                    for (int s = 1; s <= 5; s++) {
                        g.writeNumber(n[s]);
                    }
                    g.writeEndArray();
                });
            })));
        });
    }

    /**
     * The error a person should see: a task's {@link DumpFormatException} or I/O error with the
     * message it was raised with. Spark ends a job whose task failed with its own exception, which
     * carries the task's error (as its cause when that could be sent back, else as text).
     */
    private static RuntimeException failure(Exception e, List<DumpUnit> units) throws IOException {
        if (e instanceof IOException io) {
            throw io;
        }
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof DumpFormatException d) {
                return d;
            }
            if (t instanceof UncheckedIOException u) {
                throw u.getCause();
            }
        }
        java.util.regex.Matcher m = TASK_ERROR.matcher(String.valueOf(e.getMessage()));
        if (!m.find()) {
            return e instanceof RuntimeException r ? r : new IllegalStateException(e.getMessage(), e);
        }
        String message = m.group(2);
        if (!m.group(1).endsWith("DumpFormatException")) {
            throw new IOException(message, e);
        }
        for (DumpUnit u : units) {
            java.util.regex.Matcher at = java.util.regex.Pattern.compile("(?s)" + java.util.regex.Pattern.quote(u.name())
                    + ": (?:line (\\d+): )?(.*)").matcher(message);
            if (at.matches()) {
                return new DumpFormatException(u.name(), at.group(1) == null ? 0 : Long.parseLong(at.group(1)), at.group(2), e);
            }
        }
        return new DumpFormatException("(spark task)", 0, message, e);
    }
}
