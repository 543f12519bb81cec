package steelyard.report.charts;

import java.awt.Color;
import java.awt.Font;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Rectangle2D;
import java.util.HashSet;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYPointerAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.renderer.xy.XYStepRenderer;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.general.DatasetUtils;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * Chart factories for tuning and audit results. Each takes plain values and returns a styled
 * {@link JFreeChart} (no frame, no panel); the same chart goes into the window or, through
 * {@link ChartExport}, into the HTML report. Error rates are in percent (23.5 means 23.5 %).
 *
 * <p>A NaN level or weight means "not known": its marker is left out. An empty input gives a chart that
 * renders with a "no data" message. Mismatched array lengths and duplicate names are refused with an
 * {@link IllegalArgumentException} naming the sizes or the duplicate, never silently dropped.
 *
 * <p>Not thread-safe in the sense of JFreeChart: build a chart on one thread, then hand it over.
 */
public final class Charts {
  private Charts() {}

  /**
   * Error rate against one weight, as a step function, with horizontal lines at the rank-1 and oracle error
   * rates and a vertical line at the chosen weight.
   *
   * @param weightLabel  axis label of the weight, e.g. {@code "LM weight λ"}
   * @param errorLabel   axis label of the error, e.g. {@code "WER (%)"}
   * @param error        the error rate in percent on each interval of the weight
   * @param rankOneLevel error rate of the recogniser's rank 1 in percent (NaN: no line)
   * @param oracleLevel  error rate of the oracle in percent (NaN: no line)
   * @param chosenWeight the chosen weight (NaN: no line)
   */
  public static JFreeChart errorAgainstWeight(String weightLabel, String errorLabel, StepSeries error,
      double rankOneLevel, double oracleLevel, double chosenWeight) {
    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(series(error.name(), error.x(), error.y()));
    XYPlot plot = stepPlot(weightLabel, errorLabel, data);
    JFreeChart chart = finish(plot, true);
    XYStepRenderer r = (XYStepRenderer) plot.getRenderer();
    style(r, 0, Palette.BLUE, Palette.SOLID, null);
    ChartStyle.rangeMarker(plot, rankOneLevel, "rank 1: " + ChartStyle.percent(rankOneLevel), Palette.ORANGE, Palette.DASHED);
    ChartStyle.rangeMarker(plot, oracleLevel, "oracle: " + ChartStyle.percent(oracleLevel), Palette.GREEN, Palette.DOTTED);
    ChartStyle.domainMarker(plot, chosenWeight, "chosen " + ChartStyle.number(chosenWeight), Palette.INK, Palette.DASH_DOT);
    ChartStyle.include((NumberAxis) plot.getRangeAxis(), DatasetUtils.findRangeBounds(data), rankOneLevel, oracleLevel);
    ChartStyle.include((NumberAxis) plot.getDomainAxis(), DatasetUtils.findDomainBounds(data), chosenWeight);
    return chart;
  }

  /**
   * Counts of overrules that helped and that hurt (against the reference) at each weight, as step functions
   * (a count holds from its weight to the next), with a vertical line at the chosen weight. Helped is a solid
   * line with round points, hurt a dashed line with square points.
   */
  public static JFreeChart helpedHurtAgainstWeight(String weightLabel, double[] x, int[] helped, int[] hurt, double chosenWeight) {
    sameLength("x", x.length, "helped", helped.length);
    sameLength("x", x.length, "hurt", hurt.length);
    new StepSeries("weights", x, new double[x.length]); // validates x
    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(series("helped", x, toDouble(helped)));
    data.addSeries(series("hurt", x, toDouble(hurt)));
    XYPlot plot = stepPlot(weightLabel, "overrules", data);
    JFreeChart chart = finish(plot, true);
    XYStepRenderer r = (XYStepRenderer) plot.getRenderer();
    style(r, 0, Palette.BLUE, Palette.SOLID, new Ellipse2D.Double(-3.5, -3.5, 7, 7));
    style(r, 1, Palette.ORANGE, Palette.DASHED, new Rectangle2D.Double(-3.5, -3.5, 7, 7));
    ((NumberAxis) plot.getRangeAxis()).setStandardTickUnits(NumberAxis.createIntegerTickUnits());
    ((NumberAxis) plot.getRangeAxis()).setAutoRangeIncludesZero(true);
    ChartStyle.domainMarker(plot, chosenWeight, "chosen " + ChartStyle.number(chosenWeight), Palette.INK, Palette.DASH_DOT);
    ChartStyle.include((NumberAxis) plot.getDomainAxis(), DatasetUtils.findDomainBounds(data), chosenWeight);
    return chart;
  }

  /**
   * Error rate over a grid of two weights as a heat map (light: low error, dark: high), with a colour-scale
   * legend and the chosen point marked by crossing lines and a labelled arrow. Each cell is drawn as a block
   * centred on its grid point, as wide as the smallest grid step; NaN cells are grey.
   *
   * @param xs        grid values of the first weight, strictly ascending
   * @param ys        grid values of the second weight, strictly ascending
   * @param errorRate error rate in percent, indexed {@code [iy][ix]}
   */
  public static JFreeChart errorSurface(String xLabel, String yLabel, double[] xs, double[] ys, double[][] errorRate,
      double chosenX, double chosenY) {
    return errorSurface(xLabel, yLabel, "error (%)", xs, ys, errorRate, chosenX, chosenY);
  }

  /** As {@link #errorSurface(String, String, double[], double[], double[][], double, double)}, naming the error in the legend. */
  public static JFreeChart errorSurface(String xLabel, String yLabel, String errorLabel, double[] xs, double[] ys,
      double[][] errorRate, double chosenX, double chosenY) {
    new StepSeries(xLabel, xs, new double[xs.length]); // validates ascending
    new StepSeries(yLabel, ys, new double[ys.length]);
    sameLength("ys", ys.length, "errorRate rows", errorRate.length);
    DefaultXYZDataset data = new DefaultXYZDataset();
    double[][] cells = gridCells(xs, ys, errorRate);
    if (cells[0].length > 0) data.addSeries("error", cells);
    NumberAxis xAxis = new NumberAxis(xLabel);
    NumberAxis yAxis = new NumberAxis(yLabel);
    XYBlockRenderer r = new XYBlockRenderer();
    XYPlot plot = new XYPlot(data, xAxis, yAxis, r);
    JFreeChart chart = finish(plot, false);
    r.setBlockWidth(smallestStep(xs));
    r.setBlockHeight(smallestStep(ys));
    double[] bounds = finiteBounds(cells[2]);
    SequentialScale scale = new SequentialScale(bounds[0], bounds[1]);
    r.setPaintScale(scale);
    plot.setDomainGridlinesVisible(false);
    plot.setRangeGridlinesVisible(false);
    plot.setAxisOffset(RectangleInsets.ZERO_INSETS);
    fit(xAxis, r.findDomainBounds(data), chosenX);
    fit(yAxis, r.findRangeBounds(data), chosenY);
    markChosen(plot, chosenX, chosenY);
    chart.addSubtitle(scaleLegend(scale, errorLabel));
    return chart;
  }

  /**
   * Error rate per group (speaker, sheet …) before and after rescoring, as horizontal bars: "before" outlined
   * and pale, "after" solid and dark, so the two read apart without colour.
   *
   * @param groups group names, unique, in display order
   * @param before error rate of rank 1 per group, in percent
   * @param after  error rate of the picks per group, in percent
   */
  public static JFreeChart errorPerGroup(List<String> groups, double[] before, double[] after, String errorLabel) {
    return BarCharts.errorPerGroup(groups, before, after, errorLabel);
  }

  /**
   * Each hypothesis's weighted score terms as one horizontal stacked bar: positive terms stack right of zero,
   * negative ones left; segments wide enough carry the term's name as a label.
   *
   * @param hypothesisLabels one unique label per hypothesis (rows of {@code weightedTerms})
   * @param termNames        one unique name per term (columns)
   * @param weightedTerms    weight × term value, natural-log units, indexed {@code [hyp][term]}
   */
  public static JFreeChart scoreBreakdown(List<String> hypothesisLabels, List<String> termNames, double[][] weightedTerms) {
    return BarCharts.scoreBreakdown(hypothesisLabels, termNames, weightedTerms);
  }

  private static XYPlot stepPlot(String xLabel, String yLabel, XYSeriesCollection data) {
    NumberAxis x = new NumberAxis(xLabel);
    x.setAutoRangeIncludesZero(false);
    NumberAxis y = new NumberAxis(yLabel);
    y.setAutoRangeIncludesZero(false);
    XYStepRenderer r = new XYStepRenderer();
    r.setStepPoint(1.0);
    return new XYPlot(data, x, y, r);
  }

  private static void style(XYStepRenderer r, int series, Color paint, java.awt.Stroke stroke, java.awt.Shape shape) {
    r.setSeriesPaint(series, paint);
    r.setSeriesStroke(series, stroke);
    r.setSeriesShapesVisible(series, shape != null);
    if (shape != null) r.setSeriesShape(series, shape);
  }

  private static JFreeChart finish(XYPlot plot, boolean legend) {
    JFreeChart chart = ChartStyle.apply(new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, legend));
    plot.setOrientation(PlotOrientation.VERTICAL);
    if (chart.getLegend() != null) {
      chart.getLegend().setFrame(BlockBorder.NONE);
      chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    }
    return chart;
  }

  static XYSeries series(String name, double[] x, double[] y) {
    XYSeries s = new XYSeries(name, false, true);
    for (int k = 0; k < x.length; k++) s.add(x[k], Double.isNaN(y[k]) ? null : Double.valueOf(y[k]), false);
    return s;
  }

  private static double[] toDouble(int[] v) {
    double[] d = new double[v.length];
    for (int k = 0; k < v.length; k++) d[k] = v[k];
    return d;
  }

  static void sameLength(String a, int na, String b, int nb) {
    if (na != nb) throw new IllegalArgumentException(a + " has " + na + " values but " + b + " has " + nb);
  }

  static <T> void unique(String what, List<T> names) {
    HashSet<T> seen = new HashSet<>();
    for (T n : names) {
      if (n == null) throw new IllegalArgumentException(what + " must not contain null");
      if (!seen.add(n)) throw new IllegalArgumentException(what + " must be unique; repeated: " + n);
    }
  }

  private static double[][] gridCells(double[] xs, double[] ys, double[][] errorRate) {
    int n = xs.length * ys.length;
    double[][] cells = new double[3][n];
    int k = 0;
    for (int iy = 0; iy < ys.length; iy++) {
      sameLength("xs", xs.length, "errorRate[" + iy + "]", errorRate[iy].length);
      for (int ix = 0; ix < xs.length; ix++, k++) {
        cells[0][k] = xs[ix];
        cells[1][k] = ys[iy];
        cells[2][k] = errorRate[iy][ix];
      }
    }
    return cells;
  }

  private static double smallestStep(double[] v) {
    double step = Double.POSITIVE_INFINITY;
    for (int k = 1; k < v.length; k++) step = Math.min(step, v[k] - v[k - 1]);
    return Double.isFinite(step) ? step : 1.0;
  }

  private static double[] finiteBounds(double[] v) {
    double lo = Double.POSITIVE_INFINITY;
    double hi = Double.NEGATIVE_INFINITY;
    for (double d : v) {
      if (Double.isFinite(d)) {
        lo = Math.min(lo, d);
        hi = Math.max(hi, d);
      }
    }
    if (lo == hi) return new double[] {lo - 0.5, hi + 0.5}; // a flat surface: the scale legend needs a positive span
    return lo < hi ? new double[] {lo, hi} : new double[] {0.0, 1.0};
  }

  // Axis exactly over the blocks, widened only when the chosen point lies outside them.
  private static void fit(NumberAxis axis, org.jfree.data.Range blocks, double chosen) {
    if (blocks == null) {
      ChartStyle.include(axis, null, chosen);
      return;
    }
    double lo = blocks.getLowerBound();
    double hi = blocks.getUpperBound();
    if (Double.isFinite(chosen) && (chosen < lo || chosen > hi)) {
      ChartStyle.include(axis, blocks, chosen);
      return;
    }
    axis.setRange(lo, hi);
  }

  // Crossing lines through the chosen point and an arrow whose label points towards the middle of the plot.
  private static void markChosen(XYPlot plot, double x, double y) {
    if (Double.isNaN(x) || Double.isNaN(y)) return;
    ChartStyle.domainMarker(plot, x, null, Palette.INK, Palette.DASH_DOT);
    ChartStyle.rangeMarker(plot, y, null, Palette.INK, Palette.DASH_DOT);
    boolean right = x > plot.getDomainAxis().getRange().getCentralValue();
    boolean top = y > plot.getRangeAxis().getRange().getCentralValue();
    // Java2D angles: 0 points right, positive turns clockwise (y grows downwards).
    double angle = Math.atan2(top ? 1 : -1, right ? -1 : 1);
    XYPointerAnnotation a = new XYPointerAnnotation(
        "chosen (" + ChartStyle.number(x) + ", " + ChartStyle.number(y) + ")", x, y, angle);
    a.setFont(new Font(ChartStyle.FAMILY, Font.BOLD, 11));
    a.setPaint(Palette.INK);
    a.setArrowPaint(Palette.INK);
    a.setArrowStroke(new java.awt.BasicStroke(1.6f));
    a.setBackgroundPaint(new Color(255, 255, 255, 235));
    a.setOutlineVisible(true);
    a.setOutlinePaint(Palette.INK);
    a.setTextAnchor(top ? (right ? TextAnchor.TOP_RIGHT : TextAnchor.TOP_LEFT) : (right ? TextAnchor.BOTTOM_RIGHT : TextAnchor.BOTTOM_LEFT));
    a.setBaseRadius(34);
    a.setTipRadius(3);
    plot.addAnnotation(a);
  }

  private static PaintScaleLegend scaleLegend(SequentialScale scale, String label) {
    NumberAxis axis = new NumberAxis(label);
    axis.setRange(scale.getLowerBound(), scale.getUpperBound() > scale.getLowerBound() ? scale.getUpperBound() : scale.getLowerBound() + 1);
    axis.setLabelFont(new Font(ChartStyle.FAMILY, Font.PLAIN, 11));
    axis.setTickLabelFont(new Font(ChartStyle.FAMILY, Font.PLAIN, 10));
    axis.setLabelPaint(Palette.INK);
    axis.setTickLabelPaint(Palette.INK);
    PaintScaleLegend legend = new PaintScaleLegend(scale, axis);
    legend.setPosition(RectangleEdge.RIGHT);
    legend.setAxisLocation(AxisLocation.BOTTOM_OR_RIGHT);
    legend.setStripWidth(14);
    legend.setSubdivisionCount(64);
    legend.setMargin(new RectangleInsets(8, 8, 8, 4));
    legend.setStripOutlineVisible(true);
    legend.setStripOutlinePaint(Palette.GREY);
    legend.setBackgroundPaint(Color.WHITE);
    return legend;
  }
}
