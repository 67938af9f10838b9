package org.voteworth.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.voteworth.analysis.ComparisonResult;

/** Writes a {@link ComparisonResult} as a terminal table, Markdown, CSV or JSON: the same numbers in each. */
public final class CompareWriter {
    private CompareWriter() {
    }

    public static String write(ComparisonResult r, OutputFormat format, Map<String, String> parameters) {
        return switch (format) {
            case TABLE -> text(r, parameters, false);
            case MD -> text(r, parameters, true);
            case CSV -> reviewers(r).toCsv();
            case JSON -> json(r, parameters);
        };
    }

    /** One row per reviewer of the union, with the rank under every rule. */
    static Grid reviewers(ComparisonResult r) {
        List<String> h = new ArrayList<>(List.of("reviewer", "helpful>", "total>", "share>", "top_review_share>"));
        r.rules().forEach(n -> h.add("rank_" + n + ">"));
        Grid g = new Grid(h);
        for (ComparisonResult.Row row : r.rows()) {
            List<String> cells = new ArrayList<>(List.of(row.reviewer(), Long.toString(row.helpfulVotes()),
                    Long.toString(row.totalVotes()), SweepWriter.num(row.share()), SweepWriter.num(row.topReviewShare())));
            for (String n : r.rules()) {
                int k = row.ranks().getOrDefault(n, 0);
                cells.add(k == 0 ? "-" : Integer.toString(k));
            }
            g.add(cells);
        }
        return g;
    }

    static Grid pairs(ComparisonResult r) {
        Grid g = new Grid(List.of("rule_a", "rule_b", "jaccard>", "kendall_tau_b>", "spearman_rho>", "rbo>"));
        for (ComparisonResult.PairStats p : r.pairs()) {
            g.add(List.of(p.ruleA(), p.ruleB(), SweepWriter.num(p.jaccard()), SweepWriter.num(p.kendallTauB()),
                    SweepWriter.num(p.spearmanRho()), SweepWriter.num(p.rbo())));
        }
        return g;
    }

    private static String text(ComparisonResult r, Map<String, String> parameters, boolean md) {
        StringBuilder b = new StringBuilder();
        String title = "Rules compared at top " + r.k() + ": " + String.join(", ", r.rules());
        b.append(md ? "# " + title + "\n\n" : title + "\n");
        parameters.forEach((k, v) -> b.append(md ? "- **" + k + "**: " + v : "  " + k + ": " + v).append('\n'));
        b.append(md ? "- **unranked reviewers**: " : "  unranked reviewers: ").append(r.unrankedRank()).append("\n\n");
        b.append(md ? pairs(r).toMarkdown() : pairs(r).toText()).append('\n');
        b.append(md ? reviewers(r).toMarkdown() : reviewers(r).toText());
        b.append(md ? "\n## Large disagreements\n\n" : "\nLarge disagreements:\n");
        if (r.disagreements().isEmpty()) {
            b.append(md ? "" : "  ").append("none: no reviewer in one rule's top ").append(r.k())
                    .append(" ranks beyond twice that under another.\n");
        }
        r.disagreements().forEach(s -> b.append(md ? "- " : "  - ").append(s).append('\n'));
        b.append(md ? "\n## Cautions\n\n" : "\nCautions:\n");
        Cautions.TEXT.forEach(c -> b.append(md ? "- " : "  - ").append(c).append('\n'));
        return b.toString();
    }

    private static String json(ComparisonResult r, Map<String, String> parameters) {
        return Json.object(f -> f
                .field("k", r.k())
                .strings("rules", r.rules())
                .strings("rule_labels", r.labels())
                .field("unranked_rank", r.unrankedRank())
                .object("parameters", p -> parameters.forEach(p::field))
                .strings("cautions", Cautions.TEXT)
                .array("pairs", r.pairs(), (o, p) -> o
                        .field("rule_a", p.ruleA())
                        .field("rule_b", p.ruleB())
                        .field("jaccard", p.jaccard())
                        .field("kendall_tau_b", p.kendallTauB())
                        .field("spearman_rho", p.spearmanRho())
                        .field("rbo", p.rbo())
                        .field("rbo_persistence", p.persistence()))
                .array("reviewers", r.rows(), (o, row) -> o
                        .field("reviewer", row.reviewer())
                        .field("helpful_votes", row.helpfulVotes())
                        .field("total_votes", row.totalVotes())
                        .field("share", row.share())
                        .field("top_review_share", row.topReviewShare())
                        .map("ranks", row.ranks()))
                .strings("disagreements", r.disagreements()));
    }
}
