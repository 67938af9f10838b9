package org.voteworth.report;

import com.fasterxml.jackson.core.JsonGenerator;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.voteworth.score.Explanation;
import org.voteworth.score.Flag;
import org.voteworth.score.Ranking;

/** Writes a {@link RankingReport} as a terminal table, Markdown, CSV or JSON: the same numbers in each. */
public final class RankingWriter {
    private RankingWriter() {
    }

    public static String write(RankingReport r, OutputFormat format, boolean withReasons) {
        return switch (format) {
            case TABLE -> text(r, withReasons);
            case MD -> markdown(r);
            case CSV -> grid(r, true).toCsv();
            case JSON -> json(r);
        };
    }

    /** The columns shown for each ranked entry; the CSV adds the reasons. */
    static Grid grid(RankingReport r, boolean withReasons) {
        List<String> h = new ArrayList<>(List.of("rank>", "reviewer", "score>", "lower>", "upper>", "helpful>", "total>",
                "share>", "reviews>", "top_review_share>"));
        for (Ranking c : r.compared()) {
            h.add("rank_" + c.rule().name() + ">");
        }
        h.add("flags");
        if (withReasons) {
            h.add("reasons");
        }
        Grid g = new Grid(h);
        for (Explanation e : r.entries()) {
            List<String> row = new ArrayList<>(List.of(Integer.toString(e.rank()), e.reviewer(), num(e.score()),
                    e.interval().map(i -> num(i.lower())).orElse(""), e.interval().map(i -> num(i.upper())).orElse(""),
                    Long.toString(e.helpfulVotes()), Long.toString(e.totalVotes()), num(e.share()),
                    Long.toString(e.reviews()), num(e.maxReviewShare())));
            for (Ranking c : r.compared()) {
                int k = e.ranksByRule().getOrDefault(c.rule().name(), 0);
                row.add(k == 0 ? "-" : Integer.toString(k));
            }
            row.add(e.flags().stream().map(Flag::words).collect(Collectors.joining("; ")));
            if (withReasons) {
                row.add(String.join(" ", e.reasons()));
            }
            g.add(row);
        }
        return g;
    }

    private static String text(RankingReport r, boolean withReasons) {
        StringBuilder b = new StringBuilder();
        b.append(r.title()).append('\n');
        r.parameters().forEach((k, v) -> b.append("  ").append(k).append(": ").append(v).append('\n'));
        b.append('\n').append(grid(r, false).toText());
        if (withReasons) {
            for (Explanation e : r.entries()) {
                b.append("\n#").append(e.rank()).append(' ').append(e.reviewer()).append('\n');
                e.reasons().forEach(s -> b.append("  - ").append(s).append('\n'));
            }
        }
        return b.toString();
    }

    private static String markdown(RankingReport r) {
        StringBuilder b = new StringBuilder();
        b.append("# ").append(r.title()).append("\n\n");
        r.parameters().forEach((k, v) -> b.append("- **").append(k).append("**: ").append(v).append('\n'));
        b.append("\n").append(grid(r, false).toMarkdown());
        b.append("\n## Why each reviewer stands where they stand\n");
        for (Explanation e : r.entries()) {
            b.append("\n### #").append(e.rank()).append(' ').append(e.reviewer().replace("|", "\\|")).append("\n\n");
            if (!e.flags().isEmpty()) {
                b.append("Flags: ").append(e.flags().stream().map(Flag::words).collect(Collectors.joining(", "))).append("\n\n");
            }
            e.reasons().forEach(s -> b.append("- ").append(s).append('\n'));
        }
        b.append("\n## Cautions\n\n");
        Cautions.TEXT.forEach(c -> b.append("- ").append(c).append('\n'));
        return b.toString();
    }

    private static String json(RankingReport r) {
        return Json.object(f -> f
                .field("title", r.title())
                .field("rule", r.ranking().rule().name())
                .field("rule_label", r.ranking().rule().label())
                .field("rule_description", r.ranking().rule().describe())
                .field("entry_bar", r.ranking().bar().describe())
                .field("ranked", r.ranking().size())
                .object("parameters", p -> r.parameters().forEach(p::field))
                .strings("cautions", Cautions.TEXT)
                .stream(g -> {
                    g.writeArrayFieldStart("entries");
                    for (Explanation e : r.entries()) {
                        entry(g, e);
                    }
                    g.writeEndArray();
                }));
    }

    static void entry(JsonGenerator j, Explanation e) throws IOException {
        j.writeStartObject();
        j.writeNumberField("rank", e.rank());
        j.writeStringField("reviewer", e.reviewer());
        j.writeNumberField("score", e.score());
        if (e.interval().isPresent()) {
            j.writeObjectFieldStart("interval");
            j.writeNumberField("lower", e.interval().get().lower());
            j.writeNumberField("upper", e.interval().get().upper());
            j.writeNumberField("confidence", e.interval().get().confidence());
            j.writeEndObject();
        }
        j.writeNumberField("helpful_votes", e.helpfulVotes());
        j.writeNumberField("total_votes", e.totalVotes());
        j.writeNumberField("share", e.share());
        j.writeNumberField("reviews", e.reviews());
        j.writeNumberField("voted_reviews", e.votedReviews());
        j.writeNumberField("top_review_share", e.maxReviewShare());
        j.writeNumberField("herfindahl", e.herfindahl());
        j.writeNumberField("verified_share", e.verifiedShare());
        if (e.shrinkageWeight().isPresent()) {
            j.writeNumberField("shrinkage_weight", e.shrinkageWeight().getAsDouble());
        }
        j.writeObjectFieldStart("ranks");
        for (Map.Entry<String, Integer> k : e.ranksByRule().entrySet().stream().sorted(Map.Entry.comparingByKey()).toList()) {
            if (k.getValue() == 0) {
                j.writeNullField(k.getKey());
            } else {
                j.writeNumberField(k.getKey(), k.getValue());
            }
        }
        j.writeEndObject();
        if (e.above().isPresent()) {
            neighbour(j, "above", e.above().get());
        }
        if (e.below().isPresent()) {
            neighbour(j, "below", e.below().get());
        }
        j.writeArrayFieldStart("flags");
        for (Flag f : e.flags()) {
            j.writeString(f.name().toLowerCase(Locale.ROOT));
        }
        j.writeEndArray();
        j.writeArrayFieldStart("reasons");
        for (String s : e.reasons()) {
            j.writeString(s);
        }
        j.writeEndArray();
        j.writeEndObject();
    }

    private static void neighbour(JsonGenerator j, String field, Explanation.Neighbour n) throws IOException {
        j.writeObjectFieldStart(field);
        j.writeNumberField("rank", n.rank());
        j.writeStringField("reviewer", n.reviewer());
        j.writeNumberField("score", n.score());
        j.writeNumberField("gap", n.gap());
        if (n.helpfulVotesToDrawLevel() >= 0) {
            j.writeNumberField("to_draw_level", n.helpfulVotesToDrawLevel());
        } else {
            j.writeNullField("to_draw_level");
        }
        j.writeEndObject();
    }

    static String num(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.4f", v);
    }
}
