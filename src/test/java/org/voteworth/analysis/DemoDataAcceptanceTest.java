package org.voteworth.analysis;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.voteworth.demo.PlantedCases;
import org.voteworth.score.BetaPrior;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.EntryBar;
import org.voteworth.score.Flag;
import org.voteworth.score.Ranker;
import org.voteworth.score.Ranking;
import org.voteworth.score.RankingRule;
import org.voteworth.score.RuleSettings;
import org.voteworth.score.Rules;
import org.voteworth.score.VoteFrequencyTable;
import org.voteworth.tally.TallyTable;

/**
 * The acceptance checks on the bundled demo-data sample. The planted reviewers and their
 * exact votes are facts of the generator (demo-data/README.md); the rest is computed.
 */
class DemoDataAcceptanceTest {
    static TallyTable table;
    static RuleSettings settings;

    @BeforeAll
    static void read() {
        table = DemoData.table();
        BetaPrior prior = EmpiricalBayesPrior.fit(VoteFrequencyTable.of(table, 1)).prior();
        settings = RuleSettings.defaults(prior);
    }

    private static List<RankingRule> rules(String... names) {
        List<RankingRule> out = new ArrayList<>();
        for (String n : names) {
            out.add(Rules.byName(n, settings));
        }
        return out;
    }

    @Test
    void rawShareTopTenChangesAcrossBarsWhileWilsonAndBayesStayWhereNoMemberIsExcluded() {
        SweepResult r = ThresholdSweep.run(table, rules("raw-share", "wilson", "bayes-mean"), EntryBar.On.HELPFUL,
                ThresholdSweep.DEFAULT_BARS, 10, UnaryOperator.identity());
        SweepResult.RuleSweep raw = r.rules().get(0);
        SweepResult.RuleSweep wilson = r.rules().get(1);
        SweepResult.RuleSweep bayes = r.rules().get(2);
        // Raw share: the list at 50 helpful votes shares nobody with the list at bar 0.
        assertThat(raw.minJaccardLowest()).isEqualTo(0.0);
        assertThat(raw.minJaccardConsecutive()).isEqualTo(0.0);
        // Wilson and Bayes: identical lists over every bar that excluded none of their members.
        assertThat(wilson.minJaccardWhereNoneExcluded()).isGreaterThanOrEqualTo(0.9);
        assertThat(bayes.minJaccardWhereNoneExcluded()).isGreaterThanOrEqualTo(0.9);
        // Wilson's list is unchanged from bar 0 to bar 100 (none of its members has fewer than 100 helpful votes).
        for (SweepResult.Step s : wilson.steps()) {
            if (s.bar() <= 100) {
                assertThat(s.jaccardLowest()).as("wilson at bar " + s.bar()).isEqualTo(1.0);
            }
        }
    }

    @Test
    void sweepNamesThePlantedExpertAndExplainsHisAbsenceAndReturn() {
        SweepResult r = ThresholdSweep.run(table, rules("raw-share", "wilson"), EntryBar.On.HELPFUL,
                ThresholdSweep.DEFAULT_BARS, 10, UnaryOperator.identity());
        SweepResult.Artefact expert = r.rules().get(0).artefacts().stream()
                .filter(a -> a.reviewer().equals(PlantedCases.EXPERT)).findFirst().orElseThrow();
        assertThat(expert.totalVotes()).isEqualTo(900);
        assertThat(expert.firstBar()).isEqualTo(50);
        assertThat(expert.rankAtFirstBar()).isEqualTo(1);
        assertThat(expert.outrankedWithLessEvidence()).isEqualTo(expert.rankAtLowest() - 1);
        assertThat(expert.sentence()).contains("planted-expert", "far more evidence", "missing there",
                "with fewer votes and a higher raw share", "present from at least 50 helpful votes");
        SweepResult.Change entered = r.rules().get(0).steps().get(4).entered().stream()
                .filter(c -> c.reviewer().equals(PlantedCases.EXPERT)).findFirst().orElseThrow();
        assertThat(entered.reason()).contains("the bar now excludes all 16 reviewers with fewer votes");
        // Under Wilson the expert is #1 at every bar: no artefact to explain.
        assertThat(r.rules().get(1).artefacts()).noneMatch(a -> a.reviewer().equals(PlantedCases.EXPERT));
        r.rules().get(1).steps().forEach(s -> assertThat(s.top().get(0).reviewer()).isEqualTo(PlantedCases.EXPERT));
    }

    @Test
    void theFittedPriorGivesTheWilsonLeaderItsChanceOfTheTopTenBack() {
        // Demo-data property (invented data): planted-expert has 896 of 900 votes helpful, far more
        // evidence than any 100 % reviewer. A uniform prior lets small 100 % samples draw shares
        // near 1 so often that the leader almost never makes the top 10 of a draw.
        Ranking wilson = Ranker.rank(table, Rules.byName("wilson", settings), EntryBar.NONE);
        RankUncertainty.Result u = RankUncertainty.of(wilson, settings.prior(), RankUncertainty.Settings.defaults(10, 42));
        RankUncertainty.Result uniform = RankUncertainty.of(wilson, new BetaPrior(1, 1), RankUncertainty.Settings.defaults(10, 42));
        double fitted = u.of(table.find(PlantedCases.EXPERT)).probabilityTopK();
        double flat = uniform.of(table.find(PlantedCases.EXPERT)).probabilityTopK();
        // Seeded run: 0.1985 under the fitted prior, 0.0055 under the uniform one. The top 10 by
        // true share stays genuinely open (hundreds of reviewers are near 100 %), but no longer
        // closed to the reviewer with the most evidence.
        assertThat(fitted).isGreaterThan(0.15).isGreaterThan(20 * flat);
    }

    @Test
    void auditOfARawShareListFlagsItsSmallSamplesAndNamesTheOverlooked() {
        Ranking raw = Ranker.rank(table, Rules.byName("raw-share", settings), EntryBar.NONE);
        List<String> promoted = new ArrayList<>();
        for (int slot : raw.top(10)) {
            promoted.add(table.id(slot));
        }
        promoted.add("nobody-by-this-id");
        Ranking wilson = Ranker.rank(table, Rules.byName("wilson", settings), EntryBar.NONE);
        PromotionAudit.Settings s = new PromotionAudit.Settings(settings.prior(), wilson, 10, List.of(raw, wilson),
                RankUncertainty.Settings.defaults(10, 42), 0.9, 0.95, 0.8);
        AuditResult a = PromotionAudit.run(PromotionList.of("test list", promoted), new PromotionAudit.TopK(10, "wilson"), s,
                UnaryOperator.identity());
        assertThat(a.missing()).containsExactly("nobody-by-this-id");
        assertThat(a.members()).hasSize(10).allMatch(AuditResult.Member::smallSample);
        assertThat(a.members()).anyMatch(m -> m.flags().contains(Flag.VOTE_CONCENTRATION));
        assertThat(a.summary().precision()).isEqualTo(0.0);
        assertThat(a.summary().expectedBelow()).isGreaterThan(9);
        assertThat(a.summary().maxMonteCarloError()).isLessThan(0.012);
        assertThat(a.overlooked()).extracting(AuditResult.Overlooked::reviewer).contains(PlantedCases.EXPERT);
        // Target-share bar: every listed reviewer is 100 % on 25-49 votes, so P(share >= 0.9) is high for each.
        AuditResult share = PromotionAudit.run(PromotionList.of("test list", promoted), new PromotionAudit.TargetShare(0.9, 0.95),
                s, UnaryOperator.identity());
        assertThat(share.members()).allMatch(m -> m.probabilityMeetsBar() > 0.8);
    }

    @Test
    void compareSeesRawShareApartFromTheStatisticalRules() {
        List<Ranking> rs = new ArrayList<>();
        for (RankingRule rule : rules("raw-share", "wilson", "bayes-mean")) {
            rs.add(Ranker.rank(table, rule, EntryBar.NONE));
        }
        ComparisonResult c = RuleComparison.compare(rs, 10, 0.9, 0.8, UnaryOperator.identity());
        ComparisonResult.PairStats rawWilson = c.pairs().get(0);
        ComparisonResult.PairStats wilsonBayes = c.pairs().get(2);
        assertThat(rawWilson.jaccard()).isEqualTo(0.0);
        assertThat(rawWilson.rbo()).isEqualTo(0.0);
        assertThat(wilsonBayes.rbo()).isGreaterThan(0.5);
        assertThat(wilsonBayes.kendallTauB()).isGreaterThan(rawWilson.kendallTauB());
        assertThat(c.disagreements()).anyMatch(s -> s.startsWith("planted-expert: #1 by wilson") && s.contains("(evidence)"));
        assertThat(c.disagreements()).anyMatch(s -> s.startsWith("planted-viral") && s.contains("concentration"));
    }
}
