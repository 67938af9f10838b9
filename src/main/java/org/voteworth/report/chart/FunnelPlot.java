package org.voteworth.report.chart;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.geom.Ellipse2D;
import java.text.DecimalFormat;
import java.text.FieldPosition;
import java.text.NumberFormat;
import java.text.ParsePosition;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.voteworth.score.WilsonScore;

/**
 * A funnel plot of helpful share against total votes, one mark per reviewer, with control limits
 * around the overall share p0 = ΣH / ΣT: the shares a reviewer whose true share is p0 would show
 * by chance at each number of votes. Small samples at 100 % fall inside the funnel's wide mouth
 * and are seen for what they are (Spiegelhalter DJ (2005), "Funnel plots for comparing
 * institutional performance", Statistics in Medicine 24:1185-1202).
 *
 * <p>The limits at n votes are p0 ± z·sqrt(p0(1 − p0)/n), clamped to [0, 1], with z from
 * {@link WilsonScore#z} at 95 % and 99.8 % (Spiegelhalter's two funnels). They are exactly the
 * shares whose Wilson score interval at that n just reaches p0, since the Wilson interval is the
 * inversion of this score test. Reviewers with the same votes share one mark, drawn larger;
 * above {@link #POINT_LIMIT} distinct marks they are binned into a two-dimensional histogram
 * (shaded cells) so the page stays small.
 */
public final class FunnelPlot {
    /** Above this many distinct vote pairs the plot is dense: counts per cell instead of one mark each. */
    public static final int POINT_LIMIT = 10_000;
    public static final double INNER = 0.95;
    public static final double OUTER = 0.998;
    private static final int X_CELLS = 80;
    private static final int Y_CELLS = 50;

    /**
     * A drawn funnel.
     *
     * @param svg the chart
     * @param reviewers reviewers plotted (those with at least one vote)
     * @param dense whether marks were binned into cells
     * @param overallShare p0
     */
    public record Drawn(String svg, int reviewers, boolean dense, double overallShare) {
    }

    private FunnelPlot() {
    }

    /** The lower and upper control limit at {@code n} votes around {@code p0} for a two-sided confidence. */
    public static double[] limits(double p0, double n, double confidence) {
        if (n <= 0) {
            throw new IllegalArgumentException("control limits need at least one vote, not " + n);
        }
        double half = WilsonScore.z(confidence) * Math.sqrt(p0 * (1 - p0) / n);
        return new double[] {Math.max(0, p0 - half), Math.min(1, p0 + half)};
    }

    /**
     * Draws the funnel of the reviewers with at least one vote.
     *
     * @param helpful helpful votes per reviewer
     * @param total total votes per reviewer, same order
     */
    public static Drawn draw(long[] helpful, long[] total, String id, int width, int height) {
        long sumH = 0;
        long sumT = 0;
        long maxT = 1;
        int n = 0;
        for (int i = 0; i < total.length; i++) {
            if (total[i] > 0) {
                sumH += helpful[i];
                sumT += total[i];
                maxT = Math.max(maxT, total[i]);
                n++;
            }
        }
        double p0 = sumT == 0 ? 0 : (double) sumH / sumT;
        double xMax = Math.log10(maxT) + 0.1;
        NumberAxis x = new NumberAxis("total votes per reviewer (log scale)");
        x.setRange(-0.1, xMax);
        x.setTickUnit(new NumberTickUnit(1, new PowerOfTen()));
        NumberAxis y = new NumberAxis("helpful share of votes (%)");
        y.setRange(0, 1.03);
        y.setTickUnit(new NumberTickUnit(0.1, NumberFormat.getPercentInstance(Locale.ROOT)));
        XYPlot plot = new XYPlot();
        plot.setDomainAxis(x);
        plot.setRangeAxis(y);
        boolean dense = distinctPairCount(helpful, total) > POINT_LIMIT;
        PaintScale scale = null;
        if (dense) {
            scale = cells(plot, helpful, total, xMax);
        } else {
            marks(plot, helpful, total);
        }
        limitsLayer(plot, p0, maxT);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        if (scale != null) {
            NumberAxis sa = new NumberAxis("reviewers per cell (log10)");
            sa.setTickLabelFont(SvgChart.TICK);
            sa.setLabelFont(SvgChart.TICK);
            PaintScaleLegend legend = new PaintScaleLegend(scale, sa);
            legend.setPosition(RectangleEdge.RIGHT);
            legend.setStripWidth(12);
            chart.addSubtitle(legend);
        }
        SvgChart.style(chart);
        return new Drawn(SvgChart.svg(chart, id, width, height), n, dense, p0);
    }

    /**
     * One mark per distinct (helpful, total) pair: reviewers with the same votes would draw the
     * same mark on top of each other, so the mark grows with how many share it instead.
     */
    private static void marks(XYPlot plot, long[] helpful, long[] total) {
        Map<Long, Map<Long, Integer>> pairs = distinctPairs(helpful, total);
        XYSeries one = new XYSeries("1 reviewer", false, true);
        XYSeries few = new XYSeries("2-9 reviewers with the same votes", false, true);
        XYSeries many = new XYSeries("10 or more with the same votes", false, true);
        pairs.forEach((t, byH) -> byH.forEach((h, n) ->
                (n == 1 ? one : n < 10 ? few : many).add(Math.log10(t), (double) h / t, false)));
        XYSeriesCollection c = new XYSeriesCollection();
        c.addSeries(one);
        c.addSeries(few);
        c.addSeries(many);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setDrawOutlines(false);
        double[] size = {4, 7, 11};
        for (int s = 0; s < 3; s++) {
            r.setSeriesShape(s, new Ellipse2D.Double(-size[s] / 2, -size[s] / 2, size[s], size[s]));
            r.setSeriesPaint(s, new Color(0, 0x72, 0xB2, 120));
        }
        plot.setDataset(0, c);
        plot.setRenderer(0, r);
    }

    /** Number of distinct (helpful, total) pairs among reviewers with at least one vote. */
    static int distinctPairCount(long[] helpful, long[] total) {
        return distinctPairs(helpful, total).values().stream().mapToInt(Map::size).sum();
    }

    private static Map<Long, Map<Long, Integer>> distinctPairs(long[] helpful, long[] total) {
        Map<Long, Map<Long, Integer>> pairs = new TreeMap<>();
        for (int i = 0; i < total.length; i++) {
            if (total[i] > 0) {
                pairs.computeIfAbsent(total[i], x -> new TreeMap<>()).merge(helpful[i], 1, Integer::sum);
            }
        }
        return pairs;
    }

    /** Bins reviewers into cells of log10(votes) × share, and shades each by the log of its count. */
    private static PaintScale cells(XYPlot plot, long[] helpful, long[] total, double xMax) {
        double w = (xMax + 0.1) / X_CELLS;
        double h = 1.0 / Y_CELLS;
        long[][] count = new long[X_CELLS][Y_CELLS + 1];
        for (int i = 0; i < total.length; i++) {
            if (total[i] > 0) {
                int cx = Math.min(X_CELLS - 1, (int) ((Math.log10(total[i]) + 0.1) / w));
                int cy = (int) Math.floor((double) helpful[i] / total[i] / h);
                count[cx][cy]++;
            }
        }
        int cellsUsed = 0;
        for (long[] col : count) {
            for (long c : col) {
                cellsUsed += c > 0 ? 1 : 0;
            }
        }
        double[][] xyz = new double[3][cellsUsed];
        double maxLog = 0;
        int k = 0;
        for (int cx = 0; cx < X_CELLS; cx++) {
            for (int cy = 0; cy <= Y_CELLS; cy++) {
                if (count[cx][cy] > 0) {
                    xyz[0][k] = -0.1 + (cx + 0.5) * w;
                    xyz[1][k] = Math.min(cy, Y_CELLS - 1) * h + h / 2;
                    xyz[2][k] = Math.log10(count[cx][cy]);
                    maxLog = Math.max(maxLog, xyz[2][k]);
                    k++;
                }
            }
        }
        DefaultXYZDataset d = new DefaultXYZDataset();
        d.addSeries("reviewers per cell", xyz);
        XYBlockRenderer r = new XYBlockRenderer();
        r.setBlockWidth(w);
        r.setBlockHeight(h);
        PaintScale scale = new Blues(Math.max(maxLog, 1));
        r.setPaintScale(scale);
        plot.setDataset(0, d);
        plot.setRenderer(0, r);
        return scale;
    }

    private static void limitsLayer(XYPlot plot, double p0, long maxT) {
        XYSeries mean = new XYSeries("overall share " + String.format(Locale.ROOT, "%.1f %%", 100 * p0));
        XYSeries lo95 = new XYSeries("95 % control limits");
        XYSeries hi95 = new XYSeries("95 % upper");
        XYSeries lo998 = new XYSeries("99.8 % control limits");
        XYSeries hi998 = new XYSeries("99.8 % upper");
        int steps = 200;
        double top = Math.log10(maxT) + 0.1;
        for (int i = 0; i <= steps; i++) {
            double lx = top * i / steps;
            double votes = Math.pow(10, lx);
            double[] a = limits(p0, votes, INNER);
            double[] b = limits(p0, votes, OUTER);
            mean.add(lx, p0);
            lo95.add(lx, a[0]);
            hi95.add(lx, a[1]);
            lo998.add(lx, b[0]);
            hi998.add(lx, b[1]);
        }
        XYSeriesCollection c = new XYSeriesCollection();
        c.addSeries(mean);
        c.addSeries(lo95);
        c.addSeries(hi95);
        c.addSeries(lo998);
        c.addSeries(hi998);
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        r.setDrawSeriesLineAsPath(true);
        BasicStroke solid = new BasicStroke(1.6f);
        BasicStroke dashed = new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {6f, 4f}, 0f);
        r.setSeriesPaint(0, Palette.BLACK);
        r.setSeriesStroke(0, solid);
        for (int s : new int[] {1, 2}) {
            r.setSeriesPaint(s, Palette.VERMILLION);
            r.setSeriesStroke(s, solid);
        }
        for (int s : new int[] {3, 4}) {
            r.setSeriesPaint(s, Palette.ORANGE);
            r.setSeriesStroke(s, dashed);
        }
        r.setSeriesVisibleInLegend(2, false);
        r.setSeriesVisibleInLegend(4, false);
        plot.setDataset(1, c);
        plot.setRenderer(1, r);
    }

    /** Tick labels 1, 10, 100 ... for an axis in log10 units. */
    private static final class PowerOfTen extends NumberFormat {
        private static final long serialVersionUID = 1L;
        private final DecimalFormat plain = new DecimalFormat("#,##0", java.text.DecimalFormatSymbols.getInstance(Locale.ROOT));

        @Override
        public StringBuffer format(double number, StringBuffer toAppendTo, FieldPosition pos) {
            return toAppendTo.append(plain.format(Math.round(Math.pow(10, number))));
        }

        @Override
        public StringBuffer format(long number, StringBuffer toAppendTo, FieldPosition pos) {
            return format((double) number, toAppendTo, pos);
        }

        @Override
        public Number parse(String source, ParsePosition parsePosition) {
            throw new UnsupportedOperationException("tick labels are only written");
        }
    }

    /**
     * A sequential light-to-dark blue scale (the ColorBrewer "Blues" end points #deebf7 to
     * #08306b, from memory): one hue, so it reads for colour-blind readers and in greyscale.
     */
    private record Blues(double upper) implements PaintScale {
        @Override
        public double getLowerBound() {
            return 0;
        }

        @Override
        public double getUpperBound() {
            return upper;
        }

        @Override
        public java.awt.Paint getPaint(double value) {
            double t = Math.max(0, Math.min(1, value / upper));
            return new Color(mix(0xDE, 0x08, t), mix(0xEB, 0x30, t), mix(0xF7, 0x6B, t));
        }

        private static int mix(int a, int b, double t) {
            return (int) Math.round(a + (b - a) * t);
        }
    }
}
