package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.voteworth.analysis.SweepResult;
import org.voteworth.analysis.ThresholdSweep;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.SweepWriter;
import org.voteworth.score.PriorFit;
import org.voteworth.score.RankingRule;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code voteworth sweep}: does the top k depend on an arbitrary entry bar? */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {"Ranks under each rule at a grid of entry bars and shows the top k at each bar, the Jaccard overlap "
                + "with the previous bar and with the lowest bar, who enters and leaves and why, and threshold artefacts: "
                + "reviewers with far more evidence missing at a low bar yet present at a higher one.",
                "Input: a dump (files, folders, globs) or a reviewers.csv written by 'tally'."})
final class SweepCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Mixin
    ScoringOptions scoring;

    @Mixin
    PrivacyOptions privacy;

    @Option(names = "--rules", split = ",", paramLabel = "RULE",
            description = "Rules to sweep (default: raw-share,wilson,bayes-mean; --rule NAME sweeps that one only).")
    List<String> rules = new ArrayList<>(List.of("raw-share", "wilson", "bayes-mean"));

    @Option(names = "--bars", split = ",", paramLabel = "N",
            description = "Entry bars to sweep, counted on --bar-on votes (default: 0,5,10,20,50,100,200,300,500).")
    List<Long> bars = new ArrayList<>(ThresholdSweep.DEFAULT_BARS);

    @Option(names = "--top", defaultValue = "10", paramLabel = "K", description = "Size of each list (default: ${DEFAULT-VALUE}).")
    int top;

    @Mixin
    ReportOptions report;

    @Override
    public Integer call() throws IOException {
        if (top < 1) {
            throw new IllegalArgumentException("--top must be at least 1, not " + top);
        }
        for (long b : bars) {
            if (b < 0) {
                throw new IllegalArgumentException("--bars: an entry bar cannot be negative, got " + b);
            }
        }
        OutputFormat f = report.format();
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = report.prepare(dump);
        TallyRun.Result t = AnalysisInput.read(dump, scoring, org.voteworth.tally.TallyUnit.REVIEWER, rejects, report.quiet, err);
        PriorFit fit = RankRun.prior(t.table(), scoring);
        RuleSettings settings = new RuleSettings(scoring.confidence, scoring.quantile, fit.prior());
        List<String> names = spec.commandLine().getParseResult().hasMatchedOption("--rule") ? List.of(scoring.rule) : rules;
        List<RankingRule> chosen = names.stream().map(n -> Rules.byName(n.trim(), settings)).toList();
        SweepResult r = ThresholdSweep.run(t.table(), chosen, scoring.entryBar().on(), bars, top, privacy.ids());
        Map<String, String> p = AnalysisInput.parameters(fit, scoring, dump, t.table());
        report.emit(spec, "sweep", f, SweepWriter.write(r, f, p));
        return report.finish(t, err);
    }
}
