package org.voteworth.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.voteworth.analysis.SweepResult;

/** Writes a {@link SweepResult} as a terminal table, Markdown, CSV or JSON: the same numbers in each. */
public final class SweepWriter {
    private SweepWriter() {
    }

    /**
     * @param parameters rule settings, prior, inputs ... as label → value, in order
     */
    public static String write(SweepResult r, OutputFormat format, Map<String, String> parameters) {
        return switch (format) {
            case TABLE -> text(r, parameters, false);
            case MD -> text(r, parameters, true);
            case CSV -> lists(r).toCsv();
            case JSON -> json(r, parameters);
        };
    }

    /** One row per rule and bar: the overlaps and the list. */
    static Grid overview(SweepResult r) {
        Grid g = new Grid(List.of("rule", "bar>", "ranked>", "jaccard_previous>", "jaccard_lowest>", "entered>", "left>",
                "top"));
        for (SweepResult.RuleSweep s : r.rules()) {
            for (SweepResult.Step st : s.steps()) {
                g.add(List.of(s.rule(), Long.toString(st.bar()), Integer.toString(st.ranked()), num(st.jaccardPrevious()),
                        num(st.jaccardLowest()), Integer.toString(st.entered().size()), Integer.toString(st.left().size()),
                        st.top().stream().map(SweepResult.Member::reviewer).collect(Collectors.joining(" "))));
            }
        }
        return g;
    }

    /** The CSV: one row per rule, bar and list member, with entries and departures as extra rows. */
    static Grid lists(SweepResult r) {
        Grid g = new Grid(List.of("rule", "bar>", "event", "rank>", "reviewer", "helpful>", "total>", "score>",
                "jaccard_previous>", "jaccard_lowest>", "reason"));
        for (SweepResult.RuleSweep s : r.rules()) {
            for (SweepResult.Step st : s.steps()) {
                for (SweepResult.Member m : st.top()) {
                    g.add(List.of(s.rule(), Long.toString(st.bar()), "member", Integer.toString(m.rank()), m.reviewer(),
                            Long.toString(m.helpfulVotes()), Long.toString(m.totalVotes()), num(m.score()),
                            num(st.jaccardPrevious()), num(st.jaccardLowest()), ""));
                }
                for (SweepResult.Change c : st.entered()) {
                    g.add(change(s, st, "entered", c));
                }
                for (SweepResult.Change c : st.left()) {
                    g.add(change(s, st, "left", c));
                }
            }
            for (SweepResult.Artefact a : s.artefacts()) {
                g.add(List.of(s.rule(), Long.toString(a.firstBar()), "artefact", Integer.toString(a.rankAtFirstBar()), a.reviewer(),
                        Long.toString(a.helpfulVotes()), Long.toString(a.totalVotes()), "", "", "", a.sentence()));
            }
        }
        return g;
    }

    private static List<String> change(SweepResult.RuleSweep s, SweepResult.Step st, String event, SweepResult.Change c) {
        return List.of(s.rule(), Long.toString(st.bar()), event, c.rankAfter() == 0 ? "" : Integer.toString(c.rankAfter()),
                c.reviewer(), Long.toString(c.helpfulVotes()), Long.toString(c.totalVotes()), "", num(st.jaccardPrevious()),
                num(st.jaccardLowest()), c.reason());
    }

    private static String text(SweepResult r, Map<String, String> parameters, boolean md) {
        StringBuilder b = new StringBuilder();
        String title = "Entry-bar sweep: top " + r.k() + " at bars on " + on(r) + " votes " + r.bars();
        b.append(md ? "# " + title + "\n\n" : title + "\n");
        parameters.forEach((k, v) -> b.append(md ? "- **" + k + "**: " + v : "  " + k + ": " + v).append('\n'));
        b.append('\n');
        b.append(md ? overview(r).toMarkdown() : overview(r).toText());
        for (SweepResult.RuleSweep s : r.rules()) {
            b.append('\n').append(md ? "## " : "").append(s.label()).append(" (").append(s.rule()).append(")\n");
            if (md) {
                b.append('\n');
            }
            b.append(bullet(md)).append(String.format(Locale.ROOT, "smallest Jaccard between consecutive bars %s, against the"
                    + " lowest bar %s; over bars that excluded none of the previous list %s", num(s.minJaccardConsecutive()),
                    num(s.minJaccardLowest()), Double.isNaN(s.minJaccardWhereNoneExcluded()) ? "(no such bar)"
                            : num(s.minJaccardWhereNoneExcluded()))).append('\n');
            for (SweepResult.Artefact a : s.artefacts()) {
                b.append(bullet(md)).append("Threshold artefact: ").append(a.sentence()).append('\n');
            }
            for (SweepResult.Step st : s.steps()) {
                for (SweepResult.Change c : st.left()) {
                    b.append(bullet(md)).append("bar ").append(st.bar()).append(": ").append(c.reviewer()).append(" (")
                            .append(c.helpfulVotes()).append('/').append(c.totalVotes()).append(") ").append(c.reason()).append('\n');
                }
                for (SweepResult.Change c : st.entered()) {
                    b.append(bullet(md)).append("bar ").append(st.bar()).append(": ").append(c.reviewer()).append(" (")
                            .append(c.helpfulVotes()).append('/').append(c.totalVotes()).append(") ").append(c.reason()).append('\n');
                }
            }
        }
        b.append(md ? "\n## Cautions\n\n" : "\nCautions:\n");
        Cautions.TEXT.forEach(c -> b.append(bullet(md)).append(c).append('\n'));
        return b.toString();
    }

    private static String json(SweepResult r, Map<String, String> parameters) {
        return Json.object(f -> f
                .field("bar_on", on(r))
                .field("k", r.k())
                .stream(g -> {
                    g.writeArrayFieldStart("bars");
                    for (long bar : r.bars()) {
                        g.writeNumber(bar);
                    }
                    g.writeEndArray();
                })
                .object("parameters", p -> parameters.forEach(p::field))
                .strings("cautions", Cautions.TEXT)
                .array("rules", r.rules(), (o, s) -> o
                        .field("rule", s.rule())
                        .field("label", s.label())
                        .field("min_jaccard_consecutive", s.minJaccardConsecutive())
                        .field("min_jaccard_lowest", s.minJaccardLowest())
                        .field("min_jaccard_where_none_excluded", s.minJaccardWhereNoneExcluded())
                        .array("artefacts", s.artefacts(), (x, a) -> x
                                .field("reviewer", a.reviewer())
                                .field("helpful_votes", a.helpfulVotes())
                                .field("total_votes", a.totalVotes())
                                .field("rank_at_lowest_bar", a.rankAtLowest())
                                .field("outranked_with_less_evidence", a.outrankedWithLessEvidence())
                                .field("median_total_of_lowest_list", a.medianTotalOfLowestList())
                                .field("first_bar", a.firstBar())
                                .field("rank_at_first_bar", a.rankAtFirstBar())
                                .field("sentence", a.sentence()))
                        .array("steps", s.steps(), (x, st) -> x
                                .field("bar", st.bar())
                                .field("ranked", st.ranked())
                                .field("jaccard_previous", st.jaccardPrevious())
                                .field("jaccard_lowest", st.jaccardLowest())
                                .field("excluded_none_of_previous", st.excludedNone())
                                .array("top", st.top(), (y, m) -> y
                                        .field("rank", m.rank())
                                        .field("reviewer", m.reviewer())
                                        .field("helpful_votes", m.helpfulVotes())
                                        .field("total_votes", m.totalVotes())
                                        .field("score", m.score()))
                                .array("entered", st.entered(), SweepWriter::change)
                                .array("left", st.left(), SweepWriter::change))));
    }

    private static void change(Json.Fields y, SweepResult.Change c) {
        y.field("reviewer", c.reviewer())
                .field("helpful_votes", c.helpfulVotes())
                .field("total_votes", c.totalVotes())
                .field("rank_before", c.rankBefore())
                .field("rank_after", c.rankAfter())
                .field("reason", c.reason());
    }

    private static String on(SweepResult r) {
        return r.on().name().toLowerCase(Locale.ROOT);
    }

    private static String bullet(boolean md) {
        return md ? "- " : "  - ";
    }

    static String num(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.4f", v);
    }
}
