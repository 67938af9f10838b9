package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.logging.Level;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.voteworth.tally.Csv;

/**
 * The demo's HTML report in a real browser (headless Chromium from the Debian packages, driven
 * through the driver named explicitly): every chart is there and visible, sorting, filtering and
 * pages work, nothing is fetched, no script error is logged, and markup from a hostile dump does
 * not run. Fails, never skips, when the browser is missing: {@code .ci/run} installs it.
 */
class ReportBrowserTest {
    static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");

    @TempDir
    static Path dir;
    static Path demo;
    static Path hostile;
    static ChromeDriver browser;
    static ChromeDriverService service;

    @BeforeAll
    static void start() throws IOException {
        assertThat(CHROMIUM).as("Chromium is needed: apt-get install -y chromium chromium-driver (.ci/run does)").isExecutable();
        assertThat(CHROMEDRIVER).as("chromedriver is needed: apt-get install -y chromium-driver (.ci/run does)").isExecutable();
        demo = dir.resolve("demo");
        CliTest.Run d = CliTest.run("demo", "--out", demo.toString(), "--quiet", "--data",
                DemoCommandTest.projectDir().resolve("demo-data").toString());
        assertThat(d.code()).as(d.err()).isZero();
        hostile = dir.resolve("hostile.html");
        CliTest.Run h = CliTest.run("report", HostileDump.write(dir.resolve("dump")).toString(), "--out", hostile.toString(),
                "--top", "3", "--draws", "200", "--quiet");
        assertThat(h.code()).as(h.err()).isZero();

        service = new ChromeDriverService.Builder().usingDriverExecutable(CHROMEDRIVER.toFile()).usingAnyFreePort().build();
        ChromeOptions o = new ChromeOptions();
        o.setBinary(CHROMIUM.toFile());
        o.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--user-data-dir=" + Files.createDirectories(dir.resolve("profile")), "--window-size=1280,1600");
        LoggingPreferences logs = new LoggingPreferences();
        logs.enable(LogType.BROWSER, Level.ALL);
        o.setCapability("goog:loggingPrefs", logs);
        browser = new ChromeDriver(service, o);
        browser.manage().timeouts().pageLoadTimeout(Duration.ofSeconds(30));
    }

    @AfterAll
    static void stop() {
        if (browser != null) {
            browser.quit();
        }
        if (service != null) {
            service.stop();
        }
    }

    private static Object js(String script, Object... args) {
        return ((JavascriptExecutor) browser).executeScript(script, args);
    }

    private static void open(Path page) {
        browser.get(page.toUri().toString());
    }

    /** The text of one column in the rows the table shows now, in order. */
    @SuppressWarnings("unchecked")
    private static List<String> column(String table, int index) {
        return (List<String>) js("return Array.from(document.querySelectorAll('#' + arguments[0] + ' tbody tr'),"
                + " r => r.cells[arguments[1]].textContent);", table, index);
    }

    private static int columnIndex(String table, String header) {
        List<WebElement> heads = browser.findElements(By.cssSelector("#" + table + " thead th"));
        for (int i = 0; i < heads.size(); i++) {
            if (heads.get(i).getText().replaceAll("[\\u25B2\\u25BC]", "").strip().equals(header)) {
                return i;
            }
        }
        throw new AssertionError("no column " + header + " in " + table);
    }

    @Test
    void everyChartIsPresentAndVisibleAndNothingIsFetchedOrLogged() throws IOException, URISyntaxException {
        open(demo.resolve("report.html"));
        assertThat(browser.findElement(By.cssSelector("meta[http-equiv='Content-Security-Policy']")).getAttribute("content"))
                .isEqualTo("default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:");
        List<String> charts = new ArrayList<>(List.of("chart-categories", "chart-stars", "chart-votes-per-review", "chart-months", "chart-funnel",
                "chart-rank-intervals", "chart-sweep"));
        for (int rank = 1; rank <= 10; rank++) {
            charts.add("chart-profile-" + rank + "-categories");
            charts.add("chart-profile-" + rank + "-stars");
        }
        // One round trip for all charts: each must exist, be visible by CSS, have a size and real text.
        @SuppressWarnings("unchecked")
        List<Map<String, Object>> seen = (List<Map<String, Object>>) js("return arguments[0].map(id => {"
                + " const e = document.getElementById(id); if (!e) { return {id: id, found: false}; }"
                + " const r = e.getBoundingClientRect();"
                + " return {id: id, found: e.tagName === 'svg', visible: e.checkVisibility({checkOpacity: true, visibilityProperty: true}),"
                + " width: r.width, height: r.height, texts: e.querySelectorAll('text').length}; });", charts);
        for (Map<String, Object> c : seen) {
            String id = (String) c.get("id");
            assertThat(c.get("found")).as("chart " + id).isEqualTo(true);
            assertThat(c.get("visible")).as(id + " visible").isEqualTo(true);
            assertThat(((Number) c.get("width")).doubleValue()).as(id + " width").isGreaterThan(200);
            assertThat(((Number) c.get("height")).doubleValue()).as(id + " height").isGreaterThan(80);
            assertThat(((Number) c.get("texts")).longValue()).as(id + " has real text labels").isPositive();
        }
        WebElement funnel = browser.findElement(By.id("chart-funnel"));
        js("arguments[0].scrollIntoView()", funnel);
        assertThat(funnel.isDisplayed()).isTrue();
        assertThat(browser.findElements(By.cssSelector("svg[id^='chart-']"))).hasSize(charts.size());
        for (String section : List.of("overview", "funnel", "ranking", "sweep", "compare", "audit", "reviewers", "cautions",
                "parameters")) {
            assertThat(browser.findElement(By.id(section)).isDisplayed()).as(section).isTrue();
        }
        @SuppressWarnings("unchecked")
        List<String> requests = (List<String>) js("return performance.getEntriesByType('resource').map(e => e.name);");
        assertThat(requests).as("requests the page made").allSatisfy(r -> assertThat(r).startsWith("data:"));
        List<LogEntry> severe = browser.manage().logs().get(LogType.BROWSER).getAll().stream()
                .filter(e -> e.getLevel().intValue() >= Level.WARNING.intValue()).toList();
        assertThat(severe).as("browser log").isEmpty();

        js("window.scrollTo(0, 0)");
        browser.manage().window().setSize(new Dimension(1280, 3000));
        Path shot = browser.getScreenshotAs(OutputType.FILE).toPath();
        // Beside the test classes (target/), for docs/report-screenshot.png when the report changes.
        Path build = Path.of(ReportBrowserTest.class.getProtectionDomain().getCodeSource().getLocation().toURI()).getParent();
        Files.copy(shot, build.resolve("report-screenshot.png"), StandardCopyOption.REPLACE_EXISTING);
        assertThat(Files.size(build.resolve("report-screenshot.png"))).isGreaterThan(10_000);
    }

    private static String mostVotes() throws IOException {
        List<String> lines = Files.readAllLines(demo.resolve("reviewers.csv"));
        List<String> h = Csv.parseLine(lines.get(0));
        int id = h.indexOf("reviewer_id");
        int total = h.indexOf("total_votes");
        return lines.stream().skip(1).map(Csv::parseLine)
                .max(java.util.Comparator.comparingLong((List<String> c) -> Long.parseLong(c.get(total)))).orElseThrow().get(id);
    }

    @Test
    void rankingTableSortsFiltersAndPages() throws IOException {
        open(demo.resolve("report.html"));
        String t = "table-ranking";
        int total = columnIndex(t, "total");
        int reviewer = columnIndex(t, "reviewer");
        int rank = columnIndex(t, "rank");
        assertThat(column(t, rank)).hasSize(50).startsWith("1", "2", "3");
        String status = browser.findElement(By.cssSelector("#" + t + " .status")).getText();
        assertThat(status).startsWith("rows 1-50 of 5,147").contains("page 1 of 103");

        WebElement header = browser.findElements(By.cssSelector("#" + t + " thead th")).get(total);
        header.findElement(By.tagName("button")).click();
        assertThat(header.getAttribute("aria-sort")).isEqualTo("ascending");
        List<Long> up = column(t, total).stream().map(Long::parseLong).toList();
        assertThat(up).isSorted().first().isEqualTo(1L);
        header.findElement(By.tagName("button")).click();
        assertThat(header.getAttribute("aria-sort")).isEqualTo("descending");
        List<Long> down = column(t, total).stream().map(Long::parseLong).toList();
        assertThat(down).isSortedAccordingTo((a, b) -> Long.compare(b, a));
        // The reviewer with the most votes in the reviewer table the same run wrote.
        assertThat(column(t, reviewer).get(0)).isEqualTo(mostVotes());

        browser.findElement(By.cssSelector("#" + t + " button.next")).click();
        List<Long> second = column(t, total).stream().map(Long::parseLong).toList();
        assertThat(second).hasSize(50);
        assertThat(second.get(0)).isLessThanOrEqualTo(down.get(49));

        WebElement filter = browser.findElement(By.cssSelector("#" + t + " input.filter"));
        filter.sendKeys("planted-expert");
        assertThat(column(t, reviewer)).containsExactly("planted-expert");
        filter.clear();
        filter.sendKeys("Pet Supplies");
        int categories = columnIndex(t, "categories");
        assertThat(column(t, categories)).isNotEmpty().allSatisfy(c -> assertThat(c).contains("Pet Supplies"));
        assertThat(browser.findElement(By.cssSelector("#" + t + " .status")).getText()).contains("(filtered from 5,147)");
    }

    @Test
    void markupFromTheDataShowsAsTextAndNeverRuns() {
        open(hostile);
        assertThat(js("return typeof window." + HostileDump.MARKER + ";")).isEqualTo("undefined");
        assertThat(browser.findElements(By.cssSelector("body img"))).isEmpty();
        assertThat(browser.findElements(By.tagName("script"))).hasSize(1);
        String text = browser.findElement(By.id("ranking")).getText();
        assertThat(text).contains(HostileDump.SCRIPT_ID).contains(HostileDump.IMG_ID).contains(HostileDump.SCRIPT_CATEGORY);
        WebElement filter = browser.findElement(By.cssSelector("#table-ranking input.filter"));
        filter.sendKeys("<script>");
        assertThat(browser.findElements(By.cssSelector("#table-ranking tbody tr"))).hasSize(HostileDump.IDS.size());
        assertThat(js("return typeof window." + HostileDump.MARKER + ";")).isEqualTo("undefined");
        List<LogEntry> severe = browser.manage().logs().get(LogType.BROWSER).getAll().stream()
                .filter(e -> e.getLevel().intValue() >= Level.SEVERE.intValue()).toList();
        assertThat(severe).as("browser log").isEmpty();
    }
}
