package org.voteworth.report.chart;

import java.awt.geom.Ellipse2D;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.IntervalBarRenderer;
import org.jfree.chart.renderer.category.LineAndShapeRenderer;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.category.DefaultIntervalCategoryDataset;

/**
 * Each reviewer's rank interval as a bar (from the low to the high quantile of the rank over
 * Monte Carlo draws) with a dot at the median rank, best rank first: overlapping bars are ranks
 * the data cannot tell apart.
 */
public final class RankIntervalChart {
    /**
     * One reviewer's interval.
     *
     * @param label unique label, e.g. "#3 p-1a2b"
     * @param low rank at the low quantile
     * @param median median rank
     * @param high rank at the high quantile
     */
    public record Bar(String label, int low, int median, int high) {
    }

    private RankIntervalChart() {
    }

    /** The chart; {@code quantiles} describes the interval, e.g. "5 %-95 %". */
    public static String svg(List<Bar> bars, String quantiles, String rule, String id, int width) {
        String[] labels = bars.stream().map(Bar::label).toArray(String[]::new);
        Number[][] starts = new Number[1][bars.size()];
        Number[][] ends = new Number[1][bars.size()];
        DefaultCategoryDataset medians = new DefaultCategoryDataset();
        for (int i = 0; i < bars.size(); i++) {
            Bar b = bars.get(i);
            // A bar from rank a to rank b covers the whole of both ranks.
            starts[0][i] = b.low() - 0.4;
            ends[0][i] = b.high() + 0.4;
            medians.addValue(b.median(), "median rank", b.label());
        }
        DefaultIntervalCategoryDataset intervals = new DefaultIntervalCategoryDataset(
                new String[] {quantiles + " rank interval"}, labels, starts, ends);
        IntervalBarRenderer r = new IntervalBarRenderer();
        r.setSeriesPaint(0, Palette.ofRule(rule));
        r.setMaximumBarWidth(0.6);
        NumberAxis v = new NumberAxis("rank under " + rule + " (1 = best)");
        v.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        v.setRange(0.4, bars.stream().mapToInt(Bar::high).max().orElse(1) + 0.6);
        CategoryAxis c = new CategoryAxis("reviewer, by rank");
        c.setMaximumCategoryLabelWidthRatio(0.35f);
        CategoryPlot p = new CategoryPlot(intervals, c, v, r);
        LineAndShapeRenderer dots = new LineAndShapeRenderer(false, true);
        dots.setSeriesPaint(0, Palette.BLACK);
        dots.setSeriesShape(0, new Ellipse2D.Double(-3, -3, 6, 6));
        p.setDataset(1, medians);
        p.setRenderer(1, dots);
        p.setDatasetRenderingOrder(DatasetRenderingOrder.FORWARD);
        p.setOrientation(PlotOrientation.HORIZONTAL);
        p.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, p, true);
        return SvgChart.svg(SvgChart.style(chart), id, width, 90 + 22 * bars.size());
    }
}
