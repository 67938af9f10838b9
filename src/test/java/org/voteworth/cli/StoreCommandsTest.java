package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.store.Store;
import org.voteworth.store.StoreManifest;
import org.voteworth.store.StoredReview;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;

/**
 * {@code tally --store}: analyses from the store give what they give from the dump, the store is the
 * same for any thread count, memory budget and for an append, its rows point at the dump's lines,
 * and a damaged store stops with the file's name instead of answering.
 */
class StoreCommandsTest {
    @TempDir
    static Path dir;
    static Path first;
    static Path second;
    static Path store;

    @BeforeAll
    static void build() throws IOException {
        Path dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(6_000).withSeed(5).withCategories(6));
        first = Files.createDirectories(dir.resolve("a-first"));
        second = Files.createDirectories(dir.resolve("b-second"));
        List<Path> files;
        try (Stream<Path> s = Files.list(dump)) {
            files = s.filter(p -> p.toString().endsWith(".gz")).sorted().toList();
        }
        for (int i = 0; i < files.size(); i++) {
            Files.move(files.get(i), (i < 4 ? first : second).resolve(files.get(i).getFileName()));
        }
        store = dir.resolve("store");
        CliTest.Run r = CliTest.run("tally", first.toString(), second.toString(), "--store", store.toString(), "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
    }

    private static String out(String... args) {
        CliTest.Run r = CliTest.run(args);
        assertThat(r.code()).as(String.join(" ", args) + ": " + r.err()).isZero();
        return r.out();
    }

    private static List<StoredReview> reviews(Store s) throws IOException {
        List<StoredReview> all = new ArrayList<>();
        s.forEachReview(all::add);
        return all;
    }

    private static List<ReviewerTally> reviewers(Store s) throws IOException {
        List<ReviewerTally> all = new ArrayList<>();
        s.forEachReviewer(all::add);
        return all;
    }

    @Test
    void everyAnalysisFromTheStoreEqualsTheSameAnalysisFromTheDump() throws IOException {
        String rejects = dir.resolve("rejects-dump.tsv").toString();
        for (String rule : List.of("wilson", "bayes-mean")) {
            assertThat(out("rank", store.toString(), "--rule", rule, "--top", "40", "--format", "csv", "--quiet"))
                    .as(rule).isEqualTo(out("rank", first.toString(), second.toString(), "--rule", rule, "--top", "40",
                            "--format", "csv", "--quiet", "--rejects", rejects));
        }
        assertThat(out("rank", store.toString(), "--cap-votes", "20", "--top", "40", "--format", "csv", "--quiet"))
                .isEqualTo(out("rank", first.toString(), second.toString(), "--cap-votes", "20", "--top", "40", "--format", "csv",
                        "--quiet", "--rejects", rejects));
        assertThat(out("rank", store.toString(), "--unit", "review", "--top", "40", "--format", "csv", "--quiet"))
                .isEqualTo(out("rank", first.toString(), second.toString(), "--unit", "review", "--top", "40", "--format",
                        "csv", "--quiet", "--rejects", rejects));
        assertThat(out("sweep", store.toString(), "--format", "csv", "--quiet"))
                .isEqualTo(out("sweep", first.toString(), second.toString(), "--format", "csv", "--quiet", "--rejects", rejects));
        assertThat(out("overview", store.toString(), "--format", "csv", "--quiet"))
                .isEqualTo(out("overview", first.toString(), second.toString(), "--format", "csv", "--quiet", "--rejects", rejects));
        assertThat(out("compare", store.toString(), "--format", "csv", "--quiet"))
                .isEqualTo(out("compare", first.toString(), second.toString(), "--format", "csv", "--quiet", "--rejects", rejects));

        // The reviewer table itself, against the CSV a plain tally writes.
        Path csv = dir.resolve("plain");
        out("tally", first.toString(), second.toString(), "--out", csv.toString(), "--quiet");
        assertThat(reviewers(Store.open(store))).isEqualTo(ReviewerTableFile.read(csv.resolve("reviewers.csv")).toSortedList());
        // The store's rejects file and reconciliation are the tally's.
        assertThat(Files.readAllLines(store.resolve("rejects.tsv"))).isEqualTo(Files.readAllLines(csv.resolve("rejects.tsv")));
        CliTest.Run loud = CliTest.run("rank", store.toString(), "--top", "3");
        assertThat(loud.err()).contains("read = accepted + rejected");
    }

    @Test
    void threadsAndTheMemoryBudgetDoNotChangeTheStore() throws IOException {
        Path tmp = Files.createDirectories(dir.resolve("tmp-spill"));
        Path small = dir.resolve("store-small-memory");
        assertThat(out("tally", first.toString(), second.toString(), "--store", small.toString(), "--threads", "3", "--memory",
                "200KB", "--tmp", tmp.toString(), "--quiet")).containsPattern("[0-9]+ sorted runs spilled under --memory");
        Path one = dir.resolve("store-one-thread");
        out("tally", first.toString(), second.toString(), "--store", one.toString(), "--threads", "1", "--quiet");
        List<StoredReview> expected = reviews(Store.open(store));
        assertThat(reviews(Store.open(small))).isEqualTo(expected);
        assertThat(reviews(Store.open(one))).isEqualTo(expected);
        assertThat(reviewers(Store.open(small))).isEqualTo(reviewers(Store.open(store)));
        for (Path s : List.of(small, one)) {
            try (Stream<Path> files = Files.list(s)) {
                assertThat(files.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("manifest.json",
                        "reviewers.parquet", "reviews", "rejects.tsv", "reconciliation.txt");
            }
        }
        try (Stream<Path> files = Files.list(tmp)) {
            assertThat(files).isEmpty();
        }
    }

    @Test
    void anAppendedStoreEqualsOneBuiltInOnePassAndRefusesAFileItHasSeen() throws IOException {
        Path appended = dir.resolve("store-appended");
        out("tally", first.toString(), "--store", appended.toString(), "--quiet");
        out("tally", second.toString(), "--store", appended.toString(), "--append", "--quiet");
        Store a = Store.open(appended);
        Store b = Store.open(store);
        assertThat(reviews(a)).isEqualTo(reviews(b));
        assertThat(reviewers(a)).isEqualTo(reviewers(b));
        StoreManifest ma = a.manifest();
        StoreManifest mb = b.manifest();
        assertThat(ma.files()).isEqualTo(mb.files());
        assertThat(ma.categories()).isEqualTo(mb.categories());
        assertThat(List.of(ma.rowsRead(), ma.accepted(), ma.rejected(), ma.reviewers()))
                .isEqualTo(List.of(mb.rowsRead(), mb.accepted(), mb.rejected(), mb.reviewers()));
        assertThat(Files.readAllLines(appended.resolve("rejects.tsv"))).isEqualTo(Files.readAllLines(store.resolve("rejects.tsv")));

        String again;
        try (Stream<Path> s = Files.list(second)) {
            again = s.sorted().findFirst().orElseThrow().toString();
        }
        CliTest.Run twice = CliTest.run("tally", again, "--store", appended.toString(), "--append", "--quiet");
        assertThat(twice.code()).isEqualTo(1);
        assertThat(twice.err()).contains(again).contains("already in the store");
        CliTest.Run over = CliTest.run("tally", first.toString(), "--store", appended.toString(), "--quiet");
        assertThat(over.code()).isEqualTo(1);
        assertThat(over.err()).contains("is a store already");
        assertThat(reviews(Store.open(appended))).hasSameSizeAs(reviews(b));
    }

    @Test
    void everyStoredReviewPointsAtItsLineInTheDump() throws IOException {
        Map<String, List<String>> lines = new HashMap<>();
        for (StoredReview r : reviews(Store.open(store))) {
            List<String> file = lines.computeIfAbsent(r.file(), StoreCommandsTest::gunzipLines);
            String line = file.get((int) r.line() - 1);
            assertThat(line.split("\t")).as("%s:%d", r.file(), r.line()).contains(r.reviewer(), r.review(), r.item());
        }
    }

    private static List<String> gunzipLines(String file) {
        try (BufferedReader in = new BufferedReader(new InputStreamReader(new GZIPInputStream(Files.newInputStream(Path.of(file))),
                StandardCharsets.UTF_8))) {
            return in.lines().toList();
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    private static Path copy(String name) throws IOException {
        Path to = dir.resolve(name);
        try (Stream<Path> s = Files.walk(store)) {
            for (Path p : s.toList()) {
                Files.copy(p, to.resolve(store.relativize(p).toString()));
            }
        }
        return to;
    }

    @Test
    void aDamagedStoreStopsWithTheNameOfTheFileInsteadOfAnswering() throws IOException {
        Path truncated = copy("store-truncated");
        Path part = truncated.resolve("reviews/part-00003.parquet");
        try (RandomAccessFile f = new RandomAccessFile(part.toFile(), "rw")) {
            f.setLength(f.length() - 100);
        }
        CliTest.Run r = CliTest.run("rank", truncated.toString(), "--quiet");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("part-00003.parquet").contains("damaged or truncated");

        Path corrupted = copy("store-corrupted");
        part = corrupted.resolve("reviews/part-00005.parquet");
        try (RandomAccessFile f = new RandomAccessFile(part.toFile(), "rw")) {
            for (long at = f.length() / 4; at < f.length() / 2; at += 97) {
                f.seek(at);
                int b = f.read();
                f.seek(at);
                f.write(b ^ 0x5A);
            }
        }
        r = CliTest.run("rank", corrupted.toString(), "--cap-votes", "10", "--quiet");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("part-00005.parquet");

        Path disagreeing = copy("store-disagreeing");
        Path manifest = disagreeing.resolve("manifest.json");
        StoreManifest m = Store.open(disagreeing).manifest();
        Files.writeString(manifest, Files.readString(manifest).replace("\"reviewers\" : " + m.reviewers(),
                "\"reviewers\" : " + (m.reviewers() + 1)));
        r = CliTest.run("rank", disagreeing.toString(), "--quiet");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("reviewers.parquet").contains("manifest.json").contains(Long.toString(m.reviewers() + 1));

        Files.delete(disagreeing.resolve("reviews/part-00001.parquet"));
        Files.writeString(manifest, Files.readString(manifest).replace("\"reviewers\" : " + (m.reviewers() + 1),
                "\"reviewers\" : " + m.reviewers()));
        r = CliTest.run("profile", "planted-expert", "--store", disagreeing.toString());
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("part-00001.parquet").contains("missing");
    }

    @Test
    void profileAgreesWithTheReviewerTableAndHonoursPseudonyms() throws IOException {
        Store s = Store.open(store);
        ReviewerTally expert = s.reviewer("planted-expert").orElseThrow();
        JsonNode j = new ObjectMapper().readTree(out("profile", "planted-expert", "no-such-reviewer", "--store", store.toString(),
                "--format", "json"));
        JsonNode p = j.get("profiles").get(0);
        assertThat(p.get("reviews").asLong()).isEqualTo(expert.reviews());
        assertThat(p.get("helpful_votes").asLong()).isEqualTo(expert.helpfulVotes());
        assertThat(p.get("total_votes").asLong()).isEqualTo(expert.totalVotes());
        assertThat(p.get("verified").asLong()).isEqualTo(expert.verified());
        assertThat(p.get("review_list")).hasSize((int) expert.reviews());
        assertThat(j.get("profiles").get(1).get("found").asBoolean()).isFalse();
        assertThat(j.get("cautions")).isNotEmpty();

        Path key = dir.resolve("key.txt");
        Files.writeString(key, "store-secret\n");
        for (String format : List.of("table", "md", "csv", "json")) {
            String masked = out("profile", "planted-expert", "--store", store.toString(), "--format", format, "--pseudonymize",
                    "--key-file", key.toString());
            assertThat(masked).as(format).doesNotContain("planted-expert").contains("p-");
        }
        assertThat(out("profile", "planted-expert", "--store", store.toString(), "--format", "md"))
                .contains("## planted-expert").contains("Busiest days").contains("## Cautions");
    }
}
