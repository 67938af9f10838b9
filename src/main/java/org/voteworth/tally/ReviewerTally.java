package org.voteworth.tally;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.SortedMap;
import java.util.TreeMap;

/**
 * Everything voteworth keeps about one reviewer (or, with the review unit, one review): a
 * mergeable summary of their rows across all files and categories.
 *
 * <p>{@link #merge} is associative and commutative, so tallies built per file, per byte range, per
 * spilled partition or per cluster task combine into the same result in any order.
 *
 * @param id reviewer id as it appears in the dump
 * @param reviews rows counted
 * @param helpfulVotes H: sum of helpful votes
 * @param totalVotes T: sum of total votes (H &lt;= T)
 * @param votedReviews reviews with at least one vote
 * @param majorityReviews voted reviews whose helpful votes are more than half of their votes
 * @param maxReviewVotes the most total votes any single review received
 * @param sumSquaredVotes sum over reviews of (total votes)², for the Herfindahl index
 * @param verified reviews marked as verified purchases
 * @param incentivised reviews marked as incentivised (free product)
 * @param stars star-rating histogram
 * @param reviewsByCategory reviews per category, sorted by name
 * @param firstDay earliest review date as epoch day, or {@link #NO_DATE}
 * @param lastDay latest review date as epoch day, or {@link #NO_DATE}
 */
public record ReviewerTally(
        String id,
        long reviews,
        long helpfulVotes,
        long totalVotes,
        long votedReviews,
        long majorityReviews,
        long maxReviewVotes,
        long sumSquaredVotes,
        long verified,
        long incentivised,
        StarCounts stars,
        SortedMap<String, Long> reviewsByCategory,
        int firstDay,
        int lastDay) {

    /** {@link #firstDay} and {@link #lastDay} when no row carried a date. */
    public static final int NO_DATE = Integer.MIN_VALUE;

    public ReviewerTally {
        Objects.requireNonNull(id, "id");
        Objects.requireNonNull(stars, "stars");
        reviewsByCategory = Collections.unmodifiableSortedMap(new TreeMap<>(reviewsByCategory));
        if (helpfulVotes < 0 || helpfulVotes > totalVotes) {
            throw new IllegalArgumentException("need 0 <= helpful <= total, got " + helpfulVotes + "/" + totalVotes + " for " + id);
        }
    }

    /** The tally of a single review. */
    public static ReviewerTally ofReview(String id, long helpful, long total, int stars, boolean verified,
                                         boolean incentivised, String category, int epochDay) {
        long[] s = new long[6];
        if (stars >= 1 && stars <= 5) {
            s[stars]++;
        }
        return new ReviewerTally(id, 1, helpful, total, total > 0 ? 1 : 0, 2 * helpful > total ? 1 : 0, total,
                total * total, verified ? 1 : 0, incentivised ? 1 : 0,
                new StarCounts(s[1], s[2], s[3], s[4], s[5]), new TreeMap<>(Map.of(category, 1L)), epochDay, epochDay);
    }

    /** Combines two tallies of the same id. */
    public ReviewerTally merge(ReviewerTally o) {
        if (!id.equals(o.id)) {
            throw new IllegalArgumentException("cannot merge tallies of " + id + " and " + o.id);
        }
        TreeMap<String, Long> cats = new TreeMap<>(reviewsByCategory);
        o.reviewsByCategory.forEach((k, v) -> cats.merge(k, v, Long::sum));
        return new ReviewerTally(id, reviews + o.reviews, helpfulVotes + o.helpfulVotes, totalVotes + o.totalVotes,
                votedReviews + o.votedReviews, majorityReviews + o.majorityReviews,
                Math.max(maxReviewVotes, o.maxReviewVotes), sumSquaredVotes + o.sumSquaredVotes,
                verified + o.verified, incentivised + o.incentivised, stars.plus(o.stars), cats,
                minDay(firstDay, o.firstDay), maxDay(lastDay, o.lastDay));
    }

    /** H / T, or NaN when the reviewer has no votes. */
    public double helpfulShare() {
        return totalVotes == 0 ? Double.NaN : (double) helpfulVotes / totalVotes;
    }

    /** The largest single review's share of T, or 0 without votes. */
    public double maxReviewShare() {
        return totalVotes == 0 ? 0 : (double) maxReviewVotes / totalVotes;
    }

    /** Herfindahl index of votes over reviews, Σ(t_i / T)²: 1 when one review holds every vote. */
    public double herfindahl() {
        return totalVotes == 0 ? 0 : sumSquaredVotes / ((double) totalVotes * totalVotes);
    }

    static int minDay(int a, int b) {
        if (a == NO_DATE) {
            return b;
        }
        return b == NO_DATE ? a : Math.min(a, b);
    }

    static int maxDay(int a, int b) {
        if (a == NO_DATE) {
            return b;
        }
        return b == NO_DATE ? a : Math.max(a, b);
    }
}
