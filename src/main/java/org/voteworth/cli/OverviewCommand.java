package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.voteworth.analysis.DatasetOverview;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.OverviewWriter;
import org.voteworth.store.Store;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyUnit;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** {@code voteworth overview}: what is in a dump, per category and overall, from exact counts in one pass. */
@Command(name = "overview", mixinStandardHelpOptions = true,
        description = {"Streams a review dump once and describes it per category and overall: rows, reviewers, the star "
                + "histogram, helpful and total votes per review (min, quartiles, median, p90, p99, max, mean, sd; exact), "
                + "the share of reviews without votes, verified and incentivised shares, reviews per reviewer and reviews "
                + "per month.",
                "Input: a dump (files, folders, globs). 'tally' writes the same overview as overview.json beside the "
                        + "reviewer table."})
final class OverviewCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Mixin
    ReportOptions report;

    @Override
    public Integer call() throws IOException {
        if (dump.inputs.size() == 1 && Files.isRegularFile(Path.of(dump.inputs.get(0)))
                && ReviewerTableFile.looksLikeReviewerTable(Path.of(dump.inputs.get(0)))) {
            throw new IllegalArgumentException(dump.inputs.get(0) + " is a reviewer table (votes already summed per reviewer);"
                    + " the overview needs each review's row: give the dump instead");
        }
        OutputFormat f = report.format();
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = report.prepare(dump);
        TallyRun.Written w;
        if (dump.inputs.size() == 1 && Store.isStore(Path.of(dump.inputs.get(0)))) {
            w = StoreTally.overview(Path.of(dump.inputs.get(0)));
        } else {
            Files.createDirectories(dump.tmpDir());
            // The reviewer table is only needed for reviews per reviewer; it is written within --memory and dropped.
            Path table = Files.createTempFile(dump.tmpDir(), "voteworth-overview-", ".csv");
            try (TallyRun.TempCleanup cleanup = TallyRun.TempCleanup.register(table)) {
                w = TallyRun.write(dump, TallyUnit.REVIEWER, table, rejects, report.quiet, err);
            }
        }
        DatasetOverview o = DatasetOverview.of(w.overview());
        report.emit(spec, "overview", f, OverviewWriter.write(o, f, parameters(dump, w)));
        return report.finish(w.summary(), err);
    }

    /** The parameters an overview starts with: what was read, and how it reconciles. */
    static Map<String, String> parameters(DumpOptions d, TallyRun.Written w) {
        Map<String, String> p = new LinkedHashMap<>();
        p.put("input", String.join(" ", d.inputs) + " (" + w.summary().files().size() + " files)");
        p.put("rows", String.format(Locale.ROOT, "%,d read = %,d accepted + %,d rejected%s", w.summary().rowsRead(),
                w.summary().accepted(), w.summary().rejected(), w.summary().reconciles() ? "" : " (does NOT reconcile)"));
        p.put("rejects", w.rejectsFile().toString());
        return p;
    }
}
