package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import steelyard.report.AuditRun;
import steelyard.report.ReportSections;
import steelyard.report.SectionInput;
import steelyard.report.html.ReportModel;

/**
 * What the window exports as the HTML report: one section of the core mapping ({@link ReportSections}) from the
 * audit run of the current choice ({@link AuditRun}) with its chart series, the workspace's load warnings among the
 * notes. The figures are in-sample (the open data, with the weights as set); the page says so.
 */
public final class WindowReport {
  /** The error row's label. */
  static final String DATA_SET = "open data, weights as set (in-sample)";

  private WindowReport() {}

  /** The report of {@code run} over {@code ws}; {@code charts} may be null (no λ curve or surface). */
  public static ReportModel model(Workspace ws, AuditRun.Result run, SectionInput.ChartSeries charts) {
    String name = ws.request().hyps().getFileName().toString();
    List<String> notes = new ArrayList<>(ws.warnings());
    for (String w : run.summary().warnings()) if (!notes.contains(w)) notes.add(w);
    SectionInput.Builder b = SectionInput.builder(name, run.session().method(), run.session().weights())
        .characters(ws.corpus().unit() == steelyard.text.Unit.CHAR).audit(run.audit(), run.inputs()).groups(run.groups())
        .notes(notes).charts(charts);
    if (run.versusFirst() != null)
      b.errors(ReportSections.errorRow(DATA_SET, run.summary(), run.versusFirst()))
          .pairedTest(ReportSections.pairedTest("open data", run.versusFirst()));
    return new ReportModel("Steelyard: " + name,
        List.of("Exported from the window: the error rates are measured on the data the weights were set on, so they are optimistic "
            + "for new data."), List.of(ReportSections.section(b.build())));
  }
}
