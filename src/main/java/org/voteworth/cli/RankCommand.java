package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.Callable;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.RankingReport;
import org.voteworth.report.RankingWriter;
import org.voteworth.report.UncertainRankingWriter;
import org.voteworth.analysis.RankUncertainty;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code voteworth rank}: the explained top k under one rule, with the ranks under other rules beside. */
@Command(name = "rank", mixinStandardHelpOptions = true,
        description = {"Ranks reviewers under a rule and explains every rank: inputs, score, interval, the prior's "
                + "pull, the ranks under the other rules, the margins to the neighbours and flags.",
                "Input: a dump (files, folders, globs) or a reviewers.csv written by 'tally'."})
final class RankCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Mixin
    ScoringOptions scoring;

    @Mixin
    PrivacyOptions privacy;

    @Option(names = "--top", defaultValue = "20", paramLabel = "K", description = "How many ranks to show (default: ${DEFAULT-VALUE}).")
    int top;

    @Option(names = "--format", defaultValue = "table", paramLabel = "table|md|csv|json",
            description = "Output format (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--out", paramLabel = "DIR", description = "Write ranking-RULE.EXT into this folder instead of stdout.")
    Path out;

    @Option(names = "--explain", description = "With --format table: print the reasons under the table.")
    boolean explain;

    @Option(names = "--unit", defaultValue = "reviewer", paramLabel = "reviewer|review", description = "Rank reviewers (default) or single reviews.")
    String unit;

    @Option(names = "--quiet", description = "No progress or reconciliation on stderr.")
    boolean quiet;

    @Option(names = "--uncertainty", description = "Add P(in top k), its Monte Carlo error and the 5 %%-95 %% rank interval "
            + "to every format (seeded Monte Carlo; see --draws, --seed, --uncertainty-k).")
    boolean withUncertainty;

    @Option(names = "--uncertainty-k", defaultValue = "0", paramLabel = "K",
            description = "The k of P(in top k) (default: --top).")
    int uncertaintyK;

    @Mixin
    UncertaintyOptions uncertainty;

    @Override
    public Integer call() throws IOException {
        if (top < 1) {
            throw new IllegalArgumentException("--top must be at least 1, not " + top);
        }
        OutputFormat f = OutputFormat.parse(format);
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = dump.rejectsFile().orElse(out != null ? out.resolve("rejects.tsv") : Path.of("voteworth-rejects.tsv"));
        if (out != null) {
            Files.createDirectories(out);
        }
        TallyRun.Result t = AnalysisInput.read(dump, scoring, TallyCommand.unit(unit), rejects, quiet, err);
        RankRun run = RankRun.of(t.table(), scoring);
        RankingReport report = run.report(run.primary, top, privacy.ids(), Map.of("input", String.join(" ", dump.inputs)));
        String text = withUncertainty
                ? UncertainRankingWriter.write(report, RankUncertainty.of(run.primary,
                        uncertainty.settings(uncertaintyK > 0 ? uncertaintyK : top)), f, explain)
                : RankingWriter.write(report, f, explain);
        if (out == null) {
            spec.commandLine().getOut().print(text);
            spec.commandLine().getOut().flush();
        } else {
            Path file = out.resolve("ranking-" + run.primary.rule().name() + "." + f.extension());
            Files.writeString(file, text);
            spec.commandLine().getOut().println("wrote " + file);
            spec.commandLine().getOut().flush();
        }
        if (!quiet && !t.summary().files().isEmpty()) {
            err.print(t.summary().describe());
            err.flush();
        }
        return t.summary().reconciles() ? 0 : 1;
    }
}
