package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.function.UnaryOperator;
import org.voteworth.analysis.PromotionList;
import org.voteworth.analysis.RankUncertainty;
import org.voteworth.analysis.ThresholdSweep;
import org.voteworth.demo.DemoOptions;
import org.voteworth.demo.PlantedCases;
import org.voteworth.report.Cautions;
import org.voteworth.report.Grid;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.RankingReport;
import org.voteworth.report.RankingWriter;
import org.voteworth.score.EntryBar;
import org.voteworth.score.Explainer;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code voteworth demo}: the whole journey on the bundled demo dump (or a freshly generated one):
 * tally, fit the prior, rank under three rules side by side, explain, and write every output.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the main job on the bundled demo dump of a fictional marketplace: tally, fit the "
                + "empirical-Bayes prior, rank by raw share above an entry bar, by Wilson lower bound and by "
                + "Bayesian average side by side, explain every rank, and write the outputs to --out, ending with one "
                + "self-contained HTML report (report.html) whose path it prints.",
                "With --rows or --size it first generates a fresh dump of that size."})
final class DemoCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--out", defaultValue = "voteworth-demo", paramLabel = "DIR", description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--data", paramLabel = "DIR", description = "Dump to use (default: the bundled demo-data folder).")
    Path data;

    @Option(names = "--rows", paramLabel = "N", description = "Generate a fresh dump of N rows into DIR/dump first.")
    Long rows;

    @Option(names = "--size", paramLabel = "BYTES", description = "Generate a fresh dump of about this size (e.g. 200MB) first.")
    String size;

    @Option(names = "--seed", defaultValue = "" + DemoOptions.DEFAULT_SEED, paramLabel = "SEED", description = "Seed for --rows/--size.")
    long seed;

    @Option(names = "--top", defaultValue = "10", paramLabel = "K", description = "Ranks per list (default: ${DEFAULT-VALUE}).")
    int top;

    @Option(names = "--raw-bar", defaultValue = "5", paramLabel = "N",
            description = "Entry bar (helpful votes) of the raw-share list, as analysts set it today (default: ${DEFAULT-VALUE}).")
    long rawBar;

    @Mixin
    PrivacyOptions privacy;

    @Option(names = "--quiet", description = "No progress on stderr.")
    boolean quiet;

    @Override
    public Integer call() throws IOException {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Files.createDirectories(out);
        Path dumpDir = dumpFolder(err);

        DumpOptions dump = new DumpOptions();
        dump.inputs = List.of(dumpDir.toString());
        dump.maxRejectRate = 0.05;
        TallyRun.Result t = TallyRun.run(dump, TallyUnit.REVIEWER, out.resolve("rejects.tsv"), quiet, err);
        TallyTable table = t.table();
        ReviewerTableFile.write(table, out.resolve("reviewers.csv"));
        Files.writeString(out.resolve("reconciliation.txt"), t.summary().describe());

        ScoringOptions defaults = new ScoringOptions();
        defaults.prior = "fit";
        defaults.fitFloor = 1;
        PriorFit fit = RankRun.prior(table, defaults);
        RuleSettings settings = new RuleSettings(0.95, 0.05, fit.prior());
        Ranking raw = Ranker.rank(table, Rules.byName("raw-share", settings), EntryBar.helpful(rawBar));
        Ranking wilson = Ranker.rank(table, Rules.byName("wilson", settings), EntryBar.NONE);
        Ranking bayes = Ranker.rank(table, Rules.byName("bayes-mean", settings), EntryBar.NONE);
        List<Ranking> all = List.of(raw, wilson, bayes);
        UnaryOperator<String> ids = privacy.ids();

        List<Path> written = new ArrayList<>();
        for (Ranking r : all) {
            RankRun run = new RankRun(table, fit, settings, r.bar(), r, all, Explainer.DEFAULT_CONCENTRATION_LIMIT);
            RankingReport report = run.report(r, top, ids, Map.of("input", dumpDir.toString()));
            for (OutputFormat f : List.of(OutputFormat.MD, OutputFormat.CSV, OutputFormat.JSON)) {
                Path p = out.resolve("ranking-" + r.rule().name() + "." + f.extension());
                Files.writeString(p, RankingWriter.write(report, f, true));
                written.add(p);
            }
        }
        Path html = out.resolve("report.html");
        RankRun wilsonRun = new RankRun(table, fit, settings, wilson.bar(), wilson, all, Explainer.DEFAULT_CONCENTRATION_LIMIT);
        List<String> rawTop = java.util.Arrays.stream(raw.top(top)).mapToObj(table::id).toList();
        Map<String, String> htmlParameters = new java.util.LinkedHashMap<>();
        htmlParameters.put("input", dumpDir.toString());
        htmlParameters.put("raw-share entry bar", raw.bar().describe());
        ReportCommand.write(html, t, wilsonRun, wilson, top, ReportCommand.DEFAULT_ROWS, ids,
                Optional.of(PromotionList.of("the raw-share top " + top + " (" + raw.bar().describe() + ")", rawTop)),
                RankUncertainty.Settings.defaults(top, UncertaintyOptions.DEFAULT_SEED), ThresholdSweep.DEFAULT_BARS,
                htmlParameters, Optional.empty(), List.of());
        written.add(html);
        String side = sideBySide(all, top, ids, table);
        String summary = summary(t, fit, all, side, ids);
        Files.writeString(out.resolve("summary.md"), summary);

        o.println(console(t, fit, all, side, ids));
        o.println("Outputs in " + out.toAbsolutePath().normalize() + ":");
        o.println("  report.html           the report to share: charts, the ranking, sweep, comparison, audit, one panel per reviewer");
        o.println("  summary.md            what the demo shows, the three lists side by side, the prior, the cautions");
        o.println("  ranking-RULE.md|csv|json  the explained top " + top + " under raw-share, wilson and bayes-mean");
        o.println("  reviewers.csv         the reviewer table (" + table.size() + " reviewers)");
        o.println("  rejects.tsv           the " + t.summary().rejected() + " rejected rows with file, line, field and reason");
        o.println("  reconciliation.txt    read = accepted + rejected, per file");
        o.println();
        o.println("Open the report (it works offline): " + html.toAbsolutePath().normalize());
        o.flush();
        return t.summary().reconciles() ? 0 : 1;
    }

    private Path dumpFolder(PrintWriter err) throws IOException {
        if (rows != null || size != null) {
            if (rows != null && size != null) {
                throw new IllegalArgumentException("give --rows or --size, not both");
            }
            DemoOptions d = (rows != null ? DemoOptions.rows(rows) : DemoOptions.size(DemoOptions.parseSize(size))).withSeed(seed);
            Path dir = out.resolve("dump");
            GenerateCommand.generate(d, dir, quiet ? null : err);
            return dir;
        }
        if (data != null) {
            return data;
        }
        return bundledDemoData().orElseThrow(() -> new IllegalArgumentException(
                "the bundled demo-data folder was not found; run from the project folder, give --data DIR, or generate one with --rows 40000"));
    }

    /** demo-data beside the project the jar was built in, else in the working folder. */
    static Optional<Path> bundledDemoData() {
        List<Path> candidates = new ArrayList<>();
        try {
            Path jar = Path.of(DemoCommand.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            // target/voteworth.jar or target/classes: the project is two levels up.
            if (jar.getParent() != null && jar.getParent().getParent() != null) {
                candidates.add(jar.getParent().getParent().resolve("demo-data"));
            }
        } catch (URISyntaxException | SecurityException | IllegalArgumentException e) {
            // fall through to the working folder
        }
        candidates.add(Path.of("demo-data"));
        return candidates.stream().filter(Files::isDirectory).findFirst();
    }

    static String sideBySide(List<Ranking> all, int k, UnaryOperator<String> ids, TallyTable table) {
        List<String> h = new ArrayList<>(List.of("rank>"));
        for (Ranking r : all) {
            h.add(r.rule().label() + (r.bar().minimum() > 0 ? ", " + r.bar().describe() : ""));
        }
        Grid g = new Grid(h);
        for (int rank = 1; rank <= k; rank++) {
            List<String> row = new ArrayList<>(List.of(Integer.toString(rank)));
            for (Ranking r : all) {
                if (rank > r.size()) {
                    row.add("");
                    continue;
                }
                int s = r.slotAt(rank);
                row.add(ids.apply(table.id(s)) + " (" + table.helpfulVotes(s) + "/" + table.totalVotes(s) + ")");
            }
            g.add(row);
        }
        return g.toMarkdown();
    }

    /** Median total votes of a top-k list: the figure that shows what each list rests on. */
    static long medianVotes(Ranking r, int k) {
        int[] top = r.top(k);
        long[] v = new long[top.length];
        for (int i = 0; i < top.length; i++) {
            v[i] = r.table().totalVotes(top[i]);
        }
        java.util.Arrays.sort(v);
        return v.length == 0 ? 0 : v[v.length / 2];
    }

    private String findings(List<Ranking> all, UnaryOperator<String> ids) {
        StringBuilder b = new StringBuilder();
        for (Ranking r : all) {
            int[] topK = r.top(top);
            long perfect = java.util.Arrays.stream(topK)
                    .filter(s -> r.table().helpfulVotes(s) == r.table().totalVotes(s)).count();
            b.append(String.format(Locale.ROOT, "- %s%s: %d of the top %d have every vote helpful (100 %%); median total votes in the list %d.%n",
                    r.rule().label(), r.bar().minimum() > 0 ? " (" + r.bar().describe() + ")" : "", perfect, topK.length,
                    medianVotes(r, top)));
        }
        TallyTable t = all.get(0).table();
        for (String id : List.of(PlantedCases.EXPERT, PlantedCases.VIRAL)) {
            int s = t.find(id);
            if (s < 0) {
                continue;
            }
            StringBuilder ranks = new StringBuilder();
            for (Ranking r : all) {
                ranks.append(ranks.length() == 0 ? "" : ", ").append(r.rule().name()).append(" #").append(r.rankOf(s) == 0 ? "-" : r.rankOf(s));
            }
            b.append(String.format(Locale.ROOT, "- %s (%d of %d votes helpful, %.1f %%; top review holds %.0f %% of the votes): %s.%n",
                    ids.apply(id), t.helpfulVotes(s), t.totalVotes(s), 100.0 * t.helpfulVotes(s) / Math.max(1, t.totalVotes(s)),
                    100 * t.get(s).maxReviewShare(), ranks));
        }
        return b.toString();
    }

    private String console(TallyRun.Result t, PriorFit fit, List<Ranking> all, String side, UnaryOperator<String> ids) {
        return String.format(Locale.ROOT, "voteworth demo: %,d reviews read, %,d accepted, %,d rejected (read = accepted + rejected %s), "
                        + "%,d reviewers, %.1f s (%s)%nprior: %s%n%n%s%n%s", t.summary().rowsRead(), t.summary().accepted(),
                t.summary().rejected(), t.summary().reconciles() ? "holds" : "DOES NOT HOLD", t.table().size(), t.seconds(),
                t.throughput(), RankRun.describe(fit), side, findings(all, ids));
    }

    private String summary(TallyRun.Result t, PriorFit fit, List<Ranking> all, String side, UnaryOperator<String> ids) {
        StringBuilder b = new StringBuilder();
        b.append("# voteworth demo\n\n");
        b.append("The dump of a fictional marketplace, tallied per reviewer across all categories and ranked three ways. ")
                .append("The raw-share list, with the entry bar analysts use today, is filled by small samples at or near 100 %; ")
                .append("the Wilson and Bayesian lists hold the reviewers with the most evidence.\n\n");
        b.append("## The three lists side by side (helpful/total votes)\n\n").append(side).append('\n');
        b.append("## What the lists rest on\n\n").append(findings(all, ids)).append('\n');
        b.append("## Parameters\n\n");
        b.append("- prior: ").append(RankRun.describe(fit)).append('\n');
        b.append("- confidence: 0.95; tie order: higher score, then more total votes, then reviewer id\n");
        for (Ranking r : all) {
            b.append("- ").append(r.rule().name()).append(": ").append(r.rule().describe()).append(" Entry bar: ")
                    .append(r.bar().describe()).append("; ").append(r.size()).append(" ranked.\n");
        }
        b.append("\n## Input and reconciliation\n\n```\n").append(t.summary().describe()).append("```\n\n");
        b.append("## Cautions\n\n");
        Cautions.TEXT.forEach(c -> b.append("- ").append(c).append('\n'));
        return b.toString();
    }
}
