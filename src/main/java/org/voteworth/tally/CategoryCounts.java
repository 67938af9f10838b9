package org.voteworth.tally;

import java.time.YearMonth;
import java.util.Arrays;
import java.util.Collections;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;
import org.voteworth.source.ReviewRow;

/**
 * The exact data set overview counts of one category (or of all of them): rows, star histogram,
 * frequency counts of helpful and total votes, verified and incentivised flags, reviews per month
 * and reviews per reviewer. Read through the getters; only {@link OverviewCounts} adds to it.
 * Merging adds counts, so it is associative and commutative.
 */
public final class CategoryCounts {
    private final String category;
    private long rows;
    /** stars[0] = no rating, stars[1..5] = one to five stars. */
    private final long[] stars = new long[6];
    /** [absent, no, yes]: indexed by the flag + 1 ({@link ReviewRow#ABSENT} is -1). */
    private final long[] verified = new long[3];
    private final long[] incentivised = new long[3];
    private final FrequencyCounts helpful = new FrequencyCounts();
    private final FrequencyCounts total = new FrequencyCounts();
    private FrequencyCounts reviewsPerReviewer = new FrequencyCounts();
    private long undated;
    /** Reviews per month: months[i] counts epoch month monthBase + i (0 = January 1970). */
    private long[] months = new long[0];
    private long monthBase;

    CategoryCounts(String category) {
        this.category = Objects.requireNonNull(category, "category");
    }

    /** The category name; "" for rows without one, and for the overall counts. */
    public String category() {
        return category;
    }

    void add(long helpfulVotes, long totalVotes, int starRating, int verifiedFlag, int incentivisedFlag, int epochDay) {
        rows++;
        stars[starRating >= 1 && starRating <= 5 ? starRating : 0]++;
        verified[flag(verifiedFlag)]++;
        incentivised[flag(incentivisedFlag)]++;
        helpful.add(helpfulVotes);
        total.add(totalVotes);
        if (epochDay == ReviewRow.NO_DATE) {
            undated++;
        } else {
            addMonth(epochMonth(epochDay), 1);
        }
    }

    private static int flag(int f) {
        return f == 1 ? 2 : f == 0 ? 1 : 0;
    }

    void addReviewer(long reviews) {
        reviewsPerReviewer.add(reviews);
    }

    /** Sets reviews per reviewer outright (the overall counts take them from the whole table, not the categories). */
    void replaceReviewers(FrequencyCounts counts) {
        reviewsPerReviewer = counts.copy();
    }

    void mergeFrom(CategoryCounts o) {
        rows += o.rows;
        for (int i = 0; i < stars.length; i++) {
            stars[i] += o.stars[i];
        }
        for (int i = 0; i < 3; i++) {
            verified[i] += o.verified[i];
            incentivised[i] += o.incentivised[i];
        }
        helpful.mergeFrom(o.helpful);
        total.mergeFrom(o.total);
        reviewsPerReviewer.mergeFrom(o.reviewsPerReviewer);
        undated += o.undated;
        for (int i = 0; i < o.months.length; i++) {
            if (o.months[i] > 0) {
                addMonth(o.monthBase + i, o.months[i]);
            }
        }
    }

    private void addMonth(long month, long n) {
        if (months.length == 0) {
            months = new long[12];
            monthBase = month - month % 12;
        }
        long i = month - monthBase;
        if (i < 0 || i >= months.length) {
            long lo = Math.min(monthBase, month - Math.floorMod(month, 12));
            long hi = Math.max(monthBase + months.length, month + 1);
            long[] grown = new long[Math.toIntExact(hi - lo)];
            System.arraycopy(months, 0, grown, Math.toIntExact(monthBase - lo), months.length);
            months = grown;
            monthBase = lo;
            i = month - monthBase;
        }
        months[(int) i] += n;
    }

    /**
     * Months since January 1970 (may be negative) of a day since 1970-01-01, by the proleptic
     * Gregorian calendar without allocating (H. Hinnant, "chrono-Compatible Low-Level Date
     * Algorithms", civil_from_days).
     */
    static long epochMonth(long epochDay) {
        long z = epochDay + 719_468;
        long era = Math.floorDiv(z, 146_097);
        long doe = z - era * 146_097;
        long yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
        long doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
        long mp = (5 * doy + 2) / 153;
        long month = mp < 10 ? mp + 3 : mp - 9;
        long year = yoe + era * 400 + (month <= 2 ? 1 : 0);
        return (year - 1970) * 12 + month - 1;
    }

    /** Reviews counted. */
    public long rows() {
        return rows;
    }

    /** The star histogram of rated reviews. */
    public StarCounts stars() {
        return new StarCounts(stars[1], stars[2], stars[3], stars[4], stars[5]);
    }

    /** Reviews without a star rating (no stars column, or an empty cell). */
    public long unrated() {
        return stars[0];
    }

    /** Frequency counts of the helpful votes per review (a copy). */
    public FrequencyCounts helpfulVotes() {
        return helpful.copy();
    }

    /** Frequency counts of the total votes per review (a copy). */
    public FrequencyCounts totalVotes() {
        return total.copy();
    }

    /** Reviews that received no vote at all. */
    public long zeroVoteReviews() {
        return total.countOf(0);
    }

    /** Reviews marked verified. */
    public long verified() {
        return verified[2];
    }

    /** Reviews marked not verified. */
    public long notVerified() {
        return verified[1];
    }

    /** Reviews marked incentivised. */
    public long incentivised() {
        return incentivised[2];
    }

    /** Reviews marked not incentivised. */
    public long notIncentivised() {
        return incentivised[1];
    }

    /** Reviews without a date. */
    public long undated() {
        return undated;
    }

    /** Reviews per calendar month of their date, ascending; months without reviews are left out. */
    public SortedMap<YearMonth, Long> reviewsPerMonth() {
        TreeMap<YearMonth, Long> m = new TreeMap<>();
        for (int i = 0; i < months.length; i++) {
            if (months[i] > 0) {
                long em = monthBase + i;
                m.put(YearMonth.of(Math.toIntExact(1970 + Math.floorDiv(em, 12)), (int) Math.floorMod(em, 12) + 1), months[i]);
            }
        }
        return Collections.unmodifiableSortedMap(m);
    }

    /**
     * Frequency counts of reviews per reviewer (a copy): for a category, each reviewer's reviews in
     * that category. Empty until the final reviewer table was added ({@link OverviewCounts#addReviewer}).
     */
    public FrequencyCounts reviewsPerReviewer() {
        return reviewsPerReviewer.copy();
    }

    /** Distinct reviewers with at least one review here; 0 until the reviewer table was added. */
    public long reviewers() {
        return reviewsPerReviewer.count();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof CategoryCounts c && category.equals(c.category) && rows == c.rows
                && Arrays.equals(stars, c.stars) && Arrays.equals(verified, c.verified)
                && Arrays.equals(incentivised, c.incentivised) && helpful.equals(c.helpful) && total.equals(c.total)
                && reviewsPerReviewer.equals(c.reviewsPerReviewer) && undated == c.undated
                && reviewsPerMonth().equals(c.reviewsPerMonth());
    }

    @Override
    public int hashCode() {
        return Objects.hash(category, rows, Arrays.hashCode(stars), helpful, total, undated);
    }

    @Override
    public String toString() {
        return "CategoryCounts{" + (category.isEmpty() ? "(all)" : category) + ", rows " + rows + ", reviewers " + reviewers() + "}";
    }
}
