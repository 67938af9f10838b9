package org.voteworth.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.math3.stat.interval.WilsonScoreInterval;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.voteworth.demo.PlantedCases;
import org.voteworth.report.Cautions;
import org.voteworth.tally.ReviewerTally;

class RankingTest {
    static ReviewerTable demo;

    @BeforeAll
    static void read(@org.junit.jupiter.api.io.TempDir Path dir) throws IOException {
        demo = Dump.open(DumpTest.PROJECT.resolve("demo-data")).rejects(dir.resolve("rejects.tsv")).tally();
    }

    @Test
    void wilsonScoresAreCommonsMathsLowerBoundsAtTheGivenConfidence() {
        // Reference library: Commons Math's WilsonScoreInterval (trials, successes, confidence).
        for (double c : new double[] {0.95, 0.90}) {
            Ranking r = demo.rank(Rule.wilson().confidence(c));
            for (int rank = 1; rank <= 20; rank++) {
                ReviewerTally t = demo.tallyTable().get(r.ranking().slotAt(rank));
                double lower = new WilsonScoreInterval().createInterval((int) t.totalVotes(), (int) t.helpfulVotes(), c)
                        .getLowerBound();
                assertThat(r.ranking().scoreAt(rank)).as(t.id() + " at " + c).isCloseTo(lower, within(1e-9));
            }
        }
    }

    @Test
    void aGivenPriorGivesTheBetaBinomialPosteriorMean() {
        // Textbook conjugacy: under Beta(a, b), H of T votes give the posterior mean (a + H) / (a + b + T).
        Ranking r = demo.rank(Rule.bayesMean().prior(2, 3));
        ReviewerTally t = demo.reviewer(PlantedCases.EXPERT).orElseThrow();
        double score = r.ranking().scoreAt(r.rankOf(PlantedCases.EXPERT));
        assertThat(score).isCloseTo((2.0 + t.helpfulVotes()) / (5.0 + t.totalVotes()), within(1e-12));
        assertThat(r.prior().describe()).startsWith("Beta(2.0000, 3.0000)").contains("given");
    }

    @Test
    void theEntryBarKeepsOutReviewersBelowIt() {
        Ranking r = demo.rank(Rule.rawShare().bar(5));
        for (String id : r.topIds(r.size())) {
            assertThat(demo.reviewer(id).orElseThrow().helpfulVotes()).isGreaterThanOrEqualTo(5);
        }
        long eligible = demo.tallyTable().toSortedList().stream().filter(t -> t.helpfulVotes() >= 5).count();
        assertThat(r.size()).isEqualTo(eligible);
        assertThat(r.rankOf(PlantedCases.small(1))).isZero();
        assertThatThrownBy(() -> r.explain(PlantedCases.small(1))).hasMessageContaining("at least 5 helpful votes");
        assertThatThrownBy(() -> r.rankOf("no-such-reviewer")).hasMessageContaining("'no-such-reviewer' is not in the table");
    }

    @Test
    void reportsCarryTheirParametersAndTheCautions() {
        Ranking r = demo.rank(Rule.wilson());
        for (Display d : List.of(r.top(5), r.sweep(5, 0, 10), r.compare(5, Rule.rawShare().bar(5)),
                r.audit(r.topIds(3), 3, 200), demo.history(PlantedCases.EXPERT))) {
            assertThat(d.mimeType()).isEqualTo("text/markdown");
            assertThat(d.content()).contains(Cautions.TEXT.get(0));
            assertThat(d.text()).isNotBlank().isEqualTo(d.toString());
        }
        assertThat(r.top(5).content()).contains("planted-expert", "**confidence**: 0.95", "**entry bar**: no entry bar");
        assertThat(r.explain(PlantedCases.EXPERT).content()).startsWith("### #1 planted-expert");
        // The audit of the rule's own top 3 finds each in the top 3.
        assertThat(r.audit(r.topIds(3), 3, 200).result().members()).allMatch(m -> m.inStatisticalTopK());
    }

    @Test
    void aPseudonymisedTableShowsNoRealIdInAnyOutput() {
        ReviewerTable masked = demo.pseudonymized("test key");
        Ranking r = masked.rank(Rule.wilson());
        List<String> ids = r.topIds(10);
        String all = r.top(10).content() + r.top(10).text() + r.explain(ids.get(0)).content() + r.sweep(10, 0, 5).content()
                + r.compare(10, Rule.bayesMean()).content() + r.audit(ids, 10, 200).content() + masked.history(ids.get(0)).content()
                + masked.toTablesaw().stringColumn("reviewer_id").asList() + masked.categoriesToTablesaw().stringColumn(0).asList();
        for (String id : ids) {
            assertThat(all).doesNotContain(id);
        }
        assertThat(all).contains("p-");
    }
}
