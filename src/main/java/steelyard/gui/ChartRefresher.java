package steelyard.gui;

import java.util.Locale;
import steelyard.gui.model.Choices;
import steelyard.gui.model.Sweeps;
import steelyard.gui.model.WeightSettings;
import steelyard.gui.model.Workspace;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * Keeps the charts in step with the window while they are visible. The error per group follows the current
 * choices at once; the sweep along λ and the λ × μ surface are computed in the background and kept: moving
 * λ only moves the marker, and only a change of the other weights (or of the data) computes them again.
 * EDT only.
 */
final class ChartRefresher {
  /** Points along each axis of the surface. */
  static final int SURFACE_POINTS = 33;

  private final SteelyardWindow window;
  private RescoreWeights sweepKey;
  private Workspace sweepOf;
  private Sweeps.LambdaSweep sweep;
  private Sweeps.Surface surface;

  ChartRefresher(SteelyardWindow window) {
    this.window = window;
  }

  /** Forgets the computed series (new data). */
  void invalidate() {
    sweepKey = null;
    sweep = null;
    surface = null;
    window.charts.clear();
  }

  /** Brings the charts up to date when the Charts view is showing. */
  void refreshIfVisible() {
    Workspace ws = window.workspace();
    Choices c = window.choices();
    if (ws == null || c == null || window.views.getSelectedComponent() != window.charts) return;
    var unit = ws.corpus().unit();
    window.charts.showGroups(Sweeps.perGroup(ws.corpus(), c), unit);
    RescoreWeights w = c.weights();
    RescoreWeights key = new WeightSettings(0, w.lengthWeight(), w.posteriorScale(), 0, 0, RescoreMethod.NBEST).apply(w);
    if (ws == sweepOf && key.equals(sweepKey) && sweep != null && surface != null) {
      draw(ws, w);
      return;
    }
    double top = Math.max(40, Math.ceil(2 * w.lmWeight() / 10) * 10);
    double[] surfLambdas = Sweeps.grid(0, top, SURFACE_POINTS);
    double[] mus = Sweeps.grid(-16, 16, SURFACE_POINTS);
    window.tasks.submit("charts", "Computing the charts", p -> {
      p.report(0.05, "exact error along λ");
      Sweeps.LambdaSweep s = Sweeps.lambda(ws, w, 0, top);
      p.checkCancelled();
      p.report(0.3, "error over λ × μ");
      Sweeps.Surface f = Sweeps.surface(ws, w, surfLambdas, mus);
      return new Object[] {s, f};
    }, (o, v, e) -> {
      if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(window, "Cannot compute the charts", e);
      if (o != Tasks.Outcome.COMPLETE || ws != window.workspace()) return;
      sweepOf = ws;
      sweepKey = key;
      sweep = (Sweeps.LambdaSweep) v[0];
      surface = (Sweeps.Surface) v[1];
      Choices now = window.choices();
      if (now != null) draw(ws, now.weights());
    });
  }

  private void draw(Workspace ws, RescoreWeights w) {
    Sweeps.LambdaSweep s = new Sweeps.LambdaSweep(sweep.lambdas(), sweep.errorRate(), sweep.helped(), sweep.hurt(), sweep.firstRate(),
        sweep.oracleRate(), w.lmWeight());
    String how = String.format(Locale.ROOT, "Exact N-best error along λ (%d steps, the tuner's line search), other weights as set.",
        Math.max(1, sweep.lambdas().length - 1));
    window.charts.showSweep(s, ws.corpus().unit(), how);
    window.charts.showSurface(surface, ws.corpus().unit(), w.lmWeight(), w.lengthWeight());
  }
}
