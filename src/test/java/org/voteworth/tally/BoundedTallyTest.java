package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.DumpFile;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.ParallelDumpReader;
import org.voteworth.source.ProgressListener;
import org.voteworth.source.RejectCounter;
import org.voteworth.source.SourceOptions;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/**
 * Spilling must not change the result: the reference is the plain in-memory {@link TallyTable}
 * (whose merge is property-tested in TallyTableTest) written by {@link ReviewerTableFile}.
 */
class BoundedTallyTest {
    @TempDir
    Path dir;

    @Test
    void aTinyBudgetSpillsAndGivesTheSameReviewerTableForEveryThreadCount() throws IOException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(40_000).withGzip(false).withCategories(3));
        List<DumpFile> files = DumpFinder.find(List.of(dir.resolve("dump").toString()), CategoryFromName.defaults());
        SourceOptions o = SourceOptions.defaults();
        TallyTable reference = new TallyTable();
        new org.voteworth.source.DumpReader(o).read(files, reference, new RejectCounter());
        Path expected = dir.resolve("expected.csv");
        ReviewerTableFile.write(reference, expected);

        boolean[] liveMergedSeen = new boolean[2];
        for (int threads : new int[] {1, 2, 3, 7}) {
            for (long budget : new long[] {Long.MAX_VALUE, 200_000, 1_500_000}) {
                Path tmp = Files.createDirectories(dir.resolve("tmp-" + threads + "-" + budget));
                Path got = dir.resolve("got-" + threads + "-" + budget + ".csv");
                BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, budget, tmp);
                try (tally) {
                    new ParallelDumpReader(o, threads).withTempDir(tmp).read(files, w -> tally.newSink(), new RejectCounter(),
                            ProgressListener.NONE);
                    tally.write(got);
                    assertThat(tally.spilled()).as("budget %d", budget).isEqualTo(budget != Long.MAX_VALUE);
                    assertThat(tally.reviewers()).isEqualTo(reference.size());
                    if (tally.spilled()) {
                        liveMergedSeen[tally.mergedLiveTables() ? 1 : 0] = true;
                    }
                }
                assertThat(Files.mismatch(expected, got)).as("threads %d budget %d", threads, budget).isEqualTo(-1L);
                try (var s = Files.list(tmp)) {
                    assertThat(s).as("temp files left in %s", tmp).isEmpty();
                }
            }
        }
        assertThat(liveMergedSeen).as("spilled runs whose last tables went to disk, and ones merged in memory").containsOnly(true);
    }

    @Test
    void reviewsPerReviewerCountedWhileWritingEqualThoseOfTheWrittenTableWithOrWithoutSpilling() throws IOException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(5_000).withGzip(false).withCategories(3));
        List<DumpFile> files = DumpFinder.find(List.of(dir.resolve("dump").toString()), CategoryFromName.defaults());
        TallyTable reference = new TallyTable();
        new org.voteworth.source.DumpReader(SourceOptions.defaults()).read(files, reference, new RejectCounter());
        for (long budget : new long[] {Long.MAX_VALUE, 50_000}) {
            OverviewCounts fromRecords = new OverviewCounts();
            Path got = dir.resolve("got.csv");
            try (BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, budget, dir)) {
                new ParallelDumpReader(SourceOptions.defaults(), 2).read(files, w -> tally.newSink(), new RejectCounter(),
                        ProgressListener.NONE);
                tally.write(got, fromRecords);
                assertThat(tally.spilled()).isEqualTo(budget != Long.MAX_VALUE);
            }
            // The written table, read back as values in file order, is the reference in id order.
            List<ReviewerTally> seen = new java.util.ArrayList<>();
            ReviewerTableFile.forEach(got, seen::add);
            assertThat(seen).as("budget %d", budget).isEqualTo(reference.toSortedList());
            // Reviews per reviewer counted from the writer's records equal those counted from the values.
            OverviewCounts fromValues = new OverviewCounts();
            seen.forEach(fromValues::addReviewer);
            assertThat(fromRecords).as("budget %d", budget).isEqualTo(fromValues);
            assertThat(fromRecords.overall().reviewsPerReviewer().count()).isEqualTo(reference.size());
        }
    }

    @Test
    void nonNumericIdsSurviveASpill() throws IOException {
        Random rnd = new Random(3);
        TallyTable reference = new TallyTable();
        BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, 1, dir);
        org.voteworth.source.ReviewSink sink = tally.newSink();
        org.voteworth.source.ReviewRow row = new org.voteworth.source.ReviewRow();
        row.file = new DumpFile(dir.resolve("x.tsv"), "toys", DumpFile.Compression.NONE, 0);
        for (int i = 0; i < 50_000; i++) {
            String id = switch (i % 3) {
                case 0 -> Integer.toString(rnd.nextInt(3000));
                case 1 -> "0" + rnd.nextInt(3000);
                default -> "rev-é" + rnd.nextInt(3000);
            };
            long total = rnd.nextInt(20);
            long helpful = total == 0 ? 0 : rnd.nextInt((int) total + 1);
            String cat = i % 5 == 0 ? "games" : "toys";
            reference.add(id, helpful, total, 1 + i % 5, i % 2 == 0, i % 7 == 0, cat, 18000 + i % 400);
            sink.accept(TestRows.fill(row, id, cat, helpful, total, 1 + i % 5, i % 2 == 0, i % 7 == 0, 18000 + i % 400));
        }
        Path got = dir.resolve("got.csv");
        Path expected = dir.resolve("expected.csv");
        try (tally) {
            assertThat(tally.spilled()).isTrue();
            // One file per spill, each holding a section per partition.
            try (java.util.stream.Stream<Path> files = Files.list(tally.spillDir().orElseThrow())) {
                assertThat(files.filter(f -> f.getFileName().toString().startsWith("spill-")).count())
                        .isEqualTo(tally.spills());
            }
            tally.write(got);
            // Every spill file is deleted once all its sections are merged.
            try (java.util.stream.Stream<Path> files = Files.list(tally.spillDir().orElseThrow())) {
                assertThat(files.filter(f -> f.getFileName().toString().startsWith("spill-"))).isEmpty();
            }
        }
        ReviewerTableFile.write(reference, expected);
        assertThat(Files.mismatch(expected, got)).isEqualTo(-1L);
        assertThat(tally.spillDir()).hasValueSatisfying(d -> assertThat(d).doesNotExist());
    }

    @Test
    void partitionsTooLargeToMergeAtOnceAreMergedInPiecesWithTheSameResult() throws IOException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(30_000).withGzip(false).withCategories(3));
        List<DumpFile> files = DumpFinder.find(List.of(dir.resolve("dump").toString()), CategoryFromName.defaults());
        TallyTable reference = new TallyTable();
        new org.voteworth.source.DumpReader(SourceOptions.defaults()).read(files, reference, new RejectCounter());
        Path expected = dir.resolve("expected.csv");
        ReviewerTableFile.write(reference, expected);
        for (int threads : new int[] {1, 2}) {
            for (long budget : new long[] {4_000, Long.MAX_VALUE}) {
                Path got = dir.resolve("got-" + threads + ".csv");
                try (BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, budget, dir, 1, 0)) {
                    new ParallelDumpReader(SourceOptions.defaults(), threads).read(files, w -> tally.newSink(), new RejectCounter(),
                            ProgressListener.NONE);
                    tally.write(got);
                    // Without a budget nothing is spilled, and the partitions (of tables kept in memory) are merged whole.
                    assertThat(tally.spilled()).isEqualTo(budget != Long.MAX_VALUE);
                    assertThat(tally.partitionsMergedInPieces() > 0).as("threads %d", threads).isEqualTo(budget != Long.MAX_VALUE);
                }
                assertThat(Files.mismatch(expected, got)).as("threads %d budget %d", threads, budget).isEqualTo(-1L);
            }
        }
    }

    /**
     * Partition boundaries come from the ids seen before the first spill. Input sorted by id (or
     * ids that agree on their first eight bytes) puts most later reviewers into one partition;
     * the table must come out the same, that partition being merged in pieces.
     */
    @Test
    void inputSortedByIdAndIdsWithALongCommonPrefixGiveTheSameTable() throws IOException {
        for (String prefix : new String[] {"", "reviewer-0000"}) {
            TallyTable reference = new TallyTable();
            BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, 120_000, dir, 20_000, 0);
            org.voteworth.source.ReviewSink sink = tally.newSink();
            org.voteworth.source.ReviewRow row = new org.voteworth.source.ReviewRow();
            row.file = new DumpFile(dir.resolve("x.tsv"), "toys", DumpFile.Compression.NONE, 0);
            for (int i = 0; i < 60_000; i++) {
                String id = prefix + (100_000 + i / 2);
                long total = i % 7;
                long helpful = total / 2;
                reference.add(id, helpful, total, 1 + i % 5, i % 2 == 0, i % 3 == 0, "toys", 18000 + i % 400);
                sink.accept(TestRows.fill(row, id, "toys", helpful, total, 1 + i % 5, i % 2 == 0, i % 3 == 0, 18000 + i % 400));
            }
            Path got = dir.resolve("got.csv");
            Path expected = dir.resolve("expected.csv");
            try (tally) {
                tally.write(got);
                assertThat(tally.spilled()).isTrue();
                assertThat(tally.partitionsMergedInPieces()).as("prefix '%s'", prefix).isPositive();
            }
            ReviewerTableFile.write(reference, expected);
            assertThat(Files.mismatch(expected, got)).as("prefix '%s'", prefix).isEqualTo(-1L);
        }
    }

    @Test
    void fastDecimalMatchesTheFormatter() throws IOException {
        Random rnd = new Random(5);
        double[] values = new double[200_000];
        StringBuilder expected = new StringBuilder(String.join(",", ReviewerTableFile.HEADER)).append('\n');
        java.io.ByteArrayOutputStream bytes = new java.io.ByteArrayOutputStream();
        try (ReviewerTableFile.Rows rows = new ReviewerTableFile.Rows(bytes, new Categories(), WrittenTally.NONE)) {
            for (int i = 0; i < values.length; i++) {
                long t = 1 + rnd.nextInt(5000);
                // Shares k/t, multiples of 1/128 (0, 1, and halfway cases such as 1/128 = 0.0078125), and any double.
                values[i] = i % 3 == 0 ? (double) rnd.nextInt((int) t + 1) / t
                        : i % 3 == 1 ? (double) rnd.nextInt(129) / 128 : rnd.nextDouble();
                rows.decimal(values[i]);
                // Reference: java.util.Formatter's %.6f (HALF_UP on the exact binary value).
                expected.append(String.format(java.util.Locale.ROOT, "%.6f", values[i]));
            }
        }
        assertThat(bytes.toString(java.nio.charset.StandardCharsets.UTF_8)).isEqualTo(expected.toString());
    }
}
