package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.function.UnaryOperator;
import org.voteworth.analysis.AuditResult;
import org.voteworth.analysis.ComparisonResult;
import org.voteworth.analysis.PromotionAudit;
import org.voteworth.analysis.PromotionList;
import org.voteworth.analysis.RankBiasedOverlap;
import org.voteworth.analysis.RankUncertainty;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.analysis.RuleComparison;
import org.voteworth.analysis.SweepResult;
import org.voteworth.analysis.ThresholdSweep;
import org.voteworth.report.HtmlReport;
import org.voteworth.report.IdMask;
import org.voteworth.report.RankingReport;
import org.voteworth.score.Ranking;
import org.voteworth.score.RankingRule;
import org.voteworth.store.Store;
import org.voteworth.tally.TallyUnit;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code voteworth report}: one self-contained HTML file with charts, for people who will not run a command. */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Writes one HTML file that opens offline in any browser: the data set, a funnel plot of helpful share "
                + "against votes with control limits, the ranking under --rule with rank intervals and P(in top k), the "
                + "entry-bar sweep, the rules compared, the audit of --list when given, a panel per top reviewer, and the "
                + "cautions, parameters and input files. Prints the file's path.",
                "Input: a dump (files, folders, globs), a reviewers.csv written by 'tally', or a store written by 'tally --store';"
                        + " from a store the page also profiles the top reviewers and those given by --profile."})
final class ReportCommand implements Callable<Integer> {
    /** Ranked rows the ranking table holds at most; the page stays usable (paginated) at this size. */
    static final int DEFAULT_ROWS = 10_000;

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

    @Option(names = "--top", defaultValue = "20", paramLabel = "K",
            description = "Size of the lists: panels, rank intervals, P(in top k), sweep and comparison (default: ${DEFAULT-VALUE}).")
    int top;

    @Option(names = "--rows", defaultValue = "" + DEFAULT_ROWS, paramLabel = "N",
            description = "Ranked reviewers the ranking table holds (default: ${DEFAULT-VALUE}).")
    int rows;

    @Option(names = "--bars", split = ",", paramLabel = "N",
            description = "Entry bars of the sweep, counted on --bar-on votes (default: 0,5,10,20,50,100,200,300,500).")
    List<Long> bars = new ArrayList<>(ThresholdSweep.DEFAULT_BARS);

    @Option(names = "--list", paramLabel = "FILE",
            description = "A promotion list to audit against the top K under --rule: one reviewer id per line, or a CSV with a"
                    + " reviewer_id column.")
    Path list;

    @Option(names = "--profile", paramLabel = "ID",
            description = "A reviewer to profile besides the top K (repeatable); needs a store as the input.")
    List<String> profileIds = new ArrayList<>();

    @Option(names = "--out", defaultValue = "voteworth-report.html", paramLabel = "FILE",
            description = "The HTML file to write (default: ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--quiet", description = "No progress or reconciliation on stderr.")
    boolean quiet;

    @Override
    public Integer call() throws IOException {
        if (top < 1 || rows < 1) {
            throw new IllegalArgumentException("--top and --rows must be at least 1, not " + top + " and " + rows);
        }
        Optional<Path> store = AnalysisInput.store(dump);
        if (store.isEmpty() && !profileIds.isEmpty()) {
            throw new IllegalArgumentException("--profile needs a store as the input (written by 'tally --store DIR'), not "
                    + String.join(" ", dump.inputs));
        }
        Optional<PromotionList> promoted = list == null ? Optional.empty() : Optional.of(PromotionList.read(list));
        PrintWriter err = spec.commandLine().getErr();
        Path parent = out.toAbsolutePath().getParent();
        Files.createDirectories(parent);
        Path rejects = dump.rejectsFile().orElse(parent.resolve("rejects.tsv"));
        TallyRun.Result t = AnalysisInput.readWithOverview(dump, scoring, TallyUnit.REVIEWER, rejects, quiet, err);
        RankRun run = RankRun.of(t.table(), scoring);
        Map<String, String> p = new LinkedHashMap<>(AnalysisInput.parameters(run.fit, scoring, dump, t.table()));
        Optional<Store> profiled = store.isEmpty() ? Optional.empty() : Optional.of(Store.open(store.get()));
        if (profiled.isPresent() && !profiled.get().hasReviews()) {
            if (!profileIds.isEmpty()) {
                throw new IllegalArgumentException("--profile needs each review: " + store.get() + " holds the reviewer table"
                        + " only; build a store with 'voteworth tally DUMP... --store DIR' on the dump files");
            }
            profiled = Optional.empty();
        }
        write(out, t, run, run.primary, top, rows, privacy.ids(), promoted, uncertainty.settings(top, dump.threads()), bars, p,
                profiled, profileIds);
        PrintWriter stdout = spec.commandLine().getOut();
        stdout.println(out.toAbsolutePath().normalize());
        stdout.flush();
        if (!quiet && !t.summary().files().isEmpty()) {
            err.print(t.summary().describe());
            err.flush();
        }
        return t.summary().reconciles() ? 0 : 1;
    }

    /**
     * Computes every section of the report over one ranking run and writes the HTML file.
     *
     * @param primary the ranking the report is about (one of {@code run.compared})
     * @param promoted a list to audit against the top {@code k} of {@code primary}
     * @param parameters what the reader needs to reproduce the report; the rule, bars and seed are added
     * @param store the store the input was read from, when it holds each review: to profile the top {@code k} of
     *     {@code primary} and {@code profileIds}
     */
    static void write(Path file, TallyRun.Result t, RankRun run, Ranking primary, int k, int rows, UnaryOperator<String> ids,
                      Optional<PromotionList> promoted, RankUncertainty.Settings draws, List<Long> bars,
                      Map<String, String> parameters, Optional<Store> store, List<String> profileIds) throws IOException {
        Map<String, String> p = new LinkedHashMap<>(run.parameters(primary));
        p.putAll(parameters);
        p.put("lists", "top " + k);
        p.put("sweep bars", bars + " " + primary.bar().on().name().toLowerCase(java.util.Locale.ROOT) + " votes");
        p.put("monte carlo", draws.draws() + " draws, seed " + draws.seed());
        p.put("pseudonyms", !(ids instanceof IdMask) ? "no: reviewer ids as in the input"
                : "yes: reviewer ids replaced by a keyed HMAC-SHA-256 pseudonym");
        RankingReport ranking = run.report(primary, rows, ids, Map.of());
        RankUncertainty.Result u = RankUncertainty.of(primary, run.fit.prior(), draws);
        List<RankingRule> rules = run.compared.stream().map(Ranking::rule).toList();
        SweepResult sweep = ThresholdSweep.run(t.table(), rules, primary.bar().on(), bars, k, ids);
        ComparisonResult comparison = RuleComparison.compare(run.compared, k, RankBiasedOverlap.DEFAULT_PERSISTENCE,
                run.concentrationLimit, ids);
        Optional<AuditResult> audit = promoted.map(l -> PromotionAudit.run(l, new PromotionAudit.TopK(k, primary.rule().name()),
                new PromotionAudit.Settings(run.fit.prior(), primary, k, run.compared, draws, 0.9, run.settings.confidence(),
                        run.concentrationLimit), ids));
        audit.ifPresent(a -> p.put("audit", "the list " + a.list() + " against the top " + k + " under " + primary.rule().name()));
        Optional<HtmlReport.Profiles> profiles = Optional.empty();
        if (store.isPresent()) {
            Set<String> wanted = new LinkedHashSet<>();
            Arrays.stream(primary.top(k)).mapToObj(t.table()::id).forEach(wanted::add);
            wanted.addAll(profileIds);
            List<ReviewerProfile> found = new ArrayList<>();
            for (String id : wanted) {
                found.add(ReviewerProfile.of(store.get(), id));
            }
            profiles = Optional.of(new HtmlReport.Profiles(found, ids));
            p.put("profiles", "the top " + k + (profileIds.isEmpty() ? "" : " and " + profileIds.size() + " asked for")
                    + ", from the store's reviews");
        }
        HtmlReport html = new HtmlReport("Reviewer credibility report", p, t.summary(), t.table(), t.overview(), ranking, u, k, sweep,
                comparison, audit, profiles);
        Files.writeString(file, html.render());
    }
}
