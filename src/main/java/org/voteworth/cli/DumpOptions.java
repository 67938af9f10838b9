package org.voteworth.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** How to read a dump: the inputs and the options every command that reads one shares. */
final class DumpOptions {
    @Parameters(arity = "1..*", paramLabel = "INPUT",
            description = "Dump files, folders (searched recursively) or globs; plain, .gz, .zst or .bz2. "
                    + "Commands that rank also take a reviewer table (reviewers.csv) written by 'tally'.")
    List<String> inputs = new ArrayList<>();

    @Option(names = "--map", paramLabel = "FIELD=HEADER[,...]",
            description = "Map fields to header names, e.g. --map reviewer=customer,helpful=up_votes. "
                    + "Fields: reviewer, review, item, category, stars, helpful, total, verified, incentivised, date.")
    String map;

    @Option(names = "--map-file", paramLabel = "FILE", description = "A file of field=header lines (# comments).")
    Path mapFile;

    @Option(names = "--csv", description = "Read comma-separated files with RFC 4180 quoting instead of TSV.")
    boolean csv;

    @Option(names = "--category-pattern", paramLabel = "REGEX",
            description = "Regex with one group taking the category from the file name, when there is no category column "
                    + "(default: the name without extensions and part suffix, e.g. garden.part-02.tsv.gz -> garden).")
    String categoryPattern;

    @Option(names = "--max-reject-rate", defaultValue = "0.05", paramLabel = "SHARE",
            description = "Stop when more than this share of a file's rows is rejected (default: ${DEFAULT-VALUE}).")
    double maxRejectRate;

    @Option(names = "--rejects", paramLabel = "FILE",
            description = "Where to write rejected rows with file, line, field and reason (default: rejects.tsv in --out, "
                    + "or beside the first input's folder when there is no --out).")
    Path rejects;

    /** The default of {@code --memory}; the launcher's default heap is sized from it (see README). */
    static final String DEFAULT_MEMORY = "256MiB";

    @Option(names = "--threads", paramLabel = "N",
            description = "Worker threads for the whole command: scanning, and the Monte Carlo draws where there are any "
                    + "(default: the available processors). Results are identical for any N.")
    int threads = Runtime.getRuntime().availableProcessors();

    @Option(names = "--memory", defaultValue = DEFAULT_MEMORY, paramLabel = "SIZE",
            description = "Memory budget for the partial tallies while scanning (default: ${DEFAULT-VALUE}); above it they "
                    + "spill to --tmp and are merged partition by partition. Commands that rank still hold the final "
                    + "reviewer table. Units: KB, MB, GB, KiB, MiB, GiB.")
    String memory = DEFAULT_MEMORY;

    @Option(names = "--tmp", paramLabel = "DIR",
            description = "Folder for spilled tallies and buffered rejects (default: the system temp folder).")
    Path tmp;

    long memoryBytes() {
        return org.voteworth.demo.DemoOptions.parseSize(memory);
    }

    /** The worker count, checked: 1 or more. */
    int threads() {
        if (threads < 1) {
            throw new IllegalArgumentException("--threads must be 1 or more, got " + threads);
        }
        return threads;
    }

    Path tmpDir() {
        return tmp != null ? tmp : Path.of(System.getProperty("java.io.tmpdir"));
    }

    Optional<Path> rejectsFile() {
        return Optional.ofNullable(rejects);
    }
}
