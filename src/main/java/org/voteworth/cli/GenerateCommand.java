package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.GeneratedDump;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code voteworth generate}: writes the review dump of the fictional demo marketplace. */
@Command(name = "generate", mixinStandardHelpOptions = true,
        description = {"Writes a review dump of a fictional online marketplace: one gzip TSV per category, "
                + "the largest split into part files, with planted cases and a few malformed rows.",
                "Deterministic: the same seed and size give byte-identical files."})
final class GenerateCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @ArgGroup(exclusive = true)
    Size size;

    static final class Size {
        @Option(names = "--rows", paramLabel = "N", description = "Rows to write (default: 40000).")
        long rows;

        @Option(names = "--size", paramLabel = "BYTES", description = "Approximate uncompressed size, e.g. 500MB, 4GB, 1.5GiB.")
        String bytes;
    }

    @Option(names = "--seed", defaultValue = "" + DemoOptions.DEFAULT_SEED, paramLabel = "SEED",
            description = "Random seed (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Folder to write the dump into.")
    Path out;

    @Option(names = "--categories", paramLabel = "N",
            description = "Product categories, largest first (default: all of the marketplace's categories).")
    Integer categories;

    @Option(names = "--plain", description = "Write plain .tsv instead of .tsv.gz.")
    boolean plain;

    @Option(names = "--no-planted", negatable = false, description = "Leave out the planted reviewers.")
    boolean noPlanted;

    @Option(names = "--no-malformed", negatable = false, description = "Leave out the malformed rows.")
    boolean noMalformed;

    @Option(names = "--quiet", description = "No progress on stderr.")
    boolean quiet;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        GeneratedDump d = generate(options(), out, quiet ? null : spec.commandLine().getErr());
        o.printf(Locale.ROOT, "wrote %,d rows (%,d lines) in %d files, %.1f MB on disk (%.1f MB uncompressed) to %s%n",
                d.rows(), d.physicalLines(), d.files().size(), d.bytes() / 1e6, d.uncompressedBytes() / 1e6, out);
        if (!d.malformedByKind().isEmpty()) {
            o.printf(Locale.ROOT, "planted malformed lines: %s; a correct reader accepts %,d and rejects %,d%n",
                    d.malformedByKind(), d.expectedAcceptedRows(), d.expectedRejectedLines());
        }
        o.flush();
        return 0;
    }

    DemoOptions options() {
        DemoOptions d = size != null && size.bytes != null ? DemoOptions.size(DemoOptions.parseSize(size.bytes))
                : DemoOptions.rows(size != null && size.rows > 0 ? size.rows : 40_000);
        return d.withSeed(seed).withCategories(categories == null ? DemoOptions.MAX_CATEGORIES : categories).withGzip(!plain).withPlantCases(!noPlanted)
                .withMalformedRows(!noMalformed);
    }

    /** Generates with a progress line on {@code err} every few seconds (none when err is null). */
    static GeneratedDump generate(DemoOptions options, Path dir, PrintWriter err) throws IOException {
        long start = System.nanoTime();
        long[] last = {start};
        DemoDumpGenerator g = err == null ? new DemoDumpGenerator() : new DemoDumpGenerator(rows -> {
            long now = System.nanoTime();
            if (now - last[0] > 3_000_000_000L) {
                last[0] = now;
                err.printf(Locale.ROOT, "generate: %,d rows, %,.0f rows/s%n", rows, rows / ((now - start) / 1e9));
                err.flush();
            }
        });
        return g.generate(dir, options);
    }
}
