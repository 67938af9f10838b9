package org.voteworth.score;

/** Cautions attached to a ranked reviewer; each says why a score deserves a second look. */
public enum Flag {
    /** The 95 % Wilson interval of the share is wider than 0.25: too few votes to say much. */
    LOW_EVIDENCE("low evidence"),
    /** One review holds more than the concentration limit (default 80 %) of the reviewer's votes. */
    VOTE_CONCENTRATION("one review carries the votes"),
    /** Fewer than half of at least five reviews are verified purchases. */
    LOW_VERIFIED_SHARE("low verified share");

    private final String words;

    Flag(String words) {
        this.words = words;
    }

    /** The flag in a few plain words, for tables. */
    public String words() {
        return words;
    }
}
