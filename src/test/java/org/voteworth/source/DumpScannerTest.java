package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DumpScannerTest {
    /** What a sink saw of one accepted row (copied: the row is a flyweight). */
    record Seen(long line, String reviewer, long helpful, long total, String category, String review) {
    }

    static final class Collect implements ReviewSink {
        final List<Seen> rows = new ArrayList<>();

        @Override
        public void accept(ReviewRow r) {
            rows.add(new Seen(r.line, r.reviewer(), r.helpful, r.total, r.category(), r.review()));
        }
    }

    private static final SourceOptions LENIENT = SourceOptions.defaults().withMaxRejectRate(1);

    @TempDir
    Path dir;

    private FileReport scan(Path p, SourceOptions o, int buffer, Collect sink, RejectSink rejects) throws IOException {
        return new DumpScanner(o, buffer).scan(SampleDump.dumpFile(p), sink, rejects);
    }

    @Test
    void readsEveryRowAndCountsTheHeaderAsNoRow() throws IOException {
        Path p = SampleDump.write(dir.resolve("garden.tsv"), SampleDump.HEADER + "\n" + SampleDump.row("R1", 1, 2) + "\n"
                + SampleDump.row("R2", 0, 3) + "\n");
        Collect sink = new Collect();
        FileReport r = scan(p, LENIENT, DumpScanner.DEFAULT_BUFFER, sink, new RejectCounter());
        assertThat(r.rowsRead()).isEqualTo(2);
        assertThat(r.accepted()).isEqualTo(2);
        assertThat(r.rejected()).isZero();
        assertThat(r.noHeader()).isFalse();
        assertThat(sink.rows).extracting(Seen::line).containsExactly(2L, 3L);
        assertThat(sink.rows).extracting(Seen::reviewer).containsExactly("R1", "R2");
        assertThat(sink.rows).extracting(Seen::category).containsOnly("garden");
    }

    @Test
    void gzipGivesTheSameRowsAsPlain() throws IOException {
        String text = SampleDump.HEADER + "\n" + randomRows(new Random(1), 3000, 0) + "\n";
        Collect plain = new Collect();
        Collect gz = new Collect();
        FileReport a = scan(SampleDump.write(dir.resolve("toys.tsv"), text), LENIENT, 4096, plain, new RejectCounter());
        FileReport b = scan(SampleDump.write(dir.resolve("toys.tsv.gz"), text), LENIENT, 4096, gz, new RejectCounter());
        assertThat(gz.rows).isEqualTo(plain.rows).hasSize(3000);
        assertThat(b.rowsRead()).isEqualTo(a.rowsRead());
    }

    @Test
    void byteOrderMarkOnTheHeaderIsDropped() throws IOException {
        byte[] bom = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};
        Path ok = SampleDump.write(dir.resolve("bom.tsv"), withBom(bom, SampleDump.HEADER + "\n" + SampleDump.row("R1", 1, 1) + "\n"));
        Collect sink = new Collect();
        assertThat(scan(ok, SourceOptions.defaults(), 64, sink, new RejectCounter()).accepted()).isEqualTo(1);
        assertThat(sink.rows.get(0).reviewer()).isEqualTo("R1");
        // The header names people see (and exact --map matching) have no mark in front.
        Path odd = SampleDump.write(dir.resolve("odd.tsv"), withBom(bom, "who\thelpful\ttotal\nR1\t1\t1\n"));
        assertThatThrownBy(() -> scan(odd, SourceOptions.defaults(), 64, new Collect(), new RejectCounter()))
                .hasMessageContaining("the header has 'who', 'helpful', 'total'");
        assertThat(scan(odd, SourceOptions.defaults().withMapping(HeaderMapping.parse("reviewer=who")), 64, new Collect(),
                new RejectCounter()).accepted()).isEqualTo(1);
    }

    private static byte[] withBom(byte[] bom, String text) {
        byte[] rest = text.getBytes(StandardCharsets.UTF_8);
        byte[] all = new byte[bom.length + rest.length];
        System.arraycopy(bom, 0, all, 0, bom.length);
        System.arraycopy(rest, 0, all, bom.length, rest.length);
        return all;
    }

    @Test
    void crlfFilesReadLikeLfFiles() throws IOException {
        String lf = SampleDump.HEADER + "\n" + randomRows(new Random(2), 200, 0) + "\n";
        Collect a = new Collect();
        Collect b = new Collect();
        scan(SampleDump.write(dir.resolve("lf.tsv"), lf), LENIENT, 128, a, new RejectCounter());
        FileReport r = scan(SampleDump.write(dir.resolve("crlf.tsv"), lf.replace("\n", "\r\n")), LENIENT, 128, b, new RejectCounter());
        assertThat(r.rejected()).isZero();
        assertThat(b.rows).extracting(s -> List.of(s.line(), s.reviewer(), s.helpful(), s.total(), s.review()))
                .isEqualTo(a.rows.stream().map(s -> List.of(s.line(), s.reviewer(), s.helpful(), s.total(), s.review())).toList());
    }

    @Test
    void aFinalLineWithoutNewlineIsStillARow() throws IOException {
        Path p = SampleDump.write(dir.resolve("end.tsv"), SampleDump.HEADER + "\n" + SampleDump.row("R1", 1, 2) + "\n"
                + SampleDump.row("R2", 2, 2));
        for (int buffer : new int[] {1, 5, 64, DumpScanner.DEFAULT_BUFFER}) {
            Collect sink = new Collect();
            FileReport r = scan(p, LENIENT, buffer, sink, new RejectCounter());
            assertThat(r.accepted()).as("buffer %d", buffer).isEqualTo(2);
            assertThat(sink.rows.get(1)).isEqualTo(new Seen(3, "R2", 2, 2, "garden", "VR22"));
        }
    }

    @Test
    void emptyFilesAndHeaderOnlyFilesHaveNoRows() throws IOException {
        FileReport empty = scan(SampleDump.write(dir.resolve("empty.tsv"), ""), SourceOptions.defaults(), 16, new Collect(),
                new RejectCounter());
        assertThat(empty.rowsRead()).isZero();
        assertThat(empty.noHeader()).isTrue();
        FileReport emptyGz = scan(SampleDump.write(dir.resolve("empty.tsv.gz"), ""), SourceOptions.defaults(), 16, new Collect(),
                new RejectCounter());
        assertThat(emptyGz.noHeader()).isTrue();
        for (String text : new String[] {SampleDump.HEADER, SampleDump.HEADER + "\n", SampleDump.HEADER + "\r\n"}) {
            FileReport h = scan(SampleDump.write(dir.resolve("header.tsv"), text), SourceOptions.defaults(), 16, new Collect(),
                    new RejectCounter());
            assertThat(h.rowsRead()).isZero();
            assertThat(h.noHeader()).isFalse();
            assertThat(h.reconciles()).isTrue();
        }
    }

    @Test
    void rowsStraddlingBufferEndsAndRowsLongerThanTheBuffer() throws IOException {
        Random rnd = new Random(11);
        String rows = randomRows(rnd, 400, 300);
        Path p = SampleDump.write(dir.resolve("kitchen.tsv"), SampleDump.HEADER + "\n" + rows + "\n");
        Collect expected = new Collect();
        scan(p, LENIENT, DumpScanner.DEFAULT_BUFFER, expected, new RejectCounter());
        assertThat(expected.rows).hasSize(400);
        for (int buffer : new int[] {1, 2, 3, 7, 16, 61, 255, 1024}) {
            Collect sink = new Collect();
            FileReport r = scan(p, LENIENT, buffer, sink, new RejectCounter());
            assertThat(sink.rows).as("buffer %d", buffer).isEqualTo(expected.rows);
            assertThat(r.rowsRead()).isEqualTo(400);
        }
        String huge = "x".repeat(100_000);
        Path big = SampleDump.write(dir.resolve("big.tsv"), SampleDump.HEADER + "\n"
                + SampleDump.row("R1", 1, 2).replace("Works;", huge) + "\n" + SampleDump.row("R2", 0, 1) + "\n");
        Collect sink = new Collect();
        FileReport r = scan(big, LENIENT, 16, sink, new RejectCounter());
        assertThat(r.accepted()).isEqualTo(2);
        assertThat(sink.rows.get(1).reviewer()).isEqualTo("R2");
    }

    @Test
    void everyRejectKindReachesTheRejectsFileWithFileLineFieldAndReason() throws IOException {
        String twelve = SampleDump.row("R1", 1, 2);
        List<String> lines = List.of(
                SampleDump.HEADER,                                     // 1
                twelve,                                                // 2 ok
                twelve.substring(0, twelve.lastIndexOf('\t')),         // 3 field-count
                "",                                                    // 4 empty-row
                SampleDump.rowWith(0, ""),                             // 5 empty-reviewer
                SampleDump.rowWith(5, "abc"),                          // 6 bad-votes helpful
                SampleDump.rowWith(6, "-3"),                           // 7 bad-votes total
                SampleDump.rowWith(6, "0"),                            // 8 helpful-above-total
                SampleDump.rowWith(4, "6"),                            // 9 bad-stars
                SampleDump.rowWith(7, "maybe"),                        // 10 bad-flag verified
                SampleDump.rowWith(8, "sometimes"),                    // 11 bad-flag incentivised
                SampleDump.rowWith(9, "2021-02-30"),                   // 12 bad-date
                twelve + "\textra\\field\r",                           // 13 field-count, with a backslash and CR
                SampleDump.row("R9", 0, 0));                           // 14 ok
        Path p = SampleDump.write(dir.resolve("mixed.tsv"), String.join("\n", lines) + "\n");
        Path log = dir.resolve("out/rejects.tsv");
        FileReport r;
        try (RejectLog rejects = new RejectLog(log)) {
            r = scan(p, LENIENT, 32, new Collect(), rejects);
        }
        assertThat(r.rowsRead()).isEqualTo(13);
        assertThat(r.accepted()).isEqualTo(2);
        assertThat(r.rejected()).isEqualTo(11);
        assertThat(r.reconciles()).isTrue();
        assertThat(r.rejectsByReason()).containsExactlyEntriesOf(new java.util.TreeMap<>(Map.of(
                "bad-date", 1L, "bad-flag", 2L, "bad-stars", 1L, "bad-votes", 2L, "empty-reviewer", 1L, "empty-row", 1L,
                "field-count", 2L, "helpful-above-total", 1L)));
        List<String> out = Files.readAllLines(log);
        assertThat(out.get(0)).isEqualTo("file\tline\tfield\treason\tvalue\trow");
        List<List<String>> cells = out.subList(1, out.size()).stream().map(l -> List.of(l.split("\t", -1)).subList(0, 5)).toList();
        String f = p.toString();
        assertThat(cells).containsExactly(
                List.of(f, "3", "(row)", "field-count", "11"),
                List.of(f, "4", "(row)", "empty-row", ""),
                List.of(f, "5", "reviewer", "empty-reviewer", ""),
                List.of(f, "6", "helpful", "bad-votes", "abc"),
                List.of(f, "7", "total", "bad-votes", "-3"),
                List.of(f, "8", "helpful", "helpful-above-total", "1"),
                List.of(f, "9", "stars", "bad-stars", "6"),
                List.of(f, "10", "verified", "bad-flag", "maybe"),
                List.of(f, "11", "incentivised", "bad-flag", "sometimes"),
                List.of(f, "12", "date", "bad-date", "2021-02-30"),
                List.of(f, "13", "(row)", "field-count", "13"));
        // The row column keeps the raw row, escaped so it stays on one line; unescaping gives it back.
        String last = out.get(out.size() - 1);
        String rowCell = last.split("\t", 6)[5];
        assertThat(rowCell).doesNotContain("\t").endsWith("\\textra\\\\field\\r");
        byte[] raw = RejectLog.unescape(rowCell.getBytes(StandardCharsets.UTF_8), 0, rowCell.length());
        assertThat(new String(raw, StandardCharsets.UTF_8)).isEqualTo(lines.get(12));
    }

    @Test
    void aByteRangeScanMatchesTheWholeFile() throws IOException {
        String rows = randomRows(new Random(5), 1000, 50);
        byte[] all = (SampleDump.HEADER + "\n" + rows + "\n").getBytes(StandardCharsets.UTF_8);
        Path p = SampleDump.write(dir.resolve("garden.tsv"), all);
        DumpFile file = SampleDump.dumpFile(p);
        Collect whole = new Collect();
        new DumpScanner(LENIENT, 512).scan(file, whole, new RejectCounter());
        // Split at the line end nearest the middle, as a parallel reader would.
        int cut = indexOf(all, (byte) '\n', all.length / 2) + 1;
        long linesBefore = count(all, 0, cut, (byte) '\n');
        Collect parts = new Collect();
        DumpScanner s = new DumpScanner(LENIENT, 512);
        FileReport a = s.scan(file, new ByteArrayInputStream(Arrays.copyOfRange(all, 0, cut)), 1, true, parts, new RejectCounter());
        FileReport b = s.scan(file, new ByteArrayInputStream(Arrays.copyOfRange(all, cut, all.length)), linesBefore + 1, false,
                parts, new RejectCounter());
        assertThat(parts.rows).isEqualTo(whole.rows);
        assertThat(a.rowsRead() + b.rowsRead()).isEqualTo(1000);
        assertThat(s.readMapping(file)).isEqualTo(SampleDump.mapping());
    }

    @Test
    void truncatedGzipIsAClearErrorNamingTheFile() throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (GZIPOutputStream gz = new GZIPOutputStream(bytes)) {
            gz.write((SampleDump.HEADER + "\n" + randomRows(new Random(3), 2000, 0) + "\n").getBytes(StandardCharsets.UTF_8));
        }
        byte[] full = bytes.toByteArray();
        Path p = dir.resolve("garden.tsv.gz");
        Files.write(p, Arrays.copyOf(full, full.length / 2));
        assertThatThrownBy(() -> scan(p, LENIENT, 4096, new Collect(), new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining(p.toString())
                .hasMessageContaining("gzip data is truncated or corrupt");
        Path notGzip = SampleDump.write(dir.resolve("kitchen.tsv.gz.tmp"), "x");
        Path renamed = Files.move(notGzip, dir.resolve("kitchen.tsv.gz"));
        assertThatThrownBy(() -> scan(renamed, LENIENT, 4096, new Collect(), new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("kitchen.tsv.gz: the gzip data is truncated or corrupt");
    }

    @Test
    void gzipDataUnderAPlainNameIsCaught() throws IOException {
        Path gz = SampleDump.write(dir.resolve("toys.tsv.gz"), SampleDump.HEADER + "\n");
        Path plain = Files.move(gz, dir.resolve("toys.tsv"));
        assertThatThrownBy(() -> scan(plain, LENIENT, 4096, new Collect(), new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("looks gzip-compressed but its name does not end in .gz");
    }

    @Test
    void aMissingFileIsNamed() {
        Path p = dir.resolve("gone.tsv");
        DumpFile f = new DumpFile(p, "gone", DumpFile.Compression.NONE, 0);
        assertThatThrownBy(() -> new DumpScanner(LENIENT).scan(f, new Collect(), new RejectCounter()))
                .isInstanceOf(IOException.class)
                .hasMessageContaining(p.toString());
    }

    @Test
    void headerErrorsNameTheFile() throws IOException {
        Path p = SampleDump.write(dir.resolve("odd.tsv"), "who\tups\tdowns\nR1\t1\t2\n");
        assertThatThrownBy(() -> scan(p, LENIENT, 4096, new Collect(), new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageStartingWith(p + ": line 1: no column for required fields reviewer");
        Collect sink = new Collect();
        FileReport r = scan(p, LENIENT.withMapping(HeaderMapping.parse("reviewer=who,helpful=ups,total=downs")), 4096, sink,
                new RejectCounter());
        assertThat(r.accepted()).isEqualTo(1);
        assertThat(sink.rows.get(0).category()).isEqualTo("odd");
        assertThatThrownBy(() -> new DumpScanner(LENIENT).readMapping(SampleDump.dumpFile(SampleDump.write(dir.resolve("e.tsv"), ""))))
                .hasMessageContaining("e.tsv: the file is empty: expected a header line");
    }

    @Test
    void csvFilesAreScannedWithTheirQuoting() throws IOException {
        Path p = SampleDump.write(dir.resolve("shoes.csv"), "reviewer,helpful,total,body\r\n\"R,1\",1,2,\"said \"\"fine\"\", ok\"\r\n"
                + "R2,0,1,\"broken\nacross lines\"\r\nR3,1,1,x");
        Collect sink = new Collect();
        RejectCounter rejects = new RejectCounter();
        FileReport r = scan(p, LENIENT.withFormat(Format.CSV), 8, sink, rejects);
        assertThat(sink.rows).extracting(Seen::reviewer).containsExactly("R,1", "R3");
        assertThat(r.rowsRead()).isEqualTo(4);
        assertThat(rejects.byReason()).containsExactlyInAnyOrderEntriesOf(Map.of("bad-quote", 1L, "field-count", 1L));
    }

    // ---- helpers ----

    /** Random valid rows with review text of up to {@code textLength} characters, quotes and odd bytes included. */
    static String randomRows(Random rnd, int n, int textLength) {
        StringBuilder b = new StringBuilder();
        String alphabet = "abc xyz\"'.,;\\éß€";
        for (int i = 0; i < n; i++) {
            long total = rnd.nextInt(50);
            long helpful = total == 0 ? 0 : rnd.nextInt((int) total + 1);
            StringBuilder text = new StringBuilder();
            int len = textLength == 0 ? 0 : rnd.nextInt(textLength);
            for (int k = 0; k < len; k++) {
                text.append(alphabet.charAt(rnd.nextInt(alphabet.length())));
            }
            String[] f = SampleDump.row("R" + rnd.nextInt(100), helpful, total).split("\t", -1);
            f[11] = text.toString();
            if (i > 0) {
                b.append('\n');
            }
            b.append(String.join("\t", f));
        }
        return b.toString();
    }

    private static int indexOf(byte[] b, byte c, int from) {
        for (int i = from; i < b.length; i++) {
            if (b[i] == c) {
                return i;
            }
        }
        return -1;
    }

    private static long count(byte[] b, int from, int to, byte c) {
        long n = 0;
        for (int i = from; i < to; i++) {
            if (b[i] == c) {
                n++;
            }
        }
        return n;
    }
}
