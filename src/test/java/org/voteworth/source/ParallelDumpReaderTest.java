package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import java.util.zip.GZIPOutputStream;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.GeneratedDump;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

/**
 * The parallel reader must give what the one-thread {@link DumpReader} gives (the reference:
 * one sequential scan, itself checked against independently counted generated dumps in
 * DumpReaderTest and DemoDumpGeneratorTest), tally for tally and reject for reject.
 */
class ParallelDumpReaderTest {
    @TempDir
    Path dir;

    /** What one read produced, in comparable form. */
    record Outcome(List<String> reports, List<String> rejects, List<ReviewerTally> tallies) {
    }

    private static final class Recorder implements RejectSink {
        final List<String> lines = Collections.synchronizedList(new ArrayList<>());

        @Override
        public void reject(DumpFile file, long line, Reject reject, byte[] row, int start, int end) {
            lines.add(file.path().getFileName() + ":" + line + ":" + reject.reason() + ":" + reject.field() + ":"
                    + new String(row, start, end - start, StandardCharsets.UTF_8));
        }
    }

    private static Outcome sequential(SourceOptions o, List<DumpFile> files) throws IOException {
        TallyTable t = new TallyTable();
        Recorder r = new Recorder();
        ScanSummary s = new DumpReader(o).read(files, t, r);
        return new Outcome(reports(s), r.lines, t.toSortedList());
    }

    private static Outcome parallel(ParallelDumpReader reader, List<DumpFile> files) throws IOException {
        List<TallyTable> tables = new ArrayList<>();
        Recorder r = new Recorder();
        ScanSummary s = reader.read(files, w -> {
            TallyTable t = new TallyTable();
            tables.add(t);
            return t;
        }, r, ProgressListener.NONE);
        TallyTable all = tables.get(0);
        for (int i = 1; i < tables.size(); i++) {
            all.mergeFrom(tables.get(i));
        }
        return new Outcome(reports(s), r.lines, all.toSortedList());
    }

    private static List<String> reports(ScanSummary s) {
        return s.files().stream().map(f -> f.file().path().getFileName() + " " + f.rowsRead() + " " + f.accepted() + " "
                + f.rejected() + " " + f.rejectsByReason() + " " + f.noHeader()).toList();
    }

    private List<DumpFile> generated(String folder) throws IOException {
        // A generated dump with planted malformed rows (stray line breaks, tabs, bad numbers) in every file.
        GeneratedDump g = new DemoDumpGenerator().generate(dir.resolve(folder),
                DemoOptions.rows(30_000).withGzip(false).withCategories(4));
        assertThat(g.expectedRejectedLines()).isPositive();
        return DumpFinder.find(List.of(dir.resolve(folder).toString()), CategoryFromName.defaults());
    }

    @Test
    void identicalToOneSequentialScanForEveryThreadCount() throws IOException {
        List<DumpFile> files = generated("plain");
        SourceOptions o = SourceOptions.defaults();
        Outcome expected = sequential(o, files);
        assertThat(expected.rejects()).isNotEmpty();
        for (int threads : new int[] {1, 2, 3, 7}) {
            // Cut every file into many ranges so that threads share files.
            ParallelDumpReader r = new ParallelDumpReader(o, threads).withTempDir(dir)
                    .withCuts(f -> new long[] {f.sizeBytes() / 7, f.sizeBytes() / 3, f.sizeBytes() / 2, 3 * f.sizeBytes() / 4});
            assertThat(parallel(r, files)).as("threads %d", threads).isEqualTo(expected);
            assertThat(parallel(new ParallelDumpReader(o, threads).withTempDir(dir), files)).isEqualTo(expected);
        }
    }

    @Test
    void compressedInputGivesTheSameTalliesAndRejects() throws IOException {
        List<DumpFile> plain = generated("plain");
        SourceOptions o = SourceOptions.defaults();
        Outcome expected = sequential(o, plain);
        for (String ext : new String[] {".gz", ".zst", ".bz2"}) {
            Path out = dir.resolve("c" + ext.substring(1));
            Files.createDirectories(out);
            for (DumpFile f : plain) {
                compress(f.path(), out.resolve(f.path().getFileName() + ext));
            }
            List<DumpFile> files = DumpFinder.find(List.of(out.toString()), CategoryFromName.defaults());
            assertThat(files).allMatch(f -> f.compression() != DumpFile.Compression.NONE);
            for (int threads : new int[] {1, 2, 3}) {
                Outcome got = parallel(new ParallelDumpReader(o, threads).withTempDir(dir), files);
                assertThat(got.tallies()).as(ext).isEqualTo(expected.tallies());
                assertThat(strip(got.rejects(), ext)).as(ext).isEqualTo(expected.rejects());
                assertThat(strip(got.reports(), ext)).as(ext).isEqualTo(expected.reports());
            }
            assertThat(sequential(o, files).tallies()).as(ext + " sequential").isEqualTo(expected.tallies());
        }
    }

    private static List<String> strip(List<String> lines, String ext) {
        return lines.stream().map(s -> s.replaceFirst(java.util.regex.Pattern.quote(ext), "")).toList();
    }

    static void compress(Path from, Path to) throws IOException {
        String n = to.getFileName().toString();
        try (OutputStream raw = Files.newOutputStream(to);
             OutputStream o = n.endsWith(".gz") ? new GZIPOutputStream(raw)
                     : n.endsWith(".zst") ? new com.github.luben.zstd.ZstdOutputStream(raw)
                     : new BZip2CompressorOutputStream(raw)) {
            Files.copy(from, o);
        }
    }

    @Test
    void everyCutPositionGivesTheSameResultIncludingHeaderRowEndsAndCrlf() throws IOException {
        Random rnd = new Random(11);
        StringBuilder b = new StringBuilder(SampleDump.HEADER).append("\r\n");
        for (int i = 0; i < 12; i++) {
            b.append(SampleDump.row("R" + rnd.nextInt(5), i % 3, 3 + i)).append(i % 2 == 0 ? "\r\n" : "\n");
            if (i == 4) {
                b.append("\n"); // an empty row: rejected
            }
            if (i == 7) {
                b.append(SampleDump.rowWith(6, "lots")).append("\r\n"); // bad votes: rejected
            }
        }
        b.append(SampleDump.row("R9", 1, 1)); // a last row without a line break
        Path p = SampleDump.write(dir.resolve("crlf.tsv"), b.toString());
        List<DumpFile> files = List.of(SampleDump.dumpFile(p));
        SourceOptions o = SourceOptions.defaults().withMaxRejectRate(1.0);
        Outcome expected = sequential(o, files);
        assertThat(expected.rejects()).hasSize(2);
        long size = Files.size(p);
        for (long at = 0; at <= size; at++) {
            long cut = at;
            for (int threads : new int[] {1, 2}) {
                Outcome got = parallel(new ParallelDumpReader(o, threads).withTempDir(dir).withCuts(f -> new long[] {cut}), files);
                assertThat(got).as("cut at byte %d", cut).isEqualTo(expected);
            }
        }
        // Many cuts at once, several inside one row.
        long[] many = new long[(int) (size / 5)];
        for (int i = 0; i < many.length; i++) {
            many[i] = 5L * i + 1;
        }
        assertThat(parallel(new ParallelDumpReader(o, 3).withTempDir(dir).withCuts(f -> many), files)).isEqualTo(expected);
    }

    @Test
    void theRejectRateStopIsTheSameWhateverTheCuts() throws IOException {
        StringBuilder b = new StringBuilder(SampleDump.HEADER).append('\n');
        for (int i = 0; i < 3000; i++) {
            b.append(i > 1500 && i % 10 == 0 ? SampleDump.rowWith(6, "x") : SampleDump.row("R" + i % 50, 1, 2)).append('\n');
        }
        Path p = SampleDump.write(dir.resolve("bad.tsv"), b.toString());
        List<DumpFile> files = List.of(SampleDump.dumpFile(p));
        SourceOptions o = SourceOptions.defaults().withMaxRejectRate(0.02);
        String expected = null;
        try {
            sequential(o, files);
        } catch (DumpFormatException e) {
            expected = e.getMessage();
        }
        assertThat(expected).contains("over the limit");
        long size = Files.size(p);
        String want = expected;
        assertThatThrownBy(() -> parallel(new ParallelDumpReader(o, 3).withTempDir(dir)
                .withCuts(f -> new long[] {size / 5, size / 2, 4 * size / 5}), files)).isInstanceOf(DumpFormatException.class)
                .hasMessage(want);
    }

    @Test
    void corruptCompressedDataIsNamed() throws IOException {
        Path p = dir.resolve("broken.tsv.zst");
        Files.write(p, new byte[] {0x28, (byte) 0xb5, 0x2f, (byte) 0xfd, 1, 2, 3});
        assertThatThrownBy(() -> parallel(new ParallelDumpReader(SourceOptions.defaults(), 2).withTempDir(dir),
                List.of(SampleDump.dumpFile(p)))).isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("broken.tsv.zst").hasMessageContaining("zstd data is truncated or corrupt");
        try (var s = Files.list(dir)) {
            assertThat(s.filter(f -> f.getFileName().toString().startsWith("voteworth-rejects"))).isEmpty();
        }
    }

    @Test
    void aFailureElsewhereIsReportedInsteadOfTheUnitsItStopped() throws IOException {
        // The large file's worker is stopped when the other file fails; the error a user reads must
        // name that failure, not the stop it caused.
        List<DumpFile> files = new ArrayList<>(generated("plain"));
        Path p = dir.resolve("broken.tsv.zst");
        Files.write(p, new byte[] {0x28, (byte) 0xb5, 0x2f, (byte) 0xfd, 1, 2, 3});
        files.add(SampleDump.dumpFile(p));
        for (int threads : new int[] {2, 3}) {
            assertThatThrownBy(() -> parallel(new ParallelDumpReader(SourceOptions.defaults(), threads).withTempDir(dir), files))
                    .as("threads %d", threads).isInstanceOf(DumpFormatException.class)
                    .hasMessageContaining("broken.tsv.zst");
        }
    }
}
