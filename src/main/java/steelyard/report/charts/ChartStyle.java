package steelyard.report.charts;

import java.awt.Color;
import java.awt.Font;
import java.awt.Stroke;
import java.util.Locale;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.StandardChartTheme;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.Range;

/** The look every chart shares: fonts, background, grid, markers, and axis ranges that include the markers. */
final class ChartStyle {
  /** Logical font family: maps to the platform's sans-serif face in Java and to {@code sans-serif} in SVG. */
  static final String FAMILY = Font.SANS_SERIF;
  static final String NO_DATA = "No data to show";

  private ChartStyle() {}

  /** Applies our theme to {@code chart} (per chart: the global theme is left alone for other users). */
  static JFreeChart apply(JFreeChart chart) {
    StandardChartTheme theme = new StandardChartTheme("steelyard");
    theme.setExtraLargeFont(new Font(FAMILY, Font.BOLD, 16));
    theme.setLargeFont(new Font(FAMILY, Font.BOLD, 13));
    theme.setRegularFont(new Font(FAMILY, Font.PLAIN, 12));
    theme.setSmallFont(new Font(FAMILY, Font.PLAIN, 11));
    theme.setChartBackgroundPaint(Color.WHITE);
    theme.setPlotBackgroundPaint(Color.WHITE);
    theme.setPlotOutlinePaint(Palette.GREY);
    theme.setDomainGridlinePaint(Palette.GRID);
    theme.setRangeGridlinePaint(Palette.GRID);
    theme.setAxisLabelPaint(Palette.INK);
    theme.setTickLabelPaint(Palette.INK);
    theme.setTitlePaint(Palette.INK);
    theme.setLegendItemPaint(Palette.INK);
    theme.setLegendBackgroundPaint(Color.WHITE);
    theme.setItemLabelPaint(Palette.INK);
    theme.setShadowVisible(false);
    theme.setAxisOffset(RectangleInsets.ZERO_INSETS);
    theme.apply(chart);
    chart.setAntiAlias(true);
    chart.setTextAntiAlias(true);
    chart.getPlot().setNoDataMessage(NO_DATA);
    chart.getPlot().setNoDataMessageFont(new Font(FAMILY, Font.ITALIC, 13));
    chart.getPlot().setNoDataMessagePaint(Palette.INK);
    return chart;
  }

  /** A horizontal (range) or vertical (domain) line at {@code value}, labelled inside the plot. */
  static ValueMarker marker(double value, String label, Color paint, Stroke stroke, boolean horizontal) {
    ValueMarker m = new ValueMarker(value, paint, stroke);
    m.setLabel(label);
    m.setLabelFont(new Font(FAMILY, Font.BOLD, 11));
    m.setLabelPaint(paint.darker());
    m.setLabelBackgroundColor(new Color(255, 255, 255, 220));
    if (horizontal) {
      m.setLabelAnchor(RectangleAnchor.TOP_LEFT);
      m.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
      m.setLabelOffset(new RectangleInsets(2, 6, 2, 2));
    } else {
      m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
      m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
      m.setLabelOffset(new RectangleInsets(4, 4, 2, 2));
    }
    return m;
  }

  /** Adds a range (horizontal) marker unless {@code value} is NaN. */
  static void rangeMarker(XYPlot plot, double value, String label, Color paint, Stroke stroke) {
    if (!Double.isNaN(value)) plot.addRangeMarker(marker(value, label, paint, stroke, true), Layer.FOREGROUND);
  }

  /** Adds a domain (vertical) marker unless {@code value} is NaN. */
  static void domainMarker(XYPlot plot, double value, String label, Color paint, Stroke stroke) {
    if (!Double.isNaN(value)) plot.addDomainMarker(marker(value, label, paint, stroke, false), Layer.FOREGROUND);
  }

  /**
   * Fixes {@code axis} to the span of the data plus every finite extra value (markers), with a margin, so
   * markers outside the data still show. Leaves the axis on auto range when there is nothing finite.
   */
  static void include(NumberAxis axis, Range data, double... extra) {
    double lo = data == null ? Double.POSITIVE_INFINITY : data.getLowerBound();
    double hi = data == null ? Double.NEGATIVE_INFINITY : data.getUpperBound();
    for (double v : extra) {
      if (Double.isFinite(v)) {
        lo = Math.min(lo, v);
        hi = Math.max(hi, v);
      }
    }
    if (!(lo <= hi)) return;
    double pad = hi > lo ? (hi - lo) * 0.08 : Math.max(Math.abs(hi) * 0.1, 1.0);
    axis.setRange(lo - pad, hi + pad);
  }

  /** A value for labels: up to four significant decimals, no trailing zeros, locale-independent. */
  static String number(double v) {
    if (!Double.isFinite(v)) return Double.isNaN(v) ? "n/a" : (v > 0 ? "inf" : "-inf");
    String s = String.format(Locale.ROOT, "%.4f", v);
    s = s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
    return s.equals("-0") ? "0" : s;
  }

  /** A percentage for labels: two decimals and a percent sign. */
  static String percent(double v) {
    return String.format(Locale.ROOT, "%.2f %%", v);
  }
}
