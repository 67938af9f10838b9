package org.voteworth.report.chart;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Rectangle;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.Axis;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.title.LegendTitle;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;

/**
 * Draws a chart as an SVG element to inline in an HTML page: real text (not paths), a view box so
 * it scales with the page, and ids prefixed with the chart's own id so several charts can share
 * one page. Also sets the look every chart shares: white background, light grid, no gradients,
 * sans-serif labels large enough for print.
 */
public final class SvgChart {
    static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 13);
    static final Font TICK = new Font(Font.SANS_SERIF, Font.PLAIN, 11);

    static {
        // Charts are drawn off screen, also on machines without a display.
        System.setProperty("java.awt.headless", "true");
        // Rotated labels (the vertical axis title) as SVG text too, not as glyph outlines.
        org.jfree.chart.text.TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    private SvgChart() {
    }

    /**
     * The chart as an {@code <svg>} element with the given id and a view box of the given size.
     *
     * @param id an HTML id: letters, digits and dashes only
     */
    public static String svg(JFreeChart chart, String id, int width, int height) {
        if (!id.matches("[A-Za-z][A-Za-z0-9-]*")) {
            throw new IllegalArgumentException("a chart id takes letters, digits and dashes, starting with a letter: '" + id + "'");
        }
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        g.setDefsKeyPrefix(id + "-");
        // Two decimals are far below a pixel and keep charts with thousands of marks small.
        g.setGeomDoubleConverter(SvgChart::twoDecimals);
        chart.draw(g, new Rectangle(0, 0, width, height));
        return g.getSVGElement(id, false, new ViewBox(0, 0, width, height), null, null);
    }

    private static String twoDecimals(double v) {
        long r = Math.round(v * 100);
        if (r % 100 == 0) {
            return Long.toString(r / 100);
        }
        return Double.toString(r / 100.0);
    }

    /** Gives a chart the shared look. */
    static JFreeChart style(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        chart.setAntiAlias(true);
        chart.setTextAntiAlias(true);
        LegendTitle legend = chart.getLegend();
        if (legend != null) {
            legend.setItemFont(TICK);
            legend.setFrame(org.jfree.chart.block.BlockBorder.NONE);
        }
        Plot p = chart.getPlot();
        p.setBackgroundPaint(Color.WHITE);
        p.setOutlinePaint(Palette.GRID);
        if (p instanceof XYPlot xy) {
            xy.setDomainGridlinePaint(Palette.GRID);
            xy.setRangeGridlinePaint(Palette.GRID);
            xy.setDomainGridlineStroke(new BasicStroke(0.5f));
            xy.setRangeGridlineStroke(new BasicStroke(0.5f));
            axis(xy.getDomainAxis());
            axis(xy.getRangeAxis());
        } else if (p instanceof CategoryPlot c) {
            c.setRangeGridlinePaint(Palette.GRID);
            c.setRangeGridlineStroke(new BasicStroke(0.5f));
            axis(c.getDomainAxis());
            axis(c.getRangeAxis());
            if (c.getRenderer() instanceof BarRenderer b) {
                b.setBarPainter(new StandardBarPainter());
                b.setShadowVisible(false);
                b.setDrawBarOutline(false);
            }
        }
        return chart;
    }

    private static void axis(Axis a) {
        a.setLabelFont(LABEL);
        a.setTickLabelFont(TICK);
        a.setLabelPaint(Palette.BLACK);
        a.setTickLabelPaint(Palette.BLACK);
    }
}
