package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.TallyTable;

/** What every rule must satisfy, whatever its formula (facts of the trade about ranking by shares). */
class RulesTest {
    private static final RuleSettings SETTINGS = RuleSettings.defaults(new BetaPrior(2.304768, 14.079707));

    static List<RankingRule> all() {
        return Rules.names().stream().map(n -> Rules.byName(n, SETTINGS)).toList();
    }

    @Test
    void everyNameBuildsItsRule() {
        assertThat(Rules.names()).containsExactly("raw-share", "wilson", "wilson-cc", "bayes-mean", "bayes-lower",
                "review-majority");
        for (String n : Rules.names()) {
            RankingRule r = Rules.byName(n, SETTINGS);
            assertThat(r.name()).isEqualTo(n);
            assertThat(r.label()).isNotBlank();
            assertThat(r.describe()).endsWith(".");
        }
        assertThat(Rules.byName("wilson", new RuleSettings(0.9, 0.1, SETTINGS.prior())))
                .isEqualTo(new WilsonLowerBound(0.9, false));
        assertThat(Rules.byName("bayes-lower", new RuleSettings(0.9, 0.1, SETTINGS.prior())))
                .isEqualTo(new BayesianLowerQuantile(SETTINGS.prior(), 0.1));
    }

    @Test
    void unknownNameListsTheValidOnes() {
        assertThatThrownBy(() -> Rules.byName("wilsn", SETTINGS))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("'wilsn'")
                .hasMessageContaining("raw-share, wilson, wilson-cc, bayes-mean, bayes-lower, review-majority");
    }

    @Test
    void scoresLieInTheUnitIntervalAndInsideTheirIntervals() {
        Random rnd = new Random(20240611);
        for (RankingRule rule : all()) {
            for (int i = 0; i < 400; i++) {
                Evidence e = randomEvidence(rnd);
                if (!rule.eligible(e)) {
                    continue;
                }
                double s = rule.score(e);
                assertThat(s).as(rule.name() + " " + e).isBetween(0.0, 1.0);
                rule.interval(e).ifPresent(iv -> assertThat(s).as(rule.name() + " " + e).isBetween(iv.lower(), iv.upper()));
            }
        }
    }

    @Test
    void moreHelpfulVotesAtTheSameTotalNeverLowerAScore() {
        for (RankingRule rule : all()) {
            if (rule instanceof ReviewMajority) {
                continue;
            }
            for (long t : new long[] {1, 2, 3, 10, 57, 400, 10_000}) {
                double prev = -1;
                for (long h = 0; h <= t; h += Math.max(1, t / 50)) {
                    double s = rule.score(Evidence.of(h, t));
                    assertThat(s).as(rule.name() + " " + h + "/" + t).isGreaterThanOrEqualTo(prev);
                    prev = s;
                }
            }
        }
        ReviewMajority m = new ReviewMajority(0.95);
        for (long n = 1; n <= 40; n++) {
            double prev = -1;
            for (long x = 0; x <= n; x++) {
                double s = m.score(new Evidence(x, n, n, x));
                assertThat(s).isGreaterThanOrEqualTo(prev);
                prev = s;
            }
        }
    }

    @Test
    void lowerBoundsSitBelowWhatTheyBound() {
        // Wilson bound below p, its continuity-corrected bound below it; the posterior 5 % quantile below the posterior
        // mean; the posterior mean between p and the prior mean (shrinkage, METHODS.md).
        WilsonLowerBound w = new WilsonLowerBound(0.95, false);
        WilsonLowerBound cc = new WilsonLowerBound(0.95, true);
        BayesianAverage mean = new BayesianAverage(SETTINGS.prior());
        BayesianLowerQuantile lower = new BayesianLowerQuantile(SETTINGS.prior(), 0.05);
        double mu = SETTINGS.prior().mean();
        Random rnd = new Random(99);
        for (int i = 0; i < 500; i++) {
            Evidence e = randomEvidence(rnd);
            if (e.totalVotes() == 0) {
                continue;
            }
            double p = e.share();
            assertThat(w.score(e)).isLessThanOrEqualTo(p);
            assertThat(cc.score(e)).isLessThanOrEqualTo(w.score(e));
            assertThat(lower.score(e)).isLessThan(mean.score(e));
            assertThat(mean.score(e)).isBetween(Math.min(p, mu), Math.max(p, mu));
        }
    }

    @Test
    void theSameShareOnMoreVotesRanksHigherUnderTheBounds() {
        // The reason to rank by a lower bound (common practice): 10/10 is better evidence than 1/1.
        for (RankingRule rule : List.of(new WilsonLowerBound(0.95, false), new WilsonLowerBound(0.95, true),
                new BayesianLowerQuantile(SETTINGS.prior(), 0.05), new BayesianAverage(SETTINGS.prior()))) {
            assertThat(rule.score(Evidence.of(10, 10))).as(rule.name()).isGreaterThan(rule.score(Evidence.of(1, 1)));
            assertThat(rule.score(Evidence.of(900, 1000))).as(rule.name()).isGreaterThan(rule.score(Evidence.of(9, 10)));
        }
    }

    @Test
    void theRankerRanksUnderEveryRule() {
        TallyTable t = new TallyTable();
        t.add("small", 1, 1, 5, true, false, "garden", 19000);
        t.add("big", 95, 100, 5, true, false, "garden", 19000);
        t.add("big", 90, 100, 4, true, false, "garden", 19001);
        t.add("none", 0, 0, 3, true, false, "garden", 19000);
        for (RankingRule rule : all()) {
            Ranking r = Ranker.rank(t, rule, EntryBar.NONE);
            assertThat(r.size()).as(rule.name()).isEqualTo(2);
            String first = t.id(r.slotAt(1));
            assertThat(first).as(rule.name()).isEqualTo(rule instanceof RawShare ? "small" : "big");
        }
    }

    static Evidence randomEvidence(Random rnd) {
        long t = switch (rnd.nextInt(4)) {
            case 0 -> rnd.nextInt(3);
            case 1 -> rnd.nextInt(30);
            case 2 -> rnd.nextInt(1000);
            default -> rnd.nextInt(200_000);
        };
        long h = t == 0 ? 0 : rnd.nextLong(t + 1);
        long voted = t == 0 ? 0 : 1 + rnd.nextLong(Math.min(t, 50));
        long majority = rnd.nextLong(voted + 1);
        return new Evidence(h, t, voted, majority);
    }
}
