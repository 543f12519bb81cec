package steelyard.gui;

import java.awt.GridLayout;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.swing.JPanel;
import steelyard.gui.model.Sweeps;
import steelyard.report.charts.Charts;
import steelyard.report.charts.StepSeries;
import steelyard.text.Unit;

/**
 * The four charts: corpus error against λ with the rank-1 and oracle levels and the current λ; helped and
 * hurt counts against λ; the error over λ × μ as a heat map; the error per group before and after. Each
 * exports to PNG and SVG. The series come from {@link Sweeps} (N-best re-choices at a grid of weights).
 * EDT only.
 */
final class ChartsView extends JPanel {
  private static final long serialVersionUID = 1L;
  final ChartBox error = new ChartBox("charts.error", "Error against λ", "error-against-lambda");
  final ChartBox helped = new ChartBox("charts.helped", "Helped and hurt against λ", "helped-hurt-against-lambda");
  final ChartBox surface = new ChartBox("charts.surface", "Error over λ × μ", "error-surface");
  final ChartBox groups = new ChartBox("charts.groups", "Error per group", "error-per-group");

  ChartsView() {
    super(new GridLayout(2, 2, 0, 0));
    setName("charts");
    add(error);
    add(helped);
    add(surface);
    add(groups);
  }

  /** All four boxes, in reading order. */
  List<ChartBox> boxes() {
    return List.of(error, helped, surface, groups);
  }

  void showSweep(Sweeps.LambdaSweep s, Unit unit, String how) {
    String rate = rate(unit);
    StepSeries series = new StepSeries("chosen", s.lambdas(), percent(s.errorRate()));
    error.chart(Charts.errorAgainstWeight("LM weight λ", rate + " (%)", series, 100 * s.firstRate(), 100 * s.oracleRate(), s.current()),
        how + String.format(Locale.ROOT, " Lowest on the grid: %.2f %%.", 100 * min(s.errorRate())));
    helped.chart(Charts.helpedHurtAgainstWeight("LM weight λ", s.lambdas(), s.helped(), s.hurt(), s.current()),
        "Utterances whose pick has fewer (helped) or more (hurt) errors than rank 1, at each λ.");
  }

  void showSurface(Sweeps.Surface s, Unit unit, double lambda, double mu) {
    double[][] byMu = new double[s.mus().length][s.lambdas().length];
    for (int i = 0; i < s.lambdas().length; i++) for (int j = 0; j < s.mus().length; j++) byMu[j][i] = 100 * s.errorRate()[i][j];
    surface.chart(Charts.errorSurface("LM weight λ", "length weight μ", rate(unit) + " (%)", s.lambdas(), s.mus(), byMu, lambda, mu),
        String.format(Locale.ROOT, "Lowest cell: %.2f %% at λ = %s, μ = %s (exact N-best errors; light is low).",
            100 * s.errorRate()[s.best()[0]][s.best()[1]], trim(s.lambdas()[s.best()[0]]), trim(s.mus()[s.best()[1]])));
  }

  void showGroups(List<Sweeps.GroupErrors> g, Unit unit) {
    List<String> names = new ArrayList<>();
    double[] before = new double[g.size()];
    double[] after = new double[g.size()];
    for (int k = 0; k < g.size(); k++) {
      names.add(g.get(k).group().isEmpty() ? "(no group)" : g.get(k).group());
      before[k] = 100 * g.get(k).firstRate();
      after[k] = 100 * g.get(k).choiceRate();
    }
    groups.chart(Charts.errorPerGroup(names, before, after, rate(unit) + " (%)"), "Rank 1 (outlined) against the current picks (solid).");
  }

  void clear() {
    for (ChartBox b : boxes()) b.chart(null, null);
  }

  private static String rate(Unit u) {
    return u == Unit.CHAR ? "CER" : "WER";
  }

  private static double[] percent(double[] r) {
    double[] p = new double[r.length];
    for (int k = 0; k < r.length; k++) p[k] = 100 * r[k];
    return p;
  }

  private static double min(double[] v) {
    double m = Double.NaN;
    for (double d : v) if (!Double.isNaN(d) && (Double.isNaN(m) || d < m)) m = d;
    return m;
  }

  static String trim(double v) {
    return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
  }
}
