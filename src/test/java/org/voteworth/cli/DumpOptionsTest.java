package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/** Every command that scans a dump takes --threads, --memory and --tmp, and its result does not depend on them. */
class DumpOptionsTest {
    @TempDir
    static Path dir;
    static Path dump;
    static Path list;

    @BeforeAll
    static void generate() throws IOException {
        dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(5_000).withSeed(21).withCategories(3).withGzip(false));
        list = dir.resolve("promoted.txt");
        Files.writeString(list, "planted-expert\n");
    }

    private static String run(List<String> args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(out), new PrintWriter(err), args.toArray(String[]::new));
        assertThat(code).as("%s: %s", args, err).isZero();
        return out.toString();
    }

    private static List<String> args(String command, String rejects, String... more) {
        List<String> a = new ArrayList<>(List.of(command, dump.toString(), "--format", "json", "--quiet", "--rejects",
                dir.resolve(rejects).toString()));
        a.addAll(List.of(more));
        if (command.equals("audit")) {
            a.addAll(List.of("--list", list.toString(), "--top-k", "10"));
        }
        return a;
    }

    @Test
    void threadsAndBudgetDoNotChangeAnyCommandsResult() throws IOException {
        Path tmp = Files.createDirectories(dir.resolve("tmp"));
        for (String c : new String[] {"rank", "sweep", "compare", "audit", "overview"}) {
            String one = run(args(c, c + "-1.tsv", "--threads", "1"));
            // A budget far below the tallies' size: partial tallies spill to --tmp and are merged back.
            String spilled = run(args(c, c + "-3.tsv", "--threads", "3", "--memory", "64KB", "--tmp", tmp.toString()));
            assertThat(spilled.replace(c + "-3.tsv", c + "-1.tsv")).as(c).isEqualTo(one);
            assertThat(Files.mismatch(dir.resolve(c + "-1.tsv"), dir.resolve(c + "-3.tsv"))).as(c + " rejects").isEqualTo(-1L);
            try (Stream<Path> s = Files.list(tmp)) {
                assertThat(s).as(c + " leaves no temporary files").isEmpty();
            }
        }
    }

    @Test
    void aRankingCommandWhosePartialTalliesSpillRanksTheSame() throws IOException {
        // 20,000 rows on one worker: it checks the budget after 16,384 rows, finds it passed and spills.
        Path one = dir.resolve("one-category");
        new DemoDumpGenerator().generate(one, DemoOptions.rows(20_000).withSeed(4).withCategories(1).withGzip(false));
        Path tmp = Files.createDirectories(dir.resolve("tmp-rank"));
        List<String> base = List.of("rank", one.toString(), "--format", "json", "--top", "20", "--rejects",
                dir.resolve("spill-rejects.tsv").toString());
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        List<String> spilling = new ArrayList<>(base);
        spilling.addAll(List.of("--memory", "64KB", "--tmp", tmp.toString(), "--threads", "1"));
        assertThat(Main.run(new PrintWriter(out), new PrintWriter(err), spilling.toArray(String[]::new))).isZero();
        assertThat(err.toString()).containsPattern("tally: done: .*, [1-9]\\d* spills");
        List<String> inMemory = new ArrayList<>(base);
        inMemory.add("--quiet");
        assertThat(out.toString()).isEqualTo(run(inMemory));
        try (Stream<Path> s = Files.list(tmp)) {
            assertThat(s).isEmpty();
        }
    }

    @Test
    void rankUncertaintyTakesTheCommandsOneThreadOption() {
        String a = run(args("rank", "u-1.tsv", "--top", "5", "--uncertainty", "--draws", "200", "--threads", "1"));
        String b = run(args("rank", "u-2.tsv", "--top", "5", "--uncertainty", "--draws", "200", "--threads", "2"));
        assertThat(b.replace("u-2.tsv", "u-1.tsv")).isEqualTo(a).contains("p_top_k");
        assertThat(run(List.of("rank", "--help"))).containsOnlyOnce("--threads=N  ").contains("Worker threads for the whole command");
    }

    @Test
    void refusesNoThreads() {
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(new StringWriter()), new PrintWriter(err), "overview", dump.toString(), "--threads",
                "0", "--quiet", "--rejects", dir.resolve("r0.tsv").toString());
        assertThat(code).isEqualTo(1);
        assertThat(err.toString()).contains("--threads must be 1 or more");
    }
}
