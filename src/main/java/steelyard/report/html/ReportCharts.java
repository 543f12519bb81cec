package steelyard.report.html;

import java.util.ArrayList;
import java.util.List;
import steelyard.report.charts.ChartExport;
import steelyard.report.charts.Charts;
import steelyard.report.charts.StepSeries;
import steelyard.report.html.PageView.ChartView;
import steelyard.report.html.ReportModel.ChartData;
import steelyard.report.html.ReportModel.ErrorGrid;
import steelyard.report.html.ReportModel.GroupErrors;
import steelyard.report.html.ReportModel.HelpedHurt;
import steelyard.report.html.ReportModel.WeightCurve;

/** Turns a section's chart data into inline SVG (rates converted from fractions to percent for the axes). */
final class ReportCharts {
  static final int WIDTH = 620;
  static final int HEIGHT = 360;
  private static final int GROUP_ROW = 34;

  private ReportCharts() {}

  /** The section's charts with ids {@code idPrefix + "-" + kind}; parts that are null are left out. */
  static List<ChartView> render(ChartData data, String errorName, String idPrefix) {
    List<ChartView> out = new ArrayList<>();
    if (data.errorCurve() != null) out.add(errorCurve(data.errorCurve(), errorName, idPrefix + "-error"));
    if (data.helpedHurt() != null) out.add(helpedHurt(data.helpedHurt(), idPrefix + "-verdicts"));
    if (data.surface() != null) out.add(surface(data.surface(), errorName, idPrefix + "-surface"));
    if (data.groups() != null) out.add(groups(data.groups(), errorName, idPrefix + "-groups"));
    return out;
  }

  private static ChartView errorCurve(WeightCurve c, String errorName, String id) {
    StepSeries steps = new StepSeries(errorName + " of the picks", c.weights(), percent(c.errorRate()));
    var chart = Charts.errorAgainstWeight(c.weightName(), errorName + " (%)", steps, c.rankOne() * 100, c.oracle() * 100, c.chosen());
    return new ChartView(id, errorName + " against " + c.weightName(), errorName + " of the picks as " + c.weightName()
        + " changes, the other weights held at their chosen values (solid steps). Dashed line: rank 1. Dotted line: "
        + "the oracle. Dash-dot line: the chosen value.", ChartExport.svg(chart, WIDTH, HEIGHT, id));
  }

  private static ChartView helpedHurt(HelpedHurt h, String id) {
    var chart = Charts.helpedHurtAgainstWeight(h.weightName(), h.weights(), h.helped(), h.hurt(), h.chosen());
    return new ChartView(id, "Overrules that helped and hurt against " + h.weightName(), "How many overrules helped "
        + "(solid line, round points) and hurt (dashed line, square points) as " + h.weightName()
        + " changes. Dash-dot line: the chosen value.", ChartExport.svg(chart, WIDTH, HEIGHT, id));
  }

  private static ChartView surface(ErrorGrid g, String errorName, String id) {
    double[][] pct = new double[g.errorRate().length][];
    for (int k = 0; k < pct.length; k++) pct[k] = percent(g.errorRate()[k]);
    var chart = Charts.errorSurface(g.xName(), g.yName(), errorName + " (%)", g.xs(), g.ys(), pct, g.chosenX(), g.chosenY());
    return new ChartView(id, errorName + " over " + g.xName() + " and " + g.yName(), errorName + " at each grid point; "
        + "lighter cells have fewer errors, grey cells were not measured. The crossing dash-dot lines and the "
        + "arrow mark the chosen weights.", ChartExport.svg(chart, WIDTH, HEIGHT + 40, id));
  }

  private static ChartView groups(GroupErrors g, String errorName, String id) {
    var chart = Charts.errorPerGroup(g.groups(), percent(g.rankOne()), percent(g.chosen()), errorName + " (%)");
    int height = Math.max(HEIGHT / 2, 110 + GROUP_ROW * g.groups().size());
    return new ChartView(id, errorName + " per group", errorName + " of each group: pale outlined bars for rank 1, "
        + "solid dark bars for the picks.", ChartExport.svg(chart, WIDTH, height, id));
  }

  private static double[] percent(double[] fractions) {
    double[] out = new double[fractions.length];
    for (int k = 0; k < out.length; k++) out[k] = fractions[k] * 100;
    return out;
  }
}
