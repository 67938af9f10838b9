package org.voteworth.store;

import java.util.Objects;
import org.voteworth.source.ReviewRow;

/**
 * One review as the store keeps it: its numeric columns and where it came from. Absent fields
 * carry the sentinels of {@link ReviewRow}: {@code ""} for ids and category,
 * {@link ReviewRow#ABSENT} for stars, verified and incentivised, {@link ReviewRow#NO_DATE} for the date.
 *
 * @param reviewer reviewer id
 * @param review review id, or ""
 * @param item item id, or ""
 * @param category category, or ""
 * @param stars 1 to 5, or {@link ReviewRow#ABSENT}
 * @param helpfulVotes helpful votes
 * @param totalVotes total votes
 * @param verified 1, 0 or {@link ReviewRow#ABSENT}
 * @param incentivised 1, 0 or {@link ReviewRow#ABSENT}
 * @param epochDay review date as days since 1970-01-01, or {@link ReviewRow#NO_DATE}
 * @param file the dump file, as the manifest names it
 * @param line the review's line in that file (the header is line 1)
 */
public record StoredReview(String reviewer, String review, String item, String category, int stars, long helpfulVotes,
                           long totalVotes, int verified, int incentivised, int epochDay, String file, long line) {
    public StoredReview {
        Objects.requireNonNull(reviewer, "reviewer");
        Objects.requireNonNull(review, "review");
        Objects.requireNonNull(item, "item");
        Objects.requireNonNull(category, "category");
        Objects.requireNonNull(file, "file");
    }
}
