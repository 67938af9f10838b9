package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RejectRateLimitTest {
    @TempDir
    Path dir;

    private static String rows(int n, int badEvery) {
        StringBuilder b = new StringBuilder(SampleDump.HEADER).append('\n');
        for (int i = 1; i <= n; i++) {
            b.append(badEvery > 0 && i % badEvery == 0 ? SampleDump.rowWith(5, "n/a") : SampleDump.row("R" + i, 1, 2)).append('\n');
        }
        return b.toString();
    }

    @Test
    void aCommaFileReadAsTsvStopsEarlyAndSuggestsCsv() throws IOException {
        // A tab-separated header over comma-separated rows: the header resolves, every row is one field.
        StringBuilder b = new StringBuilder(SampleDump.HEADER).append('\n');
        for (int i = 0; i < 50_000; i++) {
            b.append(SampleDump.row("R" + i, 1, 2).replace('\t', ',')).append('\n');
        }
        Path p = SampleDump.write(dir.resolve("garden.tsv"), b.toString());
        RejectCounter rejects = new RejectCounter();
        AtomicLong accepted = new AtomicLong();
        assertThatThrownBy(() -> new DumpScanner(SourceOptions.defaults()).scan(SampleDump.dumpFile(p), r -> accepted.incrementAndGet(), rejects))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining(p.toString())
                .hasMessageContaining("100.0 % of rows rejected (1,000 of 1,000 read so far)")
                .hasMessageContaining("limit of 5.0 % (--max-reject-rate 0.05)")
                .hasMessageContaining("field-count: 1,000 rows, e.g. line 2: expected 12 fields, found 1")
                .hasMessageContaining("read it with --csv");
        assertThat(rejects.total()).as("stopped after the first 1,000 rows").isEqualTo(RejectRateLimit.MIN_ROWS);
        assertThat(accepted.get()).isZero();
    }

    @Test
    void aCommaFileWithACommaHeaderFailsAtTheHeaderSuggestingCsv() throws IOException {
        Path p = SampleDump.write(dir.resolve("kitchen.tsv"), rows(10, 0).replace('\t', ','));
        assertThatThrownBy(() -> new DumpScanner(SourceOptions.defaults()).scan(SampleDump.dumpFile(p), r -> { }, new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("kitchen.tsv: line 1:")
                .hasMessageContaining("add --csv");
    }

    @Test
    void aTabFileReadAsCsvSuggestsDroppingCsv() throws IOException {
        // Header with commas so it resolves as CSV; the rows are tab-separated.
        String text = String.join(",", SampleDump.COLUMNS) + "\n" + rows(2000, 0).substring(SampleDump.HEADER.length() + 1)
                .replace(",", ";").replace("; the", " the");
        Path p = SampleDump.write(dir.resolve("toys.csv"), text);
        assertThatThrownBy(() -> new DumpScanner(SourceOptions.defaults().withFormat(Format.CSV)).scan(SampleDump.dumpFile(p),
                r -> { }, new RejectCounter()))
                .hasMessageContaining("drop --csv");
    }

    @Test
    void aWrongColumnSuggestsMap() throws IOException {
        Path p = SampleDump.write(dir.resolve("shoes.tsv"), rows(1500, 2));
        assertThatThrownBy(() -> new DumpScanner(SourceOptions.defaults()).scan(SampleDump.dumpFile(p), r -> { }, new RejectCounter()))
                .hasMessageContaining("50.0 % of rows rejected")
                .hasMessageContaining("bad-votes: 500 rows, e.g. line 3: helpful votes 'n/a' is not a non-negative whole number (field helpful)")
                .hasMessageContaining("--map helpful=<header>");
    }

    @Test
    void theEndOfAFileIsCheckedWhateverItsSize() throws IOException {
        Path p = SampleDump.write(dir.resolve("garden.tsv"), rows(10, 10));
        DumpFile f = SampleDump.dumpFile(p);
        assertThatThrownBy(() -> new DumpScanner(SourceOptions.defaults()).scan(f, r -> { }, new RejectCounter()))
                .isInstanceOf(DumpFormatException.class)
                .hasMessageContaining("10.0 % of rows rejected (1 of 10 read)");
        assertThat(new DumpScanner(SourceOptions.defaults().withMaxRejectRate(0.1)).scan(f, r -> { }, new RejectCounter()).rejected())
                .isEqualTo(1);
    }

    @Test
    void rejectsBelowTheLimitPass() throws IOException {
        // 1 in 25 = 4 %, under the default 5 %.
        Path p = SampleDump.write(dir.resolve("garden.tsv"), rows(5000, 25));
        FileReport r = new DumpScanner(SourceOptions.defaults()).scan(SampleDump.dumpFile(p), x -> { }, new RejectCounter());
        assertThat(r.rejected()).isEqualTo(200);
        assertThat(r.reconciles()).isTrue();
    }

    @Test
    void theBoundaryAndTheOptionsRange() {
        RejectRateLimit l = new RejectRateLimit(0.05);
        assertThat(l.exceeded(100, 5)).isFalse();
        assertThat(l.exceeded(100, 6)).isTrue();
        assertThat(l.exceeded(0, 0)).isFalse();
        assertThat(new RejectRateLimit(1).exceeded(10, 10)).isFalse();
        for (double bad : List.of(-0.1, 1.5, Double.NaN)) {
            assertThatThrownBy(() -> new RejectRateLimit(bad)).hasMessageContaining("--max-reject-rate must be between 0 and 1");
        }
        assertThatThrownBy(() -> SourceOptions.defaults().withMaxRejectRate(2)).hasMessageContaining("--max-reject-rate");
    }
}
