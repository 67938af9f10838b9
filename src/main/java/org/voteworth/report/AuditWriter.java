package org.voteworth.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.voteworth.analysis.AuditResult;

/** Writes an {@link AuditResult} as a terminal table, Markdown, CSV or JSON: the same numbers in each. */
public final class AuditWriter {
    private AuditWriter() {
    }

    /**
     * @param failures the fail policy's conditions that hold (empty when it passes or there is none)
     */
    public static String write(AuditResult r, OutputFormat format, Map<String, String> parameters, List<String> failures) {
        return switch (format) {
            case TABLE -> text(r, parameters, failures, false);
            case MD -> text(r, parameters, failures, true);
            case CSV -> csv(r).toCsv();
            case JSON -> json(r, parameters, failures);
        };
    }

    static Grid members(AuditResult r) {
        List<String> h = new ArrayList<>(List.of("reviewer", "helpful>", "total>", "share>", "p_meets_bar>", "wilson_lower>",
                "posterior_mean>", "p_top_k>", "p_top_k_se>", "in_top_k"));
        List<String> rules = r.members().isEmpty() ? List.of() : new ArrayList<>(r.members().get(0).ranks().keySet());
        rules.forEach(n -> h.add("rank_" + n + ">"));
        h.add("flags");
        Grid g = new Grid(h);
        for (AuditResult.Member m : r.members()) {
            List<String> row = new ArrayList<>(List.of(m.reviewer(), Long.toString(m.helpfulVotes()), Long.toString(m.totalVotes()),
                    SweepWriter.num(m.share()), SweepWriter.num(m.probabilityMeetsBar()), SweepWriter.num(m.wilsonLower()),
                    SweepWriter.num(m.posteriorMean()), SweepWriter.num(m.probabilityTopK()), SweepWriter.num(m.topKError()),
                    m.inStatisticalTopK() ? "yes" : "no"));
            rules.forEach(n -> row.add(m.ranks().get(n) == 0 ? "-" : Integer.toString(m.ranks().get(n))));
            List<String> words = new ArrayList<>();
            if (m.smallSample()) {
                words.add("small sample");
            }
            m.flags().forEach(x -> words.add(x.words()));
            row.add(String.join("; ", words));
            g.add(row);
        }
        return g;
    }

    static Grid overlooked(AuditResult r) {
        Grid g = new Grid(List.of("reviewer", "helpful>", "total>", "posterior_mean>", "rank>", "beats", "min_p_beats>"));
        for (AuditResult.Overlooked o : r.overlooked()) {
            g.add(List.of(o.reviewer(), Long.toString(o.helpfulVotes()), Long.toString(o.totalVotes()),
                    SweepWriter.num(o.posteriorMean()), o.rank() == 0 ? "-" : Integer.toString(o.rank()),
                    String.join(" ", o.beats()), SweepWriter.num(o.minProbability())));
        }
        return g;
    }

    /** One CSV: listed members, then overlooked reviewers and missing ids, told apart by the {@code part} column. */
    static Grid csv(AuditResult r) {
        Grid m = members(r);
        List<String> h = new ArrayList<>();
        h.add("part");
        List<String> mh = m.headers();
        for (int i = 0; i < mh.size(); i++) {
            // Keep the numeric markers of the member columns.
            boolean numeric = i >= 1 && i <= 8 || mh.get(i).startsWith("rank_");
            h.add(mh.get(i) + (numeric ? ">" : ""));
        }
        h.add("beats");
        Grid g = new Grid(h);
        for (List<String> row : m.rows()) {
            List<String> c = new ArrayList<>();
            c.add("listed");
            c.addAll(row);
            c.add("");
            g.add(c);
        }
        for (AuditResult.Overlooked o : r.overlooked()) {
            List<String> c = new ArrayList<>();
            c.add("overlooked");
            c.add(o.reviewer());
            c.add(Long.toString(o.helpfulVotes()));
            c.add(Long.toString(o.totalVotes()));
            while (c.size() < 7) {
                c.add("");
            }
            c.add(SweepWriter.num(o.posteriorMean()));
            while (c.size() < h.size() - 1) {
                c.add("");
            }
            c.add(String.join(" ", o.beats()));
            g.add(c);
        }
        for (String id : r.missing()) {
            List<String> c = new ArrayList<>();
            c.add("missing");
            c.add(id);
            while (c.size() < h.size()) {
                c.add("");
            }
            g.add(c);
        }
        return g;
    }

    private static String text(AuditResult r, Map<String, String> parameters, List<String> failures, boolean md) {
        StringBuilder b = new StringBuilder();
        AuditResult.Summary s = r.summary();
        String title = "Audit of " + r.list() + " against " + r.bar();
        b.append(md ? "# " + title + "\n\n" : title + "\n");
        parameters.forEach((k, v) -> b.append(md ? "- **" + k + "**: " + v : "  " + k + ": " + v).append('\n'));
        b.append(md ? "- **share model**: " : "  share model: ").append(r.model()).append('\n');
        b.append(md ? "\n## Summary\n\n" : "\nSummary:\n");
        String p = md ? "- " : "  ";
        b.append(p).append(String.format(Locale.ROOT, "%d listed, %d found in the data, %d not in the data%s", s.listed(), s.found(),
                s.missing(), r.duplicates().isEmpty() ? "" : ", " + r.duplicates().size() + " listed twice or more")).append('\n');
        b.append(p).append(String.format(Locale.ROOT, "expected number below the bar: %.2f (sum of 1 - P); %d more likely below"
                + " than above; smallest P(meets the bar) %.4f", s.expectedBelow(), s.likelyBelow(), s.minProbability())).append('\n');
        b.append(p).append(String.format(Locale.ROOT, "precision against the statistical top %d under %s: %.2f", r.k(),
                r.topKRule(), s.precision())).append('\n');
        b.append(p).append(String.format(Locale.ROOT, "reviewers not listed who beat its weakest members with high probability: %d",
                s.overlooked())).append('\n');
        b.append(p).append(String.format(Locale.ROOT, "largest Monte Carlo standard error of a P(in top k): %.4f",
                s.maxMonteCarloError())).append('\n');
        if (!failures.isEmpty()) {
            b.append(p).append("FAILED the policy: ").append(String.join("; ", failures)).append('\n');
        }
        b.append(md ? "\n## Listed reviewers\n\n" + members(r).toMarkdown() : "\nListed reviewers:\n" + members(r).toText());
        if (!r.missing().isEmpty()) {
            b.append(md ? "\n## Not in the data\n\n" : "\nNot in the data:\n");
            r.missing().forEach(id -> b.append(md ? "- " : "  ").append(id).append('\n'));
        }
        b.append(md ? "\n## Overlooked reviewers\n\n" : "\nOverlooked reviewers (not listed, beat its weakest members):\n");
        if (r.overlooked().isEmpty()) {
            b.append(md ? "None.\n" : "  none\n");
        } else {
            b.append(md ? overlooked(r).toMarkdown() : overlooked(r).toText());
        }
        b.append(md ? "\n## Cautions\n\n" : "\nCautions:\n");
        Cautions.TEXT.forEach(c -> b.append(md ? "- " : "  - ").append(c).append('\n'));
        return b.toString();
    }

    private static String json(AuditResult r, Map<String, String> parameters, List<String> failures) {
        AuditResult.Summary s = r.summary();
        return Json.object(f -> f
                .field("list", r.list())
                .field("bar", r.bar())
                .field("share_model", r.model())
                .field("top_k_rule", r.topKRule())
                .field("k", r.k())
                .object("parameters", p -> parameters.forEach(p::field))
                .object("summary", o -> o
                        .field("listed", s.listed())
                        .field("found", s.found())
                        .field("missing", s.missing())
                        .field("expected_below", s.expectedBelow())
                        .field("likely_below", s.likelyBelow())
                        .field("min_probability", s.minProbability())
                        .field("precision", s.precision())
                        .field("overlooked", s.overlooked())
                        .field("max_monte_carlo_error", s.maxMonteCarloError()))
                .field("passed", failures.isEmpty())
                .strings("failures", failures)
                .array("members", r.members(), (o, m) -> o
                        .field("reviewer", m.reviewer())
                        .field("helpful_votes", m.helpfulVotes())
                        .field("total_votes", m.totalVotes())
                        .field("share", m.share())
                        .field("p_meets_bar", m.probabilityMeetsBar())
                        .field("wilson_lower", m.wilsonLower())
                        .field("posterior_mean", m.posteriorMean())
                        .field("p_top_k", m.probabilityTopK())
                        .field("p_top_k_se", m.topKError())
                        .field("in_statistical_top_k", m.inStatisticalTopK())
                        .map("ranks", m.ranks())
                        .field("small_sample", m.smallSample())
                        .strings("flags", m.flags().stream().map(x -> x.name().toLowerCase(Locale.ROOT)).toList()))
                .strings("missing", r.missing())
                .strings("duplicates", r.duplicates())
                .array("overlooked", r.overlooked(), (o, x) -> o
                        .field("reviewer", x.reviewer())
                        .field("helpful_votes", x.helpfulVotes())
                        .field("total_votes", x.totalVotes())
                        .field("posterior_mean", x.posteriorMean())
                        .field("rank", x.rank())
                        .strings("beats", x.beats())
                        .field("min_p_beats", x.minProbability()))
                .strings("cautions", Cautions.TEXT));
    }
}
