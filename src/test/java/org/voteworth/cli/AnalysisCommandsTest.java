package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** sweep, compare, audit and rank --uncertainty through the command line, on the bundled demo-data sample. */
class AnalysisCommandsTest {
    @TempDir
    static Path dir;
    static Path reviewers;
    static Path list;

    /** The command line's exit code and output, as {@link CliTest#run} captures them. */
    private static CliTest.Run run(String... args) {
        return CliTest.run(args);
    }

    @BeforeAll
    static void tally() throws IOException {
        Path out = dir.resolve("tally");
        CliTest.Run r = run("tally", "demo-data", "--out", out.toString(), "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
        reviewers = out.resolve("reviewers.csv");
        // The promotion list: the raw-share top 10 at no bar, plus an id that is not in the data.
        CliTest.Run rank = run("rank", reviewers.toString(), "--rule", "raw-share", "--top", "10", "--format", "json", "--quiet");
        JsonNode j = new ObjectMapper().readTree(rank.out());
        StringBuilder b = new StringBuilder("# promoted by raw share\n");
        j.get("entries").forEach(e -> b.append(e.get("reviewer").asText()).append('\n'));
        b.append("not-a-reviewer\n");
        list = dir.resolve("promoted.txt");
        Files.writeString(list, b.toString());
    }

    @Test
    void everyCommandHasHelp() {
        for (String c : new String[] {"sweep", "compare", "audit"}) {
            CliTest.Run r = run(c, "--help");
            assertThat(r.code()).isZero();
            assertThat(r.out()).contains("Usage: voteworth " + c, "--format", "--out", "--top", "--rule", "--quiet");
        }
        assertThat(run("audit", "--help").out()).contains("--fail-if", "Exit codes", "3 the --fail-if policy fails");
        assertThat(run("rank", "--help").out()).contains("--uncertainty", "--draws", "--seed", "--cap-votes");
    }

    @Test
    void sweepWritesEveryFormat() throws IOException {
        CliTest.Run t = run("sweep", reviewers.toString(), "--quiet");
        assertThat(t.code()).as(t.err()).isZero();
        assertThat(t.out()).contains("Threshold artefact: planted-expert", "jaccard_previous");
        assertThat(run("sweep", reviewers.toString(), "--quiet", "--format", "md").out()).startsWith("# Entry-bar sweep")
                .contains("| rule |");
        assertThat(run("sweep", reviewers.toString(), "--quiet", "--format", "csv").out())
                .startsWith("rule,bar,event,rank,reviewer").contains("artefact");
        JsonNode j = new ObjectMapper().readTree(run("sweep", reviewers.toString(), "--quiet", "--format", "json").out());
        assertThat(j.get("rules")).hasSize(3);
        assertThat(j.get("rules").get(0).get("min_jaccard_lowest").asDouble()).isZero();
        Path out = dir.resolve("sweep-out");
        assertThat(run("sweep", reviewers.toString(), "--quiet", "--rule", "wilson", "--bars", "0,50", "--out", out.toString())
                .code()).isZero();
        assertThat(Files.readString(out.resolve("sweep.txt"))).contains("Wilson lower bound").doesNotContain("raw-share  ");
    }

    @Test
    void compareWritesEveryFormat() throws IOException {
        CliTest.Run t = run("compare", reviewers.toString(), "--quiet");
        assertThat(t.code()).as(t.err()).isZero();
        assertThat(t.out()).contains("kendall_tau_b", "spearman_rho", "rbo", "Large disagreements", "planted-expert: #1 by wilson");
        assertThat(run("compare", reviewers.toString(), "--quiet", "--format", "md").out()).contains("## Large disagreements");
        assertThat(run("compare", reviewers.toString(), "--quiet", "--format", "csv").out())
                .startsWith("reviewer,helpful,total,share,top_review_share,rank_raw-share");
        JsonNode j = new ObjectMapper().readTree(run("compare", reviewers.toString(), "--quiet", "--format", "json").out());
        assertThat(j.get("pairs")).hasSize(3);
        assertThat(j.get("pairs").get(0).get("jaccard").asDouble()).isZero();
        assertThat(run("compare", reviewers.toString(), "--quiet", "--rules", "wilson").code()).isEqualTo(1);
    }

    @Test
    void auditReportsMissingIdsAndGatesAPipeline() throws IOException {
        CliTest.Run t = run("audit", reviewers.toString(), "--list", list.toString(), "--top-k", "10", "--rule", "wilson", "--quiet");
        assertThat(t.code()).as(t.err()).isZero();
        assertThat(t.out()).contains("Not in the data", "not-a-reviewer", "small sample", "planted-expert");
        CliTest.Run failing = run("audit", reviewers.toString(), "--list", list.toString(), "--top-k", "10", "--rule", "wilson",
                "--quiet", "--fail-if", "expected-below>1", "--format", "json");
        assertThat(failing.code()).isEqualTo(AuditCommand.POLICY_FAILED);
        JsonNode j = new ObjectMapper().readTree(failing.out());
        assertThat(j.get("passed").asBoolean()).isFalse();
        assertThat(j.get("summary").get("missing").asInt()).isEqualTo(1);
        assertThat(j.get("overlooked").toString()).contains("planted-expert");
        CliTest.Run passing = run("audit", reviewers.toString(), "--list", list.toString(), "--target-share", "0.8", "--quiet",
                "--fail-if", "below>0", "--format", "md");
        assertThat(passing.code()).as(passing.out()).isZero();
        assertThat(passing.out()).startsWith("# Audit of");
        assertThat(run("audit", reviewers.toString(), "--list", list.toString(), "--top-k", "10", "--quiet", "--format", "csv")
                .out()).startsWith("part,reviewer").contains("\nmissing,not-a-reviewer");
        // No bar, or a bad policy: errors for people.
        CliTest.Run noBar = run("audit", reviewers.toString(), "--list", list.toString(), "--quiet");
        assertThat(noBar.code()).isEqualTo(1);
        assertThat(noBar.err()).contains("--target-share S", "--top-k K");
        assertThat(run("audit", reviewers.toString(), "--list", list.toString(), "--top-k", "5", "--fail-if", "loud>1", "--quiet")
                .err()).contains("unknown metric 'loud'");
    }

    @Test
    void rankAddsUncertaintyColumnsToEveryFormat() throws IOException {
        CliTest.Run t = run("rank", reviewers.toString(), "--top", "5", "--uncertainty", "--draws", "500", "--quiet");
        assertThat(t.code()).as(t.err()).isZero();
        assertThat(t.out()).contains("p_top_5", "rank_low", "rank_high", "pruned");
        assertThat(run("rank", reviewers.toString(), "--top", "5", "--uncertainty", "--format", "csv", "--quiet").out())
                .contains("p_top_5,p_se,rank_low,rank_median,rank_high");
        assertThat(run("rank", reviewers.toString(), "--top", "5", "--uncertainty", "--format", "md", "--quiet").out())
                .contains("**rank uncertainty**");
        CliTest.Run a = run("rank", reviewers.toString(), "--top", "5", "--uncertainty", "--format", "json", "--threads", "1", "--quiet");
        CliTest.Run b = run("rank", reviewers.toString(), "--top", "5", "--uncertainty", "--format", "json", "--threads", "3", "--quiet");
        JsonNode j = new ObjectMapper().readTree(a.out());
        assertThat(j.get("rank_uncertainty")).hasSize(5);
        assertThat(j.get("uncertainty").get("pruned").asInt()).isPositive();
        assertThat(a.out()).isEqualTo(b.out());
    }

    @Test
    void theVoteCapNeedsTheDumpAndTamesTheViralReviewer() throws IOException {
        CliTest.Run onTable = run("rank", reviewers.toString(), "--cap-votes", "50", "--quiet");
        assertThat(onTable.code()).isEqualTo(1);
        assertThat(onTable.err()).contains("--cap-votes needs each review's votes");
        Path out = dir.resolve("capped");
        CliTest.Run capped = run("compare", "demo-data", "--cap-votes", "50", "--format", "json", "--quiet", "--out", out.toString());
        assertThat(capped.code()).as(capped.err()).isZero();
        String json = Files.readString(out.resolve("compare.json"));
        assertThat(json).contains("at most 50 votes per review");
        // planted-viral: 1150/1200 on one review -> 48/50, plus 9/14 on the others: 57 of 64.
        JsonNode viral = null;
        for (JsonNode r : new ObjectMapper().readTree(json).get("reviewers")) {
            if (r.get("reviewer").asText().equals("planted-viral")) {
                viral = r;
            }
        }
        if (viral != null) {
            assertThat(viral.get("total_votes").asLong()).isEqualTo(64);
        }
    }
}
