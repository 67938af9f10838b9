package org.voteworth.api;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.voteworth.analysis.AuditResult;
import org.voteworth.analysis.ComparisonResult;
import org.voteworth.analysis.PromotionAudit;
import org.voteworth.analysis.PromotionList;
import org.voteworth.analysis.RankBiasedOverlap;
import org.voteworth.analysis.RankUncertainty;
import org.voteworth.analysis.RuleComparison;
import org.voteworth.analysis.SweepResult;
import org.voteworth.analysis.ThresholdSweep;
import org.voteworth.report.AuditWriter;
import org.voteworth.report.CompareWriter;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.RankingReport;
import org.voteworth.report.RankingWriter;
import org.voteworth.report.SweepWriter;
import org.voteworth.score.Explainer;
import org.voteworth.score.Explanation;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranker;
import org.voteworth.tally.TallyTable;

/**
 * A reviewer table ranked under one {@link Rule}: the top k explained, one rank explained, and
 * the analyses that start from a ranking (entry-bar sweep, rule comparison, promotion audit).
 * Ties go to more total votes, then to the smaller id. Every report carries its parameters and
 * the cautions, and shows ids pseudonymised when the table is.
 */
public final class Ranking {
    /** The rules whose ranks every report shows beside the ranking's own. */
    static final List<String> SHOWN = List.of("raw-share", "wilson", "bayes-mean");
    /** Beat probability of the audit's "overlooked" reviewers, as the command line's default. */
    static final double BEAT_PROBABILITY = 0.9;
    /** Seed of the audit's Monte Carlo draws, as the command line's default. */
    static final long SEED = 20240611L;

    private final ReviewerTable table;
    private final Rule rule;
    private final PriorFit fit;
    private final org.voteworth.score.Ranking ranking;

    Ranking(ReviewerTable table, Rule rule, PriorFit fit, org.voteworth.score.Ranking ranking) {
        this.table = table;
        this.rule = rule;
        this.fit = fit;
        this.ranking = ranking;
    }

    /** The rule ranked under. */
    public Rule rule() {
        return rule;
    }

    /** The prior the Bayesian rules used (fitted or given). */
    public PriorFit prior() {
        return fit;
    }

    /** The ranking as the scoring layer holds it (table slots and scores by rank), for computing further. */
    public org.voteworth.score.Ranking ranking() {
        return ranking;
    }

    /** How many reviewers are ranked: those the rule can score and the entry bar admits. */
    public int size() {
        return ranking.size();
    }

    /** The rank of a reviewer (by the id in the dump), or 0 when the rule or the bar leaves them out. */
    public int rankOf(String id) {
        return ranking.rankOf(slot(id));
    }

    /**
     * The ids of the top {@code k}, as the dump spells them (not pseudonymised: they are for
     * passing back to the API, e.g. to {@link #audit(List)}; show them through a report).
     */
    public List<String> topIds(int k) {
        List<String> out = new ArrayList<>();
        for (int slot : ranking.top(k)) {
            out.add(table.tallyTable().id(slot));
        }
        return out;
    }

    /** The explained top {@code k}, with each reviewer's rank under raw-share, wilson and bayes-mean beside. */
    public Report<RankingReport> top(int k) {
        if (k < 1) {
            throw new IllegalArgumentException("the top k must be at least 1, not " + k);
        }
        Map<String, String> p = RankingReport.parameters(ranking, fit, rule.confidence());
        p.putAll(input());
        RankingReport r = RankingReport.explain(ranking, compared(), fit, Explainer.DEFAULT_CONCENTRATION_LIMIT, k,
                table.ids(), p);
        return Report.markdown(r, RankingWriter.write(r, OutputFormat.MD, true), RankingWriter.write(r, OutputFormat.TABLE, false));
    }

    /** Why one reviewer stands where they stand: votes, interval, the prior's pull, the other rules, the neighbours. */
    public Report<Explanation> explain(String id) {
        int rank = rankOf(id);
        if (rank == 0) {
            throw new IllegalArgumentException("reviewer '" + id + "' is not ranked under " + rule.name() + ": "
                    + (table.tallyTable().totalVotes(slot(id)) == 0 ? "they have no votes" : "they do not pass " + rule.entryBar().describe()));
        }
        Explanation e = new Explainer(ranking, compared(), Optional.of(fit.prior()), Explainer.DEFAULT_CONCENTRATION_LIMIT)
                .withIds(table.ids()).explain(rank);
        StringBuilder md = new StringBuilder("### #" + e.rank() + " " + e.reviewer().replace("|", "\\|") + "\n\n");
        StringBuilder text = new StringBuilder("#" + e.rank() + " " + e.reviewer() + "\n");
        for (String s : e.reasons()) {
            md.append("- ").append(s).append('\n');
            text.append("  - ").append(s).append('\n');
        }
        return Report.markdown(e, md.toString(), text.toString());
    }

    /**
     * Ranks again at each entry bar (counted as this rule's bar counts: helpful or total votes)
     * and shows the top {@code k} at each, the overlap between bars, who enters and leaves and why,
     * and threshold artefacts.
     */
    public Report<SweepResult> sweep(int k, long... bars) {
        List<Long> grid = new ArrayList<>();
        for (long b : bars) {
            grid.add(b);
        }
        SweepResult r = ThresholdSweep.run(table.tallyTable(), List.of(ranking.rule()), ranking.bar().on(),
                grid.isEmpty() ? ThresholdSweep.DEFAULT_BARS : grid, k, table.ids());
        Map<String, String> p = parameters();
        p.put("rule", ranking.rule().label());
        return Report.markdown(r, SweepWriter.write(r, OutputFormat.MD, p), SweepWriter.write(r, OutputFormat.TABLE, p));
    }

    /**
     * This ranking beside others of the same table (each with its own entry bar and confidence):
     * ranks, Jaccard at k, Kendall's tau-b, Spearman's rho, rank-biased overlap, and why they disagree.
     */
    public Report<ComparisonResult> compare(int k, Rule... others) {
        if (others.length == 0) {
            throw new IllegalArgumentException("compare needs at least one other rule, e.g. compare(10, Rule.rawShare().bar(5))");
        }
        List<org.voteworth.score.Ranking> all = new ArrayList<>(List.of(ranking));
        for (Rule o : others) {
            all.add(table.rank(o).ranking);
        }
        ComparisonResult r = RuleComparison.compare(all, k, RankBiasedOverlap.DEFAULT_PERSISTENCE,
                Explainer.DEFAULT_CONCENTRATION_LIMIT, table.ids());
        Map<String, String> p = parameters();
        p.put("rank-biased overlap", "extrapolated (RBO_EXT), persistence p = " + RankBiasedOverlap.DEFAULT_PERSISTENCE);
        return Report.markdown(r, CompareWriter.write(r, OutputFormat.MD, p), CompareWriter.write(r, OutputFormat.TABLE, p));
    }

    /** Audits a promotion list against the top k of this ranking, k the number of listed ids. */
    public Report<AuditResult> audit(List<String> promoted) {
        return audit(promoted, PromotionList.of("list", promoted).ids().size());
    }

    /**
     * Audits a promotion list (reviewer ids as in the dump) against membership of this ranking's
     * top {@code k}: for each listed reviewer P(in top k) (seeded Monte Carlo), the Wilson bound and
     * the ranks under each rule; who is overlooked; ids not in the data.
     */
    public Report<AuditResult> audit(List<String> promoted, int k) {
        return audit(promoted, k, RankUncertainty.DEFAULT_DRAWS);
    }

    /** As {@link #audit(List, int)} with {@code draws} Monte Carlo draws (fewer for a quick look; at least 10). */
    public Report<AuditResult> audit(List<String> promoted, int k, int draws) {
        PromotionList list = PromotionList.of("list of " + promoted.size() + " ids", promoted);
        PromotionAudit.Settings s = new PromotionAudit.Settings(fit.prior(), ranking, k, compared(),
                RankUncertainty.Settings.defaults(Math.max(1, k), SEED).withDraws(draws), BEAT_PROBABILITY, rule.confidence(),
                Explainer.DEFAULT_CONCENTRATION_LIMIT);
        AuditResult r = PromotionAudit.run(list, new PromotionAudit.TopK(k, rule.name()), s, table.ids());
        Map<String, String> p = parameters();
        p.put("monte carlo", draws + " draws, seed " + SEED);
        return Report.markdown(r, AuditWriter.write(r, OutputFormat.MD, p, List.of()),
                AuditWriter.write(r, OutputFormat.TABLE, p, List.of()));
    }

    /** This ranking followed by raw-share, wilson and bayes-mean (each once) under the same bar. */
    private List<org.voteworth.score.Ranking> compared() {
        Set<String> names = new LinkedHashSet<>(List.of(rule.name()));
        names.addAll(SHOWN);
        List<org.voteworth.score.Ranking> out = new ArrayList<>();
        for (String n : names) {
            out.add(n.equals(rule.name()) ? ranking : Ranker.rank(table.tallyTable(),
                    new Rule(n, rule.confidence(), rule.quantile(), rule.prior(), rule.entryBar()).build(fit.prior()),
                    ranking.bar()));
        }
        return out;
    }

    private int slot(String id) {
        int slot = table.tallyTable().find(id);
        if (slot < 0) {
            throw new IllegalArgumentException("reviewer '" + id + "' is not in the table of " + table.source()
                    + " (" + table.size() + " reviewers)");
        }
        return slot;
    }

    private Map<String, String> input() {
        Map<String, String> p = new LinkedHashMap<>();
        p.put("input", table.source() + " (" + table.size() + " reviewers)");
        p.put("vote cap", table.capVotes() == 0 ? "none" : "at most " + table.capVotes() + " votes per review, helpful scaled in proportion");
        return p;
    }

    private Map<String, String> parameters() {
        Map<String, String> p = input();
        p.put("rule", ranking.rule().label() + ", " + ranking.bar().describe());
        p.put("confidence", Double.toString(rule.confidence()));
        p.put("prior", fit.describe());
        p.put("tie order", "higher score, then more total votes, then reviewer id");
        return p;
    }

    @Override
    public String toString() {
        TallyTable t = table.tallyTable();
        return "Ranking: " + ranking.size() + " of " + t.size() + " reviewers ranked by " + ranking.rule().label()
                + (ranking.bar().minimum() > 0 ? ", " + ranking.bar().describe() : "");
    }
}
