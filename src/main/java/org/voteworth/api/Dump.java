package org.voteworth.api;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.voteworth.demo.DemoDumpGenerator;
import org.voteworth.demo.DemoOptions;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.DumpFile;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.Format;
import org.voteworth.source.HeaderMapping;
import org.voteworth.source.ParallelDumpReader;
import org.voteworth.source.ProgressListener;
import org.voteworth.source.RejectLog;
import org.voteworth.source.ReviewSink;
import org.voteworth.source.ScanSummary;
import org.voteworth.source.SourceOptions;
import org.voteworth.tally.BoundedTally;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;
import org.voteworth.tally.VoteCap;

/**
 * A review dump to read, and how: the inputs (files, folders searched recursively, or globs;
 * plain, .gz, .zst or .bz2) with the same options as the command line's, e.g.
 * {@code Dump.open("dump/").map("reviewer=customer,helpful=up_votes").tally()}. Immutable; each
 * option returns a new {@code Dump}. {@link #tally()} reads it.
 */
public final class Dump {
    private final List<String> inputs;
    private final SourceOptions source;
    private final int threads;
    private final long capVotes;
    private final Optional<Path> rejects;
    private final String label;

    private Dump(List<String> inputs, SourceOptions source, int threads, long capVotes, Optional<Path> rejects, String label) {
        if (inputs.isEmpty()) {
            throw new IllegalArgumentException("a dump needs at least one input: a file, a folder or a glob");
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, not " + threads);
        }
        if (capVotes < 0) {
            throw new IllegalArgumentException("the vote cap must be at least 1 vote per review (or 0 for no cap), not " + capVotes);
        }
        this.inputs = List.copyOf(inputs);
        this.source = source;
        this.threads = threads;
        this.capVotes = capVotes;
        this.rejects = rejects;
        this.label = label;
    }

    /** Files, folders or globs, as on the command line. */
    public static Dump open(String... inputs) {
        return new Dump(Arrays.asList(inputs), SourceOptions.defaults(), Runtime.getRuntime().availableProcessors(), 0,
                Optional.empty(), String.join(" ", inputs));
    }

    /** Files or folders. */
    public static Dump open(Path... inputs) {
        return open(Arrays.stream(inputs).map(Path::toString).toArray(String[]::new));
    }

    /**
     * Generates the demo marketplace's dump (Quarrendale Market, the one bundled in
     * {@code demo-data/}: 40,000 reviews in 12 files with planted cases and malformed lines) into
     * {@code dir} and opens it, so a notebook runs anywhere.
     */
    public static Dump demo(Path dir) throws IOException {
        return demo(dir, 40_000, DemoOptions.DEFAULT_SEED);
    }

    /**
     * As {@link #demo(Path)}, into a new temporary folder that is deleted when the JVM exits; the
     * rejected rows go to {@code rejects.tsv} in it.
     */
    public static Dump demo() throws IOException {
        Path dir = Files.createTempDirectory("quarrendale-market-");
        Runtime.getRuntime().addShutdownHook(new Thread(() -> deleteFolder(dir), "voteworth-demo-cleanup"));
        return demo(dir).rejects(dir.resolve("rejects.tsv"));
    }

    private static void deleteFolder(Path dir) {
        try (var paths = Files.walk(dir)) {
            paths.sorted(java.util.Comparator.reverseOrder()).map(Path::toFile).forEach(java.io.File::delete);
        } catch (IOException e) {
            // The JVM is exiting: what cannot be deleted stays in the temporary folder.
        }
    }

    /** Generates a demo dump of {@code rows} reviews with {@code seed} into {@code dir} and opens it. */
    public static Dump demo(Path dir, long rows, long seed) throws IOException {
        Files.createDirectories(dir);
        new DemoDumpGenerator().generate(dir, DemoOptions.rows(rows).withSeed(seed));
        return open(dir).label(String.format(Locale.ROOT, "the %s demo dump (%,d reviews, seed %d)",
                DemoDumpGenerator.MARKETPLACE, rows, seed));
    }

    /** Maps fields to header names, e.g. {@code "reviewer=customer,helpful=up_votes"} (fields as for {@code --map}). */
    public Dump map(String fieldsToHeaders) {
        return withSource(source.withMapping(source.mapping().withOverrides(HeaderMapping.parse(fieldsToHeaders))));
    }

    /** Maps fields to header names from a file of {@code field=header} lines. */
    public Dump mapFile(Path file) throws IOException {
        return withSource(source.withMapping(source.mapping().withOverrides(HeaderMapping.load(file))));
    }

    /** Reads comma-separated files with RFC 4180 quoting instead of TSV. */
    public Dump csv() {
        return withSource(source.withFormat(Format.CSV));
    }

    /** Takes the category from file names with this regex (one group), when there is no category column. */
    public Dump categoryPattern(String regex) {
        return withSource(source.withCategories(CategoryFromName.of(regex)));
    }

    /** Stops when more than this share of a file's rows is rejected (default 0.05). */
    public Dump maxRejectRate(double share) {
        return withSource(source.withMaxRejectRate(share));
    }

    /** Scanning threads (default: all processors; the result does not depend on it). */
    public Dump threads(int n) {
        return new Dump(inputs, source, n, capVotes, rejects, label);
    }

    /** Counts at most {@code n} votes per review, helpful votes scaled in proportion; 0 = no cap. */
    public Dump capVotes(long n) {
        return new Dump(inputs, source, threads, n, rejects, label);
    }

    /**
     * Where rejected rows go (default: a new file in the temporary folder, named by
     * {@link ReviewerTable#rejectsFile()}, and removed again when no row was rejected).
     */
    public Dump rejects(Path file) {
        return new Dump(inputs, source, threads, capVotes, Optional.of(file), label);
    }

    /** The same dump named {@code text} in reports (default: the inputs), e.g. when its path says little. */
    public Dump label(String text) {
        return new Dump(inputs, source, threads, capVotes, rejects, text);
    }

    /** The inputs as given. */
    public List<String> inputs() {
        return inputs;
    }

    /**
     * Reads every row into a reviewer table in memory: each row is accepted or written with its
     * reason to the rejects file, and the table carries the reconciliation per file.
     *
     * @throws IOException when a file cannot be read
     * @throws org.voteworth.source.DumpFormatException when a file's header or reject rate is wrong, naming the file
     */
    public ReviewerTable tally() throws IOException {
        if (inputs.size() == 1 && Files.isRegularFile(Path.of(inputs.get(0)))
                && ReviewerTableFile.looksLikeReviewerTable(Path.of(inputs.get(0)))) {
            throw new IllegalArgumentException(inputs.get(0) + " is a reviewer table (votes already summed per reviewer), "
                    + "not a dump: read it with ReviewerTable.read(Path.of(\"" + inputs.get(0) + "\"))");
        }
        List<DumpFile> files = DumpFinder.find(inputs, source.categories());
        Path tmp = Path.of(System.getProperty("java.io.tmpdir"));
        Path rejectsFile = rejects.isPresent() ? rejects.get() : Files.createTempFile("voteworth-rejects-", ".tsv");
        UnaryOperator<ReviewSink> cap = capVotes == 0 ? UnaryOperator.identity() : sink -> new VoteCap(capVotes, sink);
        TallyTable table;
        ScanSummary summary;
        try (BoundedTally tally = new BoundedTally(TallyUnit.REVIEWER, Long.MAX_VALUE, tmp);
             RejectLog log = new RejectLog(rejectsFile)) {
            summary = new ParallelDumpReader(source, threads).withTempDir(tmp)
                    .read(files, worker -> cap.apply(tally.newSink()), log, ProgressListener.NONE);
            table = tally.mergedInMemory();
        }
        // A temporary rejects file with nothing in it is not evidence of anything: do not leave it behind.
        boolean keep = rejects.isPresent() || summary.rejected() > 0;
        if (!keep) {
            Files.deleteIfExists(rejectsFile);
        }
        return new ReviewerTable(table, label, summary, keep ? Optional.of(rejectsFile) : Optional.empty(),
                capVotes, UnaryOperator.identity());
    }

    private Dump withSource(SourceOptions s) {
        return new Dump(inputs, Objects.requireNonNull(s), threads, capVotes, rejects, label);
    }

    @Override
    public String toString() {
        return "Dump: " + label;
    }
}
