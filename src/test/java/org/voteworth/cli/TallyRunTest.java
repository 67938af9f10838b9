package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/** Progress on stderr, the closing summary line, and what a stopped run leaves behind. */
class TallyRunTest {
    private static final long SECOND = 1_000_000_000L;

    @TempDir
    Path dir;

    @Test
    void plainProgressIsALineEveryIntervalWithDoneOfTotalRateAndTimeLeft() {
        StringWriter out = new StringWriter();
        AtomicLong now = new AtomicLong(0);
        TallyRun.Progress p = new TallyRun.Progress(new PrintWriter(out), 0, false, 3 * SECOND, now::get);
        now.set(SECOND / 2);
        p.progress(10_000_000, 100_000_000, 1_000);
        assertThat(out.toString()).isEmpty();
        now.set(4 * SECOND);
        p.progress(40_000_000, 100_000_000, 8_000);
        now.set(5 * SECOND);
        p.progress(50_000_000, 100_000_000, 10_000);
        now.set(8 * SECOND);
        p.progress(80_000_000, 100_000_000, 16_000);
        p.finish();
        // 40 % in 4 s: 6 s left; 80 % in 8 s: 2 s left.
        assertThat(out.toString().lines().toList()).containsExactly(
                "tally: 40.0 MB of 100.0 MB (40 %), 8,000 rows, 2,000 rows/s, about 6 s left",
                "tally: 80.0 MB of 100.0 MB (80 %), 16,000 rows, 2,000 rows/s, about 2 s left");
    }

    @Test
    void aBarIsRedrawnInPlaceAndClearedAtTheEnd() {
        StringWriter out = new StringWriter();
        AtomicLong now = new AtomicLong(0);
        TallyRun.Progress p = new TallyRun.Progress(new PrintWriter(out), 0, true, SECOND / 4, now::get);
        now.set(SECOND);
        p.progress(0, 100_000_000, 0);
        now.set(2 * SECOND);
        p.progress(50_000_000, 100_000_000, 5_000);
        String bar = out.toString();
        assertThat(bar).doesNotContain("\n").startsWith("\r[");
        assertThat(bar).contains("0.0 MB of 100.0 MB, 0 rows/s, ? left");
        assertThat(bar).contains("[" + "#".repeat(15) + " ".repeat(15) + "]  50 % 50.0 MB of 100.0 MB, 2,500 rows/s, 2 s left");
        p.finish();
        assertThat(out.toString()).endsWith("\r" + " ".repeat(100) + "\r");
    }

    @Test
    void theSummaryLineGivesRowsReviewersRejectsTimeThroughputAndPeakMemory() throws IOException {
        Path dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(3_000).withSeed(3).withCategories(2));
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(new StringWriter()), new PrintWriter(err), "tally", dump.toString(), "--out",
                dir.resolve("out").toString(), "--format", "json");
        assertThat(code).as(err.toString()).isZero();
        List<String> done = err.toString().lines().filter(l -> l.startsWith("tally: done: ")).toList();
        assertThat(done).hasSize(1);
        long reviewers = Files.lines(dir.resolve("out").resolve("reviewers.csv")).count() - 1;
        long rejected = Files.lines(dir.resolve("out").resolve("rejects.tsv")).count() - 1;
        assertThat(done.get(0)).matches(String.format("tally: done: 3,0\\d\\d rows, %,d reviewers, %d rejected, \\d+\\.\\d s wall, "
                + "[\\d,]+ rows/s, [\\d.]+ MB/s, peak heap \\d+ MiB(, peak resident \\d+ MiB)?", reviewers, rejected));
        assertThat(rejected).isPositive();
    }

    @Test
    void stoppingTheProcessLeavesNoTemporaryFilesAndNoOutputThatLooksComplete() throws Exception {
        // Short invented rows: many reviewers per megabyte, and a tiny budget, so the run spills often and takes a while.
        Path dump = Files.createDirectories(dir.resolve("dump"));
        try (OutputStream o = new BufferedOutputStream(Files.newOutputStream(dump.resolve("toys.tsv")), 1 << 16)) {
            o.write("reviewer_id\thelpful_votes\ttotal_votes\n".getBytes(StandardCharsets.US_ASCII));
            for (int i = 0; i < 3_000_000; i++) {
                o.write(("R" + (i * 7919L % 2_000_003) + "\t1\t" + (1 + i % 5) + "\n").getBytes(StandardCharsets.US_ASCII));
            }
        }
        Path tmp = Files.createDirectories(dir.resolve("tmp"));
        Path out = dir.resolve("out");
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Process p = new ProcessBuilder(java.toString(), "-cp", System.getProperty("java.class.path"), Main.class.getName(),
                "tally", dump.toString(), "--out", out.toString(), "--tmp", tmp.toString(), "--memory", "1KB", "--threads", "2")
                .redirectErrorStream(true).redirectOutput(dir.resolve("log.txt").toFile()).start();
        // Wait until partial tallies are on disk, then stop the process as a service manager or Ctrl-C would.
        long deadline = System.nanoTime() + 60 * SECOND;
        while (!spilled(tmp) && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(5);
        }
        assertThat(p.isAlive()).as("the run should still be going: %s", Files.readString(dir.resolve("log.txt"))).isTrue();
        p.destroy(); // SIGTERM: the JVM runs its shutdown hooks, as on Ctrl-C (SIGINT)
        assertThat(p.waitFor(30, TimeUnit.SECONDS)).isTrue();
        assertThat(p.exitValue()).isNotZero();
        try (Stream<Path> s = Files.walk(tmp)) {
            assertThat(s.filter(f -> !f.equals(tmp))).isEmpty();
        }
        try (Stream<Path> s = Files.list(out)) {
            assertThat(s).isEmpty();
        }
    }

    private static boolean spilled(Path tmp) throws IOException {
        try (Stream<Path> s = Files.walk(tmp)) {
            return s.anyMatch(f -> f.getFileName().toString().startsWith("spill-"));
        } catch (java.io.UncheckedIOException e) {
            return false; // a folder went away while being listed
        }
    }
}
