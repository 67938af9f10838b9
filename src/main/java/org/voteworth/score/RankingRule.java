package org.voteworth.score;

import java.util.Optional;

/**
 * A way of turning a reviewer's votes into one score; higher is better. Each rule is one class
 * named after its method, with the formula and its source in the javadoc.
 *
 * <p>Rules are pure functions of the {@link Evidence}: thread-safe and cheap, because the ranker
 * calls them once per reviewer.
 */
public interface RankingRule {
    /** Stable name used on the command line and in outputs, e.g. {@code wilson}. */
    String name();

    /** Human-readable name with its parameters, e.g. "Wilson lower bound (95 %)". */
    String label();

    /** One sentence saying what the score is, for reports. */
    String describe();

    /** The score; higher ranks first. Defined for every evidence the rule finds eligible. */
    double score(Evidence e);

    /** The interval the score comes from or sits in, when the rule has one. */
    default Optional<Interval> interval(Evidence e) {
        return Optional.empty();
    }

    /** Whether the rule can score this evidence at all; by default, any with at least one vote. */
    default boolean eligible(Evidence e) {
        return e.totalVotes() > 0;
    }
}
