package org.voteworth.score;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.UnaryOperator;
import org.voteworth.tally.TallyTable;

/**
 * Explains the entries of one ranking against the other rankings of the same reviewer table.
 *
 * <p>The margin to a neighbour is given in the unit people understand: how many more helpful
 * votes (with no unhelpful ones) the lower of the two would need to draw level under the rule.
 */
public final class Explainer {
    /** Votes to draw level are searched up to this many; past it a gap is called out of reach. */
    static final long MAX_VOTES_SEARCHED = 100_000_000L;
    /** A 95 % Wilson interval wider than this marks a share as low-evidence. */
    public static final double LOW_EVIDENCE_WIDTH = 0.25;
    /** Default share of T above which one review is said to carry a reviewer's votes (METHODS.md). */
    public static final double DEFAULT_CONCENTRATION_LIMIT = 0.8;

    private final Ranking primary;
    private final List<Ranking> all;
    private final Optional<BetaPrior> prior;
    private final double concentrationLimit;
    private UnaryOperator<String> ids = UnaryOperator.identity();

    /**
     * @param primary the ranking to explain
     * @param others rankings of the same table under other rules (the primary may be among them)
     * @param prior the prior used by the Bayesian rules, for the shrinkage weight
     * @param concentrationLimit share of T above which {@link Flag#VOTE_CONCENTRATION} is raised
     */
    public Explainer(Ranking primary, List<Ranking> others, Optional<BetaPrior> prior, double concentrationLimit) {
        this.primary = primary;
        this.all = new ArrayList<>();
        this.all.add(primary);
        for (Ranking r : others) {
            if (r.table() != primary.table()) {
                throw new IllegalArgumentException("rankings to compare must rank the same reviewer table");
            }
            if (!r.rule().name().equals(primary.rule().name())) {
                this.all.add(r);
            }
        }
        this.prior = prior;
        this.concentrationLimit = concentrationLimit;
    }

    /** Shows ids through {@code mask} (e.g. a keyed pseudonym) in every explanation and sentence. */
    public Explainer withIds(UnaryOperator<String> mask) {
        this.ids = mask;
        return this;
    }

    /** Explanations of ranks 1..k (fewer when fewer are ranked). */
    public List<Explanation> explainTop(int k) {
        List<Explanation> out = new ArrayList<>();
        for (int r = 1; r <= Math.min(k, primary.size()); r++) {
            out.add(explain(r));
        }
        return out;
    }

    public Explanation explain(int rank) {
        if (rank < 1 || rank > primary.size()) {
            throw new IllegalArgumentException("rank " + rank + " is outside 1.." + primary.size());
        }
        TallyTable t = primary.table();
        RankingRule rule = primary.rule();
        int slot = primary.slotAt(rank);
        Evidence e = Evidence.of(t, slot);
        double score = primary.scoreAt(rank);
        long reviews = t.reviews(slot);
        var tally = t.get(slot);
        double verifiedShare = reviews == 0 ? 0 : (double) tally.verified() / reviews;

        Map<String, Integer> ranks = new LinkedHashMap<>();
        for (Ranking r : all) {
            ranks.put(r.rule().name(), r.rankOf(slot));
        }

        List<Flag> flags = new ArrayList<>();
        Interval wilson = WilsonScore.interval(e.helpfulVotes(), e.totalVotes(), 0.95);
        if (wilson.upper() - wilson.lower() > LOW_EVIDENCE_WIDTH) {
            flags.add(Flag.LOW_EVIDENCE);
        }
        if (tally.maxReviewShare() > concentrationLimit) {
            flags.add(Flag.VOTE_CONCENTRATION);
        }
        if (reviews >= 5 && verifiedShare < 0.5) {
            flags.add(Flag.LOW_VERIFIED_SHARE);
        }

        Optional<Interval> interval = rule.interval(e);
        OptionalDouble weight = prior.map(p -> OptionalDouble.of(p.shrinkage(e.totalVotes()))).orElse(OptionalDouble.empty());

        List<String> reasons = new ArrayList<>();
        StringBuilder first = new StringBuilder();
        first.append("#").append(rank).append(" of ").append(primary.size()).append(" by ").append(rule.label())
                .append(": ").append(e.helpfulVotes()).append(" of ").append(e.totalVotes()).append(" votes helpful (")
                .append(percent(e.share())).append("), score ").append(num(score));
        interval.ifPresent(i -> first.append(", ").append(percent(i.confidence())).append(" interval ")
                .append(num(i.lower())).append(" to ").append(num(i.upper())));
        first.append('.');
        reasons.add(first.toString());
        reasons.add("Votes come from " + e.votedReviews() + " of " + reviews + (reviews == 1 ? " review" : " reviews")
                + "; the largest single review holds " + percent(tally.maxReviewShare()) + " of them.");
        prior.ifPresent(p -> reasons.add("The prior Beta(" + num2(p.alpha()) + ", " + num2(p.beta()) + ") is worth "
                + num2(p.strength()) + " votes centred on " + percent(p.mean()) + "; this reviewer's votes carry weight w = "
                + num(weight.orElseThrow()) + ", so the Bayesian average is " + num(p.posterior(e.helpfulVotes(), e.totalVotes()).mean()) + "."));
        for (Ranking r : all) {
            if (r != primary) {
                reasons.add(compare(r, slot, rank, e));
            }
        }
        if (flags.contains(Flag.LOW_EVIDENCE)) {
            reasons.add("Caution: with " + e.totalVotes() + " votes the share could lie anywhere from " + percent(wilson.lower())
                    + " to " + percent(wilson.upper()) + " (95 % Wilson interval).");
        }
        if (flags.contains(Flag.VOTE_CONCENTRATION)) {
            reasons.add("Caution: one review carries " + percent(tally.maxReviewShare())
                    + " of the votes, so the score says more about that review than about the reviewer; see the review-majority rule.");
        }
        if (flags.contains(Flag.LOW_VERIFIED_SHARE)) {
            reasons.add("Caution: only " + percent(verifiedShare) + " of the reviews are verified purchases.");
        }

        Optional<Explanation.Neighbour> above = rank > 1 ? Optional.of(neighbour(rank - 1, rank, true)) : Optional.empty();
        Optional<Explanation.Neighbour> below = rank < primary.size() ? Optional.of(neighbour(rank + 1, rank, false)) : Optional.empty();
        above.ifPresent(n -> reasons.add(n.sentence()));
        below.ifPresent(n -> reasons.add(n.sentence()));

        return new Explanation(rank, ids.apply(t.id(slot)), rule.name(), rule.label(), score, interval, e.helpfulVotes(),
                e.totalVotes(), e.share(), reviews, e.votedReviews(), tally.maxReviewShare(), tally.herfindahl(),
                verifiedShare, weight, ranks, above, below, flags, reasons);
    }

    /** How this reviewer fares under another rule, and why it differs. */
    private String compare(Ranking other, int slot, int rank, Evidence e) {
        int otherRank = other.rankOf(slot);
        String name = other.rule().label();
        if (otherRank == 0) {
            return "Under " + name + " not ranked (" + (other.rule().eligible(e) ? "below its entry bar: " + other.bar().describe() : "not eligible") + ").";
        }
        String base = "Under " + name + ": #" + otherRank + ".";
        if (other.rule().name().equals("raw-share") && otherRank > rank + 2) {
            int fewer = 0;
            for (int r = 1; r < otherRank; r++) {
                if (primary.table().totalVotes(other.slotAt(r)) < e.totalVotes()) {
                    fewer++;
                }
            }
            String who = fewer == otherRank - 1 ? "All " + fewer + " reviewers" : fewer + " of the " + (otherRank - 1) + " reviewers";
            return base + " " + who + " above it there have fewer votes than its " + e.totalVotes()
                    + ": a higher raw share on less evidence.";
        }
        if (other.rule().name().equals("raw-share") && otherRank + 2 < rank) {
            return base + " Its raw share " + percent(e.share()) + " ranks higher than its evidence supports: with "
                    + e.totalVotes() + " votes the true share may well be lower.";
        }
        return base;
    }

    private Explanation.Neighbour neighbour(int otherRank, int rank, boolean isAbove) {
        TallyTable t = primary.table();
        int otherSlot = primary.slotAt(otherRank);
        double otherScore = primary.scoreAt(otherRank);
        double gap = Math.abs(primary.scoreAt(rank) - otherScore);
        // The lower of the two is the one that would need votes to draw level.
        int lowerSlot = isAbove ? primary.slotAt(rank) : otherSlot;
        double target = isAbove ? otherScore : primary.scoreAt(rank);
        long votes = gap == 0 ? 0 : votesToReach(Evidence.of(t, lowerSlot), target);
        String id = ids.apply(t.id(otherSlot));
        String sentence;
        if (isAbove) {
            sentence = "Behind #" + otherRank + " (" + id + ", " + num(otherScore) + ") by " + num(gap) + "; "
                    + drawLevel(votes, "it would need");
        } else {
            sentence = "Ahead of #" + otherRank + " (" + id + ", " + num(otherScore) + ") by " + num(gap) + "; "
                    + drawLevel(votes, id + " would need");
        }
        return new Explanation.Neighbour(otherRank, id, otherScore, gap, votes, sentence);
    }

    private String drawLevel(long votes, String who) {
        if (votes == 0) {
            return "a tie on score, broken by total votes, then by id.";
        }
        if (votes < 0) {
            return "no number of further helpful votes would close the gap under this rule.";
        }
        if (countsReviews()) {
            return who + " about " + votes + " more " + (votes == 1 ? "review" : "reviews") + " that most voters found helpful to draw level.";
        }
        return who + " about " + votes + " more helpful " + (votes == 1 ? "vote" : "votes") + " (and no unhelpful ones) to draw level.";
    }

    /** Smallest k with score(H + k, T + k) >= target, or -1 when none up to the search limit. */
    long votesToReach(Evidence e, double target) {
        RankingRule rule = primary.rule();
        if (rule.score(plus(e, MAX_VOTES_SEARCHED)) < target) {
            return -1;
        }
        long lo = 0;
        long hi = MAX_VOTES_SEARCHED;
        while (hi - lo > 1) {
            long mid = lo + (hi - lo) / 2;
            if (rule.score(plus(e, mid)) >= target) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /**
     * The evidence after k more helpful votes on one new review; for a rule that counts reviews,
     * after k more reviews that most voters found helpful (one vote each).
     */
    private Evidence plus(Evidence e, long k) {
        return countsReviews()
                ? new Evidence(e.helpfulVotes() + k, e.totalVotes() + k, e.votedReviews() + k, e.majorityReviews() + k)
                : new Evidence(e.helpfulVotes() + k, e.totalVotes() + k, e.votedReviews() + 1, e.majorityReviews() + 1);
    }

    private boolean countsReviews() {
        return primary.rule() instanceof ReviewMajority;
    }

    static String percent(double share) {
        if (Double.isNaN(share)) {
            return "n/a";
        }
        double p = share * 100;
        return (p == Math.rint(p) ? String.format(Locale.ROOT, "%.0f", p) : String.format(Locale.ROOT, "%.1f", p)) + " %";
    }

    static String num(double v) {
        return String.format(Locale.ROOT, "%.4f", v);
    }

    static String num2(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }
}
