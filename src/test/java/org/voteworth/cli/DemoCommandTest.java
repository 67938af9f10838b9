package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.GeneratedDump;
import org.voteworth.demo.PlantedCases;

/** The demo on the bundled sample: what a user sees first must show the problem and its remedy. */
class DemoCommandTest {
    @TempDir
    static Path dir;
    static Path out;
    static CliTest.Run run;
    static ObjectMapper json = new ObjectMapper();

    @BeforeAll
    static void runDemo() {
        out = dir.resolve("demo");
        run = CliTest.run("demo", "--out", out.toString(), "--quiet", "--data", projectDir().resolve("demo-data").toString());
    }

    static Path projectDir() {
        return Path.of(System.getProperty("voteworth.projectDir", "."));
    }

    static List<JsonNode> entries(String rule) throws IOException {
        List<JsonNode> e = new ArrayList<>();
        json.readTree(out.resolve("ranking-" + rule + ".json").toFile()).get("entries").forEach(e::add);
        return e;
    }

    @Test
    void pointsAtItsOutputs() {
        assertThat(run.code()).as(run.err()).isZero();
        assertThat(run.out()).contains("Outputs in").contains("summary.md").contains("reconciliation.txt");
        for (String f : List.of("summary.md", "reviewers.csv", "rejects.tsv", "reconciliation.txt", "ranking-raw-share.md",
                "ranking-wilson.csv", "ranking-bayes-mean.json")) {
            assertThat(out.resolve(f)).exists();
        }
    }

    @Test
    void reconciliationOnTheBundledSampleMatchesWhatTheGeneratorPlanted() throws IOException {
        // Regenerate the sample's counts with the command documented in demo-data/README.md.
        GeneratedDump expected = new DemoDumpGenerator().generate(dir.resolve("regenerated"), DemoOptions.rows(40_000));
        assertThat(run.out()).contains(String.format(java.util.Locale.ROOT, "%,d reviews read, %,d accepted, %,d rejected (read = accepted + rejected holds)",
                expected.physicalLines(), expected.expectedAcceptedRows(), expected.expectedRejectedLines()));
        assertThat(Files.readAllLines(out.resolve("rejects.tsv"))).hasSize(1 + (int) expected.expectedRejectedLines());
    }

    @Test
    void rawShareTopIsFilledBySamplesAtHundredPercentWhileTheStatisticalListsHoldTheEvidence() throws IOException {
        List<JsonNode> raw = entries("raw-share");
        List<JsonNode> wilson = entries("wilson");
        List<JsonNode> bayes = entries("bayes-mean");
        assertThat(raw).hasSize(10).allSatisfy(e -> assertThat(e.get("share").asDouble()).isEqualTo(1.0));
        assertThat(median(wilson)).isGreaterThan(5 * median(raw));
        assertThat(median(bayes)).isGreaterThan(5 * median(raw));
        assertThat(ids(raw)).doesNotContain(PlantedCases.EXPERT);
        assertThat(ids(wilson).subList(0, 3)).contains(PlantedCases.EXPERT);
        assertThat(ids(bayes).subList(0, 3)).contains(PlantedCases.EXPERT);
        assertThat(ids(wilson)).contains(PlantedCases.VETERAN_1, PlantedCases.VETERAN_2, PlantedCases.VETERAN_3);
    }

    @Test
    void everyRankIsExplainedAndTheViralReviewerIsFlagged() throws IOException {
        for (String rule : List.of("raw-share", "wilson", "bayes-mean")) {
            for (JsonNode e : entries(rule)) {
                assertThat(e.get("reasons").size()).isGreaterThanOrEqualTo(4);
                assertThat(e.get("ranks").has("raw-share") && e.get("ranks").has("wilson") && e.get("ranks").has("bayes-mean")).isTrue();
            }
        }
        JsonNode viral = entries("wilson").stream().filter(e -> e.get("reviewer").asText().equals(PlantedCases.VIRAL))
                .findFirst().orElseThrow();
        assertThat(viral.get("flags").toString()).contains("vote_concentration");
        String md = Files.readString(out.resolve("ranking-wilson.md"));
        assertThat(md).contains("reviewers above it there have fewer votes").contains("to draw level").contains("## Cautions");
    }

    private static List<String> ids(List<JsonNode> entries) {
        return entries.stream().map(e -> e.get("reviewer").asText()).toList();
    }

    private static long median(List<JsonNode> entries) {
        long[] v = entries.stream().mapToLong(e -> e.get("total_votes").asLong()).sorted().toArray();
        return v[v.length / 2];
    }
}
