package org.voteworth.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.voteworth.report.RankingReport;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.EntryBar;
import org.voteworth.score.Explainer;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.score.RankingRule;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;
import org.voteworth.score.VoteFrequencyTable;
import org.voteworth.tally.TallyTable;

/** One ranking job: the prior, the chosen rule and the compared rules over one reviewer table. */
final class RankRun {
    final TallyTable table;
    final PriorFit fit;
    final RuleSettings settings;
    final EntryBar bar;
    final Ranking primary;
    final List<Ranking> compared;
    final double concentrationLimit;

    RankRun(TallyTable table, PriorFit fit, RuleSettings settings, EntryBar bar, Ranking primary,
                    List<Ranking> compared, double concentrationLimit) {
        this.table = table;
        this.fit = fit;
        this.settings = settings;
        this.bar = bar;
        this.primary = primary;
        this.compared = compared;
        this.concentrationLimit = concentrationLimit;
    }

    static RankRun of(TallyTable table, ScoringOptions o) {
        PriorFit fit = prior(table, o);
        RuleSettings settings = new RuleSettings(o.confidence, o.quantile, fit.prior());
        EntryBar bar = o.entryBar();
        RankingRule rule = Rules.byName(o.rule, settings);
        Ranking primary = Ranker.rank(table, rule, bar);
        List<Ranking> compared = new ArrayList<>();
        compared.add(primary);
        for (String name : o.compare) {
            if (!name.equals(rule.name())) {
                compared.add(Ranker.rank(table, Rules.byName(name, settings), bar));
            }
        }
        return new RankRun(table, fit, settings, bar, primary, compared, o.concentrationLimit);
    }

    static PriorFit prior(TallyTable table, ScoringOptions o) {
        if (o.prior.equalsIgnoreCase("fit")) {
            return EmpiricalBayesPrior.fit(VoteFrequencyTable.of(table, Math.max(1, o.fitFloor)));
        }
        String[] ab = o.prior.split(",");
        if (ab.length != 2) {
            throw new IllegalArgumentException("--prior takes 'fit' or ALPHA,BETA (e.g. 2.3,14.1), not '" + o.prior + "'");
        }
        try {
            return PriorFit.given(new BetaPrior(Double.parseDouble(ab[0].trim()), Double.parseDouble(ab[1].trim())));
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("--prior: '" + o.prior + "' is not two numbers ALPHA,BETA");
        }
    }

    /** The explained top k of {@code ranking}, with the ranks under every compared rule beside. */
    RankingReport report(Ranking ranking, int k, UnaryOperator<String> ids, Map<String, String> extra) {
        Explainer ex = new Explainer(ranking, compared, Optional.of(fit.prior()), concentrationLimit).withIds(ids);
        String title = "Top " + Math.min(k, ranking.size()) + " by " + ranking.rule().label()
                + (ranking.bar().minimum() > 0 ? ", " + ranking.bar().describe() : "");
        Map<String, String> p = new LinkedHashMap<>(parameters(ranking));
        p.putAll(extra);
        return new RankingReport(title, ranking, compared, ex.explainTop(k), p);
    }

    Map<String, String> parameters(Ranking ranking) {
        Map<String, String> p = new LinkedHashMap<>();
        p.put("rule", ranking.rule().label() + ": " + ranking.rule().describe());
        p.put("entry bar", ranking.bar().describe());
        p.put("ranked", ranking.size() + " of " + table.size() + (table.unit() == org.voteworth.tally.TallyUnit.REVIEW ? " reviews" : " reviewers")
                + " (those with at least one vote" + (ranking.bar().minimum() > 0 ? " and past the bar" : "") + ")");
        p.put("confidence", fmt(settings.confidence()));
        p.put("prior", describe(fit));
        p.put("tie order", "higher score, then more total votes, then reviewer id");
        return p;
    }

    static String describe(PriorFit f) {
        String s = String.format(Locale.ROOT, "Beta(%.4f, %.4f), mean %.4f, strength %.2f votes; %s", f.prior().alpha(),
                f.prior().beta(), f.mu(), f.kappa(), f.method().name().toLowerCase(Locale.ROOT).replace('_', ' '));
        if (f.method() != PriorFit.Method.GIVEN) {
            s += String.format(Locale.ROOT, " over %d reviewers (%d distinct vote pairs), log-likelihood %.2f%s", f.unitsUsed(),
                    f.distinctPairs(), f.logLikelihood(), f.converged() ? "" : ", NOT converged");
        }
        if (!f.warnings().isEmpty()) {
            s += "; " + String.join("; ", f.warnings());
        }
        return s;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%s", v);
    }
}
