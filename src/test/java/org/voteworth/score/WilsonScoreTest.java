package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.interval.AgrestiCoullInterval;
import org.apache.commons.math3.stat.interval.ConfidenceInterval;
import org.apache.commons.math3.stat.interval.WilsonScoreInterval;
import org.junit.jupiter.api.Test;

class WilsonScoreTest {

    @Test
    void publishedWilsonIntervals() {
        // reference-checks/wilson_intervals.csv: Newcombe (1998), R binom via statsmodels, Astropy; sources per row.
        List<Map<String, String>> rows = ReferenceCsv.read("wilson_intervals.csv");
        assertThat(rows).hasSize(14);
        for (Map<String, String> r : rows) {
            long x = Long.parseLong(r.get("x"));
            long n = Long.parseLong(r.get("n"));
            double c = Double.parseDouble(r.get("confidence"));
            Interval i = switch (r.get("method")) {
                case "wilson" -> WilsonScore.interval(x, n, c);
                case "wilson-cc" -> WilsonScore.continuityCorrected(x, n, c);
                default -> throw new IllegalStateException(r.get("#line") + ": unknown method " + r.get("method"));
            };
            ReferenceCsv.check(r, "lower", i.lower());
            ReferenceCsv.check(r, "upper", i.upper());
            assertThat(i.confidence()).isEqualTo(c);
        }
    }

    @Test
    void normalQuantilesFromTheHandbook() {
        // reference-checks/normal_quantiles.csv: NIST/SEMATECH e-Handbook 1.3.6.7.1, and computed full precision.
        for (Map<String, String> r : ReferenceCsv.read("normal_quantiles.csv")) {
            double p = Double.parseDouble(r.get("probability"));
            ReferenceCsv.check(r, "quantile", WilsonScore.z(2 * p - 1));
        }
    }

    @Test
    void agreesWithCommonsMathOnAGrid() {
        // Commons Math WilsonScoreInterval (a general-purpose reference library) uses the same z;
        // it does not clamp, so x = 0 and x = n leave residues of about 1e-16 where we give 0 and 1.
        WilsonScoreInterval reference = new WilsonScoreInterval();
        double[] confidences = {0.5, 0.8, 0.9, 0.95, 0.99, 0.999};
        long[] trials = {1, 2, 3, 5, 10, 29, 100, 263, 1000, 12345};
        for (double c : confidences) {
            for (long n : trials) {
                for (long x = 0; x <= n; x += Math.max(1, n / 37)) {
                    check(reference.createInterval((int) n, (int) x, c), WilsonScore.interval(x, n, c), x, n, c);
                }
                check(reference.createInterval((int) n, (int) n, c), WilsonScore.interval(n, n, c), n, n, c);
            }
        }
    }

    private static void check(ConfidenceInterval expected, Interval actual, long x, long n, double c) {
        String what = x + "/" + n + " at " + c;
        assertThat(actual.lower()).as(what).isCloseTo(expected.getLowerBound(), within(1e-12));
        assertThat(actual.upper()).as(what).isCloseTo(expected.getUpperBound(), within(1e-12));
        if (x == 0) {
            assertThat(actual.lower()).as(what).isZero();
        }
        if (x == n) {
            assertThat(actual.upper()).as(what).isEqualTo(1.0);
        }
    }

    @Test
    void continuityCorrectionWidensTheInterval() {
        // Newcombe (1998): method 4 contains method 3 (both limits move outwards, or stay at 0 and 1).
        for (long n = 1; n <= 60; n++) {
            for (long x = 0; x <= n; x++) {
                Interval w = WilsonScore.interval(x, n, 0.95);
                Interval cc = WilsonScore.continuityCorrected(x, n, 0.95);
                assertThat(cc.lower()).as(x + "/" + n).isLessThanOrEqualTo(w.lower());
                assertThat(cc.upper()).as(x + "/" + n).isGreaterThanOrEqualTo(w.upper());
            }
        }
    }

    @Test
    void containsTheShareAndNarrowsWithMoreTrials() {
        // Facts of the trade: the Wilson interval holds p = x/n, and the same share on ten times the trials is narrower.
        for (long n = 1; n <= 50; n++) {
            for (long x = 0; x <= n; x++) {
                double p = (double) x / n;
                Interval i = WilsonScore.interval(x, n, 0.95);
                assertThat(i.lower()).isLessThanOrEqualTo(p);
                assertThat(i.upper()).isGreaterThanOrEqualTo(p);
                Interval big = WilsonScore.interval(10 * x, 10 * n, 0.95);
                assertThat(big.upper() - big.lower()).isLessThan(i.upper() - i.lower());
            }
        }
    }

    @Test
    void noTrialsGiveTheWholeRange() {
        assertThat(WilsonScore.interval(0, 0, 0.95)).isEqualTo(new Interval(0, 1, 0.95));
        assertThat(WilsonScore.continuityCorrected(0, 0, 0.9)).isEqualTo(new Interval(0, 1, 0.9));
    }

    @Test
    void commonsMathsAgrestiCoullIsNotTheWilsonInterval() {
        // REFERENCES.md §1 naming trap: the NIST handbook calls the Wilson formula "Agresti and Coull";
        // Commons Math's AgrestiCoullInterval is the usual, different one (4/20: 0.0749, 0.4218).
        ConfidenceInterval ac = new AgrestiCoullInterval().createInterval(20, 4, 0.95);
        Interval w = WilsonScore.interval(4, 20, 0.95);
        assertThat(Math.abs(ac.getLowerBound() - w.lower())).isGreaterThan(1e-3);
    }

    @Test
    void rejectsNonsenseWithTheValue() {
        assertThatThrownBy(() -> WilsonScore.interval(5, 4, 0.95)).hasMessageContaining("5 of 4");
        assertThatThrownBy(() -> WilsonScore.z(1.0)).hasMessageContaining("confidence").hasMessageContaining("1.0");
        assertThatThrownBy(() -> WilsonScore.z(95)).hasMessageContaining("95");
    }
}
