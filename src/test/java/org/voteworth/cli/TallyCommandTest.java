package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/** {@code tally} gives the same files whatever --threads and --memory, and leaves nothing half-written. */
class TallyCommandTest {
    @TempDir
    Path dir;

    private int run(String... args) {
        return Main.run(new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()), args);
    }

    @Test
    void threadsAndSpillingDoNotChangeAnyOutput() throws IOException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(20_000).withGzip(false).withCategories(3));
        Path tmp = Files.createDirectories(dir.resolve("tmp"));
        assertThat(run("tally", dir.resolve("dump").toString(), "--out", dir.resolve("a").toString(), "--threads", "1",
                "--quiet")).isZero();
        assertThat(run("tally", dir.resolve("dump").toString(), "--out", dir.resolve("b").toString(), "--threads", "3",
                "--memory", "100KB", "--tmp", tmp.toString(), "--quiet")).isZero();
        for (String f : new String[] {"reviewers.csv", "rejects.tsv", "reconciliation.txt"}) {
            assertThat(Files.mismatch(dir.resolve("a").resolve(f), dir.resolve("b").resolve(f))).as(f).isEqualTo(-1L);
        }
        // The overview's counts too; only its parameters (the paths of each run) differ.
        ObjectMapper json = new ObjectMapper();
        JsonNode oa = json.readTree(dir.resolve("a").resolve("overview.json").toFile());
        JsonNode ob = json.readTree(dir.resolve("b").resolve("overview.json").toFile());
        assertThat(ob.get("overall")).isEqualTo(oa.get("overall"));
        assertThat(ob.get("categories")).isEqualTo(oa.get("categories"));
        assertThat(oa.get("categories")).hasSize(3);
        try (Stream<Path> s = Files.list(tmp)) {
            assertThat(s).isEmpty();
        }
        try (Stream<Path> s = Files.list(dir.resolve("b"))) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("reviewers.csv", "rejects.tsv",
                    "reconciliation.txt", "overview.json");
        }
    }

    @Test
    void aRunStoppedForTooManyRejectsKeepsTheRejectsAndNothingThatLooksComplete() throws IOException {
        Path dump = Files.createDirectories(dir.resolve("dump"));
        // Comma-separated rows read as TSV: every row is rejected, so the run stops.
        StringBuilder b = new StringBuilder("reviewer_id,helpful_votes,total_votes\n");
        for (int i = 0; i < 2000; i++) {
            b.append("R").append(i).append(",1,2\n");
        }
        Files.writeString(dump.resolve("toys.tsv"), "reviewer_id\thelpful_votes\ttotal_votes\n" + b.substring(b.indexOf("\n") + 1));
        Path tmp = Files.createDirectories(dir.resolve("tmp"));
        Path out = dir.resolve("out");
        StringWriter err = new StringWriter();
        assertThat(Main.run(new PrintWriter(new StringWriter()), new PrintWriter(err), "tally", dump.toString(), "--out",
                out.toString(), "--tmp", tmp.toString(), "--threads", "2", "--quiet")).isEqualTo(1);
        // The rejects are the evidence of what went wrong: kept, complete up to the stop, and named in the message.
        try (Stream<Path> s = Files.list(out)) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactly("rejects.tsv");
        }
        java.util.List<String> rejects = Files.readAllLines(out.resolve("rejects.tsv"));
        assertThat(rejects.get(0)).isEqualTo(org.voteworth.source.RejectLog.HEADER);
        assertThat(rejects.size() - 1).isGreaterThan(org.voteworth.source.RejectRateLimit.MIN_ROWS / 20);
        assertThat(rejects.get(1)).contains("toys.tsv").contains(org.voteworth.source.Reject.FIELD_COUNT);
        assertThat(err.toString()).contains("--max-reject-rate").contains("kept in " + out.resolve("rejects.tsv"));
        try (Stream<Path> s = Files.list(tmp)) {
            assertThat(s).isEmpty();
        }
    }
}
