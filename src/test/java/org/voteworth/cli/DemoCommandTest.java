package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.GeneratedDump;
import org.voteworth.demo.PlantedCases;
import org.voteworth.tally.Csv;

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

    @Test
    void endsWithTheHtmlReportWhosePathItPrints() {
        Path html = out.resolve("report.html").toAbsolutePath().normalize();
        assertThat(html).exists();
        assertThat(run.out().strip()).endsWith(html.toString());
    }

    @Test
    void theHtmlRankingCarriesTheNumbersOfTheCsvJsonAndMarkdownOfTheSameRun() throws IOException {
        List<Map<String, String>> page = htmlTable(Files.readString(out.resolve("report.html")), "table-ranking");
        List<String> csv = Files.readAllLines(out.resolve("ranking-wilson.csv"));
        List<String> header = Csv.parseLine(csv.get(0));
        List<Map<String, String>> md = markdownTable(Files.readString(out.resolve("ranking-wilson.md")));
        List<JsonNode> json = entries("wilson");
        assertThat(csv).hasSize(11);
        assertThat(page.size()).isGreaterThan(10);
        for (int i = 0; i < 10; i++) {
            Map<String, String> h = page.get(i);
            List<String> c = Csv.parseLine(csv.get(i + 1));
            for (int col = 0; col < header.size(); col++) {
                if (!header.get(col).equals("reasons")) {
                    assertThat(h.get(header.get(col))).as("row %d, %s", i + 1, header.get(col)).isEqualTo(c.get(col));
                    assertThat(md.get(i).get(header.get(col))).as("markdown row %d, %s", i + 1, header.get(col)).isEqualTo(c.get(col));
                }
            }
            JsonNode j = json.get(i);
            assertThat(h.get("reviewer")).isEqualTo(j.get("reviewer").asText());
            assertThat(h.get("rank")).isEqualTo(j.get("rank").asText());
            assertThat(h.get("helpful")).isEqualTo(j.get("helpful_votes").asText());
            assertThat(h.get("total")).isEqualTo(j.get("total_votes").asText());
            assertThat(Double.parseDouble(h.get("score"))).isCloseTo(j.get("score").asDouble(), within(5e-5));
            assertThat(Double.parseDouble(h.get("share"))).isCloseTo(j.get("share").asDouble(), within(5e-5));
        }
    }

    /** The rows of one table of the report, by header, with character references undone. */
    static List<Map<String, String>> htmlTable(String html, String id) {
        int from = html.indexOf("<div class=\"data-table\" id=\"" + id + "\"");
        assertThat(from).as("table " + id).isNotNegative();
        String t = html.substring(from, html.indexOf("</table>", from));
        List<String> headers = cells(t.substring(t.indexOf("<thead>"), t.indexOf("</thead>")), "th");
        List<Map<String, String>> rows = new ArrayList<>();
        Matcher m = Pattern.compile("<tr(?: hidden)?>(.*?)</tr>").matcher(t.substring(t.indexOf("<tbody>")));
        while (m.find()) {
            List<String> c = cells(m.group(1), "td");
            Map<String, String> row = new LinkedHashMap<>();
            for (int i = 0; i < headers.size(); i++) {
                row.put(headers.get(i), c.get(i));
            }
            rows.add(row);
        }
        return rows;
    }

    private static List<String> cells(String html, String tag) {
        List<String> out = new ArrayList<>();
        Matcher m = Pattern.compile("<" + tag + "[^>]*>(.*?)</" + tag + ">").matcher(html);
        while (m.find()) {
            out.add(m.group(1).replaceAll("<[^>]+>", "").replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"")
                    .replace("&#39;", "'").replace("&amp;", "&"));
        }
        return out;
    }

    /** The first table of a Markdown file, by header. */
    private static List<Map<String, String>> markdownTable(String md) {
        List<String> lines = md.lines().filter(l -> l.startsWith("|")).toList();
        List<String> headers = mdCells(lines.get(0));
        List<Map<String, String>> rows = new ArrayList<>();
        for (String l : lines.subList(2, lines.size())) {
            List<String> c = mdCells(l);
            Map<String, String> row = new LinkedHashMap<>();
            for (int i = 0; i < headers.size(); i++) {
                row.put(headers.get(i), c.get(i));
            }
            rows.add(row);
        }
        return rows;
    }

    private static List<String> mdCells(String line) {
        String[] parts = line.substring(1, line.length() - 1).split("(?<!\\\\)\\|", -1);
        return java.util.Arrays.stream(parts).map(String::strip).toList();
    }
}
