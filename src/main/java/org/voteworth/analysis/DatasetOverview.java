package org.voteworth.analysis;

import java.time.YearMonth;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.SortedMap;
import java.util.TreeMap;
import org.voteworth.tally.CategoryCounts;
import org.voteworth.tally.FrequencyCounts;
import org.voteworth.tally.OverviewCounts;
import org.voteworth.tally.StarCounts;

/**
 * The data set overview (docs/methods.md, "Data set overview"): per category and overall, rows,
 * reviewers, the star histogram, the distribution of helpful and total votes per review, the
 * share of reviews without votes, verified and incentivised shares, reviews per reviewer and
 * reviews per month. Every figure is computed from exact frequency counts ({@link OverviewCounts}),
 * so medians and quantiles are exact, not estimated from a sample.
 *
 * @param overall all categories together
 * @param categories one section per category, sorted by name ("" for rows without a category)
 */
public record DatasetOverview(Section overall, List<Section> categories) {
    public DatasetOverview {
        Objects.requireNonNull(overall, "overall");
        categories = List.copyOf(categories);
    }

    /** The overview of {@code counts}. */
    public static DatasetOverview of(OverviewCounts counts) {
        return new DatasetOverview(Section.of(counts.overall()), counts.byCategory().stream().map(Section::of).toList());
    }

    /**
     * The overview of one category, or of all of them.
     *
     * @param category the category name; "" for the overall section and for rows without a category
     * @param rows reviews counted
     * @param reviewers distinct reviewers with a review here (0 when the reviewer table was not counted)
     * @param stars the star histogram of rated reviews
     * @param unrated reviews without a star rating
     * @param helpfulVotes helpful votes per review
     * @param totalVotes total votes per review
     * @param zeroVoteReviews reviews with no vote at all
     * @param verified reviews marked verified, not verified, or without the flag
     * @param incentivised reviews marked incentivised, not incentivised, or without the flag
     * @param reviewsPerReviewer reviews per reviewer (in this category, for a category section)
     * @param reviewsPerMonth reviews per calendar month of their date, ascending
     * @param undated reviews without a date
     */
    public record Section(String category, long rows, long reviewers, StarCounts stars, long unrated,
                          Distribution helpfulVotes, Distribution totalVotes, long zeroVoteReviews, Share verified,
                          Share incentivised, Distribution reviewsPerReviewer, SortedMap<YearMonth, Long> reviewsPerMonth,
                          long undated) {
        public Section {
            Objects.requireNonNull(category, "category");
            reviewsPerMonth = Collections.unmodifiableSortedMap(new TreeMap<>(reviewsPerMonth));
        }

        static Section of(CategoryCounts c) {
            return new Section(c.category(), c.rows(), c.reviewers(), c.stars(), c.unrated(),
                    Distribution.of(c.helpfulVotes()), Distribution.of(c.totalVotes()), c.zeroVoteReviews(),
                    new Share(c.verified(), c.notVerified(), c.rows() - c.verified() - c.notVerified()),
                    new Share(c.incentivised(), c.notIncentivised(), c.rows() - c.incentivised() - c.notIncentivised()),
                    Distribution.of(c.reviewsPerReviewer()), c.reviewsPerMonth(), c.undated());
        }

        /** Share of reviews with no vote at all; empty without rows. */
        public OptionalDouble zeroVoteShare() {
            return rows == 0 ? OptionalDouble.empty() : OptionalDouble.of((double) zeroVoteReviews / rows);
        }
    }

    /**
     * Summary of exact frequency counts: count, extremes, mean, sample standard deviation and
     * quantiles by linear interpolation between order statistics ({@link FrequencyCounts#quantile},
     * Hyndman and Fan's type 7; the median of an even count is the mean of the two middle values).
     * Without values, count is 0, min and max are 0 and every other figure is NaN; with one value
     * the standard deviation is NaN.
     */
    public record Distribution(long count, long min, long max, double mean, double standardDeviation, double q1,
                               double median, double q3, double p90, double p99) {
        /** The summary of {@code f}. */
        public static Distribution of(FrequencyCounts f) {
            if (f.isEmpty()) {
                return new Distribution(0, 0, 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                        Double.NaN);
            }
            return new Distribution(f.count(), f.min(), f.max(), f.mean(), f.standardDeviation(), f.quantile(0.25),
                    f.median(), f.quantile(0.75), f.quantile(0.90), f.quantile(0.99));
        }
    }

    /**
     * A yes/no flag over reviews.
     *
     * @param yes reviews with the flag set
     * @param no reviews with the flag cleared
     * @param unknown reviews without the flag (no such column, or an empty cell)
     */
    public record Share(long yes, long no, long unknown) {
        /** Reviews that carry the flag. */
        public long known() {
            return yes + no;
        }

        /** yes / (yes + no); empty when no review carries the flag. */
        public OptionalDouble share() {
            return known() == 0 ? OptionalDouble.empty() : OptionalDouble.of((double) yes / known());
        }
    }
}
