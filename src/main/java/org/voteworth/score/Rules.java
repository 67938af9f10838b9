package org.voteworth.score;

import java.util.List;

/** The ranking rules by their command-line names. */
public final class Rules {
    private static final List<String> NAMES =
            List.of("raw-share", "wilson", "wilson-cc", "bayes-mean", "bayes-lower", "review-majority");

    private Rules() {
    }

    /** Every rule name, in the order reports list them. */
    public static List<String> names() {
        return NAMES;
    }

    /**
     * The rule called {@code name}, built with the settings it needs.
     *
     * @throws IllegalArgumentException for an unknown name, listing the valid ones
     */
    public static RankingRule byName(String name, RuleSettings s) {
        return switch (name) {
            case "raw-share" -> new RawShare();
            case "wilson" -> new WilsonLowerBound(s.confidence(), false);
            case "wilson-cc" -> new WilsonLowerBound(s.confidence(), true);
            case "bayes-mean" -> new BayesianAverage(s.prior());
            case "bayes-lower" -> new BayesianLowerQuantile(s.prior(), s.quantile());
            case "review-majority" -> new ReviewMajority(s.confidence());
            default -> throw new IllegalArgumentException("unknown ranking rule '" + name + "': use one of "
                    + String.join(", ", NAMES));
        };
    }
}
