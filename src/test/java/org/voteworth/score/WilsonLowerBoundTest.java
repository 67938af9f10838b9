package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.junit.jupiter.api.Test;

class WilsonLowerBoundTest {

    @Test
    void boundsUsedForSorting() {
        // reference-checks/wilson_sorting.csv: published counts, bounds computed independently (not published).
        for (Map<String, String> r : ReferenceCsv.read("wilson_sorting.csv")) {
            WilsonLowerBound rule = new WilsonLowerBound(Double.parseDouble(r.get("confidence")), false);
            ReferenceCsv.check(r, "lower", rule.score(Evidence.of(Long.parseLong(r.get("x")), Long.parseLong(r.get("n")))));
        }
    }

    @Test
    void twoOfTwoRanksBelowAHundredOfAHundredAndOne() {
        // The point of ranking by the bound (common practice): 2/2 = 100 % ranks below 100/101 and even below 600/1000.
        WilsonLowerBound w = new WilsonLowerBound(0.95, false);
        assertThat(w.score(Evidence.of(2, 2))).isLessThan(w.score(Evidence.of(600, 1000)));
        assertThat(w.score(Evidence.of(600, 1000))).isLessThan(w.score(Evidence.of(100, 101)));
    }

    @Test
    void scoreIsTheLowerEndOfItsInterval() {
        for (boolean cc : new boolean[] {false, true}) {
            WilsonLowerBound w = new WilsonLowerBound(0.95, cc);
            for (long t = 0; t <= 30; t++) {
                for (long h = 0; h <= t; h++) {
                    Evidence e = Evidence.of(h, t);
                    Interval i = w.interval(e).orElseThrow();
                    assertThat(i.lower()).isEqualTo(w.score(e));
                    assertThat(i.confidence()).isEqualTo(0.95);
                }
            }
        }
        // Newcombe (1998), 1/29 (confirmed): Wilson 0.0061, continuity-corrected 0.0018.
        assertThat(new WilsonLowerBound(0.95, false).score(Evidence.of(1, 29))).isCloseTo(0.0061, within(5e-5));
        assertThat(new WilsonLowerBound(0.95, true).score(Evidence.of(1, 29))).isCloseTo(0.0018, within(5e-5));
    }

    @Test
    void noVotesScoreZeroButAreNotEligible() {
        WilsonLowerBound w = new WilsonLowerBound(0.95, false);
        assertThat(w.score(Evidence.of(0, 0))).isZero();
        assertThat(w.eligible(Evidence.of(0, 0))).isFalse();
        assertThat(w.eligible(Evidence.of(0, 1))).isTrue();
    }

    @Test
    void namesLabelsAndParameters() {
        WilsonLowerBound w = new WilsonLowerBound(0.95, false);
        assertThat(w.name()).isEqualTo("wilson");
        assertThat(w.label()).isEqualTo("Wilson lower bound (95 %)");
        assertThat(w.z()).isCloseTo(1.959964, within(5e-7));
        assertThat(new WilsonLowerBound(0.975, true).name()).isEqualTo("wilson-cc");
        assertThat(new WilsonLowerBound(0.975, true).label()).isEqualTo("Wilson lower bound, continuity-corrected (97.5 %)");
        assertThat(new WilsonLowerBound(0.9, true).confidence()).isEqualTo(0.9);
        assertThat(new WilsonLowerBound(0.9, true).continuityCorrected()).isTrue();
        assertThat(w.describe()).endsWith(".").contains("95 %");
        assertThat(w).isEqualTo(new WilsonLowerBound(0.95, false)).isNotEqualTo(new WilsonLowerBound(0.95, true));
    }
}
