package org.voteworth.report.chart;

import java.awt.Color;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.CategoryLabelPositions;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.labels.ItemLabelAnchor;
import org.jfree.chart.labels.ItemLabelPosition;
import org.jfree.chart.labels.StandardCategoryItemLabelGenerator;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.DefaultCategoryDataset;

/**
 * One series of counts as bars: reviews per category, a star histogram, votes per review. Labels
 * come from the data and are drawn as escaped SVG text.
 *
 * @param labels one label per bar, in order (unique)
 * @param values one count per bar
 * @param labelAxis title of the axis of labels
 * @param valueAxis title of the axis of counts, with its unit
 * @param horizontal bars run left to right (for long labels such as category names)
 * @param logScale counts on a log scale (bars of zero are left out)
 */
public record BarChart(List<String> labels, List<Long> values, String labelAxis, String valueAxis, boolean horizontal,
                       boolean logScale) {
    public BarChart {
        labels = List.copyOf(labels);
        values = List.copyOf(values);
        if (labels.size() != values.size()) {
            throw new IllegalArgumentException(labels.size() + " labels for " + values.size() + " values");
        }
    }

    /** The chart as an inline SVG element; {@code colour} fills the bars. */
    public String svg(String id, int width, int height, Color colour) {
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        for (int i = 0; i < labels.size(); i++) {
            if (!logScale || values.get(i) > 0) {
                d.addValue(values.get(i), valueAxis, labels.get(i));
            }
        }
        CategoryAxis c = new CategoryAxis(labelAxis);
        c.setCategoryMargin(0.15);
        c.setMaximumCategoryLabelWidthRatio(horizontal ? 0.45f : 1f);
        if (!horizontal && labels.size() > 8) {
            c.setCategoryLabelPositions(CategoryLabelPositions.UP_45);
        }
        ValueAxis v;
        if (logScale) {
            LogAxis log = new LogAxis(valueAxis);
            log.setBase(10);
            // Ticks at 1, 10, 100 ...; a bar of one still shows above the axis.
            log.setSmallestValue(0.7);
            log.setTickUnit(new NumberTickUnit(1));
            log.setNumberFormatOverride(java.text.NumberFormat.getIntegerInstance(java.util.Locale.ROOT));
            v = log;
        } else {
            NumberAxis n = new NumberAxis(valueAxis);
            n.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
            n.setNumberFormatOverride(java.text.NumberFormat.getIntegerInstance(java.util.Locale.ROOT));
            v = n;
        }
        BarRenderer r = new BarRenderer();
        r.setSeriesPaint(0, colour);
        r.setMaximumBarWidth(0.08);
        if (labels.size() <= 12) {
            r.setDefaultItemLabelGenerator(new StandardCategoryItemLabelGenerator("{2}",
                    java.text.NumberFormat.getIntegerInstance(java.util.Locale.ROOT)));
            r.setDefaultItemLabelsVisible(true);
            r.setDefaultItemLabelFont(SvgChart.TICK);
            r.setDefaultPositiveItemLabelPosition(horizontal
                    ? new ItemLabelPosition(ItemLabelAnchor.OUTSIDE3, TextAnchor.CENTER_LEFT)
                    : new ItemLabelPosition(ItemLabelAnchor.OUTSIDE12, TextAnchor.BOTTOM_CENTER));
            r.setItemLabelAnchorOffset(4);
            v.setUpperMargin(0.15);
        }
        CategoryPlot p = new CategoryPlot(d, c, v, r);
        p.setOrientation(horizontal ? PlotOrientation.HORIZONTAL : PlotOrientation.VERTICAL);
        p.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, p, false);
        return SvgChart.svg(SvgChart.style(chart), id, width, height);
    }
}
