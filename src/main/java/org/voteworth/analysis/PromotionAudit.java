package org.voteworth.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.function.UnaryOperator;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.Evidence;
import org.voteworth.score.Explainer;
import org.voteworth.score.Flag;
import org.voteworth.score.Interval;
import org.voteworth.score.Ranking;
import org.voteworth.score.WilsonLowerBound;
import org.voteworth.score.WilsonScore;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;

/**
 * Audits a promotion list (METHODS.md, "Auditing a promotion list"): for each listed reviewer the
 * probability of meeting the bar, the Wilson bound, the ranks under every rule, P(in top k) and
 * flags; the reviewers not listed who beat its weakest members with high probability; and the
 * summary figures, among them the expected number below the bar Σ(1 − P).
 *
 * <p>Shares are modelled by the posterior Beta(α + H, β + T − H) under the fitted prior. With a
 * target share s, P(meets) = P(θ ≥ s); with a top-k bar, P(meets) = P(in top k) under the named
 * rule by {@link RankUncertainty}. The weakest members are those with P(meets) &lt; 0.5, or, when
 * none is, the one with the lowest posterior mean; P(θ_c &gt; θ_w) comes from
 * {@link BetaComparison}.
 */
public final class PromotionAudit {
    /** Overlooked reviewers kept in the result at most (the summary counts them all). */
    static final int MAX_OVERLOOKED = 25;
    /** A member with less than 1/this of the statistical top k's median total votes is a small sample. */
    public static final int SMALL_SAMPLE_FACTOR = 5;

    private PromotionAudit() {
    }

    /** The bar the list is held to. */
    public sealed interface Bar permits TargetShare, TopK {
        String describe();
    }

    /**
     * A target share held with a confidence: a reviewer meets it when P(θ ≥ share) ≥ confidence.
     *
     * @param share s in (0, 1)
     * @param confidence in (0, 1)
     */
    public record TargetShare(double share, double confidence) implements Bar {
        public TargetShare {
            if (!(share > 0 && share < 1) || !(confidence > 0 && confidence < 1)) {
                throw new IllegalArgumentException("--target-share and --confidence must lie strictly between 0 and 1, got "
                        + share + " and " + confidence);
            }
        }

        @Override
        public String describe() {
            return String.format(Locale.ROOT, "a true helpful share of at least %s, held with %s confidence",
                    RuleComparison.pct(share), RuleComparison.pct(confidence));
        }
    }

    /**
     * Membership of the top k under a rule.
     *
     * @param k list size
     * @param rule the rule's name (its ranking is given to {@link #run})
     */
    public record TopK(int k, String rule) implements Bar {
        public TopK {
            if (k < 1) {
                throw new IllegalArgumentException("--top-k must be at least 1, got " + k);
            }
        }

        @Override
        public String describe() {
            return "membership of the top " + k + " under " + rule;
        }
    }

    /**
     * What the audit needs besides the list.
     *
     * @param prior the prior of the posterior share model
     * @param topKRanking the ranking of P(in top k) and of the statistical top k (for a top-k
     *     bar, the bar's rule)
     * @param k the k of P(in top k): the bar's k, or else the number of listed reviewers found
     *     (0 = that default)
     * @param rankings rankings whose ranks are shown, by rule
     * @param uncertainty Monte Carlo settings (their k is replaced by the audit's k)
     * @param beatProbability P(θ_c &gt; θ_w) at which a reviewer not listed counts as beating a
     *     weakest member, e.g. 0.9
     * @param confidence the confidence of the Wilson bound shown
     * @param concentrationLimit share of T above which one review is said to carry the votes
     */
    public record Settings(BetaPrior prior, Ranking topKRanking, int k, List<Ranking> rankings,
                           RankUncertainty.Settings uncertainty, double beatProbability, double confidence,
                           double concentrationLimit) {
        public Settings {
            rankings = List.copyOf(rankings);
            if (!(beatProbability > 0.5 && beatProbability < 1)) {
                throw new IllegalArgumentException("--beat-probability must lie strictly between 0.5 and 1, got "
                        + beatProbability);
            }
        }
    }

    public static AuditResult run(PromotionList list, Bar bar, Settings s, UnaryOperator<String> ids) {
        TallyTable t = s.topKRanking().table();
        List<Integer> found = new ArrayList<>();
        List<String> missing = new ArrayList<>();
        for (String id : list.ids()) {
            int slot = t.find(id);
            if (slot < 0) {
                missing.add(ids.apply(id));
            } else {
                found.add(slot);
            }
        }
        int k = bar instanceof TopK tk ? tk.k() : s.k() > 0 ? s.k() : Math.max(1, found.size());
        RankUncertainty.Settings u = new RankUncertainty.Settings(k, s.uncertainty().draws(), s.uncertainty().seed(),
                s.uncertainty().threads(), s.uncertainty().lowQuantile(), s.uncertainty().highQuantile());
        RankUncertainty.Result spread = RankUncertainty.of(s.topKRanking(), s.prior(), u);
        Set<Integer> statTop = new HashSet<>();
        for (int slot : s.topKRanking().top(k)) {
            statTop.add(slot);
        }
        long[] topTotals = java.util.Arrays.stream(s.topKRanking().top(k)).mapToLong(t::totalVotes).sorted().toArray();
        double medianTop = topTotals.length == 0 ? 0 : topTotals.length % 2 == 1 ? topTotals[topTotals.length / 2]
                : (topTotals[topTotals.length / 2 - 1] + topTotals[topTotals.length / 2]) / 2.0;
        WilsonLowerBound wilson = new WilsonLowerBound(s.confidence(), false);
        List<AuditResult.Member> members = new ArrayList<>();
        double[] p = new double[found.size()];
        double maxError = 0;
        for (int i = 0; i < found.size(); i++) {
            int slot = found.get(i);
            Evidence e = Evidence.of(t, slot);
            BetaPrior post = s.prior().posterior(e.helpfulVotes(), e.totalVotes());
            RankUncertainty.Spread sp = spread.of(slot);
            maxError = Math.max(maxError, sp.standardError());
            if (bar instanceof TargetShare ts) {
                p[i] = 1 - new BetaDistribution(null, post.alpha(), post.beta(), 1e-12).cumulativeProbability(ts.share());
            } else {
                p[i] = sp.probabilityTopK();
            }
            Map<String, Integer> ranks = new LinkedHashMap<>();
            s.rankings().forEach(r -> ranks.put(r.rule().name(), r.rankOf(slot)));
            members.add(new AuditResult.Member(ids.apply(t.id(slot)), e.helpfulVotes(), e.totalVotes(), e.share(), p[i],
                    wilson.score(e), post.mean(), ranks, sp.probabilityTopK(), sp.standardError(), statTop.contains(slot),
                    flags(t.get(slot), s.concentrationLimit()), e.totalVotes() * (double) SMALL_SAMPLE_FACTOR < medianTop));
        }
        // Weakest members and who beats them.
        List<Integer> weakest = new ArrayList<>();
        for (int i = 0; i < found.size(); i++) {
            if (p[i] < 0.5) {
                weakest.add(i);
            }
        }
        if (weakest.isEmpty() && !found.isEmpty()) {
            int w = 0;
            for (int i = 1; i < found.size(); i++) {
                if (members.get(i).posteriorMean() < members.get(w).posteriorMean()) {
                    w = i;
                }
            }
            weakest.add(w);
        }
        List<AuditResult.Overlooked> overlooked = overlooked(t, s, found, weakest, members, ids);
        int likelyBelow = 0;
        double expectedBelow = 0;
        double minP = 1;
        int inTop = 0;
        for (int i = 0; i < found.size(); i++) {
            expectedBelow += 1 - p[i];
            minP = Math.min(minP, p[i]);
            if (p[i] < 0.5) {
                likelyBelow++;
            }
            if (members.get(i).inStatisticalTopK()) {
                inTop++;
            }
        }
        AuditResult.Summary summary = new AuditResult.Summary(list.ids().size(), found.size(), missing.size(), expectedBelow,
                likelyBelow, minP, found.isEmpty() ? 0 : (double) inTop / found.size(), overlooked.size(), maxError);
        List<AuditResult.Overlooked> shown = overlooked.size() > MAX_OVERLOOKED ? overlooked.subList(0, MAX_OVERLOOKED) : overlooked;
        return new AuditResult(list.source(), bar.describe(), ShareModel.posterior(s.prior()).describe(),
                s.topKRanking().rule().name(), k, members, missing, list.duplicates().stream().map(ids).toList(), shown, summary);
    }

    static List<Flag> flags(ReviewerTally tally, double concentrationLimit) {
        List<Flag> flags = new ArrayList<>();
        Interval w = WilsonScore.interval(tally.helpfulVotes(), tally.totalVotes(), 0.95);
        if (w.upper() - w.lower() > Explainer.LOW_EVIDENCE_WIDTH) {
            flags.add(Flag.LOW_EVIDENCE);
        }
        if (tally.maxReviewShare() > concentrationLimit) {
            flags.add(Flag.VOTE_CONCENTRATION);
        }
        double verified = tally.reviews() == 0 ? 0 : (double) tally.verified() / tally.reviews();
        if (tally.reviews() >= 5 && verified < 0.5) {
            flags.add(Flag.LOW_VERIFIED_SHARE);
        }
        return flags;
    }

    private static List<AuditResult.Overlooked> overlooked(TallyTable t, Settings s, List<Integer> found, List<Integer> weakest,
                                                           List<AuditResult.Member> members, UnaryOperator<String> ids) {
        if (weakest.isEmpty()) {
            return List.of();
        }
        Set<Integer> listed = new HashSet<>(found);
        double minMean = weakest.stream().mapToDouble(i -> members.get(i).posteriorMean()).min().orElse(1);
        NormalDistribution normal = new NormalDistribution(null, 0, 1);
        Map<String, Double> cache = new HashMap<>();
        List<AuditResult.Overlooked> out = new ArrayList<>();
        for (int c = 0; c < t.size(); c++) {
            if (listed.contains(c) || t.totalVotes(c) == 0) {
                continue;
            }
            BetaPrior pc = s.prior().posterior(t.helpfulVotes(c), t.totalVotes(c));
            if (pc.mean() <= minMean) {
                continue;
            }
            List<String> beats = new ArrayList<>();
            double minBeat = 1;
            for (int wi : weakest) {
                int w = found.get(wi);
                BetaPrior pw = s.prior().posterior(t.helpfulVotes(w), t.totalVotes(w));
                double sd = Math.sqrt(pc.sd() * pc.sd() + pw.sd() * pw.sd());
                // A normal approximation screens out clear cases; the exact integral decides the rest.
                if (normal.cumulativeProbability((pc.mean() - pw.mean()) / sd) < s.beatProbability() - 0.15) {
                    continue;
                }
                String key = t.helpfulVotes(c) + "/" + t.totalVotes(c) + ":" + t.helpfulVotes(w) + "/" + t.totalVotes(w);
                double prob = cache.computeIfAbsent(key, kk -> BetaComparison.probabilityGreater(pc, pw));
                if (prob >= s.beatProbability()) {
                    beats.add(members.get(wi).reviewer());
                    minBeat = Math.min(minBeat, prob);
                }
            }
            if (!beats.isEmpty()) {
                out.add(new AuditResult.Overlooked(ids.apply(t.id(c)), t.helpfulVotes(c), t.totalVotes(c), pc.mean(),
                        s.topKRanking().rankOf(c), beats, minBeat));
            }
        }
        out.sort(Comparator.comparingInt((AuditResult.Overlooked o) -> -o.beats().size())
                .thenComparing(o -> -o.posteriorMean()).thenComparing(AuditResult.Overlooked::reviewer));
        return out;
    }
}
