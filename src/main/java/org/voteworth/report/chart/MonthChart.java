package org.voteworth.report.chart;

import java.text.SimpleDateFormat;
import java.time.YearMonth;
import java.util.Locale;
import java.util.SortedMap;
import java.util.TimeZone;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.data.time.Month;
import org.jfree.data.time.TimeSeries;
import org.jfree.data.time.TimeSeriesCollection;

/** Counts per calendar month as bars on a time axis, which labels years rather than every month. */
public final class MonthChart {
    private static final TimeZone UTC = TimeZone.getTimeZone("UTC");

    private MonthChart() {
    }

    /** The chart; {@code valueAxis} names the counts with their unit. */
    public static String svg(SortedMap<YearMonth, Long> perMonth, String valueAxis, String id, int width, int height) {
        TimeSeries s = new TimeSeries(valueAxis);
        perMonth.forEach((m, n) -> s.add(new Month(m.getMonthValue(), m.getYear()), n));
        TimeSeriesCollection d = new TimeSeriesCollection(s, UTC);
        DateAxis x = new DateAxis("month of the review date");
        x.setTimeZone(UTC);
        x.setLocale(Locale.ROOT);
        SimpleDateFormat year = new SimpleDateFormat("MMM yyyy", Locale.ROOT);
        year.setTimeZone(UTC);
        x.setDateFormatOverride(year);
        NumberAxis y = new NumberAxis(valueAxis);
        y.setNumberFormatOverride(java.text.NumberFormat.getIntegerInstance(Locale.ROOT));
        XYBarRenderer r = new XYBarRenderer(0.1);
        r.setBarPainter(new StandardXYBarPainter());
        r.setShadowVisible(false);
        r.setSeriesPaint(0, Palette.BLUISH_GREEN);
        XYPlot p = new XYPlot(d, x, y, r);
        JFreeChart chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, p, false);
        return SvgChart.svg(SvgChart.style(chart), id, width, height);
    }
}
