package org.voteworth.report;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.voteworth.score.Explanation;
import org.voteworth.score.Ranking;

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
}
