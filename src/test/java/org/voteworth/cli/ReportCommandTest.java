package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.report.HtmlReport;
import org.voteworth.tally.Csv;

/** voteworth report on a dump whose ids and categories are hostile: nothing from the data runs, pseudonyms hold. */
class ReportCommandTest {
    @TempDir
    static Path dir;
    static Path dump;

    @BeforeAll
    static void write() throws IOException {
        dump = HostileDump.write(dir.resolve("dump"));
    }

    @Test
    void helpNamesTheOptions() {
        CliTest.Run r = CliTest.run("report", "--help");
        assertThat(r.code()).isZero();
        assertThat(r.out()).contains("--rule", "--top", "--list", "--out", "--pseudonymize", "--draws", "--seed", "--bars", "--rows");
    }

    @Test
    void printsThePathOfOneSelfContainedPageWithEveryValueEscaped() throws IOException {
        Path out = dir.resolve("plain/report.html");
        CliTest.Run r = CliTest.run("report", dump.toString(), "--out", out.toString(), "--top", "3", "--draws", "200", "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out().strip()).isEqualTo(out.toAbsolutePath().normalize().toString());
        String html = Files.readString(out);
        assertThat(html).contains("<meta http-equiv=\"Content-Security-Policy\" content=\"" + HtmlReport.POLICY + "\">");
        // The page's own single script, and no script, image or handler from the data.
        assertThat(html.split("<script>", -1)).hasSize(2);
        assertThat(html).doesNotContain("<img", "onerror=\"window", "src=\"http", "href=\"http", "url(http", "@import");
        assertThat(html).contains("&lt;script&gt;window.__injected=1&lt;/script&gt;")
                .contains("&lt;script&gt;window.__injected=3&lt;/script&gt;")
                .contains("&quot;&gt;&lt;img src=x onerror=&quot;window.__injected=2&quot;&gt;");
        for (String section : List.of("overview", "funnel", "ranking", "sweep", "compare", "reviewers", "cautions", "parameters")) {
            assertThat(html).contains("<section id=\"" + section + "\">");
        }
        assertThat(html).contains("read = accepted + rejected: 24 = 24 + 0, holds.");
    }

    @Test
    void theCsvOfTheSameDumpNeutralisesFormulas() throws IOException {
        CliTest.Run r = CliTest.run("rank", dump.toString(), "--format", "csv", "--quiet", "--rejects", dir.resolve("r.tsv").toString());
        assertThat(r.code()).as(r.err()).isZero();
        assertThat(r.out()).contains("\"'=HYPERLINK(").contains("'+plain-41").contains("'@reviewer-7");
        assertThat(r.out().lines().skip(1).map(Csv::parseLine).map(c -> c.get(1)).toList()).containsAll(HostileDump.IDS);
    }

    @Test
    void pseudonymsReplaceEveryIdConsistentlyWithTheOtherOutputsOfTheKey() throws IOException {
        Path key = dir.resolve("key.txt");
        Files.writeString(key, "a key for the test only\n");
        Path out = dir.resolve("masked/report.html");
        Path list = dir.resolve("list.txt");
        Files.write(list, List.of("reviewer-8", "not-in-the-data"));
        CliTest.Run r = CliTest.run("report", dump.toString(), "--out", out.toString(), "--top", "3", "--draws", "200", "--quiet",
                "--list", list.toString(), "--pseudonymize", "--key-file", key.toString());
        assertThat(r.code()).as(r.err()).isZero();
        String html = Files.readString(out);
        assertThat(html).contains("<section id=\"audit\">").doesNotContain("not-in-the-data", "reviewer-8", "plain-41",
                "__injected=1", "__injected=2", "HYPERLINK");
        CliTest.Run csv = CliTest.run("rank", dump.toString(), "--format", "csv", "--quiet", "--pseudonymize", "--key-file",
                key.toString(), "--rejects", dir.resolve("r2.tsv").toString());
        List<String> pseudonyms = csv.out().lines().skip(1).map(Csv::parseLine).map(c -> c.get(1)).toList();
        assertThat(pseudonyms).hasSize(HostileDump.IDS.size()).allSatisfy(p -> assertThat(p).matches("p-[0-9a-f]{16}"));
        pseudonyms.forEach(p -> assertThat(html).contains(p));
    }
}
