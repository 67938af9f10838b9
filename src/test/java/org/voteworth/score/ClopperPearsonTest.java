package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.apache.commons.math3.stat.interval.ClopperPearsonInterval;
import org.apache.commons.math3.stat.interval.ConfidenceInterval;
import org.junit.jupiter.api.Test;

class ClopperPearsonTest {

    @Test
    void publishedExactIntervals() {
        // reference-checks/exact_intervals.csv: Newcombe (1998), R binom via statsmodels, Conover (1999), R binom.test.
        for (Map<String, String> r : ReferenceCsv.read("exact_intervals.csv")) {
            Interval i = ClopperPearson.interval(Long.parseLong(r.get("x")), Long.parseLong(r.get("n")),
                    Double.parseDouble(r.get("confidence")));
            ReferenceCsv.check(r, "lower", i.lower());
            ReferenceCsv.check(r, "upper", i.upper());
        }
    }

    @Test
    void oneSidedBoundOfThreeInFifteen() {
        // SciPy binomtest(3, 15) documentation (confirmed): the one-sided 95 % exact lower bound
        // 0.056846867590246826 is the lower end of the two-sided 90 % interval.
        assertThat(ClopperPearson.interval(3, 15, 0.90).lower()).isCloseTo(0.056846867590246826, within(1e-15));
    }

    @Test
    void agreesWithCommonsMathOnAGrid() {
        // Commons Math ClopperPearsonInterval goes through F quantiles solved to 1e-9 (its default accuracy),
        // so agreement is to about 1e-8; it throws at x = 0 and x = n (zero degrees of freedom), which we skip.
        ClopperPearsonInterval reference = new ClopperPearsonInterval();
        for (double c : new double[] {0.8, 0.9, 0.95, 0.99}) {
            for (int n : new int[] {2, 5, 20, 29, 148, 263, 1000}) {
                for (int x = 1; x < n; x += Math.max(1, n / 23)) {
                    ConfidenceInterval e = reference.createInterval(n, x, c);
                    Interval a = ClopperPearson.interval(x, n, c);
                    assertThat(a.lower()).as(x + "/" + n + " at " + c).isCloseTo(e.getLowerBound(), within(1e-8));
                    assertThat(a.upper()).as(x + "/" + n + " at " + c).isCloseTo(e.getUpperBound(), within(1e-8));
                }
            }
        }
    }

    @Test
    void edgesAndContainment() {
        // x = 0 gives L = 0 and x = n gives U = 1 (Clopper & Pearson 1934); the exact interval contains
        // the Wilson interval's share and is at least as wide at the edges (Newcombe 1998 table).
        assertThat(ClopperPearson.interval(0, 20, 0.95).lower()).isZero();
        assertThat(ClopperPearson.interval(20, 20, 0.95).upper()).isEqualTo(1.0);
        assertThat(ClopperPearson.interval(0, 0, 0.95)).isEqualTo(new Interval(0, 1, 0.95));
        for (long n = 1; n <= 40; n++) {
            for (long x = 0; x <= n; x++) {
                Interval i = ClopperPearson.interval(x, n, 0.95);
                assertThat(i.lower()).isLessThanOrEqualTo((double) x / n);
                assertThat(i.upper()).isGreaterThanOrEqualTo((double) x / n);
            }
        }
    }
}
