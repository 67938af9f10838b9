package org.voteworth.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.UnaryOperator;
import org.voteworth.report.RankingReport;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.EntryBar;
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
        Map<String, String> p = new LinkedHashMap<>(parameters(ranking));
        p.putAll(extra);
        return RankingReport.explain(ranking, compared, fit, concentrationLimit, k, ids, p);
    }

    Map<String, String> parameters(Ranking ranking) {
        return RankingReport.parameters(ranking, fit, settings.confidence());
    }

    static String describe(PriorFit f) {
        return f.describe();
    }
}
