package steelyard.gui;

import java.nio.file.Path;
import javax.swing.JFileChooser;
import javax.swing.filechooser.FileNameExtensionFilter;
import steelyard.gui.model.Choices;
import steelyard.gui.model.WindowReport;
import steelyard.gui.model.Workspace;
import steelyard.report.AuditRun;
import steelyard.report.SectionInput;
import steelyard.report.html.HtmlReport;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.TuneSettings;

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

  /** Audits the current choice, computes the charts' series and writes the page to {@code target}. */
  static void export(SteelyardWindow w, Path target) {
    Workspace ws = w.workspace();
    Choices c = w.choices();
    RescoreWeights at = c.weights();
    w.tasks.submit("report", "Writing the HTML report", p -> {
      p.report(0.05, "auditing the choice");
      AuditRun.Result run = ws.auditRun(at, c.method(), TuneSettings.DEFAULT_SEED);
      p.checkCancelled();
      p.report(0.5, "the charts' series");
      SectionInput.ChartSeries charts = run.charts(Runtime.getRuntime().availableProcessors());
      p.checkCancelled();
      HtmlReport.write(WindowReport.model(ws, run, charts), target);
      return target;
    }, (o, path, e) -> {
      if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(w, "Cannot write the report", e);
      if (o == Tasks.Outcome.COMPLETE) w.status.flash("Wrote the report to " + path);
    });
  }
}
