package steelyard.report;

import java.util.ArrayList;
import java.util.List;
import steelyard.report.SectionInput.ChartSeries;
import steelyard.report.SectionInput.GroupCounts;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.ErrorSurface;
import steelyard.tune.Sweep;

/**
 * The chart part of a report section, read off the tuner's exact sweeps: the error curve and helped/hurt counts
 * along the LM weight, the error over two weights, the error per group. Rates count the references without
 * hypotheses as all deleted ({@link ChartSeries#missingTokens}), like every corpus figure of the report.
 */
final class SweepCharts {
  /** Shown for a group whose column was empty. */
  static final String NO_GROUP = "(no group)";

  private SweepCharts() {}

  static ReportModel.ChartData charts(ChartSeries s, List<GroupCounts> groups, RescoreWeights w) {
    ReportModel.WeightCurve curve = null;
    ReportModel.HelpedHurt hh = null;
    ReportModel.ErrorGrid grid = null;
    if (s != null && s.lmSweep() != null) {
      curve = curve(s.lmSweep(), s.oracleErrors(), s.missingTokens(), WeightLabels.value(w, s.lmSweep().weight()));
      hh = helpedHurt(s.lmSweep(), WeightLabels.value(w, s.lmSweep().weight()));
    }
    if (s != null && s.surface() != null) grid = grid(s.surface(), s.missingTokens(), w);
    return new ReportModel.ChartData(curve, hh, grid, groups.isEmpty() ? null : groups(groups));
  }

  /**
   * The step function of the sweep as points: each interval's start, then a closing point at the range's end with
   * the last interval's value (the chart draws a step from each point to the next).
   */
  static ReportModel.WeightCurve curve(Sweep s, long oracleErrors, long missing, double chosen) {
    int m = s.intervals();
    double[] x = points(s);
    double[] rate = new double[m + 1];
    for (int j = 0; j <= m; j++) rate[j] = rate(s.errors()[Math.min(j, m - 1)] + missing, s.referenceTokens() + missing);
    double oracle = oracleErrors < 0 ? Double.NaN : rate(oracleErrors + missing, s.referenceTokens() + missing);
    return new ReportModel.WeightCurve(WeightLabels.label(s.weight()), x, rate, rate(s.firstErrors() + missing,
        s.referenceTokens() + missing), oracle, chosen);
  }

  /** Overrules that helped and hurt on each interval of the sweep (points as in {@link #curve}). */
  static ReportModel.HelpedHurt helpedHurt(Sweep s, double chosen) {
    int m = s.intervals();
    int[] helped = new int[m + 1];
    int[] hurt = new int[m + 1];
    for (int j = 0; j <= m; j++) {
      helped[j] = s.helped()[Math.min(j, m - 1)];
      hurt[j] = s.hurt()[Math.min(j, m - 1)];
    }
    return new ReportModel.HelpedHurt(WeightLabels.label(s.weight()), points(s), helped, hurt, chosen);
  }

  /** The surface with its columns on x and its rows on y, and the weights in effect marked. */
  static ReportModel.ErrorGrid grid(ErrorSurface e, long missing, RescoreWeights w) {
    double[][] rate = new double[e.rows().length][e.columns().length];
    for (int r = 0; r < rate.length; r++)
      for (int c = 0; c < rate[r].length; c++) rate[r][c] = rate(e.errors()[r][c] + missing, e.referenceTokens() + missing);
    return new ReportModel.ErrorGrid(WeightLabels.label(e.columnWeight()), WeightLabels.label(e.rowWeight()), e.columns(), e.rows(),
        rate, WeightLabels.value(w, e.columnWeight()), WeightLabels.value(w, e.rowWeight()));
  }

  /** Rank 1's and the picks' error rate per group, in the order given; groups without tokens are left out. */
  static ReportModel.GroupErrors groups(List<GroupCounts> groups) {
    List<String> names = new ArrayList<>();
    List<double[]> rates = new ArrayList<>();
    for (GroupCounts g : groups) {
      if (g.referenceTokens() == 0) continue;
      names.add(g.group().isEmpty() ? NO_GROUP : g.group());
      rates.add(new double[] {rate(g.firstErrors(), g.referenceTokens()), rate(g.chosenErrors(), g.referenceTokens())});
    }
    double[] before = new double[names.size()];
    double[] after = new double[names.size()];
    for (int k = 0; k < before.length; k++) {
      before[k] = rates.get(k)[0];
      after[k] = rates.get(k)[1];
    }
    return new ReportModel.GroupErrors(names, before, after);
  }

  private static double[] points(Sweep s) {
    int m = s.intervals();
    double[] x = new double[m + 1];
    for (int j = 0; j < m; j++) x[j] = s.intervalLow(j);
    x[m] = s.high();
    return x;
  }

  private static double rate(long errors, long n) {
    return n == 0 ? Double.NaN : (double) errors / n;
  }
}
