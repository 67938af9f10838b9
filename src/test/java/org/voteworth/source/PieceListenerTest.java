package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;

/**
 * With the pieces the listener reports, every row of a file cut into byte ranges gets the line the
 * one-thread {@link DumpReader} gives it (the reference scan), whatever the cuts and thread count.
 */
class PieceListenerTest {
    @TempDir
    Path dir;

    @Test
    void pieceBasesPlusLinesInThePieceAreTheLinesInTheFile() throws IOException {
        new DemoDumpGenerator().generate(dir.resolve("dump"), DemoOptions.rows(6_000).withGzip(false).withCategories(2));
        SourceOptions o = SourceOptions.defaults();
        List<DumpFile> files = DumpFinder.find(List.of(dir.resolve("dump").toString()), o.categories());
        List<String> expected = Collections.synchronizedList(new ArrayList<>());
        new DumpReader(o).read(files, row -> expected.add(files.indexOf(row.file) + ":" + row.line + ":" + row.review()),
                (file, line, reject, row, start, end) -> { });
        for (int threads : new int[] {1, 3}) {
            record Row(int file, long start, long line, String review) {
            }
            List<Row> rows = Collections.synchronizedList(new ArrayList<>());
            long[][] current = new long[threads][2];
            Map<String, Long> bases = Collections.synchronizedMap(new HashMap<>());
            PieceListener l = new PieceListener() {
                @Override
                public void started(int worker, int fileIndex, long start) {
                    current[worker][0] = fileIndex;
                    current[worker][1] = start;
                }

                @Override
                public void lineBase(int fileIndex, long start, long lineBase) {
                    bases.put(fileIndex + "@" + start, lineBase);
                }
            };
            ParallelDumpReader reader = new ParallelDumpReader(o, threads).withTempDir(dir).withPieceListener(l)
                    .withCuts(f -> new long[] {f.sizeBytes() / 5, f.sizeBytes() / 2, 4 * f.sizeBytes() / 5});
            reader.read(files, w -> row -> rows.add(new Row((int) current[w][0], current[w][1], row.line, row.review())),
                    (file, line, reject, row, start, end) -> { }, ProgressListener.NONE);
            List<String> got = new ArrayList<>();
            for (Row r : rows) {
                got.add(r.file() + ":" + (bases.get(r.file() + "@" + r.start()) + r.line()) + ":" + r.review());
            }
            assertThat(bases.keySet().stream().filter(k -> !k.endsWith("@0"))).as("pieces that do not start a file").isNotEmpty();
            assertThat(got).as("threads %d", threads).containsExactlyInAnyOrderElementsOf(expected);
        }
    }
}
