package org.voteworth.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.voteworth.analysis.RankUncertainty;
import org.voteworth.score.Explanation;

/**
 * Writes a ranking with its rank uncertainty: the columns of {@link RankingWriter} plus P(in top
 * k), its Monte Carlo standard error and the rank interval, in every format.
 */
public final class UncertainRankingWriter {
    private UncertainRankingWriter() {
    }

    public static String write(RankingReport r, RankUncertainty.Result u, OutputFormat format, boolean withReasons) {
        return switch (format) {
            case TABLE -> text(r, u, withReasons, false);
            case MD -> text(r, u, true, true);
            case CSV -> grid(r, u, true).toCsv();
            case JSON -> json(r, u);
        };
    }

    static Grid grid(RankingReport r, RankUncertainty.Result u, boolean withReasons) {
        Grid base = RankingWriter.grid(r, withReasons);
        List<String> h = new ArrayList<>();
        List<String> bh = base.headers();
        for (int i = 0; i < bh.size(); i++) {
            String name = bh.get(i);
            boolean numeric = !(name.equals("reviewer") || name.equals("flags") || name.equals("reasons"));
            h.add(name + (numeric ? ">" : ""));
            if (name.equals("score")) {
                h.add("p_top_" + u.settings().k() + ">");
                h.add("p_se>");
                h.add("rank_low>");
                h.add("rank_median>");
                h.add("rank_high>");
            }
        }
        Grid g = new Grid(h);
        List<List<String>> rows = base.rows();
        int at = bh.indexOf("score") + 1;
        for (int i = 0; i < rows.size(); i++) {
            Explanation e = r.entries().get(i);
            RankUncertainty.Spread s = u.of(r.ranking().slotAt(e.rank()));
            List<String> row = new ArrayList<>(rows.get(i));
            row.addAll(at, List.of(num(s.probabilityTopK()), num(s.standardError()), rank(s, s.rankLow()),
                    rank(s, s.rankMedian()), rank(s, s.rankHigh())));
            g.add(row);
        }
        return g;
    }

    static String describe(RankUncertainty.Result u) {
        return String.format(Locale.ROOT, "P(in top %d) and %.0f %%-%.0f %% rank intervals from %,d seeded draws (seed %d) of %s;"
                        + " %,d of %,d ranked units drawn, %,d pruned as unable to reach the top %d in practice (expected"
                        + " entrants among the pruned per draw: %.2g); largest Monte Carlo standard error %.4f",
                u.settings().k(), 100 * u.settings().lowQuantile(), 100 * u.settings().highQuantile(), u.settings().draws(),
                u.settings().seed(), u.model().describe(), u.kept(), u.ranked(), u.pruned(), u.settings().k(),
                u.prunedExpectedEntrants(), u.maxStandardError());
    }

    private static String text(RankingReport r, RankUncertainty.Result u, boolean withReasons, boolean md) {
        StringBuilder b = new StringBuilder();
        b.append(md ? "# " : "").append(r.title()).append(md ? "\n\n" : "\n");
        r.parameters().forEach((k, v) -> b.append(md ? "- **" + k + "**: " : "  " + k + ": ").append(v).append('\n'));
        b.append(md ? "- **rank uncertainty**: " : "  rank uncertainty: ").append(describe(u)).append('\n');
        b.append('\n').append(md ? grid(r, u, false).toMarkdown() : grid(r, u, false).toText());
        if (withReasons) {
            b.append(md ? "\n## Why each reviewer stands where they stand\n" : "");
            for (Explanation e : r.entries()) {
                b.append(md ? "\n### #" : "\n#").append(e.rank()).append(' ').append(e.reviewer()).append(md ? "\n\n" : "\n");
                e.reasons().forEach(s -> b.append(md ? "- " : "  - ").append(s).append('\n'));
            }
        }
        if (md) {
            b.append("\n## Cautions\n\n");
            Cautions.TEXT.forEach(c -> b.append("- ").append(c).append('\n'));
        }
        return b.toString();
    }

    private static String json(RankingReport r, RankUncertainty.Result u) {
        return Json.object(f -> f
                .field("title", r.title())
                .field("rule", r.ranking().rule().name())
                .field("rule_label", r.ranking().rule().label())
                .field("entry_bar", r.ranking().bar().describe())
                .field("ranked", r.ranking().size())
                .object("parameters", p -> r.parameters().forEach(p::field))
                .object("uncertainty", o -> o
                        .field("k", u.settings().k())
                        .field("draws", u.settings().draws())
                        .field("seed", u.settings().seed())
                        .field("share_model", u.model().describe())
                        .field("interval_low_quantile", u.settings().lowQuantile())
                        .field("interval_high_quantile", u.settings().highQuantile())
                        .field("drawn", u.kept())
                        .field("pruned", u.pruned())
                        .field("pruning_threshold", u.threshold())
                        .field("pruned_expected_entrants", u.prunedExpectedEntrants())
                        .field("max_standard_error", u.maxStandardError()))
                .strings("cautions", Cautions.TEXT)
                .stream(g -> {
                    g.writeArrayFieldStart("entries");
                    for (Explanation e : r.entries()) {
                        RankingWriter.entry(g, e);
                    }
                    g.writeEndArray();
                    g.writeArrayFieldStart("rank_uncertainty");
                    for (Explanation e : r.entries()) {
                        RankUncertainty.Spread s = u.of(r.ranking().slotAt(e.rank()));
                        g.writeStartObject();
                        g.writeNumberField("rank", e.rank());
                        g.writeStringField("reviewer", e.reviewer());
                        g.writeNumberField("p_top_k", s.probabilityTopK());
                        g.writeNumberField("standard_error", s.standardError());
                        g.writeBooleanField("pruned", s.pruned());
                        if (!s.pruned()) {
                            g.writeNumberField("rank_low", s.rankLow());
                            g.writeNumberField("rank_median", s.rankMedian());
                            g.writeNumberField("rank_high", s.rankHigh());
                        }
                        g.writeEndObject();
                    }
                    g.writeEndArray();
                }));
    }

    private static String rank(RankUncertainty.Spread s, int v) {
        return s.pruned() ? "" : Integer.toString(v);
    }

    private static String num(double v) {
        return String.format(Locale.ROOT, "%.4f", v);
    }
}
