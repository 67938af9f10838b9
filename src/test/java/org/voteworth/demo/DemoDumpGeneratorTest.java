package org.voteworth.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.zip.GZIPInputStream;
import org.apache.commons.math3.stat.interval.WilsonScoreInterval;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DemoDumpGeneratorTest {
    @TempDir
    static Path shared;
    @TempDir
    Path dir;

    static GeneratedDump dump;
    static PlainDump plain;
    /** reviewer id -> {reviews, helpful, total, largest review total} over valid lines. */
    static Map<String, long[]> byReviewer;

    @BeforeAll
    static void generateOnce() throws IOException {
        dump = new DemoDumpGenerator().generate(shared.resolve("dump"), DemoOptions.rows(40_000));
        plain = PlainDump.read(dump.files());
        byReviewer = new HashMap<>();
        for (PlainDump.Line l : plain.valid()) {
            long[] r = byReviewer.computeIfAbsent(l.reviewer(), k -> new long[4]);
            r[0]++;
            r[1] += l.helpful();
            r[2] += l.total();
            r[3] = Math.max(r[3], l.total());
        }
    }

    @Test
    void writesTheAgreedFilesAndHeader() {
        List<String> names = dump.files().stream().map(p -> p.getFileName().toString()).toList();
        assertThat(names).hasSize(12).allMatch(n -> n.matches("[a-z0-9-]+(\\.part-\\d{2})?\\.tsv\\.gz"));
        assertThat(names).startsWith("kitchen-dining.part-01.tsv.gz", "kitchen-dining.part-02.tsv.gz",
                "kitchen-dining.part-03.tsv.gz", "books.tsv.gz");
        String header = "reviewer_id\treview_id\titem_id\tcategory\tstar_rating\thelpful_votes\ttotal_votes"
                + "\tverified_purchase\tincentivised\theadline\tbody\treview_date";
        assertThat(plain.headers).hasSize(12).allMatch(header::equals);
        assertThat(plain.sawCarriageReturn).isFalse();
        assertThat(dump.rows()).isEqualTo(40_000);
    }

    @Test
    void fieldsHaveTheirFormats() {
        Set<String> reviewIds = new HashSet<>();
        LocalDate first = LocalDate.of(2019, 1, 1);
        LocalDate last = LocalDate.of(2025, 12, 31);
        for (PlainDump.Line l : plain.valid()) {
            String[] f = l.fields();
            assertThat(f[0]).matches("\\d{8}|planted-(small-\\d{2}|expert|veteran-[123]|viral)");
            assertThat(reviewIds.add(f[1])).as("review id %s unique", f[1]).isTrue();
            assertThat(f[2]).matches("IT\\d{7}");
            assertThat(f[4]).matches("[1-5]");
            assertThat(f[7]).matches("[YN]");
            assertThat(f[8]).matches("[YN]");
            assertThat(f[9]).isNotEmpty();
            LocalDate d = LocalDate.parse(f[11]);
            assertThat(d).isBetween(first, last);
        }
        // Review ids are unique over the whole dump, rejected lines included.
        for (PlainDump.Line l : plain.rejected()) {
            String[] f = l.text().split("\t", -1);
            if (f.length > 2 && f[1].startsWith("RV")) {
                assertThat(reviewIds.add(f[1])).isTrue();
            }
        }
    }

    @Test
    void sameSeedGivesIdenticalBytesAndAnotherSeedDoesNot() throws Exception {
        DemoOptions o = DemoOptions.rows(5_000).withSeed(7);
        GeneratedDump a = new DemoDumpGenerator().generate(dir.resolve("a"), o);
        GeneratedDump b = new DemoDumpGenerator().generate(dir.resolve("b"), o);
        GeneratedDump c = new DemoDumpGenerator().generate(dir.resolve("c"), o.withSeed(8));
        assertThat(digests(a.files())).isEqualTo(digests(b.files()));
        assertThat(digests(a.files())).isNotEqualTo(digests(c.files()));
        assertThat(a.plantedLines().stream().map(p -> p.file().getFileName() + ":" + p.line()).toList())
                .isEqualTo(b.plantedLines().stream().map(p -> p.file().getFileName() + ":" + p.line()).toList());
    }

    @Test
    void plainTsvHoldsTheSameBytesAsGzip() throws Exception {
        DemoOptions o = DemoOptions.rows(3_000);
        GeneratedDump gz = new DemoDumpGenerator().generate(dir.resolve("gz"), o);
        GeneratedDump tsv = new DemoDumpGenerator().generate(dir.resolve("tsv"), o.withGzip(false));
        assertThat(tsv.files()).allMatch(p -> p.toString().endsWith(".tsv"));
        assertThat(uncompressedDigests(tsv.files())).isEqualTo(uncompressedDigests(gz.files()));
        assertThat(tsv.bytes()).isEqualTo(tsv.uncompressedBytes());
        assertThat(gz.uncompressedBytes()).isEqualTo(tsv.uncompressedBytes());
    }

    @Test
    void starsAreJShaped() {
        // The J shape of online ratings: 5 the mode, a bump at 1 above 2 and 3
        // (Hu, Pavlou & Zhang 2009, Communications of the ACM 52(10):144-147).
        long[] stars = new long[6];
        plain.valid().forEach(l -> stars[l.stars()]++);
        long n = Arrays.stream(stars).sum();
        assertThat(stars[5]).isGreaterThan(Math.max(Math.max(stars[1], stars[2]), Math.max(stars[3], stars[4])));
        assertThat(stars[1]).isGreaterThan(stars[2]).isGreaterThan(0);
        assertThat(stars[1]).isGreaterThan(stars[3]);
        // The project's targets for the shares (5★ 58 %, 4★ 14 %, 3★ 8 %, 2★ 6 %, 1★ 14 %), within 2 points.
        double[] target = {0, 0.14, 0.06, 0.08, 0.14, 0.58};
        for (int s = 1; s <= 5; s++) {
            assertThat((double) stars[s] / n).as("share of %d stars", s).isCloseTo(target[s], within(0.02));
        }
    }

    @Test
    void votesAreMostlyZeroWithAHeavyTail() {
        // Median votes per review is 0 (common practice, REFERENCES.md §7).
        long[] totals = plain.valid().stream().mapToLong(PlainDump.Line::total).sorted().toArray();
        assertThat(totals[totals.length / 2]).isZero();
        double zero = Arrays.stream(totals).filter(t -> t == 0).count() / (double) totals.length;
        assertThat(zero).as("share of reviews without votes (project target 65-75 %)").isBetween(0.65, 0.75);
        assertThat(totals[totals.length - 1]).as("largest review").isGreaterThanOrEqualTo(1_000);
        assertThat(Arrays.stream(totals).filter(t -> t >= 100).count()).isGreaterThan(20);
    }

    @Test
    void mostReviewersWriteOneReviewAndAFewWriteHundreds() {
        // Median reviews per reviewer is 1 (common practice, REFERENCES.md §7).
        long[] counts = byReviewer.values().stream().mapToLong(r -> r[0]).sorted().toArray();
        assertThat(counts[counts.length / 2]).isEqualTo(1);
        assertThat(Arrays.stream(counts).filter(c -> c >= 100).count()).isGreaterThanOrEqualTo(5);
    }

    @Test
    void verifiedAndIncentivisedSharesMeetTheTargets() {
        // The project's targets: about 80 % verified purchases, well under 1 % incentivised.
        List<PlainDump.Line> v = plain.valid();
        double verified = v.stream().filter(l -> l.fields()[7].equals("Y")).count() / (double) v.size();
        double incentivised = v.stream().filter(l -> l.fields()[8].equals("Y")).count() / (double) v.size();
        assertThat(verified).isCloseTo(0.80, within(0.015));
        assertThat(incentivised).isGreaterThan(0).isLessThan(0.01);
    }

    @Test
    void textIsMostOfTheBytes() {
        // Dropping the free-text columns leaves roughly a tenth (a rule of thumb of the trade,
        // REFERENCES.md §7, not a published figure): accept 5 % to 20 %.
        long all = 0;
        long text = 0;
        for (PlainDump.Line l : plain.valid()) {
            all += l.text().getBytes(StandardCharsets.UTF_8).length + 1;
            text += l.fields()[9].getBytes(StandardCharsets.UTF_8).length + l.fields()[10].getBytes(StandardCharsets.UTF_8).length;
        }
        assertThat((double) (all - text) / all).isBetween(0.05, 0.20);
        List<Integer> words = plain.valid().stream().map(l -> l.fields()[10].split(" ").length).sorted().toList();
        assertThat(words.get(0)).isGreaterThanOrEqualTo(8);
        assertThat(words.get(words.size() / 2)).isBetween(30, 150);
        assertThat(words.get(words.size() - 1)).isGreaterThanOrEqualTo(200);
    }

    @Test
    void plantedReviewersCarryTheirIntendedVotes() {
        for (PlantedCases.PlantedReviewer p : PlantedCases.all()) {
            long[] r = byReviewer.get(p.id());
            assertThat(r).as(p.id()).isNotNull();
            assertThat(new long[] {r[0], r[1], r[2]}).as(p.id()).containsExactly(p.reviews(), p.helpful(), p.total());
        }
        assertThat(byReviewer.get(PlantedCases.VIRAL)[3]).isEqualTo(PlantedCases.VIRAL_TOP_TOTAL);
        long viralTopHelpful = plain.valid().stream()
                .filter(l -> l.reviewer().equals(PlantedCases.VIRAL) && l.total() == PlantedCases.VIRAL_TOP_TOTAL)
                .mapToLong(PlainDump.Line::helpful).sum();
        assertThat(viralTopHelpful).isEqualTo(PlantedCases.VIRAL_TOP_HELPFUL);
    }

    @Test
    void plantedCasesTellTheRankingStory() {
        // Wilson lower bounds from Commons Math (an outside reference), 95 %.
        WilsonScoreInterval wilson = new WilsonScoreInterval();
        List<Map.Entry<String, Double>> ranked = byReviewer.entrySet().stream()
                .filter(e -> e.getValue()[2] > 0)
                .map(e -> Map.entry(e.getKey(), wilson.createInterval((int) e.getValue()[2], (int) e.getValue()[1], 0.95).getLowerBound()))
                .sorted(Map.Entry.<String, Double>comparingByValue().reversed())
                .toList();
        List<String> top = ranked.stream().limit(100).map(Map.Entry::getKey).toList();
        assertThat(top.subList(0, 3)).contains(PlantedCases.EXPERT);
        assertThat(top).contains(PlantedCases.VETERAN_1, PlantedCases.VETERAN_2, PlantedCases.VETERAN_3)
                .noneMatch(id -> id.startsWith(PlantedCases.SMALL_PREFIX));
        // Under the raw share with no entry bar, the small planted reviewers are at 100 %.
        long atFull = PlantedCases.all().stream().filter(p -> p.id().startsWith(PlantedCases.SMALL_PREFIX))
                .filter(p -> p.helpful() == p.total()).count();
        assertThat(atFull).isEqualTo(37);
    }

    @Test
    void sharesAreOverDispersedSoAPriorCanBeFitted() {
        // Beta-binomial: the spread of raw shares exceeds what binomial noise alone gives
        // (the moment argument of Gelman et al., Bayesian Data Analysis, 3rd ed., §5.1).
        List<long[]> voted = byReviewer.entrySet().stream().filter(e -> !e.getKey().startsWith("planted"))
                .map(Map.Entry::getValue).filter(r -> r[2] >= 20).toList();
        double mean = voted.stream().mapToDouble(r -> (double) r[1] / r[2]).average().orElseThrow();
        double variance = voted.stream().mapToDouble(r -> Math.pow((double) r[1] / r[2] - mean, 2)).sum() / (voted.size() - 1);
        double binomial = voted.stream().mapToDouble(r -> mean * (1 - mean) / r[2]).average().orElseThrow();
        assertThat(voted.size()).isGreaterThan(100);
        assertThat(variance).isGreaterThan(2 * binomial);
    }

    @Test
    void malformedLinesReconcileExactly() {
        assertThat(dump.physicalLines()).isEqualTo(plain.lines.size());
        assertThat(dump.linesIncludingHeaders()).isEqualTo(plain.lines.size() + plain.headers.size());
        assertThat(dump.expectedRejectedLines()).isEqualTo(plain.rejected().size());
        assertThat(dump.expectedAcceptedRows()).isEqualTo(plain.valid().size());
        assertThat(dump.expectedAcceptedRows() + dump.expectedRejectedLines()).isEqualTo(dump.physicalLines());
        assertThat(dump.uncompressedBytes()).isEqualTo(plain.uncompressedBytes);

        Set<String> rejectedAt = plain.rejected().stream().map(l -> l.file() + ":" + l.number()).collect(Collectors.toSet());
        Set<String> plantedRejected = dump.plantedLines().stream().filter(p -> p.kind().rejected())
                .map(p -> p.file() + ":" + p.line()).collect(Collectors.toSet());
        assertThat(rejectedAt).isEqualTo(plantedRejected);

        Map<String, Long> expected = new LinkedHashMap<>();
        long rejected = 0;
        for (MalformedKind k : MalformedKind.values()) {
            expected.put(k.key(), (long) k.rowsPlanted() * k.linesPerRow());
            rejected += k.rejected() ? (long) k.rowsPlanted() * k.linesPerRow() : 0;
        }
        assertThat(dump.malformedByKind()).containsExactlyEntriesOf(expected);
        assertThat(dump.expectedRejectedLines()).isEqualTo(rejected).isEqualTo(29);
        // A row broken by a line break is one row and two lines.
        assertThat(dump.physicalLines()).isEqualTo(dump.rows() + MalformedKind.NEWLINE_IN_BODY.rowsPlanted());
    }

    @Test
    void eachMalformedLineIsBrokenTheWayItsKindSays() {
        Map<String, PlainDump.Line> at = new HashMap<>();
        plain.lines.forEach(l -> at.put(l.file() + ":" + l.number(), l));
        Map<MalformedKind, List<String>> texts = new LinkedHashMap<>();
        for (GeneratedDump.PlantedLine p : dump.plantedLines()) {
            PlainDump.Line l = at.get(p.file() + ":" + p.line());
            assertThat(l.valid()).as("%s at %s:%d", p.kind(), p.file(), p.line()).isEqualTo(!p.kind().rejected());
            texts.computeIfAbsent(p.kind(), k -> new ArrayList<>()).add(l.text());
        }
        assertThat(texts.get(MalformedKind.TOO_FEW_FIELDS)).extracting(DemoDumpGeneratorTest::fieldCount).containsExactlyInAnyOrder(10, 5, 11);
        assertThat(texts.get(MalformedKind.TOO_MANY_FIELDS)).extracting(DemoDumpGeneratorTest::fieldCount).containsExactlyInAnyOrder(13, 13, 14);
        assertThat(texts.get(MalformedKind.TAB_IN_BODY)).extracting(DemoDumpGeneratorTest::fieldCount).containsOnly(13);
        assertThat(texts.get(MalformedKind.NEWLINE_IN_BODY)).extracting(DemoDumpGeneratorTest::fieldCount).containsExactly(11, 2, 11, 2, 11, 2);
        assertThat(texts.get(MalformedKind.VOTES_NOT_A_NUMBER)).extracting(t -> field(t, 5) + "/" + field(t, 6))
                .allMatch(s -> s.contains("abc"));
        assertThat(texts.get(MalformedKind.VOTES_DECIMAL)).allMatch(t -> field(t, 5).equals("1.5") || field(t, 6).equals("1.5"));
        assertThat(texts.get(MalformedKind.VOTES_NEGATIVE)).allMatch(t -> field(t, 5).equals("-3") || field(t, 6).equals("-3"));
        assertThat(texts.get(MalformedKind.VOTES_EMPTY)).allMatch(t -> field(t, 5).isEmpty() || field(t, 6).isEmpty());
        assertThat(texts.get(MalformedKind.HELPFUL_ABOVE_TOTAL))
                .allMatch(t -> Long.parseLong(field(t, 5)) == Long.parseLong(field(t, 6)) + 2);
        assertThat(texts.get(MalformedKind.DATE_INVALID)).extracting(t -> field(t, 11))
                .containsExactlyInAnyOrder("2021-02-30", "2021-13-01", "yesterday");
        assertThat(texts.get(MalformedKind.STRAY_QUOTES)).hasSize(6)
                .allMatch(t -> field(t, 9).contains("\"") || field(t, 10).contains("\"") || field(t, 9).contains("''"));
        assertThat(texts.get(MalformedKind.STRAY_QUOTES)).anyMatch(t -> field(t, 9).startsWith("\""))
                .anyMatch(t -> field(t, 10).startsWith("\"")).anyMatch(t -> field(t, 9).equals("\""));
    }

    @Test
    void sizedByBytesLandsWithinTenPercent() throws IOException {
        long target = DemoOptions.parseSize("3MB");
        GeneratedDump d = new DemoDumpGenerator().generate(dir, DemoOptions.size(target).withSeed(11));
        assertThat((double) d.uncompressedBytes()).isCloseTo(target, within(0.10 * target));
        PlainDump p = PlainDump.read(d.files());
        assertThat(p.uncompressedBytes).isEqualTo(d.uncompressedBytes());
        assertThat(p.lines).hasSize((int) d.physicalLines());
        assertThat(p.rejected()).hasSize((int) d.expectedRejectedLines());
        Set<String> ids = p.valid().stream().map(PlainDump.Line::reviewer).collect(Collectors.toSet());
        assertThat(ids).contains(PlantedCases.EXPERT, PlantedCases.VIRAL, PlantedCases.small(40));
    }

    @Test
    void withoutPlantsOrDefectsEveryLineIsValid() throws IOException {
        DemoOptions o = DemoOptions.rows(2_000).withPlantCases(false).withMalformedRows(false).withCategories(1);
        long[] progress = {-1};
        GeneratedDump d = new DemoDumpGenerator(n -> progress[0] = n).generate(dir, o);
        assertThat(d.files()).extracting(p -> p.getFileName().toString())
                .containsExactly("kitchen-dining.part-01.tsv.gz", "kitchen-dining.part-02.tsv.gz", "kitchen-dining.part-03.tsv.gz");
        PlainDump p = PlainDump.read(d.files());
        assertThat(p.rejected()).isEmpty();
        assertThat(p.lines).hasSize(2_000);
        assertThat(p.valid()).allMatch(l -> l.reviewer().matches("\\d{8}") && l.fields()[3].equals("Kitchen & Dining"));
        assertThat(d.malformedByKind()).isEmpty();
        assertThat(d.plantedLines()).isEmpty();
        assertThat(d.expectedAcceptedRows()).isEqualTo(2_000);
        assertThat(progress[0]).isEqualTo(2_000);
    }

    @Test
    void refusesAFolderOfOtherFiles() throws IOException {
        Files.writeString(dir.resolve("notes.txt"), "mine");
        assertThatThrownBy(() -> new DemoDumpGenerator().generate(dir, DemoOptions.rows(3_000)))
                .isInstanceOf(IOException.class).hasMessageContaining("notes.txt").hasMessageContaining(dir.toString());
        assertThat(Files.readString(dir.resolve("notes.txt"))).isEqualTo("mine");
    }

    @Test
    void replacesAnEarlierDumpAndKeepsItsReadme() throws IOException {
        Files.writeString(dir.resolve("README.md"), "about");
        Files.writeString(dir.resolve("kitchen-dining.part-07.tsv.gz"), "stale");
        GeneratedDump d = new DemoDumpGenerator().generate(dir, DemoOptions.rows(3_000));
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString()).sorted().toList()).hasSize(13)
                    .contains("README.md").doesNotContain("kitchen-dining.part-07.tsv.gz");
        }
        assertThat(d.files()).hasSize(12);
        assertThat(Files.readString(dir.resolve("README.md"))).isEqualTo("about");
    }

    @Test
    void refusesADumpTooSmallForItsPlantedRows() {
        assertThatThrownBy(() -> new DemoDumpGenerator().generate(dir, DemoOptions.rows(500)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("500 rows")
                .hasMessageContaining("at least");
    }

    @Test
    void largeDumpsUseMorePartsAndItsOwnFileNamesAreRecognised() {
        // 4 GB: 24 % in the largest category is about 960 MB, four parts of at most 256 MiB.
        assertThat(DemoDumpGenerator.partsFor(4e9 * 0.24)).isEqualTo(4);
        assertThat(DemoDumpGenerator.partsFor(22e6 * 0.24)).isEqualTo(3);
        assertThat(DemoDumpGenerator.partsFor(1e15)).isEqualTo(99);
        assertThat(DemoDumpGenerator.isDumpFileName("kitchen-dining.part-04.tsv.gz")).isTrue();
        assertThat(DemoDumpGenerator.isDumpFileName("books.tsv")).isTrue();
        assertThat(DemoDumpGenerator.isDumpFileName("reviews.tsv.gz")).isFalse();
    }

    static int fieldCount(String text) {
        return text.split("\t", -1).length;
    }

    static String field(String text, int i) {
        return text.split("\t", -1)[i];
    }

    static List<String> digests(List<Path> files) throws IOException, NoSuchAlgorithmException {
        List<String> out = new ArrayList<>();
        for (Path f : files) {
            out.add(f.getFileName() + " " + HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(f))));
        }
        return out;
    }

    /** SHA-256 of each file's content after decompression, keyed by the name without .gz. */
    static List<String> uncompressedDigests(List<Path> files) throws IOException, NoSuchAlgorithmException {
        List<String> out = new ArrayList<>();
        for (Path f : files.stream().sorted(Comparator.comparing(Path::getFileName)).toList()) {
            String name = f.getFileName().toString();
            byte[] bytes;
            try (InputStream in = name.endsWith(".gz") ? new GZIPInputStream(Files.newInputStream(f)) : Files.newInputStream(f)) {
                bytes = in.readAllBytes();
            }
            out.add(name.replace(".gz", "") + " " + HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes)));
        }
        return out;
    }
}
