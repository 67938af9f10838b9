package org.voteworth.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.UnaryOperator;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.source.ReviewRow;
import org.voteworth.store.StoreManifest;
import org.voteworth.store.StoredReview;
import org.voteworth.tally.StarCounts;

/**
 * Writes reviewer profiles as a terminal table, Markdown, CSV (one row per review) or JSON. Ids go
 * through the given mask, so {@code --pseudonymize} holds in every format.
 */
public final class ProfileWriter {
    /** Reviews listed in the table and Markdown (the most voted); JSON and CSV list all. */
    static final int LISTED = 10;

    private ProfileWriter() {
    }

    /** The parameters a profile report lists for the store {@code label} with manifest {@code m}. */
    public static Map<String, String> storeParameters(String label, StoreManifest m) {
        Map<String, String> parameters = new LinkedHashMap<>();
        parameters.put("store", label + " (" + m.accepted() + " reviews of " + m.reviewers() + " reviewers from "
                + m.files().size() + " files)");
        parameters.put("category stars", "every review in the store, per category");
        return parameters;
    }

    public static String write(List<ReviewerProfile> profiles, OutputFormat format, UnaryOperator<String> ids,
                               Map<String, String> parameters) {
        return switch (format) {
            case TABLE -> text(profiles, ids, parameters, false);
            case MD -> text(profiles, ids, parameters, true);
            case CSV -> reviews(profiles, ids, Integer.MAX_VALUE).toCsv();
            case JSON -> json(profiles, ids, parameters);
        };
    }

    private static String text(List<ReviewerProfile> profiles, UnaryOperator<String> ids, Map<String, String> parameters,
                               boolean md) {
        StringBuilder b = new StringBuilder();
        b.append(md ? "# Reviewer profiles\n\n" : "Reviewer profiles\n");
        parameters.forEach((k, v) -> b.append(md ? "- **" + k + "**: " + v : "  " + k + ": " + v).append('\n'));
        for (ReviewerProfile p : profiles) {
            b.append('\n').append(md ? "## " : "== ").append(ids.apply(p.id())).append(md ? "\n\n" : "\n");
            if (!p.found()) {
                b.append("not in the store (no review by this id)\n");
                continue;
            }
            b.append(summary(p)).append('\n');
            b.append(md ? "\n### Categories: stars against the category's\n\n" : "\nCategories: stars against the category's\n");
            b.append(grid(categories(p), md));
            b.append(md ? "\n### Stars against their category mix\n\n" : "\nStars against their category mix\n");
            b.append(grid(stars(p), md));
            b.append(md ? "\n### Activity per month\n\n" : "\nActivity per month\n");
            b.append(grid(monthGrid(p), md));
            b.append(md ? "\n### Busiest days\n\n" : "\nBusiest days\n");
            if (p.busiestDays().isEmpty()) {
                b.append("no day with more than one review\n");
            } else {
                b.append(grid(busiestDays(p), md));
            }
            b.append(md ? "\n### Helpful share per review (most voted " + Math.min(LISTED, p.reviews().size()) + ")\n\n"
                    : "\nHelpful share per review (most voted " + Math.min(LISTED, p.reviews().size()) + ")\n");
            b.append(grid(reviews(List.of(p), ids, LISTED), md));
        }
        b.append(md ? "\n## Cautions\n\n" : "\nCautions:\n");
        Cautions.TEXT.forEach(c -> b.append(md ? "- " : "  - ").append(c).append('\n'));
        return b.toString();
    }

    /** The profile in one line: reviews, votes, first and last review, verified and incentivised shares. */
    static String summary(ReviewerProfile p) {
        return String.format(Locale.ROOT, "%s reviews, %d of %d votes helpful (%s), first %s, last %s; verified %s, incentivised %s",
                p.reviews().size(), p.helpfulVotes(), p.totalVotes(), percent(p.helpfulShare()), date(p.firstDay()),
                date(p.lastDay()), share(p.verified(), p.verifiedKnown()), share(p.incentivised(), p.incentivisedKnown()));
    }

    /** Reviews per calendar month, in order. */
    static Grid monthGrid(ReviewerProfile p) {
        Grid g = new Grid(List.of("month", "reviews>"));
        p.perMonth().forEach((m, n) -> g.add(List.of(m.toString(), Long.toString(n))));
        return g;
    }

    /** The busiest days, most reviews first. */
    static Grid busiestDays(ReviewerProfile p) {
        Grid g = new Grid(List.of("day", "reviews>"));
        p.busiestDays().forEach(d -> g.add(List.of(d.day().toString(), Long.toString(d.reviews()))));
        return g;
    }

    private static String grid(Grid g, boolean md) {
        return md ? g.toMarkdown() : g.toText();
    }

    /** Per category: the reviewer's reviews, and the shares of each star, theirs against the category's. */
    static Grid categories(ReviewerProfile p) {
        List<String> h = new ArrayList<>(List.of("category", "reviews>"));
        for (int s = 1; s <= 5; s++) {
            h.add(s + "★ theirs>");
            h.add(s + "★ category>");
        }
        Grid g = new Grid(h);
        for (ReviewerProfile.CategoryLine c : p.categories()) {
            List<String> row = new ArrayList<>(List.of(c.category().isEmpty() ? "(none)" : c.category(), Long.toString(c.reviews())));
            for (int s = 1; s <= 5; s++) {
                row.add(starShare(c.stars(), s));
                row.add(starShare(c.categoryStars(), s));
            }
            g.add(row);
        }
        return g;
    }

    /** Their stars against the shares their category mix would give. */
    static Grid stars(ReviewerProfile p) {
        Grid g = new Grid(List.of("stars", "reviews>", "share>", "expected_share>"));
        for (int s = 1; s <= 5; s++) {
            g.add(List.of(Integer.toString(s), Long.toString(p.stars().of(s)), starShare(p.stars(), s),
                    percent(p.expectedStars().get(s - 1))));
        }
        return g;
    }

    /** Reviews, the {@code limit} most voted of each profile (then in store order). */
    static Grid reviews(List<ReviewerProfile> profiles, UnaryOperator<String> ids, int limit) {
        Grid g = new Grid(List.of("reviewer", "date", "category", "review", "item", "stars>", "helpful>", "total>", "share>",
                "verified", "incentivised", "file", "line>"));
        for (ReviewerProfile p : profiles) {
            List<StoredReview> shown = p.reviews();
            if (shown.size() > limit) {
                shown = shown.stream().sorted(Comparator.comparingLong(StoredReview::totalVotes).reversed()).limit(limit).toList();
            }
            for (StoredReview r : shown) {
                g.add(List.of(ids.apply(r.reviewer()), date(r.epochDay()), r.category(), r.review(), r.item(),
                        r.stars() == ReviewRow.ABSENT ? "" : Integer.toString(r.stars()), Long.toString(r.helpfulVotes()),
                        Long.toString(r.totalVotes()), decimal(ReviewerProfile.share(r)), flag(r.verified()),
                        flag(r.incentivised()), r.file(), Long.toString(r.line())));
            }
        }
        return g;
    }

    private static String json(List<ReviewerProfile> profiles, UnaryOperator<String> ids, Map<String, String> parameters) {
        return Json.object(f -> f
                .object("parameters", p -> parameters.forEach(p::field))
                .strings("cautions", Cautions.TEXT)
                .array("profiles", profiles, (o, p) -> o
                        .field("reviewer", ids.apply(p.id()))
                        .field("found", p.found())
                        .field("reviews", p.reviews().size())
                        .field("helpful_votes", p.helpfulVotes())
                        .field("total_votes", p.totalVotes())
                        .field("helpful_share", p.helpfulShare())
                        .field("verified", p.verified())
                        .field("verified_known", p.verifiedKnown())
                        .field("verified_share", p.verifiedShare())
                        .field("incentivised", p.incentivised())
                        .field("incentivised_known", p.incentivisedKnown())
                        .field("incentivised_share", p.incentivisedShare())
                        .field("first_date", date(p.firstDay()))
                        .field("last_date", date(p.lastDay()))
                        .array("categories", p.categories(), (c, line) -> c
                                .field("category", line.category())
                                .field("reviews", line.reviews())
                                .map("stars", starMap(line.stars()))
                                .map("category_stars", starMap(line.categoryStars())))
                        .map("stars", starMap(p.stars()))
                        .map("expected_star_shares", expected(p))
                        .map("per_month", months(p))
                        .array("busiest_days", p.busiestDays(), (d, day) -> d
                                .field("day", day.day().toString())
                                .field("reviews", day.reviews()))
                        .array("review_list", p.reviews(), (r, rev) -> r
                                .field("date", date(rev.epochDay()))
                                .field("category", rev.category())
                                .field("review", rev.review())
                                .field("item", rev.item())
                                .field("stars", rev.stars())
                                .field("helpful_votes", rev.helpfulVotes())
                                .field("total_votes", rev.totalVotes())
                                .field("helpful_share", ReviewerProfile.share(rev))
                                .field("verified", rev.verified())
                                .field("incentivised", rev.incentivised())
                                .field("file", rev.file())
                                .field("line", rev.line()))));
    }

    private static Map<String, Long> starMap(StarCounts s) {
        Map<String, Long> m = new LinkedHashMap<>();
        for (int k = 1; k <= 5; k++) {
            m.put(Integer.toString(k), s.of(k));
        }
        return m;
    }

    private static Map<String, Double> expected(ReviewerProfile p) {
        Map<String, Double> m = new LinkedHashMap<>();
        for (int k = 1; k <= 5; k++) {
            if (!Double.isNaN(p.expectedStars().get(k - 1))) {
                m.put(Integer.toString(k), p.expectedStars().get(k - 1));
            }
        }
        return m;
    }

    private static Map<String, Long> months(ReviewerProfile p) {
        Map<String, Long> m = new LinkedHashMap<>();
        p.perMonth().forEach((k, v) -> m.put(k.toString(), v));
        return m;
    }

    private static String starShare(StarCounts s, int k) {
        return s.rated() == 0 ? "" : percent((double) s.of(k) / s.rated());
    }

    private static String share(long n, long of) {
        return of == 0 ? "unknown" : String.format(Locale.ROOT, "%d of %d (%s)", n, of, percent((double) n / of));
    }

    private static String percent(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.1f %%", 100 * v);
    }

    private static String decimal(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.4f", v);
    }

    private static String flag(int v) {
        return v == ReviewRow.ABSENT ? "" : v == 1 ? "yes" : "no";
    }

    private static String date(int day) {
        return day == ReviewRow.NO_DATE ? "" : LocalDate.ofEpochDay(day).toString();
    }
}
