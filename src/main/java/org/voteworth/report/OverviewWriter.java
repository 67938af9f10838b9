package org.voteworth.report;

import java.time.Month;
import java.time.YearMonth;
import java.time.format.TextStyle;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.SortedMap;
import java.util.TreeMap;
import org.voteworth.analysis.DatasetOverview;
import org.voteworth.analysis.DatasetOverview.Distribution;
import org.voteworth.analysis.DatasetOverview.Section;
import org.voteworth.analysis.DatasetOverview.Share;

/** Writes a {@link DatasetOverview} as a terminal table, Markdown, CSV or JSON: the same numbers in each. */
public final class OverviewWriter {
    /** What an overview is and is not: it describes the accepted rows, in aggregate. */
    public static final List<String> NOTES = List.of(
            "Counts describe the accepted rows; rejected rows are in the rejects file with their reasons.",
            "Medians and quantiles are exact (from frequency counts), by linear interpolation between order statistics.",
            "The overview holds aggregates over reviews and reviewers, no reviewer ids; the scores of other commands"
                    + " are statistical evidence about votes, not judgements of people.");

    private static final String NO_CATEGORY = "(none)";
    private static final String ALL = "(all)";

    private OverviewWriter() {
    }

    /**
     * @param parameters inputs and settings as label → value, in order
     */
    public static String write(DatasetOverview o, OutputFormat format, Map<String, String> parameters) {
        return switch (format) {
            case TABLE -> text(o, parameters, false);
            case MD -> text(o, parameters, true);
            case CSV -> measures(o).toCsv();
            case JSON -> json(o, parameters);
        };
    }

    private static List<Section> sections(DatasetOverview o) {
        List<Section> all = new ArrayList<>(o.categories());
        all.add(o.overall());
        return all;
    }

    private static String label(DatasetOverview o, Section s) {
        return s == o.overall() ? ALL : s.category().isEmpty() ? NO_CATEGORY : s.category();
    }

    /** One row per category (and one for all): rows, reviewers, stars, the vote-free share and the flags. */
    static Grid categories(DatasetOverview o) {
        Grid g = new Grid(List.of("category", "rows>", "reviewers>", "1_star>", "2_stars>", "3_stars>", "4_stars>", "5_stars>",
                "unrated>", "zero_vote_share>", "verified_share>", "incentivised_share>", "undated>"));
        for (Section s : sections(o)) {
            g.add(List.of(label(o, s), Long.toString(s.rows()), Long.toString(s.reviewers()), Long.toString(s.stars().one()),
                    Long.toString(s.stars().two()), Long.toString(s.stars().three()), Long.toString(s.stars().four()),
                    Long.toString(s.stars().five()), Long.toString(s.unrated()), share(s.zeroVoteShare()),
                    share(s.verified().share()), share(s.incentivised().share()), Long.toString(s.undated())));
        }
        return g;
    }

    /** Helpful votes, total votes and reviews per reviewer: one row per category and measure. */
    static Grid distributions(DatasetOverview o) {
        Grid g = new Grid(List.of("category", "of", "count>", "min>", "q1>", "median>", "q3>", "p90>", "p99>", "max>", "mean>",
                "sd>"));
        for (Section s : sections(o)) {
            for (Map.Entry<String, Distribution> e : distributionsOf(s).entrySet()) {
                Distribution d = e.getValue();
                g.add(List.of(label(o, s), e.getKey(), Long.toString(d.count()), d.count() == 0 ? "" : Long.toString(d.min()),
                        num(d.q1()), num(d.median()), num(d.q3()), num(d.p90()), num(d.p99()),
                        d.count() == 0 ? "" : Long.toString(d.max()), num(d.mean()), num(d.standardDeviation())));
            }
        }
        return g;
    }

    private static Map<String, Distribution> distributionsOf(Section s) {
        Map<String, Distribution> m = new LinkedHashMap<>();
        m.put("helpful votes per review", s.helpfulVotes());
        m.put("total votes per review", s.totalVotes());
        m.put("reviews per reviewer", s.reviewsPerReviewer());
        return m;
    }

    /** All reviews per month as a calendar: one row per year, one column per month. */
    static Grid calendar(SortedMap<YearMonth, Long> perMonth) {
        List<String> h = new ArrayList<>(List.of("year"));
        for (Month m : Month.values()) {
            h.add(m.getDisplayName(TextStyle.SHORT, Locale.ROOT) + ">");
        }
        h.add("total>");
        Grid g = new Grid(h);
        TreeMap<Integer, long[]> years = new TreeMap<>();
        perMonth.forEach((ym, n) -> years.computeIfAbsent(ym.getYear(), y -> new long[12])[ym.getMonthValue() - 1] += n);
        years.forEach((y, months) -> {
            List<String> row = new ArrayList<>(List.of(Integer.toString(y)));
            long sum = 0;
            for (long n : months) {
                row.add(n == 0 ? "" : Long.toString(n));
                sum += n;
            }
            row.add(Long.toString(sum));
            g.add(row);
        });
        return g;
    }

    /** Every figure as one (category, measure, value) row: the CSV, easy to load anywhere. */
    static Grid measures(DatasetOverview o) {
        Grid g = new Grid(List.of("category", "measure", "value>"));
        for (Section s : sections(o)) {
            String c = label(o, s);
            for (Map.Entry<String, String> e : figures(s).entrySet()) {
                g.add(List.of(c, e.getKey(), e.getValue()));
            }
        }
        return g;
    }

    private static Map<String, String> figures(Section s) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("rows", Long.toString(s.rows()));
        m.put("reviewers", Long.toString(s.reviewers()));
        for (int k = 1; k <= 5; k++) {
            m.put("stars_" + k, Long.toString(s.stars().of(k)));
        }
        m.put("unrated", Long.toString(s.unrated()));
        m.put("zero_vote_reviews", Long.toString(s.zeroVoteReviews()));
        m.put("zero_vote_share", share(s.zeroVoteShare()));
        flag(m, "verified", s.verified());
        flag(m, "incentivised", s.incentivised());
        dist(m, "helpful_votes", s.helpfulVotes());
        dist(m, "total_votes", s.totalVotes());
        dist(m, "reviews_per_reviewer", s.reviewsPerReviewer());
        s.reviewsPerMonth().forEach((ym, n) -> m.put("reviews_in_" + ym, Long.toString(n)));
        m.put("undated", Long.toString(s.undated()));
        return m;
    }

    private static void flag(Map<String, String> m, String name, Share s) {
        m.put(name + "_yes", Long.toString(s.yes()));
        m.put(name + "_no", Long.toString(s.no()));
        m.put(name + "_unknown", Long.toString(s.unknown()));
        m.put(name + "_share", share(s.share()));
    }

    private static void dist(Map<String, String> m, String name, Distribution d) {
        m.put(name + "_count", Long.toString(d.count()));
        m.put(name + "_min", d.count() == 0 ? "" : Long.toString(d.min()));
        m.put(name + "_q1", num(d.q1()));
        m.put(name + "_median", num(d.median()));
        m.put(name + "_q3", num(d.q3()));
        m.put(name + "_p90", num(d.p90()));
        m.put(name + "_p99", num(d.p99()));
        m.put(name + "_max", d.count() == 0 ? "" : Long.toString(d.max()));
        m.put(name + "_mean", num(d.mean()));
        m.put(name + "_sd", num(d.standardDeviation()));
    }

    private static String text(DatasetOverview o, Map<String, String> parameters, boolean md) {
        StringBuilder b = new StringBuilder();
        Section all = o.overall();
        String title = String.format(Locale.ROOT, "Data set overview: %,d reviews by %,d reviewers in %d categories", all.rows(),
                all.reviewers(), o.categories().size());
        b.append(md ? "# " + title + "\n\n" : title + "\n");
        parameters.forEach((k, v) -> b.append(md ? "- **" + k + "**: " + v : "  " + k + ": " + v).append('\n'));
        section(b, md, "Rows, stars and flags", categories(o));
        section(b, md, "Votes per review and reviews per reviewer", distributions(o));
        section(b, md, "Reviews per month (all categories"
                + (all.undated() > 0 ? String.format(Locale.ROOT, "; %,d reviews without a date", all.undated()) : "") + ")",
                calendar(all.reviewsPerMonth()));
        b.append(md ? "\n## Notes\n\n" : "\nNotes:\n");
        NOTES.forEach(n -> b.append(md ? "- " : "  - ").append(n).append('\n'));
        return b.toString();
    }

    private static void section(StringBuilder b, boolean md, String title, Grid g) {
        b.append(md ? "\n## " + title + "\n\n" : "\n" + title + ":\n");
        b.append(md ? g.toMarkdown() : g.toText());
    }

    private static String json(DatasetOverview o, Map<String, String> parameters) {
        return Json.object(f -> f
                .field("format", "voteworth-overview")
                .field("version", 1)
                .object("parameters", p -> parameters.forEach(p::field))
                .strings("notes", NOTES)
                .object("overall", w -> section(w, o.overall()))
                .array("categories", o.categories(), OverviewWriter::section));
    }

    private static void section(Json.Fields w, Section s) {
        Map<String, Long> stars = new LinkedHashMap<>();
        for (int k = 1; k <= 5; k++) {
            stars.put(Integer.toString(k), s.stars().of(k));
        }
        stars.put("unrated", s.unrated());
        Map<String, Long> months = new LinkedHashMap<>();
        s.reviewsPerMonth().forEach((ym, n) -> months.put(ym.toString(), n));
        w.field("category", s.category())
                .field("rows", s.rows())
                .field("reviewers", s.reviewers())
                .map("stars", stars)
                .field("zero_vote_reviews", s.zeroVoteReviews())
                .field("zero_vote_share", s.zeroVoteShare().orElse(Double.NaN))
                .object("verified", x -> flag(x, s.verified()))
                .object("incentivised", x -> flag(x, s.incentivised()))
                .object("helpful_votes", x -> dist(x, s.helpfulVotes()))
                .object("total_votes", x -> dist(x, s.totalVotes()))
                .object("reviews_per_reviewer", x -> dist(x, s.reviewsPerReviewer()))
                .map("reviews_per_month", months)
                .field("undated", s.undated());
    }

    private static void flag(Json.Fields x, Share s) {
        x.field("yes", s.yes()).field("no", s.no()).field("unknown", s.unknown()).field("share", s.share().orElse(Double.NaN));
    }

    private static void dist(Json.Fields x, Distribution d) {
        x.field("count", d.count());
        if (d.count() > 0) {
            x.field("min", d.min()).field("max", d.max());
        }
        x.field("mean", d.mean()).field("sd", d.standardDeviation()).field("q1", d.q1()).field("median", d.median())
                .field("q3", d.q3()).field("p90", d.p90()).field("p99", d.p99());
    }

    private static String share(OptionalDouble v) {
        return v.isPresent() ? String.format(Locale.ROOT, "%.4f", v.getAsDouble()) : "";
    }

    private static String num(double v) {
        if (Double.isNaN(v)) {
            return "";
        }
        return v == Math.rint(v) && Math.abs(v) < 1e15 ? Long.toString((long) v) : String.format(Locale.ROOT, "%.4f", v);
    }
}
