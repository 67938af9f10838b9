package org.voteworth.report;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.voteworth.score.Explainer;
import org.voteworth.score.Explanation;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranking;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;

/**
 * A ranking ready to write: the explained top entries under one rule, the rules it is compared
 * with, and the parameters a reader needs to reproduce it.
 *
 * @param title one line, e.g. "Top 20 reviewers by Wilson lower bound (95 %)"
 * @param ranking the ranking explained
 * @param compared other rankings of the same table whose ranks are shown beside
 * @param entries explanations of the ranks shown, in rank order, ids already masked if wanted
 * @param parameters rule, confidence, prior, bar, inputs ... as label → value, in order
 */
public record RankingReport(String title, Ranking ranking, List<Ranking> compared, List<Explanation> entries,
                            Map<String, String> parameters) {
    public RankingReport {
        compared = List.copyOf(compared);
        entries = List.copyOf(entries);
        parameters = new LinkedHashMap<>(parameters);
    }

    /**
     * The explained top {@code k} of {@code ranking}, with the ranks under every compared rule
     * beside, titled, with {@code parameters} (see {@link #parameters}) to reproduce it.
     *
     * @param compared the rankings whose ranks are shown beside ({@code ranking} may be among them)
     * @param fit the prior of the Bayesian rules, for the explanations
     * @param concentrationLimit share of the votes above which one review is flagged as carrying them
     * @param ids how ids appear (e.g. a keyed pseudonym)
     */
    public static RankingReport explain(Ranking ranking, List<Ranking> compared, PriorFit fit, double concentrationLimit,
                                        int k, UnaryOperator<String> ids, Map<String, String> parameters) {
        Explainer ex = new Explainer(ranking, compared, Optional.of(fit.prior()), concentrationLimit).withIds(ids);
        String title = "Top " + Math.min(k, ranking.size()) + " by " + ranking.rule().label()
                + (ranking.bar().minimum() > 0 ? ", " + ranking.bar().describe() : "");
        return new RankingReport(title, ranking, compared, ex.explainTop(k), parameters);
    }

    /** What a ranking report states to be reproduced: rule, entry bar, how many ranked, confidence, prior, tie order. */
    public static Map<String, String> parameters(Ranking ranking, PriorFit fit, double confidence) {
        Map<String, String> p = new LinkedHashMap<>();
        p.put("rule", ranking.rule().label() + ": " + ranking.rule().describe());
        p.put("entry bar", ranking.bar().describe());
        TallyTable table = ranking.table();
        p.put("ranked", ranking.size() + " of " + table.size() + (table.unit() == TallyUnit.REVIEW ? " reviews" : " reviewers")
                + " (those with at least one vote" + (ranking.bar().minimum() > 0 ? " and past the bar" : "") + ")");
        p.put("confidence", Double.toString(confidence));
        p.put("prior", fit.describe());
        p.put("tie order", "higher score, then more total votes, then reviewer id");
        return p;
    }
}
