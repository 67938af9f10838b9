package org.voteworth.analysis;

import java.io.IOException;
import java.time.LocalDate;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.voteworth.source.ReviewRow;
import org.voteworth.store.Store;
import org.voteworth.store.StoreManifest.CategoryStats;
import org.voteworth.store.StoredReview;
import org.voteworth.tally.StarCounts;

/**
 * One reviewer across all categories, from their reviews: where they review, how their stars
 * compare with each category's, how the votes fall on each review, the verified and incentivised
 * shares, activity per month and the busiest days.
 *
 * @param id reviewer id
 * @param reviews their reviews in store order (date, then input order)
 * @param categories per category they reviewed in: their reviews and stars against the category's
 * @param stars their star histogram over all reviews
 * @param expectedStars shares of 1 to 5 stars their category mix would give (each category's shares weighted by their reviews there)
 * @param helpfulVotes H over all reviews
 * @param totalVotes T over all reviews
 * @param verified reviews marked verified, of {@code verifiedKnown} that say either way
 * @param verifiedKnown reviews with the verified field present
 * @param incentivised reviews marked incentivised, of {@code incentivisedKnown}
 * @param incentivisedKnown reviews with the incentivised field present
 * @param perMonth reviews per calendar month, in order
 * @param busiestDays the days with two or more reviews, most first (ties: earlier day first), at most {@value #BUSIEST}
 * @param firstDay earliest review date, or {@link ReviewRow#NO_DATE}
 * @param lastDay latest review date, or {@link ReviewRow#NO_DATE}
 */
public record ReviewerProfile(String id, List<StoredReview> reviews, List<CategoryLine> categories, StarCounts stars,
                              List<Double> expectedStars, long helpfulVotes, long totalVotes, long verified, long verifiedKnown,
                              long incentivised, long incentivisedKnown, Map<YearMonth, Long> perMonth, List<Day> busiestDays,
                              int firstDay, int lastDay) {
    /** How many busy days a profile lists. */
    public static final int BUSIEST = 5;

    public ReviewerProfile {
        Objects.requireNonNull(id, "id");
        reviews = List.copyOf(reviews);
        categories = List.copyOf(categories);
        expectedStars = List.copyOf(expectedStars);
        perMonth = java.util.Collections.unmodifiableMap(new TreeMap<>(perMonth));
        busiestDays = List.copyOf(busiestDays);
    }

    /**
     * @param category category name ("" when the dump had none)
     * @param reviews the reviewer's reviews there
     * @param stars their stars there
     * @param categoryStars every review's stars in the category (the whole store)
     */
    public record CategoryLine(String category, long reviews, StarCounts stars, StarCounts categoryStars) {
    }

    /** A day with several reviews. */
    public record Day(LocalDate day, long reviews) {
    }

    /** Whether the reviewer was found at all. */
    public boolean found() {
        return !reviews.isEmpty();
    }

    /** H / T, or NaN without votes. */
    public double helpfulShare() {
        return totalVotes == 0 ? Double.NaN : (double) helpfulVotes / totalVotes;
    }

    /** Verified share of the reviews that say, or NaN when none does. */
    public double verifiedShare() {
        return verifiedKnown == 0 ? Double.NaN : (double) verified / verifiedKnown;
    }

    /** Incentivised share of the reviews that say, or NaN when none does. */
    public double incentivisedShare() {
        return incentivisedKnown == 0 ? Double.NaN : (double) incentivised / incentivisedKnown;
    }

    /** A review's helpful share, or NaN when it has no votes. */
    public static double share(StoredReview r) {
        return r.totalVotes() == 0 ? Double.NaN : (double) r.helpfulVotes() / r.totalVotes();
    }

    /**
     * The profile of {@code id} from a store that holds every review: its reviews, read from the one
     * part that can hold them, against the store's per-category star histograms.
     *
     * @throws IOException when the store holds the reviewer table only, or a part cannot be read
     */
    public static ReviewerProfile of(Store store, String id) throws IOException {
        return of(id, store.reviewsOf(id), store.manifest().categories());
    }

    /**
     * The profile of {@code id} from its reviews and the store's per-category star histograms.
     *
     * @param reviews the reviewer's reviews (all of them, any order; kept in the given order)
     */
    public static ReviewerProfile of(String id, List<StoredReview> reviews, Map<String, CategoryStats> categoryStats) {
        Map<String, long[]> byCat = new TreeMap<>();
        long[] st = new long[6];
        long h = 0;
        long t = 0;
        long ver = 0;
        long verKnown = 0;
        long inc = 0;
        long incKnown = 0;
        Map<YearMonth, Long> months = new TreeMap<>();
        Map<Integer, Long> days = new TreeMap<>();
        int first = ReviewRow.NO_DATE;
        int last = ReviewRow.NO_DATE;
        for (StoredReview r : reviews) {
            if (!r.reviewer().equals(id)) {
                throw new IllegalArgumentException("a review of " + r.reviewer() + " is not one of " + id + "'s");
            }
            long[] c = byCat.computeIfAbsent(r.category(), k -> new long[6]);
            c[0]++;
            if (r.stars() >= 1 && r.stars() <= 5) {
                c[r.stars()]++;
                st[r.stars()]++;
            }
            h += r.helpfulVotes();
            t += r.totalVotes();
            if (r.verified() != ReviewRow.ABSENT) {
                verKnown++;
                ver += r.verified();
            }
            if (r.incentivised() != ReviewRow.ABSENT) {
                incKnown++;
                inc += r.incentivised();
            }
            if (r.epochDay() != ReviewRow.NO_DATE) {
                LocalDate d = LocalDate.ofEpochDay(r.epochDay());
                months.merge(YearMonth.from(d), 1L, Long::sum);
                days.merge(r.epochDay(), 1L, Long::sum);
                first = first == ReviewRow.NO_DATE ? r.epochDay() : Math.min(first, r.epochDay());
                last = last == ReviewRow.NO_DATE ? r.epochDay() : Math.max(last, r.epochDay());
            }
        }
        List<CategoryLine> lines = new ArrayList<>();
        double[] expected = new double[6];
        long weighted = 0;
        for (Map.Entry<String, long[]> e : byCat.entrySet()) {
            long[] c = e.getValue();
            CategoryStats all = categoryStats.getOrDefault(e.getKey(), new CategoryStats(0, StarCounts.NONE));
            lines.add(new CategoryLine(e.getKey(), c[0], new StarCounts(c[1], c[2], c[3], c[4], c[5]), all.stars()));
            long rated = c[1] + c[2] + c[3] + c[4] + c[5];
            if (rated > 0 && all.stars().rated() > 0) {
                for (int s = 1; s <= 5; s++) {
                    expected[s] += rated * (double) all.stars().of(s) / all.stars().rated();
                }
                weighted += rated;
            }
        }
        lines.sort(Comparator.comparingLong(CategoryLine::reviews).reversed().thenComparing(CategoryLine::category));
        List<Double> shares = new ArrayList<>();
        for (int s = 1; s <= 5; s++) {
            shares.add(weighted == 0 ? Double.NaN : expected[s] / weighted);
        }
        List<Day> busy = days.entrySet().stream().filter(e -> e.getValue() >= 2)
                .sorted(Map.Entry.<Integer, Long>comparingByValue().reversed().thenComparing(Map.Entry.comparingByKey()))
                .limit(BUSIEST).map(e -> new Day(LocalDate.ofEpochDay(e.getKey()), e.getValue())).toList();
        return new ReviewerProfile(id, reviews, lines, new StarCounts(st[1], st[2], st[3], st[4], st[5]), shares, h, t, ver,
                verKnown, inc, incKnown, months, busy, first, last);
    }
}
