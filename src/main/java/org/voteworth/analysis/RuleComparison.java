package org.voteworth.analysis;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.function.UnaryOperator;
import org.voteworth.score.BayesianAverage;
import org.voteworth.score.BayesianLowerQuantile;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.Evidence;
import org.voteworth.score.Ranking;
import org.voteworth.score.ReviewMajority;
import org.voteworth.tally.TallyTable;

/**
 * Compares rankings of one reviewer table: the union of their top-k lists with every reviewer's
 * rank under every rule, and for each pair of rules the Jaccard overlap at k, Kendall's tau-b
 * and Spearman's rho over the union (METHODS.md, "Comparing rankings"), and rank-biased overlap.
 *
 * <p>Over the union a reviewer is ranked by their rank in the rule's full ranking, not only its
 * top k, so that the correlations see how far apart the rules place them; a reviewer the rule
 * does not rank at all (not eligible, or below its bar) takes rank (ranked + 1), tied with the
 * other unranked ones.
 */
public final class RuleComparison {
    /** A reviewer in one rule's top k that the other ranks beyond this many times k disagrees "largely". */
    public static final int LARGE_FACTOR = 2;
    /** Sentences written at most. */
    static final int MAX_SENTENCES = 40;

    private RuleComparison() {
    }

    /**
     * @param rankings at least two rankings of the same table under different rules
     * @param k the list size
     * @param persistence RBO persistence p
     * @param concentrationLimit share of T above which one review is said to carry the votes
     * @param ids how ids appear in the result
     */
    public static ComparisonResult compare(List<Ranking> rankings, int k, double persistence, double concentrationLimit,
                                           UnaryOperator<String> ids) {
        if (rankings.size() < 2) {
            throw new IllegalArgumentException("compare needs at least two rules, got " + rankings.size());
        }
        if (k < 1) {
            throw new IllegalArgumentException("compare's top k must be at least 1, got " + k);
        }
        TallyTable t = rankings.get(0).table();
        for (Ranking r : rankings) {
            if (r.table() != t) {
                throw new IllegalArgumentException("rankings to compare must rank the same reviewer table");
            }
        }
        Set<Integer> union = new LinkedHashSet<>();
        for (int rank = 1; rank <= k; rank++) {
            for (Ranking r : rankings) {
                if (rank <= r.size()) {
                    union.add(r.slotAt(rank));
                }
            }
        }
        List<Integer> slots = new ArrayList<>(union);
        List<ComparisonResult.Row> rows = new ArrayList<>();
        for (int s : slots) {
            Map<String, Integer> ranks = new LinkedHashMap<>();
            rankings.forEach(r -> ranks.put(r.rule().name(), r.rankOf(s)));
            var tally = t.get(s);
            rows.add(new ComparisonResult.Row(ids.apply(t.id(s)), tally.helpfulVotes(), tally.totalVotes(), tally.helpfulShare(),
                    tally.maxReviewShare(), ranks));
        }
        List<ComparisonResult.PairStats> pairs = new ArrayList<>();
        List<String> sentences = new ArrayList<>();
        for (int i = 0; i < rankings.size(); i++) {
            for (int j = i + 1; j < rankings.size(); j++) {
                Ranking a = rankings.get(i);
                Ranking b = rankings.get(j);
                double[] ra = unionRanks(a, slots);
                double[] rb = unionRanks(b, slots);
                double tau = slots.size() >= 2 ? KendallTauB.of(ra, rb) : Double.NaN;
                double rho = slots.size() >= 2 ? SpearmanRho.of(ra, rb) : Double.NaN;
                pairs.add(new ComparisonResult.PairStats(a.rule().name(), b.rule().name(), Jaccard.of(a.top(k), b.top(k)), tau,
                        rho, RankBiasedOverlap.extrapolated(a.top(k), b.top(k), persistence), persistence));
                disagreements(a, b, k, slots, concentrationLimit, ids, sentences);
            }
        }
        List<String> shown = sentences.size() > MAX_SENTENCES
                ? new ArrayList<>(sentences.subList(0, MAX_SENTENCES)) : sentences;
        if (sentences.size() > MAX_SENTENCES) {
            shown.add("... and " + (sentences.size() - MAX_SENTENCES) + " more large disagreements (see the table).");
        }
        List<String> names = rankings.stream().map(r -> r.rule().name()).toList();
        List<String> labels = rankings.stream().map(r -> r.rule().label()).toList();
        return new ComparisonResult(k, names, labels, rows, pairs, shown,
                "a reviewer a rule does not rank takes rank (ranked + 1) under it, tied with the other unranked reviewers");
    }

    static double[] unionRanks(Ranking r, List<Integer> slots) {
        double[] out = new double[slots.size()];
        for (int i = 0; i < out.length; i++) {
            int rank = r.rankOf(slots.get(i));
            out[i] = rank == 0 ? r.size() + 1 : rank;
        }
        return out;
    }

    private static void disagreements(Ranking a, Ranking b, int k, List<Integer> slots, double limit,
                                      UnaryOperator<String> ids, List<String> out) {
        for (int s : slots) {
            int ra = a.rankOf(s);
            int rb = b.rankOf(s);
            boolean aHigh = ra >= 1 && ra <= k && (rb == 0 || rb > LARGE_FACTOR * k);
            boolean bHigh = rb >= 1 && rb <= k && (ra == 0 || ra > LARGE_FACTOR * k);
            if (aHigh) {
                out.add(sentence(a, b, s, limit, ids));
            } else if (bHigh) {
                out.add(sentence(b, a, s, limit, ids));
            }
        }
    }

    /** Why {@code high} ranks the reviewer in its top k and {@code low} far below. */
    static String sentence(Ranking high, Ranking low, int s, double limit, UnaryOperator<String> ids) {
        TallyTable t = high.table();
        var tally = t.get(s);
        Evidence e = Evidence.of(t, s);
        String head = String.format(Locale.ROOT, "%s: #%d by %s, %s by %s", ids.apply(t.id(s)), high.rankOf(s),
                high.rule().name(), low.rankOf(s) == 0 ? "not ranked" : "#" + low.rankOf(s), low.rule().name());
        String h = high.rule().name();
        String l = low.rule().name();
        boolean concentrated = tally.maxReviewShare() > limit;
        if (low.rule() instanceof ReviewMajority && concentrated) {
            return head + String.format(Locale.ROOT, " (concentration): one review holds %s of its %d votes; %s counts every"
                    + " vote, %s counts that review once among its %d voted reviews.", pct(tally.maxReviewShare()),
                    e.totalVotes(), h, l, e.votedReviews());
        }
        if (high.rule() instanceof ReviewMajority) {
            return head + String.format(Locale.ROOT, " (concentration): %d of its %d voted reviews were judged helpful by most"
                    + " voters, but its votes overall are %s helpful (%d of %d), which %s ranks by.", e.majorityReviews(),
                    e.votedReviews(), pct(e.share()), e.helpfulVotes(), e.totalVotes(), l);
        }
        Optional<BetaPrior> prior = prior(high).or(() -> prior(low));
        if (prior.isPresent() && (prior(high).isPresent() != prior(low).isPresent())) {
            BetaPrior p = prior.get();
            double w = p.shrinkage(e.totalVotes());
            if (w < 0.8) {
                return head + String.format(Locale.ROOT, " (prior): its %d votes weigh w = %.2f against a prior worth %.1f votes"
                        + " at %s; %s %s, while %s %s.", e.totalVotes(), w, p.strength(), pct(p.mean()),
                        prior(high).isPresent() ? h : l, "pulls its share of " + pct(e.share()) + " towards the prior",
                        prior(high).isPresent() ? l : h, prior(high).isPresent() ? "holds its few votes against it"
                                : "takes its share nearly at face value");
            }
        }
        if (h.equals("raw-share")) {
            return head + evidenceTag(tally.maxReviewShare(), limit) + String.format(Locale.ROOT, ": %d of %d votes helpful (%s) is a top raw share, but %d votes"
                    + " leave room for a much lower true share, which %s allows for.", e.helpfulVotes(), e.totalVotes(),
                    pct(e.share()), e.totalVotes(), l);
        }
        if (l.equals("raw-share")) {
            return head + evidenceTag(tally.maxReviewShare(), limit) + String.format(Locale.ROOT, ": its %d votes (%s helpful) pin its share down, which %s"
                    + " rewards; %s ranks only the share, so reviewers with fewer votes and a higher share come first.",
                    e.totalVotes(), pct(e.share()), h, l);
        }
        return head + evidenceTag(tally.maxReviewShare(), limit) + String.format(Locale.ROOT, ": %d of %d votes helpful (%s); the rules weigh that much"
                + " evidence differently.", e.helpfulVotes(), e.totalVotes(), pct(e.share()));
    }

    private static String evidenceTag(double topShare, double limit) {
        return topShare > limit ? " (evidence and concentration: one review holds " + pct(topShare) + " of its votes)" : " (evidence)";
    }

    private static Optional<BetaPrior> prior(Ranking r) {
        if (r.rule() instanceof BayesianAverage b) {
            return Optional.of(b.prior());
        }
        if (r.rule() instanceof BayesianLowerQuantile b) {
            return Optional.of(b.prior());
        }
        return Optional.empty();
    }

    static String pct(double share) {
        return String.format(Locale.ROOT, "%.1f %%", 100 * share);
    }

}
