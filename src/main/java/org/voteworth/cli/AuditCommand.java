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
import org.voteworth.analysis.AuditResult;
import org.voteworth.analysis.FailPolicy;
import org.voteworth.analysis.PromotionAudit;
import org.voteworth.analysis.PromotionList;
import org.voteworth.report.AuditWriter;
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

/** {@code voteworth audit}: holds a promotion list someone made to a bar, and can gate a pipeline. */
@Command(name = "audit", mixinStandardHelpOptions = true,
        description = {"Audits a promotion list: for each listed reviewer P(meets the bar), the Wilson bound, ranks under "
                + "each rule, P(in top k) and flags; the reviewers not listed who beat its weakest members with high "
                + "probability; ids not in the data; and summary figures (expected number below the bar = sum of 1 - P, "
                + "precision against the statistical top k).",
                "Bar: --target-share S (held with --confidence C), or --top-k K under --rule NAME.",
                "--fail-if takes comma-separated METRIC OP NUMBER conditions (OP: < <= > >=; quote them for the shell); "
                        + "metrics: expected-below, below, min-probability, precision, missing, overlooked. "
                        + "e.g. --fail-if 'expected-below>1,min-probability<0.5'.",
                "Exit codes: 0 the list passes, 3 the --fail-if policy fails, 1 error, 2 usage error."})
final class AuditCommand implements Callable<Integer> {
    /** Exit code when the policy fails (1 stays for errors, 2 for usage). */
    static final int POLICY_FAILED = 3;

    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Mixin
    ScoringOptions scoring;

    @Mixin
    PrivacyOptions privacy;

    @Mixin
    UncertaintyOptions uncertainty;

    @Option(names = "--list", required = true, paramLabel = "FILE",
            description = "The promotion list: one reviewer id per line (# comments), or a CSV with a reviewer_id column.")
    Path list;

    @Option(names = "--target-share", paramLabel = "S",
            description = "Bar: a true helpful share of at least S, held with --confidence.")
    Double targetShare;

    @Option(names = "--top-k", paramLabel = "K", description = "Bar: membership of the top K under --rule.")
    Integer topK;

    @Option(names = "--top", defaultValue = "0", paramLabel = "K",
            description = "With --target-share: the k of P(in top k) and of the statistical top k under --rule "
                    + "(default: the number of listed reviewers found).")
    int top;

    @Option(names = "--beat-probability", defaultValue = "0.9", paramLabel = "P",
            description = "A reviewer not listed is overlooked when their share beats a weakest member's with at least this "
                    + "posterior probability (default: ${DEFAULT-VALUE}).")
    double beatProbability;

    @Option(names = "--fail-if", paramLabel = "POLICY", description = "Exit " + POLICY_FAILED
            + " when any condition holds, e.g. 'expected-below>1,min-probability<0.5'.")
    String failIf;

    @Mixin
    ReportOptions report;

    @Override
    public Integer call() throws IOException {
        if ((targetShare == null) == (topK == null)) {
            throw new IllegalArgumentException("give the bar to hold the list to: either --target-share S (with --confidence C)"
                    + " or --top-k K (with --rule NAME), not " + (targetShare == null ? "neither" : "both"));
        }
        if (top < 0) {
            throw new IllegalArgumentException("--top must be 0 (the list size) or more, not " + top);
        }
        OutputFormat f = report.format();
        FailPolicy policy = failIf == null ? FailPolicy.NONE : FailPolicy.parse(failIf);
        PromotionList promoted = PromotionList.read(list);
        PrintWriter err = spec.commandLine().getErr();
        Path rejects = report.prepare(dump);
        TallyRun.Result t = AnalysisInput.read(dump, scoring, org.voteworth.tally.TallyUnit.REVIEWER, rejects, report.quiet, err);
        PriorFit fit = RankRun.prior(t.table(), scoring);
        RuleSettings settings = new RuleSettings(scoring.confidence, scoring.quantile, fit.prior());
        Ranking primary = Ranker.rank(t.table(), Rules.byName(scoring.rule, settings), scoring.entryBar());
        Set<String> shown = new LinkedHashSet<>(List.of("raw-share", "wilson", "bayes-mean"));
        shown.add(scoring.rule);
        List<Ranking> rankings = new ArrayList<>();
        for (String n : shown) {
            rankings.add(n.equals(scoring.rule) ? primary : Ranker.rank(t.table(), Rules.byName(n, settings), scoring.entryBar()));
        }
        PromotionAudit.Bar bar = targetShare != null ? new PromotionAudit.TargetShare(targetShare, scoring.confidence)
                : new PromotionAudit.TopK(topK, scoring.rule);
        PromotionAudit.Settings s = new PromotionAudit.Settings(fit.prior(), primary, top, rankings,
                uncertainty.settings(Math.max(1, top), dump.threads()), beatProbability, scoring.confidence, scoring.concentrationLimit);
        AuditResult r = PromotionAudit.run(promoted, bar, s, privacy.ids());
        List<String> failures = policy.failures(r.summary());
        Map<String, String> p = AnalysisInput.parameters(fit, scoring, dump, t.table());
        p.put("rule", primary.rule().label() + ", " + scoring.entryBar().describe());
        p.put("monte carlo", uncertainty.draws + " draws, seed " + uncertainty.seed);
        p.put("policy", failIf == null ? "none" : failIf);
        report.emit(spec, "audit", f, AuditWriter.write(r, f, p, failures));
        int reconciled = report.finish(t, err);
        if (!failures.isEmpty()) {
            err.println("voteworth audit: the list fails the policy: " + String.join("; ", failures));
            err.flush();
            return POLICY_FAILED;
        }
        return reconciled;
    }
}
