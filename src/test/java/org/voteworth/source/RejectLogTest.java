package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RejectLogTest {
    private static final DumpFile FILE = new DumpFile(Path.of("dump", "garden.tsv"), "garden", DumpFile.Compression.NONE, 0);

    @TempDir
    Path dir;

    @Test
    void escapesBackslashTabCrAndLfSoEachRejectIsOneLine() throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        byte[] row = "a\\b\tc\rd\ne".getBytes(StandardCharsets.UTF_8);
        try (RejectLog log = new RejectLog("mem", out)) {
            log.reject(FILE, 7, new Reject(Reject.FIELD_COUNT, Reject.ROW, "3\t4", "expected 2 fields, found 3"), row, 0, row.length);
            assertThat(log.written()).isEqualTo(1);
        }
        String text = out.toString(StandardCharsets.UTF_8);
        assertThat(text).isEqualTo(RejectLog.HEADER + "\n" + FILE.path() + "\t7\t(row)\tfield-count\t3\\t4\ta\\\\b\\tc\\rd\\ne\n");
    }

    @Test
    void unescapingGivesBackEveryByte() throws IOException {
        Random rnd = new Random(9);
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        byte[][] rows = new byte[200][];
        try (RejectLog log = new RejectLog("mem", out)) {
            for (int i = 0; i < rows.length; i++) {
                rows[i] = new byte[rnd.nextInt(40)];
                rnd.nextBytes(rows[i]);
                // Keep the row bytes in a bigger buffer: only [start, end) is written.
                byte[] buf = new byte[rows[i].length + 4];
                System.arraycopy(rows[i], 0, buf, 2, rows[i].length);
                log.reject(FILE, i + 2, new Reject(Reject.BAD_VOTES, "helpful", "x", "m"), buf, 2, 2 + rows[i].length);
            }
        }
        byte[] all = out.toByteArray();
        int line = -1;
        int start = 0;
        for (int i = 0; i < all.length; i++) {
            if (all[i] == '\n') {
                if (line >= 0) {
                    int lastTab = start;
                    for (int k = start, tabs = 0; k < i; k++) {
                        if (all[k] == '\t' && ++tabs == 5) {
                            lastTab = k;
                        }
                    }
                    assertThat(RejectLog.unescape(all, lastTab + 1, i)).as("row %d", line).isEqualTo(rows[line]);
                }
                line++;
                start = i + 1;
            }
        }
        assertThat(line).isEqualTo(rows.length);
    }

    @Test
    void manyThreadsWriteWholeLines() throws Exception {
        Path f = dir.resolve("rejects.tsv");
        try (RejectLog log = new RejectLog(f)) {
            ExecutorService pool = Executors.newFixedThreadPool(4);
            for (int t = 0; t < 4; t++) {
                pool.submit(() -> {
                    byte[] row = "R1\tx\tx".getBytes(StandardCharsets.UTF_8);
                    for (int i = 0; i < 2000; i++) {
                        log.reject(FILE, i, new Reject(Reject.BAD_VOTES, "helpful", "x", "m"), row, 0, row.length);
                    }
                });
            }
            pool.shutdown();
            assertThat(pool.awaitTermination(30, TimeUnit.SECONDS)).isTrue();
        }
        List<String> lines = Files.readAllLines(f);
        assertThat(lines).hasSize(8001);
        assertThat(lines.subList(1, lines.size())).allSatisfy(l -> assertThat(l.split("\t", -1)).hasSize(6));
    }

    @Test
    void theCounterCountsByReason() {
        RejectCounter c = new RejectCounter();
        c.reject(FILE, 2, new Reject(Reject.BAD_DATE, "date", "x", "m"), new byte[0], 0, 0);
        c.reject(FILE, 3, new Reject(Reject.BAD_DATE, "date", "y", "m"), new byte[0], 0, 0);
        c.reject(FILE, 4, new Reject(Reject.EMPTY_ROW, Reject.ROW, "", "m"), new byte[0], 0, 0);
        assertThat(c.total()).isEqualTo(3);
        assertThat(c.byReason()).containsExactly(java.util.Map.entry("bad-date", 2L), java.util.Map.entry("empty-row", 1L));
    }
}
