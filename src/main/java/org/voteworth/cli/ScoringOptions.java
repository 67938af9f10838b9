package org.voteworth.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.voteworth.score.EntryBar;
import picocli.CommandLine.Option;

/** The options of every command that ranks: rule, confidence, prior and entry bar. */
final class ScoringOptions {
    @Option(names = "--rule", defaultValue = "wilson", paramLabel = "NAME",
            description = "Ranking rule: raw-share, wilson, wilson-cc, bayes-mean, bayes-lower, review-majority "
                    + "(default: ${DEFAULT-VALUE}).")
    String rule;

    @Option(names = "--compare", split = ",", paramLabel = "RULE",
            description = "Rules whose ranks are shown beside (default: raw-share,wilson,bayes-mean without --rule itself).")
    List<String> compare = new ArrayList<>(List.of("raw-share", "wilson", "bayes-mean"));

    @Option(names = "--confidence", defaultValue = "0.95", paramLabel = "C",
            description = "Two-sided confidence of intervals and bounds (default: ${DEFAULT-VALUE}).")
    double confidence;

    @Option(names = "--quantile", defaultValue = "0.05", paramLabel = "Q",
            description = "Posterior quantile used by bayes-lower (default: ${DEFAULT-VALUE}).")
    double quantile;

    @Option(names = "--bar", defaultValue = "0", paramLabel = "N",
            description = "Entry bar: rank only reviewers with at least N votes (default: ${DEFAULT-VALUE}).")
    long bar;

    @Option(names = "--bar-on", defaultValue = "helpful", paramLabel = "helpful|total",
            description = "Which votes the entry bar counts (default: ${DEFAULT-VALUE}).")
    String barOn;

    @Option(names = "--prior", defaultValue = "fit", paramLabel = "fit|ALPHA,BETA",
            description = "Beta prior of the Bayesian rules: fitted by empirical Bayes (default) or given.")
    String prior;

    @Option(names = "--fit-floor", defaultValue = "1", paramLabel = "T",
            description = "Fit the prior on reviewers with at least T total votes (default: ${DEFAULT-VALUE}).")
    long fitFloor;

    @Option(names = "--concentration-limit", defaultValue = "0.8", paramLabel = "SHARE",
            description = "Flag a reviewer when one review holds more than this share of the votes (default: ${DEFAULT-VALUE}).")
    double concentrationLimit;

    @Option(names = "--cap-votes", defaultValue = "0", paramLabel = "N",
            description = "Count at most N votes per review, its helpful votes scaled in proportion "
                    + "(round half up), so one viral review cannot carry a reviewer; 0 = no cap (default: ${DEFAULT-VALUE}).")
    long capVotes;

    EntryBar entryBar() {
        return switch (barOn.toLowerCase(Locale.ROOT)) {
            case "helpful" -> EntryBar.helpful(bar);
            case "total" -> EntryBar.total(bar);
            default -> throw new IllegalArgumentException("--bar-on takes helpful or total, not '" + barOn + "'");
        };
    }
}
