package org.voteworth.report;

import java.util.List;

/** The cautions every report carries (METHODS.md): what a score is, and what it is not. */
public final class Cautions {
    private Cautions() {
    }

    public static final List<String> TEXT = List.of(
            "A score is statistical evidence about helpfulness votes, not a judgement of a person.",
            "It does not measure whether a review's text is honest or accurate, whether the reviewer was paid or"
                    + " given the product, or whether votes were manipulated.",
            "Votes are clustered by review: one widely read review can carry most of a reviewer's votes"
                    + " (see the concentration flag and the review-majority rule).",
            "Every rank depends on the rule, the confidence, the prior and the entry bar stated in this report;"
                    + " rerun with the same parameters to reproduce it.",
            "Pseudonymise reviewer ids (--pseudonymize) before sharing, and defer to your own policies and to"
                    + " local privacy law.");
}
