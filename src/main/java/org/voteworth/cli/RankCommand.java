package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
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

    @Mixin
    ReportOptions report;

    @Option(names = "--explain", description = "With --format table: print the reasons under the table.")
    boolean explain;

    @Option(names = "--unit", defaultValue = "reviewer", paramLabel = "reviewer|review", description = "Rank reviewers (default) or single reviews.")
    String unit;

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
        OutputFormat f = report.format();
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = report.prepare(dump);
        TallyRun.Result t = AnalysisInput.read(dump, scoring, TallyCommand.unit(unit), rejects, report.quiet, err);
        RankRun run = RankRun.of(t.table(), scoring);
        RankingReport ranking = run.report(run.primary, top, privacy.ids(), Map.of("input", String.join(" ", dump.inputs)));
        String text = withUncertainty
                ? UncertainRankingWriter.write(ranking, RankUncertainty.of(run.primary, run.fit.prior(),
                        uncertainty.settings(uncertaintyK > 0 ? uncertaintyK : top, dump.threads())), f, explain)
                : RankingWriter.write(ranking, f, explain);
        report.emit(spec, "ranking-" + run.primary.rule().name(), f, text);
        return report.finish(t, err);
    }
}
