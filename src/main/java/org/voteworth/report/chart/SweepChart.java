package org.voteworth.report.chart;

import java.awt.BasicStroke;
import java.awt.geom.Ellipse2D;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.renderer.category.LineAndShapeRenderer;
import org.jfree.data.category.DefaultCategoryDataset;

/**
 * The threshold sweep as lines: for each rule, the overlap (Jaccard) of the top k at each entry
 * bar with the top k at the lowest bar. A rule whose list holds steady as the bar rises does not
 * depend on where the bar was put.
 */
public final class SweepChart {
    /**
     * One rule's line.
     *
     * @param rule the rule's name (gives the colour)
     * @param label the legend entry
     * @param overlap Jaccard with the lowest bar's list, one per bar
     */
    public record Line(String rule, String label, List<Double> overlap) {
        public Line {
            overlap = List.copyOf(overlap);
        }
    }

    private SweepChart() {
    }

    /** The chart; {@code barAxis} names the votes the bars count, with the unit. */
    public static String svg(List<Long> bars, List<Line> lines, int k, String barAxis, String id, int width, int height) {
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        for (Line l : lines) {
            for (int i = 0; i < bars.size(); i++) {
                d.addValue(l.overlap().get(i), l.label(), Long.toString(bars.get(i)));
            }
        }
        LineAndShapeRenderer r = new LineAndShapeRenderer(true, true);
        for (int s = 0; s < lines.size(); s++) {
            r.setSeriesPaint(s, Palette.ofRule(lines.get(s).rule()));
            r.setSeriesStroke(s, new BasicStroke(2f));
            r.setSeriesShape(s, new Ellipse2D.Double(-3.5, -3.5, 7, 7));
        }
        NumberAxis v = new NumberAxis("Jaccard overlap with the lowest bar's top " + k);
        v.setRange(0, 1.05);
        CategoryPlot p = new CategoryPlot(d, new CategoryAxis(barAxis), v, r);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, p, true);
        return SvgChart.svg(SvgChart.style(chart), id, width, height);
    }
}
