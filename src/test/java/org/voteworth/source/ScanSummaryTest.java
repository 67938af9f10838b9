package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class ScanSummaryTest {
    private static DumpFile file(String name) {
        return new DumpFile(Path.of("dump", name), "garden", DumpFile.Compression.NONE, 10);
    }

    @Test
    void totalsAndReconciliation() {
        ScanSummary s = new ScanSummary(List.of(
                new FileReport(file("garden.part-01.tsv"), 1000, 990, 10, Map.of("field-count", 6L, "bad-votes", 4L)),
                new FileReport(file("garden.part-02.tsv"), 500, 500, 0, Map.of()),
                new FileReport(file("garden.part-03.tsv"), 0, 0, 0, Map.of(), true)));
        assertThat(s.rowsRead()).isEqualTo(1500);
        assertThat(s.accepted()).isEqualTo(1490);
        assertThat(s.rejected()).isEqualTo(10);
        assertThat(s.rejectsByReason()).containsExactly(Map.entry("bad-votes", 4L), Map.entry("field-count", 6L));
        assertThat(s.reconciles()).isTrue();
        String table = s.describe();
        assertThat(table.lines()).hasSize(6);
        assertThat(table).contains("garden.part-01.tsv").contains("1,000").contains("field-count 6, bad-votes 4")
                .contains("(empty file: no header, no rows)")
                .endsWith("read = accepted + rejected: 1,500 = 1,490 + 10, holds for each of the 3 files" + System.lineSeparator());
        assertThat(table.lines().toList().get(4)).startsWith("total").contains("1,500").contains("1,490");
    }

    @Test
    void aFileThatDoesNotAddUpIsNamed() {
        ScanSummary s = new ScanSummary(List.of(
                new FileReport(file("a.tsv"), 10, 9, 0, Map.of()),
                new FileReport(file("b.tsv"), 10, 9, 1, Map.of("bad-date", 1L))));
        assertThat(s.reconciles()).isFalse();
        assertThat(s.describe()).contains("does NOT hold for: " + Path.of("dump", "a.tsv"));
        assertThat(new FileReport(file("c.tsv"), 2, 1, 1, Map.of()).reconciles()).as("reasons must add up").isFalse();
    }
}
