package org.voteworth.report.chart;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.voteworth.score.Interval;
import org.voteworth.score.WilsonScore;

/** Funnel limits against the score test they invert, and what the drawn chart holds. */
class FunnelPlotTest {
    @Test
    void limitsAreTheNormalApproximationFunnelOfSpiegelhalter() {
        // Spiegelhalter (2005), Statistics in Medicine 24:1185-1202, section 3: p0 ± z·sqrt(p0(1-p0)/n).
        // Worked by hand: p0 = 0.5, n = 100, z = 1.959964 gives 0.5 ± 0.0980.
        double[] l = FunnelPlot.limits(0.5, 100, 0.95);
        assertThat(l[0]).isCloseTo(0.4020, within(1e-4));
        assertThat(l[1]).isCloseTo(0.5980, within(1e-4));
        // 99.8 %: z = 3.090232 (NIST/SEMATECH e-Handbook, normal table), 0.5 ± 0.1545.
        double[] o = FunnelPlot.limits(0.5, 100, 0.998);
        assertThat(o[1]).isCloseTo(0.6545, within(1e-4));
        assertThat(FunnelPlot.limits(0.9, 1, 0.95)[1]).isEqualTo(1.0);
    }

    @Test
    void aShareLiesInsideTheLimitsExactlyWhenItsWilsonIntervalHoldsTheOverallShare() {
        // The Wilson interval is the inversion of the score test (Wilson 1927), so both tests must agree
        // for every count; checked against the project's Wilson interval, computed independently.
        for (double p0 : List.of(0.3, 0.745, 0.9)) {
            for (int n : List.of(1, 7, 40, 333)) {
                double[] l = FunnelPlot.limits(p0, n, 0.95);
                for (int x = 0; x <= n; x++) {
                    double share = (double) x / n;
                    Interval w = WilsonScore.interval(x, n, 0.95);
                    boolean inside = share >= l[0] - 1e-12 && share <= l[1] + 1e-12;
                    boolean covers = w.lower() <= p0 + 1e-12 && p0 <= w.upper() + 1e-12;
                    assertThat(inside).as("p0 %s, %d of %d", p0, x, n).isEqualTo(covers);
                }
            }
        }
    }

    @Test
    void drawsEveryReviewerWithVotesAsRealTextAndBinsAboveThePointLimit() {
        long[] h = {0, 3, 9, 45, 0};
        long[] t = {0, 3, 10, 60, 2};
        FunnelPlot.Drawn d = FunnelPlot.draw(h, t, "f", 800, 500);
        assertThat(d.reviewers()).isEqualTo(4);
        assertThat(d.overallShare()).isCloseTo(57.0 / 75, within(1e-12));
        assertThat(d.dense()).isFalse();
        assertThat(d.svg()).startsWith("<svg id='f'").contains("<text").contains("total votes per reviewer (log scale)")
                .contains("helpful share of votes (%)").contains("95 % control limits").contains("99.8 % control limits");

        int n = FunnelPlot.POINT_LIMIT + 500;
        long[] bh = new long[n];
        long[] bt = new long[n];
        for (int i = 0; i < n; i++) {
            bt[i] = 1 + i;
            bh[i] = i / 2;
        }
        FunnelPlot.Drawn dense = FunnelPlot.draw(bh, bt, "g", 800, 500);
        assertThat(dense.dense()).isTrue();
        assertThat(dense.svg()).contains("reviewers per cell").hasSizeLessThan(1_000_000);
    }

    @Test
    void barLabelsFromTheDataAreEscapedSvgText() {
        String svg = new BarChart(List.of("<script>alert(1)</script>", "Kitchen & Dining"), List.of(3L, 5L), "category",
                "reviews (count)", true, false).svg("c", 400, 200, Palette.BLUE);
        assertThat(svg).doesNotContain("<script").contains("&lt;script&gt;alert(1)&lt;/script&gt;").contains("Kitchen &amp; Dining");
    }
}
