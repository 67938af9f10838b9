package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import java.util.stream.StreamSupport;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.tally.Csv;

/**
 * The reviewer profiles section of {@code voteworth report} on a store: its numbers are those of
 * {@code profile --format json} for the same ids on the same store, every value from the data is
 * escaped, pseudonyms are those of the other outputs, and on a dump the section says it needs a store.
 */
class ReportProfilesTest {
    @TempDir
    static Path dir;
    static Path store;
    static Path hostileStore;

    private static final Pattern ARTICLE = Pattern.compile("<article class=\"panel\" id=\"(profile-\\d+)\">\\n<h3>(.*?)</h3>(.*?)</article>",
            Pattern.DOTALL);
    private static final Pattern ROW = Pattern.compile("<tr(?: hidden)?>(.*?)</tr>", Pattern.DOTALL);
    private static final Pattern CELL = Pattern.compile("<td[^>]*>(.*?)</td>", Pattern.DOTALL);

    @BeforeAll
    static void build() throws IOException {
        hostileStore = dir.resolve("hostile-store");
        CliTest.Run r = CliTest.run("tally", HostileDump.write(dir.resolve("hostile")).toString(), "--store", hostileStore.toString(),
                "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
        Path dump = dir.resolve("dump");
        new DemoDumpGenerator().generate(dump, DemoOptions.rows(3_000).withSeed(11).withCategories(4));
        store = dir.resolve("store");
        r = CliTest.run("tally", dump.toString(), "--store", store.toString(), "--quiet");
        assertThat(r.code()).as(r.err()).isZero();
    }

    private static String run(String... args) {
        CliTest.Run r = CliTest.run(args);
        assertThat(r.code()).as(String.join(" ", args) + ": " + r.err()).isZero();
        return r.out();
    }

    /** A profile article of the page: its anchor, shown id and body. */
    private record Article(String anchor, String id, String body) {
        /** The rows of the article's table {@code name}, cells unescaped. */
        List<List<String>> table(String name) {
            int start = body.indexOf("<div class=\"data-table\" id=\"" + anchor + "-" + name + "\"");
            assertThat(start).as(anchor + "-" + name).isNotNegative();
            String t = body.substring(start, body.indexOf("</table>", start));
            List<List<String>> rows = new ArrayList<>();
            Matcher r = ROW.matcher(t.substring(t.indexOf("<tbody>")));
            while (r.find()) {
                List<String> cells = new ArrayList<>();
                Matcher c = CELL.matcher(r.group(1));
                while (c.find()) {
                    cells.add(unescape(c.group(1)));
                }
                rows.add(cells);
            }
            return rows;
        }
    }

    private static List<Article> articles(String html) {
        List<Article> all = new ArrayList<>();
        Matcher m = ARTICLE.matcher(html.substring(html.indexOf("<section id=\"profiles\">")));
        while (m.find()) {
            all.add(new Article(m.group(1), unescape(m.group(2)), m.group(3)));
        }
        return all;
    }

    private static String unescape(String s) {
        return s.replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&#39;", "'").replace("&amp;", "&");
    }

    private static List<JsonNode> list(JsonNode array) {
        return StreamSupport.stream(array.spliterator(), false).toList();
    }

    @Test
    void theSectionShowsTheNumbersOfProfileJsonForTheTopReviewersAndTheIdsAskedFor() throws IOException {
        Path out = dir.resolve("store-report.html");
        run("report", store.toString(), "--out", out.toString(), "--top", "3", "--draws", "200", "--quiet",
                "--profile", "planted-expert", "--profile", "no-such-reviewer");
        String html = Files.readString(out);
        // The top 3 of the same rule from 'rank' on the same store, then the ids asked for.
        Set<String> expectedIds = new LinkedHashSet<>(run("rank", store.toString(), "--format", "csv", "--quiet").lines().skip(1)
                .limit(3).map(Csv::parseLine).map(c -> c.get(1)).toList());
        expectedIds.add("planted-expert");
        expectedIds.add("no-such-reviewer");
        List<Article> articles = articles(html);
        assertThat(articles.stream().map(Article::id).toList()).containsExactlyElementsOf(expectedIds);

        List<String> args = new ArrayList<>(List.of("profile"));
        args.addAll(expectedIds);
        args.addAll(List.of("--store", store.toString(), "--format", "json"));
        List<JsonNode> profiles = list(new ObjectMapper().readTree(run(args.toArray(String[]::new))).get("profiles"));
        assertThat(profiles).hasSize(articles.size());
        for (int i = 0; i < articles.size(); i++) {
            Article a = articles.get(i);
            JsonNode p = profiles.get(i);
            assertThat(p.get("reviewer").asText()).isEqualTo(a.id());
            if (!p.get("found").asBoolean()) {
                assertThat(a.body()).contains("Not in the store");
                continue;
            }
            assertThat(a.body()).contains(String.format(java.util.Locale.ROOT, "%d reviews, %d of %d votes helpful",
                    p.get("reviews").asLong(), p.get("helpful_votes").asLong(), p.get("total_votes").asLong()))
                    .contains("first " + p.get("first_date").asText() + ", last " + p.get("last_date").asText())
                    .contains("verified " + p.get("verified").asLong() + " of " + p.get("verified_known").asLong())
                    .contains("incentivised " + p.get("incentivised").asLong() + " of " + p.get("incentivised_known").asLong());
            assertThat(a.body()).contains("<svg id='" + a.anchor() + "-categories-chart'", "<svg id='" + a.anchor() + "-stars-chart'",
                    "<svg id='" + a.anchor() + "-months-chart'");
            assertThat(a.table("categories").stream().map(r -> r.get(0) + " " + r.get(1)).toList())
                    .containsExactlyElementsOf(list(p.get("categories")).stream()
                            .map(c -> c.get("category").asText() + " " + c.get("reviews").asLong()).toList());
            List<List<String>> stars = a.table("stars");
            for (int s = 1; s <= 5; s++) {
                assertThat(stars.get(s - 1).get(1)).isEqualTo(p.get("stars").get(Integer.toString(s)).asText());
            }
            List<String> months = new ArrayList<>();
            p.get("per_month").fields().forEachRemaining(e -> months.add(e.getKey() + " " + e.getValue().asLong()));
            assertThat(a.table("months").stream().map(r -> r.get(0) + " " + r.get(1)).toList()).containsExactlyElementsOf(months);
            List<String> days = list(p.get("busiest_days")).stream().map(d -> d.get("day").asText() + " " + d.get("reviews").asLong())
                    .toList();
            if (days.isEmpty()) {
                assertThat(a.body()).contains("No day with more than one review.");
            } else {
                assertThat(a.table("days").stream().map(r -> r.get(0) + " " + r.get(1)).toList()).containsExactlyElementsOf(days);
            }
            // The most voted reviews: the same review ids with the same votes as the JSON's full list.
            List<String> shown = a.table("reviews").stream().map(r -> r.get(3) + " " + r.get(6) + "/" + r.get(7)).toList();
            List<String> reviews = list(p.get("review_list")).stream().map(r -> r.get("review").asText() + " "
                    + r.get("helpful_votes").asLong() + "/" + r.get("total_votes").asLong()).toList();
            assertThat(reviews).containsAll(shown);
            assertThat(shown).hasSize(Math.min(10, reviews.size()));
            assertThat(a.table("reviews").stream().map(r -> Long.parseLong(r.get(7))).sorted(Comparator.reverseOrder()).toList())
                    .isEqualTo(list(p.get("review_list")).stream().map(r -> r.get("total_votes").asLong())
                            .sorted(Comparator.reverseOrder()).limit(shown.size()).toList());
        }
        // Each top reviewer's panel links to their profile.
        assertThat(html).contains("<a href=\"#profile-1\">Profile across all categories</a>")
                .contains("<li><a href=\"#profiles\">Reviewer profiles</a></li>");
    }

    @Test
    void hostileIdsAndCategoriesShowAsTextAndPseudonymsMatchTheProfileCommand() throws IOException {
        Path out = dir.resolve("hostile-report.html");
        run("report", hostileStore.toString(), "--out", out.toString(), "--top", "2", "--draws", "200", "--quiet",
                "--profile", HostileDump.SCRIPT_ID, "--profile", HostileDump.IMG_ID);
        String html = Files.readString(out);
        String profiles = html.substring(html.indexOf("<section id=\"profiles\">"), html.indexOf("<section id=\"cautions\">"));
        assertThat(html.split("<script>", -1)).hasSize(2);
        assertThat(profiles).doesNotContain("<script>", "<img")
                .contains("<h3>&lt;script&gt;window.__injected=1&lt;/script&gt;</h3>")
                .contains("<h3>&quot;&gt;&lt;img src=x onerror=&quot;window.__injected=2&quot;&gt;</h3>")
                .contains("&lt;script&gt;window.__injected=3&lt;/script&gt;")
                .contains("Garden &amp; Outdoors");

        Path key = dir.resolve("key.txt");
        Files.writeString(key, "a key for the test only\n");
        Path masked = dir.resolve("hostile-masked.html");
        run("report", hostileStore.toString(), "--out", masked.toString(), "--top", "2", "--draws", "200", "--quiet",
                "--profile", "reviewer-8", "--pseudonymize", "--key-file", key.toString());
        String page = Files.readString(masked);
        assertThat(page).doesNotContain("reviewer-8", "plain-41", "__injected=1", "__injected=2", "HYPERLINK");
        List<Article> articles = articles(page);
        JsonNode p = new ObjectMapper().readTree(run("profile", "reviewer-8", "--store", hostileStore.toString(), "--format", "json",
                "--pseudonymize", "--key-file", key.toString())).get("profiles").get(0);
        assertThat(p.get("reviewer").asText()).matches("p-[0-9a-f]{16}");
        assertThat(articles.stream().map(Article::id).toList()).contains(p.get("reviewer").asText());
        // The top reviewers' profiles carry the pseudonyms of their panels.
        assertThat(page).contains("<h3>#1 " + articles.get(0).id() + "</h3>");
        for (Article a : articles.subList(0, 2)) {
            assertThat(a.table("reviews")).allSatisfy(r -> assertThat(r.get(0)).isEqualTo(a.id()));
        }
    }

    @Test
    void onADumpTheSectionSaysProfilesNeedAStoreAndProfileIdsAreRefused() throws IOException {
        Path dump = HostileDump.write(dir.resolve("plain-dump"));
        Path out = dir.resolve("dump-report.html");
        run("report", dump.toString(), "--out", out.toString(), "--top", "2", "--draws", "200", "--quiet");
        assertThat(Files.readString(out)).contains("<section id=\"profiles\">")
                .contains("Reviewer profiles need a store").doesNotContain("Profile across all categories");
        CliTest.Run r = CliTest.run("report", dump.toString(), "--out", out.toString(), "--quiet", "--profile", "reviewer-8");
        assertThat(r.code()).isNotZero();
        assertThat(r.err()).contains("--profile needs a store");
    }

    @Test
    void aStoreOfTheReviewerTableOnlyGetsTheSameNoteAndRefusesProfileIds() throws IOException {
        // A store without its per-review parts, as a reviewer-table-only writer leaves it.
        Path tableOnly = dir.resolve("table-only");
        try (Stream<Path> files = Files.walk(hostileStore)) {
            for (Path f : files.toList()) {
                if (!f.startsWith(hostileStore.resolve("reviews"))) {
                    Files.copy(f, tableOnly.resolve(hostileStore.relativize(f).toString()));
                }
            }
        }
        Path manifest = tableOnly.resolve("manifest.json");
        Files.writeString(manifest, Files.readString(manifest).replaceAll("\"reviewParts\" : \\d+", "\"reviewParts\" : 0")
                .replaceAll(" mod \\d+\"", " mod 0\""));
        Path out = dir.resolve("table-only-report.html");
        run("report", tableOnly.toString(), "--out", out.toString(), "--top", "2", "--draws", "200", "--quiet");
        assertThat(Files.readString(out)).contains("Reviewer profiles need a store of every review")
                .doesNotContain("Profile across all categories");
        CliTest.Run r = CliTest.run("report", tableOnly.toString(), "--out", out.toString(), "--quiet", "--profile", "reviewer-8");
        assertThat(r.code()).isNotZero();
        assertThat(r.err()).contains("--profile needs each review").contains("table-only");
    }
}
