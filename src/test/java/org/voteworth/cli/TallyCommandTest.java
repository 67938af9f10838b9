package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

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
        try (Stream<Path> s = Files.list(tmp)) {
            assertThat(s).isEmpty();
        }
        try (Stream<Path> s = Files.list(dir.resolve("b"))) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("reviewers.csv", "rejects.tsv",
                    "reconciliation.txt");
        }
    }

    @Test
    void aFailedRunLeavesNoOutputThatLooksCompleteAndNoTemporaryFiles() throws IOException {
        Path dump = Files.createDirectories(dir.resolve("dump"));
        // Comma-separated rows read as TSV: every row is rejected, so the run stops.
        StringBuilder b = new StringBuilder("reviewer_id,helpful_votes,total_votes\n");
        for (int i = 0; i < 2000; i++) {
            b.append("R").append(i).append(",1,2\n");
        }
        Files.writeString(dump.resolve("toys.tsv"), "reviewer_id\thelpful_votes\ttotal_votes\n" + b.substring(b.indexOf("\n") + 1));
        Path tmp = Files.createDirectories(dir.resolve("tmp"));
        Path out = dir.resolve("out");
        assertThat(run("tally", dump.toString(), "--out", out.toString(), "--tmp", tmp.toString(), "--threads", "2",
                "--quiet")).isEqualTo(1);
        try (Stream<Path> s = Files.list(out)) {
            assertThat(s).isEmpty();
        }
        try (Stream<Path> s = Files.list(tmp)) {
            assertThat(s).isEmpty();
        }
    }
}
