package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DumpReaderTest {
    @TempDir
    Path dir;

    @Test
    void readsAllFilesReconcilesAndReportsProgress() throws IOException {
        Random rnd = new Random(4);
        SampleDump.write(dir.resolve("dump/garden.part-01.tsv.gz"), SampleDump.HEADER + "\n" + DumpScannerTest.randomRows(rnd, 700, 40)
                + "\n" + SampleDump.rowWith(6, "lots") + "\n");
        SampleDump.write(dir.resolve("dump/garden.part-02.tsv"), SampleDump.HEADER + "\n" + DumpScannerTest.randomRows(rnd, 300, 40));
        SampleDump.write(dir.resolve("dump/kitchen.tsv"), SampleDump.HEADER.replace("category", "department") + "\n"
                + SampleDump.rowWith(3, "") + "\n" + SampleDump.rowWith(3, "kitchen-tools") + "\n");
        SampleDump.write(dir.resolve("dump/toys.tsv"), "");
        SourceOptions options = SourceOptions.defaults();
        List<DumpFile> files = DumpFinder.find(List.of("dump"), options.categories(), dir);
        Map<String, Long> byCategory = new TreeMap<>();
        List<long[]> progress = new ArrayList<>();
        RejectCounter rejects = new RejectCounter();
        ScanSummary s = new DumpReader(options).read(files, r -> byCategory.merge(r.category(), 1L, Long::sum), rejects,
                (bytes, total, rows) -> progress.add(new long[] {bytes, total, rows}));
        assertThat(s.files()).extracting(f -> f.file().category()).containsExactly("garden", "garden", "kitchen", "toys");
        assertThat(s.rowsRead()).isEqualTo(1003);
        assertThat(s.rejected()).isEqualTo(1);
        assertThat(s.rejectsByReason()).containsExactly(Map.entry("bad-votes", 1L));
        assertThat(rejects.total()).isEqualTo(1);
        assertThat(s.reconciles()).isTrue();
        assertThat(byCategory).containsExactly(Map.entry("garden", 1000L), Map.entry("kitchen", 1L), Map.entry("kitchen-tools", 1L));
        long totalBytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        assertThat(progress).isNotEmpty();
        for (int i = 1; i < progress.size(); i++) {
            assertThat(progress.get(i)[0]).isGreaterThanOrEqualTo(progress.get(i - 1)[0]);
            assertThat(progress.get(i)[2]).isGreaterThanOrEqualTo(progress.get(i - 1)[2]);
        }
        assertThat(progress.get(progress.size() - 1)).containsExactly(totalBytes, totalBytes, 1003L);
        assertThat(s.describe()).contains("toys.tsv").contains("(empty file: no header, no rows)");
    }
}
