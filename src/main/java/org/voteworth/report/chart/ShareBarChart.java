package org.voteworth.report.chart;

import java.awt.Color;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.data.category.DefaultCategoryDataset;

/**
 * Shares side by side, several series per label: a reviewer's star histogram against the one
 * their categories would give. Values are fractions drawn as percent; a missing share (NaN) draws
 * no bar.
 *
 * @param labels one label per group of bars, in order (unique)
 * @param series one name per series, shown in the legend (unique)
 * @param shares per series, one fraction per label
 * @param labelAxis title of the axis of labels
 */
public record ShareBarChart(List<String> labels, List<String> series, List<List<Double>> shares, String labelAxis) {
    public ShareBarChart {
        labels = List.copyOf(labels);
        series = List.copyOf(series);
        shares = shares.stream().map(List::copyOf).toList();
        if (series.size() != shares.size()) {
            throw new IllegalArgumentException(series.size() + " series names for " + shares.size() + " series");
        }
        for (List<Double> s : shares) {
            if (s.size() != labels.size()) {
                throw new IllegalArgumentException(labels.size() + " labels for " + s.size() + " shares");
            }
        }
    }

    /** The chart as an inline SVG element; series {@code i} is filled with {@code colours[i]}. */
    public String svg(String id, int width, int height, Color... colours) {
        if (colours.length != series.size()) {
            throw new IllegalArgumentException(series.size() + " series for " + colours.length + " colours");
        }
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        for (int s = 0; s < series.size(); s++) {
            for (int i = 0; i < labels.size(); i++) {
                double v = shares.get(s).get(i);
                d.addValue(Double.isNaN(v) ? null : 100 * v, series.get(s), labels.get(i));
            }
        }
        CategoryAxis c = new CategoryAxis(labelAxis);
        c.setCategoryMargin(0.2);
        NumberAxis v = new NumberAxis("share of rated reviews (%)");
        v.setRange(0, 100);
        BarRenderer r = new BarRenderer();
        for (int s = 0; s < colours.length; s++) {
            r.setSeriesPaint(s, colours[s]);
        }
        r.setItemMargin(0.05);
        CategoryPlot p = new CategoryPlot(d, c, v, r);
        p.setOrientation(PlotOrientation.VERTICAL);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, p, true);
        return SvgChart.svg(SvgChart.style(chart), id, width, height);
    }
}
