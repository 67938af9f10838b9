package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.voteworth.report.OutputFormat;
import org.voteworth.source.CategoryFromName;
import org.voteworth.store.Store;
import org.voteworth.store.StoreManifest;
import org.voteworth.store.StoreWriter;
import org.voteworth.tally.OverviewCounts;
import org.voteworth.tally.TallyUnit;

/** {@code voteworth tally --store DIR [--append]}: the tally and the columnar store in one scan. */
final class StoreTally {
    private StoreTally() {
    }

    static int run(TallyCommand c, PrintWriter out, PrintWriter err, OutputFormat f) throws IOException {
        if (c.store == null) {
            throw new IllegalArgumentException("--append adds to a store: give it with --store DIR");
        }
        if (TallyCommand.unit(c.unit) != TallyUnit.REVIEWER) {
            throw new IllegalArgumentException("--store keeps the reviewer table and every review; drop --unit review "
                    + "(rank --unit review reads a store as well)");
        }
        if (c.spec.commandLine().getParseResult().hasMatchedOption("--out") || c.dump.rejectsFile().isPresent()) {
            throw new IllegalArgumentException("with --store everything goes into " + c.store + " (rejects.tsv, reconciliation.txt); "
                    + "drop --out and --rejects");
        }
        DumpOptions d = c.dump;
        Map<String, String> mapping = new TreeMap<>();
        TallyRun.mapping(d).overrides().forEach((field, header) -> mapping.put(field.key(), header));
        String pattern = d.categoryPattern != null ? d.categoryPattern : CategoryFromName.DEFAULT_PATTERN;
        Files.createDirectories(d.tmpDir());
        Path tmp = Files.createTempDirectory(d.tmpDir(), "voteworth-store-");
        // The review sort buffers take a quarter of --memory on top of the tallies' budget (the launcher's heap is
        // the budget plus 128 MiB).
        long buffers = Math.max(1, d.memoryBytes() / 4);
        try (StoreWriter w = c.append ? StoreWriter.append(c.store, mapping, pattern, buffers)
                : StoreWriter.create(c.store, mapping, pattern, buffers);
             TallyRun.TempCleanup cleanup = TallyRun.TempCleanup.register(List.of(tmp, w.tempFolder()))) {
            Path table = tmp.resolve("reviewers.csv");
            Path rejects = tmp.resolve("rejects.tsv");
            TallyRun.Written r = TallyRun.write(d, TallyUnit.REVIEWER, table, rejects, c.quiet, err, Optional.of(w));
            int spilled = w.spills();
            long t0 = System.nanoTime();
            StoreManifest m = w.finish(table, r.summary(), rejects, d.threads());
            double storeSeconds = (System.nanoTime() - t0) / 1e9;
            Store s = Store.open(c.store);
            Files.writeString(c.store.resolve("reconciliation.txt"), s.summary().describe());
            TallyRun.Written shown = new TallyRun.Written(m.reviewers(), TallyUnit.REVIEWER, r.summary(),
                    c.store.resolve(Store.REJECTS), r.seconds() + storeSeconds, r.bytes(), r.spills(), r.overview());
            out.print(TallyCommand.summary(shown, c.store.resolve(Store.REVIEWERS), f));
            if (f == OutputFormat.TABLE || f == OutputFormat.MD) {
                out.printf(Locale.ROOT, "store: %s, %,d reviews of %,d reviewers from %d files in %d parts, %.1f MB (%s; %s)%n",
                        c.store, m.accepted(), m.reviewers(), m.files().size(), m.reviewParts(), sizeOf(c.store) / 1e6,
                        c.append ? "appended " + r.summary().files().size() + " files" : "new",
                        spilled == 0 ? "sorted in memory" : spilled + " sorted runs spilled under --memory");
            }
            out.flush();
            return r.summary().reconciles() ? 0 : 1;
        } finally {
            TallyRun.deleteTree(tmp);
        }
    }

    /**
     * The data set overview of a store, counted from its reviews and reviewer table (never the
     * dump), with the store's reconciliation.
     */
    static TallyRun.Written overview(Path dir) throws IOException {
        long start = System.nanoTime();
        Store s = Store.open(dir);
        OverviewCounts counts = new OverviewCounts();
        s.scan(counts);
        s.forEachReviewer(counts::addReviewer);
        return new TallyRun.Written(s.manifest().reviewers(), TallyUnit.REVIEWER, s.summary(), s.rejectsFile(),
                (System.nanoTime() - start) / 1e9, sizeOf(dir), 0, counts);
    }

    /** Bytes of the store's files (not of hidden temporary ones). */
    static long sizeOf(Path dir) throws IOException {
        try (java.util.stream.Stream<Path> s = Files.walk(dir)) {
            return s.filter(Files::isRegularFile).filter(p -> !dir.relativize(p).toString().startsWith("."))
                    .mapToLong(p -> p.toFile().length()).sum();
        }
    }
}
