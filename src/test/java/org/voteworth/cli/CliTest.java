package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.GeneratedDump;
import org.voteworth.tally.Csv;

/** The command line end to end; {@link #run} is the capture harness every command test uses, in any package. */
public class CliTest {
    @TempDir
    static Path dir;
    static Path dump;
    static GeneratedDump generated;

    public record Run(int code, String out, String err) {
    }

    public static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new PrintWriter(out), new PrintWriter(err), args);
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void generate() throws IOException {
        dump = dir.resolve("dump");
        generated = new DemoDumpGenerator().generate(dump, DemoOptions.rows(6_000).withSeed(11));
    }

    @Test
    void tallyReconcilesWithWhatTheGeneratorPlanted() throws IOException {
        Path out = dir.resolve("tally");
        Run r = run("tally", dump.toString(), "--out", out.toString(), "--quiet", "--format", "json");
        assertThat(r.code()).as(r.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(r.out());
        assertThat(j.get("reconciles").asBoolean()).isTrue();
        assertThat(j.get("accepted").asLong()).isEqualTo(generated.expectedAcceptedRows());
        assertThat(j.get("rejected").asLong()).isEqualTo(generated.expectedRejectedLines());
        assertThat(j.get("rows_read").asLong()).isEqualTo(generated.physicalLines());
        // Every rejected line is in the rejects file (one header line plus one line per reject).
        assertThat(Files.readAllLines(out.resolve("rejects.tsv"))).hasSize(1 + (int) generated.expectedRejectedLines());
        assertThat(Files.readString(out.resolve("reconciliation.txt"))).contains("read = accepted + rejected");
        List<String> table = Files.readAllLines(out.resolve("reviewers.csv"));
        assertThat(Csv.parseLine(table.get(0))).startsWith("reviewer_id", "reviews", "helpful_votes");
        assertThat(table.size() - 1).isEqualTo(j.get("reviewers").asInt());
    }

    @Test
    void rankWritesEveryFormatFromADumpAndFromTheReviewerTable() throws IOException {
        Path out = dir.resolve("rank");
        Run tally = run("tally", dump.toString(), "--out", out.toString(), "--quiet");
        assertThat(tally.code()).as(tally.err()).isZero();

        Run table = run("rank", out.resolve("reviewers.csv").toString(), "--top", "5", "--explain", "--quiet");
        assertThat(table.code()).as(table.err()).isZero();
        assertThat(table.out()).contains("Wilson lower bound").contains("#1 ").contains("to draw level");

        Run md = run("rank", dump.toString(), "--rule", "bayes-mean", "--format", "md", "--top", "5", "--quiet",
                "--rejects", dir.resolve("r.tsv").toString());
        assertThat(md.code()).as(md.err()).isZero();
        assertThat(md.out()).contains("## Why each reviewer stands where they stand").contains("## Cautions");

        Run json = run("rank", out.resolve("reviewers.csv").toString(), "--format", "json", "--top", "3");
        JsonNode j = new ObjectMapper().readTree(json.out());
        assertThat(j.get("entries")).hasSize(3);
        assertThat(j.get("entries").get(0).get("ranks").has("raw-share")).isTrue();

        Run csv = run("rank", out.resolve("reviewers.csv").toString(), "--format", "csv", "--top", "4");
        List<String> lines = csv.out().lines().toList();
        assertThat(lines).hasSize(5);
        assertThat(Csv.parseLine(lines.get(0))).contains("rank", "reviewer", "score", "reasons");
    }

    @Test
    void pseudonymisedOutputsShowNoRealId() throws IOException {
        Path key = dir.resolve("key.txt");
        Files.writeString(key, "team-secret\n");
        Run r = run("rank", dump.toString(), "--top", "10", "--format", "json", "--pseudonymize", "--key-file", key.toString(),
                "--quiet", "--rejects", dir.resolve("r2.tsv").toString());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).doesNotContain("planted-").contains("\"p-");
    }

    @Test
    void usageErrorsExitWithTwoAndBadInputWithOne() {
        assertThat(run("rank").code()).isEqualTo(2);
        assertThat(run("rank", dump.toString(), "--no-such-option").code()).isEqualTo(2);
        Run missing = run("tally", dir.resolve("nothing-here").toString(), "--out", dir.resolve("x").toString());
        assertThat(missing.code()).isEqualTo(1);
        assertThat(missing.err()).contains("nothing-here");
        Run rule = run("rank", dump.toString(), "--rule", "best-guess", "--quiet", "--rejects", dir.resolve("r3.tsv").toString());
        assertThat(rule.code()).isEqualTo(1);
        assertThat(rule.err()).contains("best-guess").contains("wilson");
    }

    @Test
    void aWrongDelimiterStopsTheRunInsteadOfProducingNonsense() throws IOException {
        Path csv = dir.resolve("commas.tsv");
        StringBuilder b = new StringBuilder("reviewer_id,helpful_votes,total_votes\n");
        for (int i = 0; i < 2_000; i++) {
            b.append(i).append(",1,2\n");
        }
        Files.writeString(csv, b);
        Run r = run("tally", csv.toString(), "--out", dir.resolve("commas").toString(), "--quiet");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("commas.tsv");
    }

    @Test
    void versionAndHelpWork() {
        Run v = run("--version");
        assertThat(v.code()).isZero();
        assertThat(v.out()).contains("voteworth");
        for (String cmd : List.of("demo", "generate", "tally", "rank")) {
            Run h = run(cmd, "--help");
            assertThat(h.code()).isZero();
            assertThat(h.out()).contains("Usage: voteworth " + cmd);
        }
    }
}
