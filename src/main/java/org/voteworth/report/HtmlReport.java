package org.voteworth.report;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.function.UnaryOperator;
import java.util.stream.Collectors;
import org.voteworth.analysis.AuditResult;
import org.voteworth.analysis.ComparisonResult;
import org.voteworth.analysis.DatasetOverview;
import org.voteworth.analysis.RankUncertainty;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.analysis.SweepResult;
import org.voteworth.report.chart.BarChart;
import org.voteworth.report.chart.FunnelPlot;
import org.voteworth.report.chart.MonthChart;
import org.voteworth.report.chart.Palette;
import org.voteworth.report.chart.RankIntervalChart;
import org.voteworth.report.chart.ShareBarChart;
import org.voteworth.report.chart.SweepChart;
import org.voteworth.score.Explanation;
import org.voteworth.score.Flag;
import org.voteworth.source.FileReport;
import org.voteworth.source.ScanSummary;
import org.voteworth.tally.OverviewCounts;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.StarCounts;
import org.voteworth.tally.TallyTable;

/**
 * The report for people who will not run a command: one self-contained HTML page with inline SVG
 * charts, inline style and script, and a content security policy that forbids every request, so
 * it opens offline in any browser. Sections: the data set, a funnel plot, the ranking with rank
 * intervals and P(in top k), the threshold sweep, the rule comparison, the audit of a list when
 * one is given, one panel per top reviewer, the reviewer profiles when the input was a store, and the cautions, parameters and input files a reader
 * needs to reproduce it. Every value from the input is escaped by {@link Html#escape}; reviewer
 * ids arrive already masked when pseudonyms were asked for.
 *
 * @param title the page's heading
 * @param parameters rule, confidence, prior, bars, seed ... as label → value, in order
 * @param input the reconciliation per input file (empty when the input was a reviewer table)
 * @param table the reviewer table ranked
 * @param overview the data set overview counts of the same pass (no rows when the input was a reviewer table)
 * @param ranking the explained ranking shown in the ranking table (its first {@code k} entries get a panel)
 * @param uncertainty P(in top k) and rank intervals of {@code ranking}
 * @param k the size of the lists: panels, rank intervals, sweep and comparison
 * @param sweep the threshold sweep
 * @param comparison the rule comparison
 * @param audit the audit of a promotion list, when one was given
 * @param profiles the reviewer profiles, when the input was a store (otherwise the section says they need one)
 */
public record HtmlReport(String title, Map<String, String> parameters, ScanSummary input, TallyTable table,
                         OverviewCounts overview,
                         RankingReport ranking, RankUncertainty.Result uncertainty, int k, SweepResult sweep,
                         ComparisonResult comparison, Optional<AuditResult> audit, Optional<Profiles> profiles) {
    /** The content security policy of the page: nothing may be fetched, only inline style, script and data images. */
    public static final String POLICY = "default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:";

    public HtmlReport {
        parameters = new LinkedHashMap<>(parameters);
    }

    /**
     * Reviewer profiles read from a store, in the order shown.
     *
     * @param profiles one per reviewer looked up (found or not)
     * @param ids the mask reviewer ids go through, the same as for the rest of the page
     */
    public record Profiles(List<ReviewerProfile> profiles, UnaryOperator<String> ids) {
        public Profiles {
            profiles = List.copyOf(profiles);
        }

        /** The HTML id of the profile of the reviewer shown as {@code shownId}, if there is one. */
        Optional<String> anchorOf(String shownId) {
            for (int i = 0; i < profiles.size(); i++) {
                if (ids.apply(profiles.get(i).id()).equals(shownId)) {
                    return Optional.of(anchor(i));
                }
            }
            return Optional.empty();
        }

        static String anchor(int index) {
            return "profile-" + (index + 1);
        }
    }

    /** The whole page. */
    public String render() {
        StringBuilder b = new StringBuilder(1 << 20);
        b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta http-equiv=\"Content-Security-Policy\" content=\"").append(POLICY).append("\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(Html.escape(title)).append("</title>\n<style>\n")
                .append(Html.resource("report.css")).append("</style>\n</head>\n<body>\n");
        b.append("<header>\n<h1>").append(Html.escape(title)).append("</h1>\n<p class=\"note\">")
                .append(Html.escape("Reviewers ranked by " + ranking.ranking().rule().label())).append(". Written by voteworth on ").append(Instant.now().toString(), 0, 10)
                .append("; this file works offline and fetches nothing.</p>\n")
                .append("<p class=\"cautions\">").append(Html.escape(Cautions.TEXT.get(0)))
                .append(" <a href=\"#cautions\">Read the cautions</a> before acting on any rank.</p>\n");
        b.append("<nav><ol>");
        List<String[]> toc = new ArrayList<>(List.of(new String[] {"overview", "The data set"},
                new String[] {"funnel", "Helpful share against votes"}, new String[] {"ranking", "The ranking"},
                new String[] {"sweep", "The entry-bar sweep"}, new String[] {"compare", "The rules compared"}));
        audit.ifPresent(a -> toc.add(new String[] {"audit", "The audit of the list"}));
        toc.add(new String[] {"reviewers", "Why each top reviewer stands where they stand"});
        toc.add(new String[] {"profiles", "Reviewer profiles"});
        toc.add(new String[] {"cautions", "Cautions"});
        toc.add(new String[] {"parameters", "Parameters and input"});
        toc.forEach(t -> b.append("<li><a href=\"#").append(t[0]).append("\">").append(t[1]).append("</a></li>"));
        b.append("</ol></nav>\n</header>\n");
        overview(b);
        funnel(b);
        rankingSection(b);
        sweepSection(b);
        compareSection(b);
        audit.ifPresent(a -> auditSection(b, a));
        panels(b);
        profilesSection(b);
        cautions(b);
        parametersSection(b);
        b.append("<script>\n").append(Html.resource("report.js")).append("</script>\n</body>\n</html>\n");
        return b.toString();
    }

    /** Upper ends of the bins of the votes-per-review chart; the last bin is open. */
    private static final long[] VOTE_BINS = {0, 1, 2, 4, 9, 19, 49, 99, 199, 499, 999};

    private void overview(StringBuilder b) {
        section(b, "overview", "The data set");
        if (overview.rows() == 0) {
            b.append("<p>The input was a reviewer table, whose rows were summed per reviewer when it was written: the data set"
                    + " overview needs the dump itself (run the report on the dump files).</p>\n</section>\n");
            return;
        }
        DatasetOverview o = DatasetOverview.of(overview);
        DatasetOverview.Section all = o.overall();
        b.append("<p>").append(String.format(Locale.ROOT, "%,d accepted reviews by %,d reviewers in %,d categories; median %s"
                        + " votes per review, %.1f %% of reviews without a vote.", all.rows(), all.reviewers(), o.categories().size(),
                fmt(all.totalVotes().median()), 100 * all.zeroVoteShare().orElse(0))).append("</p>\n<div class=\"charts\">\n");
        List<DatasetOverview.Section> cats = new ArrayList<>(o.categories());
        cats.sort((x, y) -> Long.compare(y.rows(), x.rows()));
        figure(b, new BarChart(cats.stream().map(c -> c.category().isEmpty() ? "(no category)" : c.category()).toList(),
                cats.stream().map(DatasetOverview.Section::rows).toList(), "category", "reviews (count)", true, false)
                .svg("chart-categories", 560, 80 + 24 * Math.max(3, cats.size()), Palette.BLUE), "Reviews per category.");
        StarCounts stars = all.stars();
        figure(b, new BarChart(List.of("1 star", "2 stars", "3 stars", "4 stars", "5 stars"),
                List.of(stars.one(), stars.two(), stars.three(), stars.four(), stars.five()), "star rating", "reviews (count)",
                false, false).svg("chart-stars", 560, 340, Palette.BLUE),
                String.format(Locale.ROOT, "Star ratings of the %,d rated reviews (%,d without a rating).", stars.rated(), all.unrated()));
        long[] perBin = new long[VOTE_BINS.length + 1];
        overview.overall().totalVotes().forEach((votes, count) -> perBin[bin(votes)] += count);
        List<String> labels = new ArrayList<>();
        for (int i = 0; i <= VOTE_BINS.length; i++) {
            long lo = i == 0 ? 0 : VOTE_BINS[i - 1] + 1;
            labels.add(i == VOTE_BINS.length ? lo + "+" : lo == VOTE_BINS[i] ? Long.toString(lo) : lo + "-" + VOTE_BINS[i]);
        }
        figure(b, new BarChart(labels, java.util.Arrays.stream(perBin).boxed().toList(), "total votes on the review",
                "reviews (count, log scale)", false, true).svg("chart-votes-per-review", 560, 340, Palette.BLUE),
                String.format(Locale.ROOT, "Votes per review: %,d of %,d reviews (%.1f %%) have no vote at all, and count for no rule;"
                                + " the busiest review has %,d votes. The counts are on a log scale.", all.zeroVoteReviews(), all.rows(),
                        100 * all.zeroVoteShare().orElse(0), all.totalVotes().max()));
        figure(b, MonthChart.svg(all.reviewsPerMonth(), "reviews (count)", "chart-months", 560, 340),
                String.format(Locale.ROOT, "Reviews per month%s.", all.undated() == 0 ? ""
                        : String.format(Locale.ROOT, " (%,d reviews without a date are not shown)", all.undated())));
        b.append("</div>\n<h3>By category</h3>\n").append(Html.table(OverviewWriter.categories(o), "table-overview", "category"));
        b.append("</section>\n");
    }

    private static int bin(long votes) {
        for (int i = 0; i < VOTE_BINS.length; i++) {
            if (votes <= VOTE_BINS[i]) {
                return i;
            }
        }
        return VOTE_BINS.length;
    }

    private static String fmt(double v) {
        return Double.isNaN(v) ? "-" : v == Math.rint(v) ? Long.toString((long) v) : String.format(Locale.ROOT, "%.1f", v);
    }

    private void funnel(StringBuilder b) {
        long[] h = new long[table.size()];
        long[] t = new long[table.size()];
        for (int s = 0; s < table.size(); s++) {
            h[s] = table.helpfulVotes(s);
            t[s] = table.totalVotes(s);
        }
        FunnelPlot.Drawn f = FunnelPlot.draw(h, t, "chart-funnel", 1000, 560);
        section(b, "funnel", "Helpful share against votes: a funnel plot");
        b.append("<p>Each mark is a reviewer with at least one vote (").append(String.format(Locale.ROOT, "%,d", f.reviewers()))
                .append("). The lines are the shares a reviewer whose true share is the overall share (")
                .append(String.format(Locale.ROOT, "%.1f %%", 100 * f.overallShare()))
                .append(") would show by chance at each number of votes: 95 % and 99.8 % control limits (Wilson score)."
                        + " Marks at 100 % on a few votes lie inside the funnel's wide mouth: their share is what chance gives."
                        + " Only marks outside the limits on the right stand out on the evidence.</p>\n");
        figure(b, f.svg(), f.dense()
                ? String.format(Locale.ROOT, "Dense rendering: the %,d reviewers have more than %,d distinct vote pairs, so they"
                        + " are binned into cells shaded by how many reviewers each holds (log scale).", f.reviewers(), FunnelPlot.POINT_LIMIT)
                : "Every reviewer is drawn: reviewers with the same helpful and total votes share one mark, larger when more"
                        + " share it; marks are semi-transparent so that overlaps show darker.");
        b.append("</section>\n");
    }

    private void rankingSection(StringBuilder b) {
        section(b, "ranking", "The ranking: " + ranking.ranking().rule().label());
        b.append("<p>").append(Html.escape(ranking.ranking().rule().describe())).append(" Entry bar: ")
                .append(Html.escape(ranking.ranking().bar().describe())).append(String.format(Locale.ROOT,
                        ". %,d ranked; P(in top %d) and rank intervals from seeded Monte Carlo draws: ", ranking.ranking().size(), k))
                .append(Html.escape(UncertainRankingWriter.describe(uncertainty))).append(".</p>\n");
        List<RankIntervalChart.Bar> bars = new ArrayList<>();
        for (Explanation e : ranking.entries().subList(0, Math.min(k, ranking.entries().size()))) {
            RankUncertainty.Spread s = uncertainty.of(ranking.ranking().slotAt(e.rank()));
            if (!s.pruned()) {
                bars.add(new RankIntervalChart.Bar("#" + e.rank() + " " + e.reviewer(), s.rankLow(), s.rankMedian(), s.rankHigh()));
            }
        }
        String q = String.format(Locale.ROOT, "%.0f %%-%.0f %%", 100 * uncertainty.settings().lowQuantile(),
                100 * uncertainty.settings().highQuantile());
        figure(b, RankIntervalChart.svg(bars, q, ranking.ranking().rule().name(), "chart-rank-intervals", 1000),
                "Rank intervals of the top " + bars.size() + ": each bar spans the " + q + " range of the reviewer's rank over the"
                        + " draws, the dot is the median. Bars that overlap are ranks the votes cannot tell apart.");
        Grid base = UncertainRankingWriter.grid(ranking, uncertainty, false);
        List<String> h = new ArrayList<>();
        for (int i = 0; i < base.headers().size(); i++) {
            h.add(base.headers().get(i) + (base.numeric(i) ? ">" : ""));
        }
        h.add("categories");
        Grid g = new Grid(h);
        List<List<String>> rows = base.rows();
        for (int i = 0; i < rows.size(); i++) {
            List<String> row = new ArrayList<>(rows.get(i));
            row.add(categories(table.get(ranking.ranking().slotAt(ranking.entries().get(i).rank()))));
            g.add(row);
        }
        b.append(String.format(Locale.ROOT, "<p class=\"note\">The table holds the first %,d of %,d ranked reviewers, %d rows"
                + " a page (paginated); sorting by any column and the filter work on all of its rows.</p>\n",
                g.size(), ranking.ranking().size(), Html.PAGE_SIZE));
        b.append(Html.table(g, "table-ranking", "reviewer id or category"));
        b.append("</section>\n");
    }

    private void sweepSection(StringBuilder b) {
        section(b, "sweep", "The entry-bar sweep");
        String on = sweep.on().name().toLowerCase(Locale.ROOT);
        b.append("<p>The top ").append(sweep.k()).append(" under each rule at entry bars of ").append(Html.escape(sweep.bars().toString()))
                .append(" ").append(on).append(" votes. A rule that needs a bar to look sensible moves with it; a rule"
                        + " whose list stays put does not depend on where the bar was set.</p>\n");
        List<SweepChart.Line> lines = sweep.rules().stream().map(r -> new SweepChart.Line(r.rule(), r.label(),
                r.steps().stream().map(SweepResult.Step::jaccardLowest).toList())).toList();
        figure(b, SweepChart.svg(sweep.bars(), lines, sweep.k(), "entry bar (at least this many " + on + " votes)",
                "chart-sweep", 1000, 440), "Overlap of each bar's top " + sweep.k() + " with the lowest bar's (Jaccard: 1 = the"
                + " same reviewers, 0 = none in common), one line per rule.");
        b.append("<h3>Who enters and leaves, and why</h3>\n<ul>\n");
        int events = 0;
        for (SweepResult.RuleSweep r : sweep.rules()) {
            for (SweepResult.Artefact a : r.artefacts()) {
                b.append("<li><strong>").append(Html.escape(r.label())).append(", threshold artefact:</strong> ")
                        .append(Html.escape(a.sentence())).append("</li>\n");
                events++;
            }
        }
        b.append("</ul>\n");
        if (events == 0) {
            b.append("<p>No threshold artefacts: no reviewer with far more evidence is missing at the lowest bar.</p>\n");
        }
        b.append("<p class=\"note\">Every list member, entry and departure at every bar, with the reason:</p>\n");
        b.append(Html.table(SweepWriter.lists(sweep), "table-sweep", "reviewer id or rule")).append("</section>\n");
    }

    private void compareSection(StringBuilder b) {
        section(b, "compare", "The rules compared");
        b.append("<p>Top ").append(comparison.k()).append(" under ").append(Html.escape(String.join(", ", comparison.labels())))
                .append(". Jaccard at k; Kendall's tau-b and Spearman's rho over the union of the lists (")
                .append(Html.escape(comparison.unrankedRank())).append("); rank-biased overlap.</p>\n");
        b.append(Html.table(CompareWriter.pairs(comparison), "table-pairs", "rule"));
        if (!comparison.disagreements().isEmpty()) {
            b.append("<h3>Large disagreements</h3>\n<ul>\n");
            comparison.disagreements().forEach(d -> b.append("<li>").append(Html.escape(d)).append("</li>\n"));
            b.append("</ul>\n");
        }
        b.append("<h3>Every reviewer of the lists, with the rank under each rule</h3>\n");
        b.append(Html.table(CompareWriter.reviewers(comparison), "table-compare", "reviewer id")).append("</section>\n");
    }

    private void auditSection(StringBuilder b, AuditResult a) {
        AuditResult.Summary s = a.summary();
        section(b, "audit", "The audit of " + a.list());
        b.append("<p>Bar: ").append(Html.escape(a.bar())).append(". Share model: ").append(Html.escape(a.model())).append(".</p>\n");
        boolean holds = s.likelyBelow() == 0 && s.missing() == 0 && s.overlooked() == 0;
        b.append(holds ? "<p class=\"verdict-pass\">" : "<p class=\"verdict-fail\">").append("Verdict: ").append(Html.escape(
                String.format(Locale.ROOT, "%d of the %d listed reviewers found are more likely below the bar than above it; %d"
                        + " reviewers not listed beat its weakest members with high probability; %d listed ids are not in the"
                        + " data.", s.likelyBelow(), s.found(), s.overlooked(), s.missing()))).append("</p>\n<dl class=\"figures\">\n");
        figureRow(b, "listed", String.format(Locale.ROOT, "%d (%d in the data, %d not)", s.listed(), s.found(), s.missing()));
        figureRow(b, "expected number below the bar", String.format(Locale.ROOT, "%.2f (sum of 1 - P)", s.expectedBelow()));
        figureRow(b, "smallest P(meets the bar)", String.format(Locale.ROOT, "%.4f", s.minProbability()));
        figureRow(b, "precision against the statistical top " + a.k(), String.format(Locale.ROOT, "%.2f (%s)", s.precision(), a.topKRule()));
        figureRow(b, "overlooked reviewers", Long.toString(s.overlooked()));
        b.append("</dl>\n<h3>Listed reviewers</h3>\n").append(Html.table(AuditWriter.members(a), "table-audit", "reviewer id"));
        if (!a.missing().isEmpty()) {
            b.append("<h3>Not in the data</h3>\n<ul>\n");
            a.missing().forEach(id -> b.append("<li>").append(Html.escape(id)).append("</li>\n"));
            b.append("</ul>\n");
        }
        b.append("<h3>Overlooked reviewers (not listed, beat its weakest members with high probability)</h3>\n")
                .append(a.overlooked().isEmpty() ? "<p>None.</p>\n" : Html.table(AuditWriter.overlooked(a), "table-overlooked", "reviewer id"))
                .append("</section>\n");
    }

    private void panels(StringBuilder b) {
        List<Explanation> top = ranking.entries().subList(0, Math.min(k, ranking.entries().size()));
        section(b, "reviewers", "Why each top reviewer stands where they stand");
        b.append("<p>One panel for each of the top ").append(top.size()).append(": the numbers, the reasons in words, the flags"
                + " and a small profile.</p>\n<div class=\"panels\">\n");
        for (Explanation e : top) {
            ReviewerTally t = table.get(ranking.ranking().slotAt(e.rank()));
            RankUncertainty.Spread s = uncertainty.of(ranking.ranking().slotAt(e.rank()));
            b.append("<article class=\"panel\" id=\"reviewer-").append(e.rank()).append("\">\n<h3>#").append(e.rank()).append(' ')
                    .append(Html.escape(e.reviewer())).append("</h3>\n");
            profiles.flatMap(p -> p.anchorOf(e.reviewer())).ifPresent(a -> b.append("<p class=\"note\"><a href=\"#").append(a)
                    .append("\">Profile across all categories</a></p>\n"));
            for (Flag f : e.flags()) {
                b.append("<span class=\"flag\">").append(Html.escape(f.words())).append("</span>");
            }
            b.append("<dl class=\"figures\">\n");
            figureRow(b, "score", RankingWriter.num(e.score()) + e.interval().map(i -> String.format(Locale.ROOT,
                    " (%.0f %% interval %s to %s)", 100 * i.confidence(), RankingWriter.num(i.lower()), RankingWriter.num(i.upper())))
                    .orElse(""));
            figureRow(b, "votes", String.format(Locale.ROOT, "%,d of %,d helpful (%.1f %%)", e.helpfulVotes(), e.totalVotes(),
                    100 * e.share()));
            figureRow(b, "P(in top " + uncertainty.settings().k() + ")", RankingWriter.num(s.probabilityTopK())
                    + (s.pruned() ? "" : String.format(Locale.ROOT, "; rank interval %d to %d, median %d", s.rankLow(), s.rankHigh(),
                    s.rankMedian())));
            figureRow(b, "ranks by rule", e.ranksByRule().entrySet().stream().sorted(Map.Entry.comparingByKey())
                    .map(x -> x.getKey() + " " + (x.getValue() == 0 ? "-" : "#" + x.getValue())).collect(Collectors.joining(", ")));
            figureRow(b, "votes per review", String.format(Locale.ROOT, "%,d reviews, %,d with votes; %.1f votes per voted review;"
                            + " the largest review holds %,d votes (%.1f %% of the total)", t.reviews(), t.votedReviews(),
                    t.votedReviews() == 0 ? 0.0 : (double) t.totalVotes() / t.votedReviews(), t.maxReviewVotes(), 100 * e.maxReviewShare()));
            figureRow(b, "verified purchases", String.format(Locale.ROOT, "%.1f %% of reviews", 100 * e.verifiedShare()));
            figureRow(b, "active", day(t.firstDay()) + " to " + day(t.lastDay()));
            b.append("</dl>\n<ul>\n");
            e.reasons().forEach(r -> b.append("<li>").append(Html.escape(r)).append("</li>\n"));
            b.append("</ul>\n<div class=\"profile\">\n");
            List<String> cats = new ArrayList<>(t.reviewsByCategory().keySet());
            figure(b, new BarChart(cats.stream().map(c -> c.isEmpty() ? "(no category)" : c).toList(),
                    cats.stream().map(c -> t.reviewsByCategory().get(c)).toList(), "category", "reviews (count)", true, false)
                    .svg("chart-profile-" + e.rank() + "-categories", 460, 70 + 22 * Math.max(2, cats.size()), Palette.BLUE),
                    "Reviews per category.");
            StarCounts st = t.stars();
            figure(b, new BarChart(List.of("1", "2", "3", "4", "5"), List.of(st.one(), st.two(), st.three(), st.four(), st.five()),
                    "stars given", "reviews (count)", false, false)
                    .svg("chart-profile-" + e.rank() + "-stars", 460, 200, Palette.BLUISH_GREEN), "Star ratings given.");
            b.append("</div>\n</article>\n");
        }
        b.append("</div>\n</section>\n");
    }

    private void profilesSection(StringBuilder b) {
        section(b, "profiles", "Reviewer profiles");
        if (profiles.isEmpty()) {
            b.append("<p>Reviewer profiles need a store of every review: the input of this report was a dump, a reviewer table"
                    + " or a store of the reviewer table only. Run"
                    + " <code>voteworth tally --store DIR</code> on the dump once and the report on DIR to see, for each top"
                    + " reviewer, their reviews by category, stars against each category's, helpful share per review, verified"
                    + " and incentivised shares, activity per month and the busiest days.</p>\n</section>\n");
            return;
        }
        List<ReviewerProfile> all = profiles.get().profiles();
        b.append("<p>").append(all.size()).append(" reviewers (the top ").append(k).append(" and those asked for with --profile)"
                + " across all categories, from the store's reviews: stars are compared with the stars every review in the same"
                + " categories gave.</p>\n");
        for (int i = 0; i < all.size(); i++) {
            ReviewerProfile p = all.get(i);
            String id = Profiles.anchor(i);
            b.append("<article class=\"panel\" id=\"").append(id).append("\">\n<h3>")
                    .append(Html.escape(profiles.get().ids().apply(p.id()))).append("</h3>\n");
            if (!p.found()) {
                b.append("<p>Not in the store (no review by this id).</p>\n</article>\n");
                continue;
            }
            b.append("<p class=\"profile-summary\">").append(Html.escape(ProfileWriter.summary(p))).append("</p>\n<div class=\"profile\">\n");
            List<ReviewerProfile.CategoryLine> cats = p.categories();
            figure(b, new BarChart(cats.stream().map(c -> c.category().isEmpty() ? "(no category)" : c.category()).toList(),
                    cats.stream().map(ReviewerProfile.CategoryLine::reviews).toList(), "category", "reviews (count)", true, false)
                    .svg(id + "-categories-chart", 460, 70 + 22 * Math.max(2, cats.size()), Palette.BLUE), "Reviews per category.");
            List<Double> theirs = new ArrayList<>();
            for (int s = 1; s <= 5; s++) {
                theirs.add(p.stars().rated() == 0 ? Double.NaN : (double) p.stars().of(s) / p.stars().rated());
            }
            figure(b, new ShareBarChart(List.of("1", "2", "3", "4", "5"), List.of("their stars", "their categories' stars"),
                    List.of(theirs, p.expectedStars()), "stars").svg(id + "-stars-chart", 460, 240, Palette.BLUISH_GREEN,
                    Palette.ORANGE), "Their star ratings against the shares every review in their categories gives, weighted by"
                    + " their reviews in each.");
            if (!p.perMonth().isEmpty()) {
                figure(b, MonthChart.svg(new TreeMap<>(p.perMonth()), "reviews (count)", id + "-months-chart", 460, 240),
                        "Their reviews per month.");
            }
            b.append("</div>\n<h4>Categories: stars against the category's</h4>\n")
                    .append(Html.table(ProfileWriter.categories(p), id + "-categories", "category"))
                    .append("<h4>Stars against their category mix</h4>\n").append(Html.table(ProfileWriter.stars(p), id + "-stars", "stars"))
                    .append("<details>\n<summary>Activity per month: the ").append(p.perMonth().size()).append(" months</summary>\n")
                    .append(Html.table(ProfileWriter.monthGrid(p), id + "-months", "month")).append("</details>\n")
                    .append("<h4>Busiest days</h4>\n").append(p.busiestDays().isEmpty() ? "<p>No day with more than one review.</p>\n"
                            : Html.table(ProfileWriter.busiestDays(p), id + "-days", "day"))
                    .append("<h4>Helpful share per review (the ").append(Math.min(ProfileWriter.LISTED, p.reviews().size()))
                    .append(" most voted)</h4>\n")
                    .append(Html.table(ProfileWriter.reviews(List.of(p), profiles.get().ids(), ProfileWriter.LISTED), id + "-reviews",
                            "category, review or item"))
                    .append("</article>\n");
        }
        b.append("</section>\n");
    }

    private void cautions(StringBuilder b) {
        section(b, "cautions", "Cautions");
        b.append("<ul class=\"cautions\">\n");
        Cautions.TEXT.forEach(c -> b.append("<li>").append(Html.escape(c)).append("</li>\n"));
        b.append("</ul>\n</section>\n");
    }

    private void parametersSection(StringBuilder b) {
        section(b, "parameters", "Parameters and input");
        b.append("<dl class=\"figures\">\n");
        parameters.forEach((key, v) -> figureRow(b, key, v));
        figureRow(b, "rank uncertainty", UncertainRankingWriter.describe(uncertainty));
        b.append("</dl>\n<h3>Input files</h3>\n");
        if (input.files().isEmpty()) {
            b.append("<p>The input was a reviewer table written by tally; its rows were reconciled when it was written.</p>\n");
        } else {
            Grid g = new Grid(List.of("file", "category", "read>", "accepted>", "rejected>", "rejects by reason"));
            for (FileReport f : input.files()) {
                g.add(List.of(f.file().path().toString(), f.file().category(), Long.toString(f.rowsRead()), Long.toString(f.accepted()),
                        Long.toString(f.rejected()), f.rejectsByReason().entrySet().stream().map(x -> x.getKey() + " " + x.getValue())
                                .collect(Collectors.joining(", "))));
            }
            g.add(List.of("total", "", Long.toString(input.rowsRead()), Long.toString(input.accepted()), Long.toString(input.rejected()),
                    input.rejectsByReason().entrySet().stream().map(x -> x.getKey() + " " + x.getValue()).collect(Collectors.joining(", "))));
            b.append(Html.table(g, "table-input", "file or category"));
            b.append("<p>").append(Html.escape(String.format(Locale.ROOT, "read = accepted + rejected: %,d = %,d + %,d, %s.",
                    input.rowsRead(), input.accepted(), input.rejected(), input.reconciles() ? "holds" : "DOES NOT HOLD"))).append("</p>\n");
        }
        b.append("</section>\n");
    }

    private static void section(StringBuilder b, String id, String heading) {
        b.append("<section id=\"").append(id).append("\">\n<h2>").append(Html.escape(heading)).append("</h2>\n");
    }

    private static void figure(StringBuilder b, String svg, String caption) {
        b.append("<figure>\n").append(svg).append("\n<figcaption>").append(Html.escape(caption)).append("</figcaption>\n</figure>\n");
    }

    private static void figureRow(StringBuilder b, String term, String value) {
        b.append("<dt>").append(Html.escape(term)).append("</dt><dd>").append(Html.escape(value)).append("</dd>\n");
    }

    private static String categories(ReviewerTally t) {
        return t.reviewsByCategory().entrySet().stream().sorted(Map.Entry.<String, Long>comparingByValue().reversed())
                .map(x -> (x.getKey().isEmpty() ? "(no category)" : x.getKey()) + " " + x.getValue()).collect(Collectors.joining(", "));
    }

    private static String day(int epochDay) {
        return epochDay == ReviewerTally.NO_DATE ? "(no date)" : LocalDate.ofEpochDay(epochDay).toString();
    }
}
