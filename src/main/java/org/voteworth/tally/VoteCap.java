package org.voteworth.tally;

import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * The per-review vote cap of METHODS.md ("Votes are clustered by review"): a review with more
 * than {@code cap} total votes counts as {@code cap} votes, its helpful votes scaled in
 * proportion, before the row reaches the table:
 * <pre>
 *   total' = cap,  helpful' = round(helpful × cap / total)   when total &gt; cap
 * </pre>
 * rounded half up in exact integer arithmetic, floor((2·helpful·cap + total) / (2·total)), so
 * that 0 ≤ helpful' ≤ cap and the result does not depend on floating point. One viral review
 * then weighs no more than {@code cap} votes.
 */
public final class VoteCap implements ReviewSink {
    private final long cap;
    private final ReviewSink next;

    /**
     * @param cap the most votes one review counts for, at least 1
     * @param next the sink that receives the capped rows
     */
    public VoteCap(long cap, ReviewSink next) {
        if (cap < 1) {
            throw new IllegalArgumentException("--cap-votes must be at least 1 vote per review, got " + cap);
        }
        this.cap = cap;
        this.next = next;
    }

    public long cap() {
        return cap;
    }

    @Override
    public void accept(ReviewRow row) {
        long total = row.total;
        if (total <= cap) {
            next.accept(row);
            return;
        }
        long helpful = row.helpful;
        row.helpful = cappedHelpful(helpful, total, cap);
        row.total = cap;
        try {
            next.accept(row);
        } finally {
            // The row is the scanner's flyweight: give it back as it came.
            row.helpful = helpful;
            row.total = total;
        }
    }

    /** round(helpful × cap / total), half up, for total &gt; cap. */
    public static long cappedHelpful(long helpful, long total, long cap) {
        java.math.BigInteger num = java.math.BigInteger.valueOf(helpful).multiply(java.math.BigInteger.valueOf(2 * cap))
                .add(java.math.BigInteger.valueOf(total));
        return num.divide(java.math.BigInteger.valueOf(2 * total)).longValueExact();
    }
}
