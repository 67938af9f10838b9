package org.voteworth.analysis;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.DumpReader;
import org.voteworth.source.SourceOptions;
import org.voteworth.tally.TallyTable;

/** The bundled demo-data sample, read once for the acceptance tests. */
final class DemoData {
    static final Path DIR = Path.of("demo-data");
    private static TallyTable table;

    private DemoData() {
    }

    static synchronized TallyTable table() {
        if (table == null) {
            try {
                SourceOptions o = SourceOptions.defaults();
                TallyTable t = new TallyTable();
                new DumpReader(o).read(DumpFinder.find(List.of(DIR.toString()), o.categories()), t,
                        (file, line, reject, row, start, end) -> { });
                table = t;
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return table;
    }
}
