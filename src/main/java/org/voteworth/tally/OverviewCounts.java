package org.voteworth.tally;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * The exact data set overview counts of a dump, per category, collected in the same pass as the
 * tallies: one instance per scanning worker (it is a {@link ReviewSink}), merged at the end with
 * {@link #mergeFrom}, which adds counts and so is associative and commutative: the result does
 * not depend on thread count, byte ranges or merge order.
 *
 * <p>Two phases: rows go in through {@link #accept} (or {@link #add} by value); reviews per
 * reviewer come from the final, merged reviewer table, one {@link #addReviewer} call per reviewer
 * (a reviewer split over several partial tables would be counted more than once).
 *
 * <p>The hot path is primitive: the category's dense id picks its counters, and votes go into
 * arrays of frequency counts. Not thread-safe.
 */
public final class OverviewCounts implements ReviewSink {
    private final Categories categories = new Categories();
    private final List<CategoryCounts> byCategory = new ArrayList<>();
    private final FrequencyCounts reviewsPerReviewer = new FrequencyCounts();
    private final Map<String, CategoryCounts> byName = new HashMap<>();

    @Override
    public void accept(ReviewRow r) {
        slice(categories.idOf(r.categoryBuf, r.categoryOff, r.categoryLen))
                .add(r.helpful, r.total, r.stars, r.verified, r.incentivised, r.epochDay);
    }

    /**
     * Counts one review by its values, with the sentinels of {@link ReviewRow}: {@code starRating}
     * 1 to 5 or {@link ReviewRow#ABSENT}; the flags 1 yes, 0 no or {@link ReviewRow#ABSENT};
     * {@code epochDay} days since 1970-01-01 or {@link ReviewRow#NO_DATE}.
     */
    public void add(String category, long helpfulVotes, long totalVotes, int starRating, int verifiedFlag,
                    int incentivisedFlag, int epochDay) {
        if (helpfulVotes < 0 || helpfulVotes > totalVotes) {
            throw new IllegalArgumentException("need 0 <= helpful <= total, got " + helpfulVotes + "/" + totalVotes);
        }
        slice(category).add(helpfulVotes, totalVotes, starRating, verifiedFlag, incentivisedFlag, epochDay);
    }

    /** Counts one reviewer of the final reviewer table: their reviews overall and in each category. */
    public void addReviewer(ReviewerTally t) {
        reviewsPerReviewer.add(t.reviews());
        t.reviewsByCategory().forEach((c, n) -> slice(c).addReviewer(n));
    }

    /** As {@link #addReviewer} for the writer's record of one reviewer (category ids of {@code names}). */
    void addWritten(TallyRecord r, Categories names) {
        reviewsPerReviewer.add(r.reviews);
        for (int j = 0; j < r.categories; j++) {
            int id = r.categoryIds[j];
            boolean seen = false;
            long n = 0;
            for (int k = 0; k < r.categories; k++) {
                if (r.categoryIds[k] == id) {
                    seen |= k < j;
                    n += r.categoryCounts[k];
                }
            }
            if (!seen) {
                slice(names.name(id)).addReviewer(n);
            }
        }
    }

    /**
     * Counts every reviewer of a final, merged reviewer table: the same as {@link #addReviewer}
     * for each, read from the table's arrays without an object per reviewer.
     */
    public void addReviewers(TallyTable table) {
        if (table.unit() != TallyUnit.REVIEWER) {
            throw new IllegalArgumentException("reviews per reviewer need a reviewer table, not a " + table.unit() + " table");
        }
        for (int s = 0; s < table.size(); s++) {
            reviewsPerReviewer.add(table.reviews(s));
        }
        table.forEachCategoryCount((slot, category, reviews) -> slice(category).addReviewer(reviews));
    }

    /** Adds every count of {@code other} into these counts. */
    public void mergeFrom(OverviewCounts other) {
        for (CategoryCounts c : other.byCategory) {
            slice(c.category()).mergeFrom(c);
        }
        reviewsPerReviewer.mergeFrom(other.reviewsPerReviewer);
    }

    /** Category names seen, sorted; "" stands for rows without a category. */
    public List<String> categories() {
        return byCategory.stream().map(CategoryCounts::category).sorted().toList();
    }

    /** The counts of one category, if it was seen. */
    public Optional<CategoryCounts> category(String name) {
        return byCategory.stream().filter(c -> c.category().equals(name)).findFirst();
    }

    /** The counts of every category, sorted by name. */
    public List<CategoryCounts> byCategory() {
        return byCategory.stream().sorted(Comparator.comparing(CategoryCounts::category)).toList();
    }

    /** All categories together (a new value, category ""); reviews per reviewer over all categories. */
    public CategoryCounts overall() {
        CategoryCounts all = new CategoryCounts("");
        for (CategoryCounts c : byCategory()) {
            all.mergeFrom(c);
        }
        // Category slices count a reviewer once per category; overall counts each reviewer once.
        all.replaceReviewers(reviewsPerReviewer);
        return all;
    }

    /** Rows counted in all categories. */
    public long rows() {
        return byCategory.stream().mapToLong(CategoryCounts::rows).sum();
    }

    /** The counts of a category by name; names come from few distinct strings, so the lookup is a hash hit. */
    private CategoryCounts slice(String category) {
        CategoryCounts c = byName.get(category);
        if (c == null) {
            c = slice(categories.idOf(category));
            byName.put(category, c);
        }
        return c;
    }

    private CategoryCounts slice(int id) {
        while (byCategory.size() <= id) {
            byCategory.add(new CategoryCounts(categories.name(byCategory.size())));
        }
        return byCategory.get(id);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof OverviewCounts c && byCategory().equals(c.byCategory())
                && reviewsPerReviewer.equals(c.reviewsPerReviewer);
    }

    @Override
    public int hashCode() {
        return byCategory().hashCode();
    }

    @Override
    public String toString() {
        return "OverviewCounts" + byCategory();
    }
}
