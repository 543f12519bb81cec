package steelyard.report.charts;

import java.util.List;
import org.jfree.chart.JFreeChart;

/** Small invented charts of every kind, shared by the chart tests. */
final class ChartSamples {
  private ChartSamples() {}

  static StepSeries errorSteps() {
    return new StepSeries("WER with the chosen weights", new double[] {0, 2, 5, 9, 14, 20, 30},
        new double[] {23.8, 19.5, 16.1, 14.9, 15.4, 17.8, 21.0});
  }

  static JFreeChart errorAgainstWeight() {
    return Charts.errorAgainstWeight("LM weight λ", "WER (%)", errorSteps(), 23.82, 12.66, 11.5);
  }

  static JFreeChart helpedHurt() {
    return Charts.helpedHurtAgainstWeight("LM weight λ", new double[] {0, 2, 5, 9, 14, 20, 30},
        new int[] {0, 40, 81, 104, 110, 112, 113}, new int[] {0, 12, 20, 27, 36, 52, 70}, 11.5);
  }

  static JFreeChart surface() {
    double[] xs = {4, 8, 12, 16, 20, 24};
    double[] ys = {-2, 0, 2, 4, 6};
    double[][] e = new double[ys.length][xs.length];
    for (int iy = 0; iy < ys.length; iy++) {
      for (int ix = 0; ix < xs.length; ix++) e[iy][ix] = 15 + 0.04 * Math.pow(xs[ix] - 14, 2) + 0.3 * Math.pow(ys[iy] - 2.5, 2);
    }
    return Charts.errorSurface("LM weight λ", "length weight μ", xs, ys, e, 14, 2.5);
  }

  static JFreeChart perGroup(List<String> groups) {
    double[] before = new double[groups.size()];
    double[] after = new double[groups.size()];
    for (int g = 0; g < groups.size(); g++) {
      before[g] = 18 + 3 * g;
      after[g] = 12 + 2 * g;
    }
    return Charts.errorPerGroup(groups, before, after, "WER (%)");
  }

  static JFreeChart breakdown() {
    return Charts.scoreBreakdown(List.of("rank 1: bay nine", "pick: bay five"), List.of("acoustic", "LM", "length", "OOV"),
        new double[][] {{-12.5, -30.2, 8.0, -0.3}, {-13.1, -26.4, 8.0, 0}});
  }
}
