package org.voteworth.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.UnaryOperator;
import org.voteworth.score.EntryBar;
import org.voteworth.score.Evidence;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.score.RankingRule;
import org.voteworth.tally.TallyTable;

/**
 * The threshold sweep of METHODS.md: for a grid of entry bars and each rule, the top k, the
 * Jaccard overlap of consecutive lists and with the lowest bar's list, who enters and leaves
 * and why, and the artefact raw shares are known for: a reviewer with far more evidence missing
 * at a low bar yet present at a higher one, because small samples at 100 % fill the low-bar list.
 *
 * <p>Raising a bar only removes reviewers, so a list changes exactly when the bar excludes one of
 * its members; a rule that ranks well-evidenced reviewers first keeps its list over every bar
 * that excludes none of them.
 */
public final class ThresholdSweep {
    /** The default grid (METHODS.md). */
    public static final List<Long> DEFAULT_BARS = List.of(0L, 5L, 10L, 20L, 50L, 100L, 200L, 300L, 500L);
    /** "Far more evidence": at least this many times the median total votes of the lowest bar's list. */
    public static final double FAR_MORE_EVIDENCE = 5;
    /** Examples named in a reason. */
    private static final int EXAMPLES = 3;

    private ThresholdSweep() {
    }

    /**
     * @param bars the grid; sorted ascending and deduplicated here
     * @param ids how ids appear in the result (e.g. a keyed pseudonym)
     */
    public static SweepResult run(TallyTable table, List<RankingRule> rules, EntryBar.On on, List<Long> bars, int k,
                                  UnaryOperator<String> ids) {
        if (k < 1) {
            throw new IllegalArgumentException("the sweep's top k must be at least 1, got " + k);
        }
        if (bars.isEmpty()) {
            throw new IllegalArgumentException("the sweep needs at least one entry bar");
        }
        List<Long> grid = new ArrayList<>(new TreeSet<>(bars));
        List<SweepResult.RuleSweep> out = new ArrayList<>();
        for (RankingRule rule : rules) {
            List<Ranking> rankings = new ArrayList<>();
            for (long b : grid) {
                rankings.add(Ranker.rank(table, rule, new EntryBar(on, b)));
            }
            out.add(sweep(table, rule, rankings, k, ids));
        }
        return new SweepResult(on, grid, k, out);
    }

    private static SweepResult.RuleSweep sweep(TallyTable table, RankingRule rule, List<Ranking> rankings, int k,
                                               UnaryOperator<String> ids) {
        List<SweepResult.Step> steps = new ArrayList<>();
        int[] lowest = rankings.get(0).top(k);
        double minNoneExcluded = Double.NaN;
        for (int i = 0; i < rankings.size(); i++) {
            Ranking r = rankings.get(i);
            int[] top = r.top(k);
            List<SweepResult.Member> members = new ArrayList<>();
            for (int j = 0; j < top.length; j++) {
                members.add(new SweepResult.Member(j + 1, ids.apply(table.id(top[j])), table.helpfulVotes(top[j]),
                        table.totalVotes(top[j]), r.scoreAt(j + 1)));
            }
            double jPrev = Double.NaN;
            boolean none = false;
            List<SweepResult.Change> entered = new ArrayList<>();
            List<SweepResult.Change> left = new ArrayList<>();
            if (i > 0) {
                Ranking prev = rankings.get(i - 1);
                int[] before = prev.top(k);
                jPrev = Jaccard.of(before, top);
                none = true;
                for (int s : before) {
                    none &= r.rankOf(s) > 0;
                }
                if (none) {
                    minNoneExcluded = Double.isNaN(minNoneExcluded) ? jPrev : Math.min(minNoneExcluded, jPrev);
                }
                Set<Integer> now = set(top);
                Set<Integer> was = set(before);
                for (int s : before) {
                    if (!now.contains(s)) {
                        left.add(new SweepResult.Change(ids.apply(table.id(s)), table.helpfulVotes(s), table.totalVotes(s),
                                prev.rankOf(s), r.rankOf(s), leftReason(table, prev, r, s, k, ids)));
                    }
                }
                for (int s : top) {
                    if (!was.contains(s)) {
                        entered.add(new SweepResult.Change(ids.apply(table.id(s)), table.helpfulVotes(s), table.totalVotes(s),
                                prev.rankOf(s), r.rankOf(s), enteredReason(table, prev, r, s, ids)));
                    }
                }
            }
            steps.add(new SweepResult.Step(r.bar().minimum(), r.size(), members, jPrev, Jaccard.of(lowest, top), none,
                    entered, left));
        }
        return new SweepResult.RuleSweep(rule.name(), rule.label(), steps, artefacts(table, rule, rankings, k, ids),
                minNoneExcluded);
    }

    private static String leftReason(TallyTable t, Ranking prev, Ranking now, int s, int k, UnaryOperator<String> ids) {
        if (now.rankOf(s) == 0) {
            return "left because the bar now needs " + now.bar().describe() + " and it has "
                    + count(t, now.bar(), s) + ".";
        }
        // A lower bar admits reviewers the previous one kept out; some of them now rank above it.
        List<Integer> newAbove = new ArrayList<>();
        int fewer = 0;
        for (int r = 1; r < now.rankOf(s); r++) {
            int o = now.slotAt(r);
            if (prev.rankOf(o) == 0) {
                newAbove.add(o);
                if (t.totalVotes(o) < t.totalVotes(s)) {
                    fewer++;
                }
            }
        }
        return "left (now #" + now.rankOf(s) + ") because " + words(newAbove.size()) + " reviewers"
                + (fewer == newAbove.size() ? " with fewer votes" : "") + " and a higher " + scoreWord(now)
                + " now qualify" + examples(t, newAbove, ids) + ".";
    }

    private static String enteredReason(TallyTable t, Ranking prev, Ranking now, int s, UnaryOperator<String> ids) {
        int before = prev.rankOf(s);
        if (before == 0) {
            return "entered at #" + now.rankOf(s) + " because it now qualifies: " + now.bar().describe() + ".";
        }
        List<Integer> excluded = new ArrayList<>();
        int fewer = 0;
        for (int r = 1; r < before; r++) {
            int o = prev.slotAt(r);
            if (now.rankOf(o) == 0) {
                excluded.add(o);
                if (t.totalVotes(o) < t.totalVotes(s)) {
                    fewer++;
                }
            }
        }
        String who = fewer == excluded.size()
                ? (excluded.size() == 1 ? "the reviewer" : "all " + words(excluded.size()) + " reviewers") + " with fewer votes"
                : words(excluded.size()) + " reviewers (" + fewer + " with fewer votes)";
        return "entered at #" + now.rankOf(s) + " (was #" + before + ") because the bar now excludes " + who
                + " that ranked above it on a higher " + scoreWord(now) + examples(t, excluded, ids) + ".";
    }

    private static List<SweepResult.Artefact> artefacts(TallyTable t, RankingRule rule, List<Ranking> rankings, int k,
                                                        UnaryOperator<String> ids) {
        Ranking low = rankings.get(0);
        int[] lowTop = low.top(k);
        if (lowTop.length == 0) {
            return List.of();
        }
        long[] totals = Arrays.stream(lowTop).mapToLong(t::totalVotes).sorted().toArray();
        double median = totals.length % 2 == 1 ? totals[totals.length / 2]
                : (totals[totals.length / 2 - 1] + totals[totals.length / 2]) / 2.0;
        Set<Integer> lowSet = set(lowTop);
        List<SweepResult.Artefact> out = new ArrayList<>();
        Set<Integer> seen = new HashSet<>();
        for (int i = 1; i < rankings.size(); i++) {
            Ranking r = rankings.get(i);
            for (int s : r.top(k)) {
                if (lowSet.contains(s) || !seen.add(s) || low.rankOf(s) == 0 || t.totalVotes(s) < FAR_MORE_EVIDENCE * median) {
                    continue;
                }
                int rank0 = low.rankOf(s);
                int fewer = 0;
                for (int q = 1; q < rank0; q++) {
                    if (t.totalVotes(low.slotAt(q)) < t.totalVotes(s)) {
                        fewer++;
                    }
                }
                Evidence e = Evidence.of(t, s);
                String id = ids.apply(t.id(s));
                String sentence = String.format(Locale.ROOT, "%s (%d of %d votes helpful, %s) has far more evidence than the"
                                + " %s top %d at %s (median %s votes, %.0fx fewer) yet is missing there, at #%d, because %s"
                                + " reviewers with fewer votes and a higher %s rank above it; it is present from %s (#%d),"
                                + " when the bar excludes them.",
                        id, e.helpfulVotes(), e.totalVotes(), percent(e.share()), rule.name(), k, low.bar().describe(),
                        trim(median), e.totalVotes() / Math.max(median, 1), rank0, words(fewer), scoreWord(low),
                        r.bar().describe(), r.rankOf(s));
                out.add(new SweepResult.Artefact(id, e.helpfulVotes(), e.totalVotes(), rank0, fewer, median,
                        r.bar().minimum(), r.rankOf(s), sentence));
            }
        }
        return out;
    }

    private static String examples(TallyTable t, List<Integer> slots, UnaryOperator<String> ids) {
        if (slots.isEmpty()) {
            return "";
        }
        StringBuilder b = new StringBuilder(" (e.g. ");
        for (int i = 0; i < Math.min(EXAMPLES, slots.size()); i++) {
            int s = slots.get(i);
            if (i > 0) {
                b.append(", ");
            }
            b.append(ids.apply(t.id(s))).append(' ').append(t.helpfulVotes(s)).append('/').append(t.totalVotes(s));
        }
        return b.append(slots.size() > EXAMPLES ? ", ..." : "").append(')').toString();
    }

    private static long count(TallyTable t, EntryBar bar, int s) {
        return bar.on() == EntryBar.On.HELPFUL ? t.helpfulVotes(s) : t.totalVotes(s);
    }

    private static String scoreWord(Ranking r) {
        return r.rule().name().equals("raw-share") ? "raw share" : "score";
    }

    static String words(int n) {
        String[] w = {"no", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten", "eleven", "twelve"};
        return n < w.length ? w[n] : Integer.toString(n);
    }

    private static String percent(double share) {
        return String.format(Locale.ROOT, "%.1f %%", 100 * share);
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.1f", v);
    }

    private static Set<Integer> set(int[] a) {
        Set<Integer> s = new HashSet<>();
        for (int x : a) {
            s.add(x);
        }
        return s;
    }
}
