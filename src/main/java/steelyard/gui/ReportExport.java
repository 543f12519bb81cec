package steelyard.gui;

import java.nio.file.Path;
import javax.swing.JFileChooser;
import javax.swing.filechooser.FileNameExtensionFilter;
import steelyard.audit.AuditReport;
import steelyard.gui.model.Choices;
import steelyard.gui.model.Sweeps;
import steelyard.gui.model.WindowReport;
import steelyard.gui.model.Workspace;
import steelyard.report.html.HtmlReport;
import steelyard.rescore.RescoreWeights;

/**
 * File ▸ Export HTML report: the current choice's figures, charts and overrule audit as one self-contained
 * page ({@link HtmlReport}), computed and written in the background. EDT only.
 */
final class ReportExport {
  private ReportExport() {}

  static void ask(SteelyardWindow w) {
    if (w.workspace() == null || w.choices() == null) return;
    JFileChooser chooser = new JFileChooser();
    chooser.setFileFilter(new FileNameExtensionFilter("HTML pages", "html"));
    chooser.setSelectedFile(new java.io.File("report.html"));
    if (chooser.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) return;
    Path target = chooser.getSelectedFile().toPath();
    if (!target.getFileName().toString().toLowerCase(java.util.Locale.ROOT).endsWith(".html")) {
      target = target.resolveSibling(target.getFileName() + ".html");
    }
    export(w, target);
  }

  /** Computes the charts' series and the audit of the current choice and writes the page to {@code target}. */
  static void export(SteelyardWindow w, Path target) {
    Workspace ws = w.workspace();
    Choices c = w.choices();
    RescoreWeights at = c.weights();
    double top = Math.max(40, Math.ceil(2 * at.lmWeight() / 10) * 10);
    w.tasks.submit("report", "Writing the HTML report", p -> {
      p.report(0.05, "error along λ");
      Sweeps.LambdaSweep sweep = Sweeps.lambda(ws, at, 0, top);
      p.report(0.2, "error over λ × μ");
      Sweeps.Surface surface = Sweeps.surface(ws, at, Sweeps.grid(0, top, ChartRefresher.SURFACE_POINTS),
          Sweeps.grid(-16, 16, ChartRefresher.SURFACE_POINTS));
      p.checkCancelled();
      AuditReport audit = ws.audit(at, c.method(), p);
      HtmlReport.write(WindowReport.model(ws, c, sweep, surface, audit), target);
      return target;
    }, (o, path, e) -> {
      if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(w, "Cannot write the report", e);
      if (o == Tasks.Outcome.COMPLETE) w.status.flash("Wrote the report to " + path);
    });
  }
}
