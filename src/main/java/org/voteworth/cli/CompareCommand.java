package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import org.voteworth.analysis.ComparisonResult;
import org.voteworth.analysis.RankBiasedOverlap;
import org.voteworth.analysis.RuleComparison;
import org.voteworth.report.CompareWriter;
import org.voteworth.report.OutputFormat;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code voteworth compare}: two or more ranking rules side by side. */
@Command(name = "compare", mixinStandardHelpOptions = true,
        description = {"Ranks under two or more rules and shows their top k in one table with every reviewer's rank under "
                + "every rule; Jaccard at k, Kendall's tau-b and Spearman's rho over the union, rank-biased overlap, and a "
                + "sentence per large disagreement naming why the rules disagree (evidence, concentration, prior).",
                "Input: a dump (files, folders, globs) or a reviewers.csv written by 'tally'."})
final class CompareCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Mixin
    ScoringOptions scoring;

    @Mixin
    PrivacyOptions privacy;

    @Option(names = "--rules", split = ",", paramLabel = "RULE",
            description = "Rules to compare (default: raw-share,wilson,bayes-mean; --rule NAME is put first).")
    List<String> rules = new ArrayList<>(List.of("raw-share", "wilson", "bayes-mean"));

    @Option(names = "--persistence", defaultValue = "0.9", paramLabel = "P",
            description = "Persistence p of rank-biased overlap (default: ${DEFAULT-VALUE}).")
    double persistence = RankBiasedOverlap.DEFAULT_PERSISTENCE;

    @Option(names = "--top", defaultValue = "10", paramLabel = "K", description = "Size of each list (default: ${DEFAULT-VALUE}).")
    int top;

    @Mixin
    ReportOptions report;

    @Override
    public Integer call() throws IOException {
        if (top < 1) {
            throw new IllegalArgumentException("--top must be at least 1, not " + top);
        }
        OutputFormat f = report.format();
        Set<String> names = new LinkedHashSet<>();
        if (spec.commandLine().getParseResult().hasMatchedOption("--rule")) {
            names.add(scoring.rule);
        }
        rules.forEach(r -> names.add(r.trim()));
        if (names.size() < 2) {
            throw new IllegalArgumentException("compare needs at least two different rules, got " + names
                    + ": give --rules A,B[,C...]");
        }
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = report.prepare(dump);
        TallyRun.Result t = AnalysisInput.read(dump, scoring, org.voteworth.tally.TallyUnit.REVIEWER, rejects, report.quiet, err);
        PriorFit fit = RankRun.prior(t.table(), scoring);
        RuleSettings settings = new RuleSettings(scoring.confidence, scoring.quantile, fit.prior());
        List<Ranking> rankings = new ArrayList<>();
        for (String n : names) {
            rankings.add(Ranker.rank(t.table(), Rules.byName(n, settings), scoring.entryBar()));
        }
        ComparisonResult r = RuleComparison.compare(rankings, top, persistence, scoring.concentrationLimit, privacy.ids());
        Map<String, String> p = AnalysisInput.parameters(fit, scoring, dump, t.table());
        p.put("entry bar", scoring.entryBar().describe());
        p.put("rank-biased overlap", "extrapolated (RBO_EXT), persistence p = " + persistence);
        report.emit(spec, "compare", f, CompareWriter.write(r, f, p));
        return report.finish(t, err);
    }
}
