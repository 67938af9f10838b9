package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.voteworth.analysis.DatasetOverview;
import org.voteworth.report.Grid;
import org.voteworth.report.Json;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.OverviewWriter;
import org.voteworth.source.RejectRateExceeded;
import org.voteworth.source.FileReport;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyUnit;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code voteworth tally}: a dump in, the reviewer table, the rejects and the reconciliation out. */
@Command(name = "tally", mixinStandardHelpOptions = true,
        description = {"Streams a review dump and writes per-reviewer vote tallies across all categories.",
                "Writes reviewers.csv (one row per reviewer), rejects.tsv (every rejected row with file, line, field "
                        + "and reason), reconciliation.txt and overview.json (the data set overview, as 'overview' "
                        + "prints it) to --out, and prints the reconciliation "
                        + "read = accepted + rejected per file."})
final class TallyCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Option(names = "--out", defaultValue = "voteworth-out", paramLabel = "DIR",
            description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--unit", defaultValue = "reviewer", paramLabel = "reviewer|review",
            description = "Tally per reviewer (default) or per review.")
    String unit;

    @Option(names = "--format", defaultValue = "table", paramLabel = "table|md|csv|json",
            description = "Format of the summary on stdout (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--quiet", description = "No progress on stderr.")
    boolean quiet;

    @Option(names = "--store", paramLabel = "DIR",
            description = "Write the columnar store to DIR in the same pass instead of --out: reviewers.parquet, every review's "
                    + "numeric columns in reviews/part-*.parquet (sorted by reviewer, then date), rejects.tsv and manifest.json. "
                    + "rank, sweep, compare, audit and profile then read DIR instead of the dump.")
    Path store;

    @Option(names = "--append", description = "With --store: add new dump files to the store in DIR (a file it already holds is refused).")
    boolean append;

    @Override
    public Integer call() throws IOException {
        PrintWriter outw = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        OutputFormat f = OutputFormat.parse(format);
        if (store != null || append) {
            return StoreTally.run(this, outw, err, f);
        }
        Files.createDirectories(out);
        Path rejects = dump.rejectsFile().orElse(out.resolve("rejects.tsv"));
        TallyUnit u = unit(unit);
        Path table = out.resolve(u == TallyUnit.REVIEW ? "reviews.csv" : "reviewers.csv");
        Path reconciliation = out.resolve("reconciliation.txt");
        Path overview = out.resolve("overview.json");
        // Written under partial names and renamed at the end: an interrupted run leaves nothing that looks complete.
        // Reviews per reviewer need reviewer tallies, so the review unit writes no overview.
        List<Path> finals = u == TallyUnit.REVIEWER ? List.of(table, rejects, reconciliation, overview)
                : List.of(table, rejects, reconciliation);
        List<Path> partials = finals.stream().map(TallyCommand::partial).toList();
        try (TallyRun.TempCleanup cleanup = TallyRun.TempCleanup.register(partials)) {
            for (Path p : finals) {
                Files.deleteIfExists(p);
            }
            TallyRun.Written r;
            try {
                r = TallyRun.write(dump, u, partials.get(0), partials.get(1), quiet, err);
            } catch (RejectRateExceeded e) {
                // Stopped for too many rejects: the rejects so far are the evidence, so they stay; nothing else is written.
                Files.move(partials.get(1), rejects, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
                throw e.keptIn(rejects);
            }
            TallyRun.Written shown = new TallyRun.Written(r.reviewers(), r.unit(), r.summary(), rejects, r.seconds(), r.bytes(),
                    r.spills(), r.overview());
            Files.writeString(partials.get(2), r.summary().describe());
            if (u == TallyUnit.REVIEWER) {
                Files.writeString(partials.get(3), OverviewWriter.write(DatasetOverview.of(r.overview()), OutputFormat.JSON,
                        OverviewCommand.parameters(dump, shown)));
            }
            for (int i = 0; i < finals.size(); i++) {
                Files.move(partials.get(i), finals.get(i), java.nio.file.StandardCopyOption.REPLACE_EXISTING,
                        java.nio.file.StandardCopyOption.ATOMIC_MOVE);
            }
            outw.print(summary(shown, table, f));
            outw.flush();
            return r.summary().reconciles() ? 0 : 1;
        }
    }

    private static Path partial(Path p) {
        return p.resolveSibling("." + p.getFileName() + ".partial");
    }

    static TallyUnit unit(String s) {
        return switch (s.toLowerCase(Locale.ROOT)) {
            case "reviewer" -> TallyUnit.REVIEWER;
            case "review" -> TallyUnit.REVIEW;
            default -> throw new IllegalArgumentException("--unit takes reviewer or review, not '" + s + "'");
        };
    }

    static String summary(TallyRun.Written r, Path table, OutputFormat f) {
        Grid g = new Grid(List.of("file", "read>", "accepted>", "rejected>", "reject_rate>"));
        for (FileReport fr : r.summary().files()) {
            g.add(List.of(fr.file().toString(), Long.toString(fr.rowsRead()), Long.toString(fr.accepted()),
                    Long.toString(fr.rejected()), String.format(Locale.ROOT, "%.4f", fr.rejectRate())));
        }
        g.add(List.of("total", Long.toString(r.summary().rowsRead()), Long.toString(r.summary().accepted()),
                Long.toString(r.summary().rejected()), String.format(Locale.ROOT, "%.4f",
                        r.summary().rowsRead() == 0 ? 0.0 : (double) r.summary().rejected() / r.summary().rowsRead())));
        String totals = String.format(Locale.ROOT, "%,d %s from %,d rows in %.2f s (%s); %,d rejected, reasons %s",
                r.reviewers(), r.unit() == TallyUnit.REVIEW ? "reviews" : "reviewers", r.summary().accepted(),
                r.seconds(), r.throughput(), r.summary().rejected(), r.summary().rejectsByReason());
        String check = r.summary().reconciles()
                ? String.format(Locale.ROOT, "read = accepted + rejected holds: %,d = %,d + %,d", r.summary().rowsRead(),
                        r.summary().accepted(), r.summary().rejected())
                : "read = accepted + rejected does NOT hold: see reconciliation.txt";
        return switch (f) {
            case TABLE -> r.summary().describe() + "\n" + totals + "\nreviewer table: " + table + "\nrejects: "
                    + r.rejectsFile() + "\n" + (r.unit() == TallyUnit.REVIEWER ? "overview: " + table.resolveSibling("overview.json") + "\n" : "");
            case MD -> "# Tally\n\n" + g.toMarkdown() + "\n" + totals + "\n\n" + check + "\n\n- reviewer table: `" + table
                    + "`\n- rejects: `" + r.rejectsFile() + "`\n";
            case CSV -> g.toCsv();
            case JSON -> Json.object(w -> {
                w.field("reviewers", r.reviewers());
                w.field("spills", r.spills());
                w.field("rows_read", r.summary().rowsRead());
                w.field("accepted", r.summary().accepted());
                w.field("rejected", r.summary().rejected());
                w.field("reconciles", r.summary().reconciles());
                w.field("seconds", r.seconds());
                w.field("bytes", r.bytes());
                w.field("reviewer_table", table.toString());
                w.field("rejects_file", r.rejectsFile().toString());
                w.map("rejects_by_reason", r.summary().rejectsByReason());
                w.array("files", r.summary().files(), (fw, fr) -> {
                    fw.field("file", fr.file().toString());
                    fw.field("category", fr.file().category());
                    fw.field("read", fr.rowsRead());
                    fw.field("accepted", fr.accepted());
                    fw.field("rejected", fr.rejected());
                    fw.map("rejects_by_reason", fr.rejectsByReason());
                });
            });
        };
    }
}
