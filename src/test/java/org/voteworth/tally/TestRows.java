package org.voteworth.tally;

import java.nio.charset.StandardCharsets;
import org.voteworth.source.ReviewRow;

/** Fills a {@link ReviewRow} the way the scanner does, for tests that feed sinks one review at a time. */
final class TestRows {
    private TestRows() {
    }

    /**
     * Sets {@code row} to one review: the id and category as UTF-8 in one buffer (as the scanner
     * leaves them in its read buffer), the counts as given, no review or item id.
     */
    static ReviewRow fill(ReviewRow row, String id, String category, long helpful, long total, int stars,
                          boolean verified, boolean incentivised, int epochDay) {
        byte[] idBytes = id.getBytes(StandardCharsets.UTF_8);
        byte[] b = (id + "\t" + category).getBytes(StandardCharsets.UTF_8);
        row.buf = b;
        row.reviewerOff = 0;
        row.reviewerLen = idBytes.length;
        row.reviewOff = 0;
        row.reviewLen = 0;
        row.itemOff = 0;
        row.itemLen = 0;
        row.categoryBuf = b;
        row.categoryOff = idBytes.length + 1;
        row.categoryLen = b.length - row.categoryOff;
        row.helpful = helpful;
        row.total = total;
        row.stars = stars;
        row.verified = verified ? 1 : 0;
        row.incentivised = incentivised ? 1 : 0;
        row.epochDay = epochDay;
        return row;
    }
}
