package org.voteworth.source;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The fields of a review row that voteworth reads. Every other column of a dump is skipped
 * without being decoded.
 *
 * <p>Each field lists the header names it is recognised by (compared case-insensitively, with
 * spaces, dashes and underscores ignored); a user overrides them with {@code --map field=header}.
 */
public enum Field {
    REVIEWER(true, "reviewer", "reviewerid", "customerid", "userid", "author", "authorid", "reviewer_id"),
    REVIEW(false, "review", "reviewid", "id"),
    ITEM(false, "item", "itemid", "productid", "product", "listing", "listingid", "sku"),
    CATEGORY(false, "category", "productcategory", "department", "itemcategory"),
    STARS(false, "stars", "starrating", "rating", "score"),
    HELPFUL(true, "helpful", "helpfulvotes", "helpfulcount", "upvotes"),
    TOTAL(true, "total", "totalvotes", "votes", "votecount", "totalvotecount"),
    VERIFIED(false, "verified", "verifiedpurchase", "verifiedbuyer"),
    INCENTIVISED(false, "incentivised", "incentivized", "incentivisedreview", "incentivizedreview", "freeproduct"),
    DATE(false, "date", "reviewdate", "posted", "postedon", "createdat");

    private final boolean required;
    private final List<String> names;

    Field(boolean required, String... names) {
        this.required = required;
        this.names = List.of(names);
    }

    /** Whether a dump must provide this field for a tally to mean anything. */
    public boolean required() {
        return required;
    }

    /** The name users type in {@code --map}, e.g. {@code helpful}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Recognised header names, already in {@link #normalise(String)} form. */
    public List<String> recognisedNames() {
        return names;
    }

    /** Lower case, without spaces, dashes and underscores: "Helpful_Votes" becomes "helpfulvotes". */
    public static String normalise(String header) {
        StringBuilder b = new StringBuilder(header.length());
        for (int i = 0; i < header.length(); i++) {
            char c = header.charAt(i);
            if (c == ' ' || c == '-' || c == '_' || c == '"' || c == '\uFEFF') {
                continue;
            }
            b.append(Character.toLowerCase(c));
        }
        return b.toString();
    }

    /** The field whose {@link #key()} is {@code key}, ignoring case. */
    public static Optional<Field> ofKey(String key) {
        for (Field f : values()) {
            if (f.key().equalsIgnoreCase(key.trim())) {
                return Optional.of(f);
            }
        }
        return Optional.empty();
    }
}
