package org.voteworth.spark;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.cli.CliTest;
import org.voteworth.cli.CliTest.Run;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.VoteFrequencyTable;
import org.voteworth.source.DumpFormatException;
import org.voteworth.source.SourceOptions;
import org.voteworth.store.Store;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

/**
 * The Spark job against the local engine on the bundled demo data, in Spark local mode with two
 * worker threads; one Spark session serves every test. The local engine's output (the
 * {@code tally} command on the same files) is the reference: the two engines must agree row for
 * row, reject for reject. DuckDB, a reader that is not ours, checks the Parquet layout.
 */
class SparkTallyTest {
    static final Path DEMO = Path.of(System.getProperty("voteworth.projectDir", ".")).resolve("demo-data")
            .toAbsolutePath().normalize();

    @TempDir
    static Path dir;
    static SparkSession spark;
    static Path local;
    static Path localStore;
    static Path store;
    static SparkTally.Result result;
    static List<ReviewerTally> written;

    @BeforeAll
    static void tallyOnBothEngines() throws IOException {
        spark = SparkSession.builder().master("local[2]").appName("voteworth-spark-test")
                .config("spark.ui.enabled", "false")
                .config("spark.driver.host", "127.0.0.1")
                .config("spark.driver.bindAddress", "127.0.0.1")
                .config("spark.sql.shuffle.partitions", "4")
                .getOrCreate();
        local = dir.resolve("local");
        Run r = CliTest.run("tally", DEMO.toString(), "--out", local.toString(), "--quiet", "--threads", "2");
        assertThat(r.code()).as(r.err()).isZero();
        localStore = dir.resolve("local-store");
        Run s = CliTest.run("tally", DEMO.toString(), "--store", localStore.toString(), "--quiet", "--threads", "2");
        assertThat(s.code()).as(s.err()).isZero();
        store = dir.resolve("store");
        result = SparkTally.run(spark, new SparkTally.Request(List.of(DEMO.toString()), SourceOptions.defaults(),
                store.toString(), 3, true, 0, 1));
        written = readStore(store);
    }

    @AfterAll
    static void stop() {
        if (spark != null) {
            spark.stop();
        }
    }

    @Test
    void reviewerTableEqualsTheLocalEnginesRowForRow() throws IOException {
        List<ReviewerTally> expected = ReviewerTableFile.read(local.resolve("reviewers.csv")).toSortedList();
        List<ReviewerTally> parquet = written;
        assertThat(parquet).hasSize(expected.size());
        for (int i = 0; i < expected.size(); i++) {
            assertThat(parquet.get(i)).as("row %d", i).isEqualTo(expected.get(i));
        }
        assertThat(result.reviewers()).isEqualTo(expected.size());
        // The CSV table streamed through the driver is byte for byte the local one.
        assertThat(Files.mismatch(store.resolve("reviewers.csv"), local.resolve("reviewers.csv"))).isEqualTo(-1L);
    }

    @Test
    void rejectsAndReconciliationMatchTheLocalEngine() throws IOException {
        // demo-data/README.md: 40,003 rows read, 39,974 accepted, 29 rejected (planted malformed lines).
        assertThat(result.summary().rowsRead()).isEqualTo(40_003);
        assertThat(result.summary().accepted()).isEqualTo(39_974);
        assertThat(result.summary().rejected()).isEqualTo(29);
        assertThat(result.summary().reconciles()).isTrue();
        assertThat(Files.readString(store.resolve("rejects.tsv"))).isEqualTo(Files.readString(local.resolve("rejects.tsv")));
        assertThat(Files.readString(store.resolve("reconciliation.txt")))
                .isEqualTo(Files.readString(local.resolve("reconciliation.txt")));
    }

    @Test
    void rankPrintsTheSameRankingOnBothOutputs() {
        // bayes-mean fits the prior on each table, and the compared ranks cover raw-share and wilson.
        Run a = CliTest.run("rank", local.resolve("reviewers.csv").toString(), "--rule", "bayes-mean", "--top", "25", "--quiet");
        Run b = CliTest.run("rank", store.resolve("reviewers.csv").toString(), "--rule", "bayes-mean", "--top", "25", "--quiet");
        assertThat(a.code()).as(a.err()).isZero();
        assertThat(b.code()).as(b.err()).isZero();
        assertThat(a.out()).contains("planted-expert");
        assertThat(b.out().replace(store.toString(), "DIR")).isEqualTo(a.out().replace(local.toString(), "DIR"));
    }

    @Test
    void theSparkStoreReadsAsTheLocalStore() throws IOException {
        // Reference: the local engine's store of the same files. Spark's folder of part files (with _SUCCESS and .crc
        // side files) reads back as the same reviewer table, in the same id order, and one reviewer is found in its part.
        Store spark = Store.open(store);
        Store reference = Store.open(localStore);
        assertThat(spark.hasReviews()).isFalse();
        List<ReviewerTally> fromSpark = new ArrayList<>();
        spark.forEachReviewer(fromSpark::add);
        List<ReviewerTally> fromLocal = new ArrayList<>();
        reference.forEachReviewer(fromLocal::add);
        assertThat(fromSpark).isEqualTo(fromLocal);
        assertThat(spark.reviewer("planted-expert")).isEqualTo(reference.reviewer("planted-expert")).isPresent();
        assertThat(spark.summary().describe()).isEqualTo(reference.summary().describe());
    }

    @Test
    void rankAndSweepPrintTheSameOnTheSparkStoreAsOnTheLocalStore() {
        List<List<String>> commands = List.of(
                List.of("rank", "--rule", "bayes-mean", "--top", "25", "--quiet"),
                List.of("rank", "--rule", "wilson", "--top", "40", "--quiet"),
                List.of("sweep", "--bars", "0,5,10,50", "--quiet"),
                List.of("compare", "--top", "20", "--quiet"));
        for (List<String> c : commands) {
            Run a = CliTest.run(withInput(c, localStore));
            Run b = CliTest.run(withInput(c, store));
            assertThat(a.code()).as(a.err()).isZero();
            assertThat(b.code()).as(b.err()).isZero();
            assertThat(b.out().replace(store.toString(), "DIR")).as(String.join(" ", c))
                    .isEqualTo(a.out().replace(localStore.toString(), "DIR"));
        }
    }

    @Test
    void theReportRunsOnTheSparkStore() throws IOException {
        // The report needs the reviewer table only; its data set overview stays empty, as for a reviewer table file.
        Path html = dir.resolve("spark-report.html");
        Run r = CliTest.run("report", store.toString(), "--out", html.toString(), "--top", "3", "--draws", "200", "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(Files.readString(html)).contains("planted-expert");
    }

    private static String[] withInput(List<String> command, Path input) {
        List<String> args = new ArrayList<>(command);
        args.add(1, input.toString());
        return args.toArray(String[]::new);
    }

    @Test
    void commandsThatNeedEachReviewNameTheMissingParts() {
        for (String[] c : List.of(new String[] {"overview", store.toString()},
                new String[] {"rank", store.toString(), "--cap-votes", "10", "--quiet"},
                new String[] {"profile", "planted-expert", "--store", store.toString()})) {
            Run r = CliTest.run(c);
            assertThat(r.code()).as(String.join(" ", c)).isNotZero();
            assertThat(r.err()).as(String.join(" ", c)).contains(store.toString()).contains("per-review parts are missing")
                    .contains("tally DUMP... --store");
        }
        Run append = CliTest.run("tally", DEMO.resolve("books.tsv.gz").toString(), "--store", store.toString(), "--append",
                "--quiet");
        assertThat(append.code()).isNotZero();
        assertThat(append.err()).contains(store.toString()).contains("no per-review parts");
    }

    @Test
    void frequencyTableAndPriorAreTheLocalOnes() throws IOException {
        TallyTable table = ReviewerTableFile.read(local.resolve("reviewers.csv"));
        VoteFrequencyTable expected = VoteFrequencyTable.of(table, 1);
        assertThat(result.frequencies()).isEqualTo(expected);
        assertThat(result.prior()).isPresent();
        assertThat(result.prior().get().prior()).isEqualTo(EmpiricalBayesPrior.fit(expected).prior());
        List<String> csv = Files.readAllLines(store.resolve("vote-frequencies.csv"));
        assertThat(csv.get(0)).isEqualTo("helpful_votes,total_votes,reviewers");
        assertThat(csv).hasSize(1 + expected.distinctPairs());
    }

    @Test
    void manifestCountsAgreeWithTheLocalTable() throws IOException {
        com.fasterxml.jackson.databind.JsonNode m = new com.fasterxml.jackson.databind.ObjectMapper()
                .readTree(store.resolve(SparkTally.MANIFEST).toFile());
        assertThat(m.get("format").asText()).isEqualTo("voteworth-store");
        assertThat(m.get("version").asInt()).isEqualTo(1);
        assertThat(m.get("rows").get("read").asLong()).isEqualTo(40_003);
        assertThat(m.get("reviewers").asLong()).isEqualTo(written.size());
        assertThat(m.get("files")).hasSize(12);
        for (com.fasterxml.jackson.databind.JsonNode f : m.get("files")) {
            long byReason = 0;
            for (com.fasterxml.jackson.databind.JsonNode n : f.get("rejectsByReason")) {
                byReason += n.asLong();
            }
            assertThat(byReason).as(f.get("path").asText()).isEqualTo(f.get("rejected").asLong());
            assertThat(f.get("sha256HeadTail").asText()).hasSize(64);
        }
        // Reviews per category from the rows as the tasks counted them, against the local reviewer table's.
        Map<String, Long> expected = new java.util.TreeMap<>();
        ReviewerTableFile.read(local.resolve("reviewers.csv")).toSortedList()
                .forEach(t -> t.reviewsByCategory().forEach((c, n) -> expected.merge(c, n, Long::sum)));
        Map<String, Long> manifest = new java.util.TreeMap<>();
        m.get("categories").properties().forEach(e -> {
            manifest.put(e.getKey(), e.getValue().get("reviews").asLong());
            long rated = 0;
            for (com.fasterxml.jackson.databind.JsonNode n : e.getValue().get("stars")) {
                rated += n.asLong();
            }
            assertThat(rated).as(e.getKey()).isLessThanOrEqualTo(e.getValue().get("reviews").asLong());
        });
        assertThat(manifest).isEqualTo(expected);
        assertThat(manifest.values().stream().mapToLong(Long::longValue).sum()).isEqualTo(39_974);
    }

    @Test
    void anotherParquetReaderSeesTheStoreLayout() throws SQLException {
        String files = store.resolve(SparkTally.REVIEWERS).resolve("*.parquet").toString().replace("'", "''");
        try (Connection c = DriverManager.getConnection("jdbc:duckdb:"); Statement s = c.createStatement()) {
            Map<String, String> repetition = new LinkedHashMap<>();
            Map<String, String> physical = new LinkedHashMap<>();
            try (ResultSet r = s.executeQuery("SELECT DISTINCT name, type, repetition_type, logical_type FROM parquet_schema('"
                    + files + "')")) {
                while (r.next()) {
                    repetition.put(r.getString(1), r.getString(3));
                    physical.put(r.getString(1), r.getString(2) + (r.getString(4) == null ? "" : " " + r.getString(4)));
                }
            }
            // The store layout (version 1): required id and counters, optional dates, a 3-level list of categories.
            assertThat(repetition.get("reviewer_id")).isEqualTo("REQUIRED");
            assertThat(physical.get("reviewer_id")).startsWith("BYTE_ARRAY").contains("String");
            for (String counter : TallyRows.COUNTERS) {
                assertThat(physical.get(counter)).as(counter).startsWith("INT64");
                assertThat(repetition.get(counter)).as(counter).isEqualTo("REQUIRED");
            }
            assertThat(physical.get("first_date")).startsWith("INT32").contains("Date");
            assertThat(repetition.get("first_date")).isEqualTo("OPTIONAL");
            assertThat(repetition.get("list")).isEqualTo("REPEATED");
            assertThat(physical).containsKeys("element", "category", "reviews");
            try (ResultSet r = s.executeQuery("SELECT count(*), sum(helpful_votes), sum(total_votes), sum(reviews),"
                    + " sum(len(categories)) FROM read_parquet('" + files + "')")) {
                r.next();
                List<ReviewerTally> all = written;
                assertThat(r.getLong(1)).isEqualTo(all.size());
                assertThat(r.getLong(2)).isEqualTo(all.stream().mapToLong(ReviewerTally::helpfulVotes).sum());
                assertThat(r.getLong(3)).isEqualTo(all.stream().mapToLong(ReviewerTally::totalVotes).sum());
                assertThat(r.getLong(4)).isEqualTo(39_974);
                assertThat(r.getLong(5)).isEqualTo(all.stream().mapToLong(t -> t.reviewsByCategory().size()).sum());
            }
        }
    }

    @Test
    void theCommandLineRunsTheJobAndPrintsThePrior() throws IOException {
        Path cli = dir.resolve("cli-store");
        Run r = CliTest.run("spark-tally", DEMO.resolve("books.tsv.gz").toString(), "--out", cli.toString(), "--partitions", "2",
                "--reviewer-csv", "--csv-min-votes", "20");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("read = accepted + rejected").contains("prior: Beta(").contains("--prior ");
        assertThat(Files.readString(cli.resolve(SparkTally.MANIFEST))).contains("\"format\" : \"voteworth-store\"")
                .contains("\"category\" : \"books\"");
        List<String> reduced = Files.readAllLines(cli.resolve("reviewers.csv"));
        TallyTable all = ReviewerTableFile.read(cli.resolve("reviewers.csv"));
        assertThat(reduced).hasSize(1 + all.size());
        for (int s = 0; s < all.size(); s++) {
            assertThat(all.totalVotes(s)).isGreaterThanOrEqualTo(20);
        }
    }

    @Test
    void aFileWithTooManyRejectsStopsTheJobWithTheLocalMessage() throws IOException {
        Path bad = dir.resolve("bad");
        Files.createDirectories(bad);
        // A tab-separated header over comma-separated rows: every row is short of fields.
        StringBuilder b = new StringBuilder("reviewer_id\thelpful_votes\ttotal_votes\n");
        for (int i = 0; i < 50; i++) {
            b.append("r").append(i).append(",1,2\n");
        }
        Files.writeString(bad.resolve("commas.tsv"), b);
        Run localRun = CliTest.run("tally", bad.toString(), "--out", dir.resolve("bad-local").toString(), "--quiet");
        assertThat(localRun.code()).isEqualTo(1);
        assertThatThrownBy(() -> SparkTally.run(spark, new SparkTally.Request(List.of(bad.toString()),
                SourceOptions.defaults(), dir.resolve("bad-store").toString(), 1, false, 0, 1)))
                .isInstanceOf(DumpFormatException.class)
                .satisfies(e -> assertThat(e.getMessage()).contains("commas.tsv").contains("--csv"))
                .satisfies(e -> assertThat(localRun.err()).contains(e.getMessage()));
    }

    /** The columns of reviewers.parquet, given so that reading a part needs no job to infer them. */
    static final org.apache.spark.sql.types.StructType STORE_SCHEMA = org.apache.spark.sql.types.StructType.fromDDL(
            "reviewer_id STRING, reviews BIGINT, helpful_votes BIGINT, total_votes BIGINT, voted_reviews BIGINT,"
                    + " majority_reviews BIGINT, max_review_votes BIGINT, sum_squared_votes BIGINT, verified BIGINT,"
                    + " incentivised BIGINT, stars_1 BIGINT, stars_2 BIGINT, stars_3 BIGINT, stars_4 BIGINT, stars_5 BIGINT,"
                    + " first_date DATE, last_date DATE, categories ARRAY<STRUCT<category: STRING, reviews: BIGINT>>");

    /** The store's reviewer table, part file after part file in name order, as tallies. */
    static List<ReviewerTally> readStore(Path store) {
        List<ReviewerTally> all = new ArrayList<>();
        try (Stream<Path> parts = Files.list(store.resolve(SparkTally.REVIEWERS))) {
            for (Path p : parts.filter(p -> p.getFileName().toString().endsWith(".parquet")).sorted().toList()) {
                for (Row r : spark.read().schema(STORE_SCHEMA).parquet(p.toString()).select(TallyRows.fromStoreColumns())
                        .collectAsList()) {
                    all.add(TallyRows.tally(r));
                }
            }
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        return all;
    }
}
