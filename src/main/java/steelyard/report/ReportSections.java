package steelyard.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import steelyard.eval.Bootstrap;
import steelyard.eval.PairedComparison;
import steelyard.report.html.Fmt;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.TuneResult;
import steelyard.tune.WeightInterval;

/**
 * Maps a run's results onto one section of the HTML report ({@link ReportModel.Section}): the audit (summary and
 * overrules, each side aligned against the reference), the error rates with their 95 % bootstrap intervals, the
 * paired test against rank 1, the weights in effect (with each tuned weight's best interval), and the charts from the
 * tuner's exact sweeps. The one mapping the {@code audit} command, the demo and the window share; nothing here
 * computes a figure that the inputs do not hold, except rates from counts.
 *
 * <pre>{@code
 * ReportModel.Section s = ReportSections.section(SectionInput.builder("test", method, weights)
 *     .audit(report, inputs).errors(ReportSections.errorRow("test", summary, paired))
 *     .pairedTest(ReportSections.pairedTest("test", paired)).build());
 * HtmlReport.write(new ReportModel(title, List.of(), List.of(s)), Path.of("report.html"));
 * }</pre>
 */
public final class ReportSections {
  private ReportSections() {}

  /** The section of {@code in}; the tuning result's dev rows come before the caller's rows, its warnings after the notes. */
  public static ReportModel.Section section(SectionInput in) {
    List<ReportModel.ErrorRow> rows = new ArrayList<>();
    if (in.tuning() != null) rows.addAll(tuningRows(in.tuning()));
    rows.addAll(in.errors());
    List<String> notes = new ArrayList<>(in.notes());
    if (in.tuning() != null) notes.addAll(in.tuning().warnings());
    ReportModel.Figures figures = new ReportModel.Figures(in.method().label(), rows, in.pairedTest(),
        weights(in.weights(), in.method(), in.tuning()));
    OverruleRows overrules = new OverruleRows(in.characters());
    ReportModel.AuditSummary summary = in.audit() == null ? null : overrules.summary(in.audit().total());
    List<ReportModel.Overrule> table = in.audit() == null ? List.of() : overrules.rows(in.audit(), in.audited());
    return new ReportModel.Section(in.name(), in.characters() ? "CER" : "WER",
        in.characters() ? ReportModel.TokenKind.CHARACTERS : ReportModel.TokenKind.WORDS, notes, figures,
        SweepCharts.charts(in.charts(), in.groups(), in.weights()), summary, table);
  }

  /**
   * The error rates of a rescoring run with references ({@code rescore --refs}): rank 1 and the picks with the 95 %
   * bootstrap intervals of the paired test (same resamples for both), the N-best oracle without an interval.
   *
   * @param versusFirst the paired test of the picks against rank 1; null: rates without intervals
   */
  public static ReportModel.ErrorRow errorRow(String set, RescoreSummary s, PairedComparison versusFirst) {
    long n = s.chosen().referenceTokens();
    Bootstrap.Interval a = versusFirst == null ? Bootstrap.Interval.UNDEFINED : versusFirst.intervalA();
    Bootstrap.Interval b = versusFirst == null ? Bootstrap.Interval.UNDEFINED : versusFirst.intervalB();
    return new ReportModel.ErrorRow(set, rate(s.first().errors(), n, a), rate(s.chosen().errors(), n, b),
        ReportModel.Rate.of(fraction(s.oracle().errors(), n)));
  }

  /**
   * The dev rows of a tuning result: in-sample (rank 1, the tuned weights with their bootstrap interval) and, with
   * folds, the cross-validated rate of weights tuned on the other folds.
   */
  public static List<ReportModel.ErrorRow> tuningRows(TuneResult t) {
    ReportModel.Rate first = ReportModel.Rate.of(t.devFirstErrorRate());
    List<ReportModel.ErrorRow> rows = new ArrayList<>();
    rows.add(new ReportModel.ErrorRow("dev (in-sample)", first,
        new ReportModel.Rate(t.devErrorRate(), t.devInterval().low(), t.devInterval().high()), null));
    if (!Double.isNaN(t.cvErrorRate()))
      rows.add(new ReportModel.ErrorRow("dev (cross-validated, " + t.folds() + " folds)", first, ReportModel.Rate.of(t.cvErrorRate()), null));
    return rows;
  }

  /** The paired test of the picks (B) against rank 1 (A) on {@code set}; null when {@code c} is null. */
  public static ReportModel.PairedTest pairedTest(String set, PairedComparison c) {
    if (c == null) return null;
    return new ReportModel.PairedTest(set, c.bBetter(), c.aBetter(), c.ties(), twoSidedBootstrapP(c), c.signTestP());
  }

  /**
   * The weights that shape the picks of {@code method}: the feature weights, λ, ω and μ (the totals every method
   * starts from), α and listed system weights for the methods that use posteriors, λ′ and μ′ for the lattice search.
   * With a tuning result, a tuned weight's note gives its best interval.
   */
  public static List<ReportModel.WeightRow> weights(RescoreWeights w, RescoreMethod method, TuneResult tuning) {
    Map<String, WeightInterval> intervals = tuning == null ? Map.of() : tuning.bestInterval();
    List<String> names = WeightLabels.shaping(w, method);
    List<ReportModel.WeightRow> rows = new ArrayList<>(names.size());
    for (String n : names) rows.add(new ReportModel.WeightRow(WeightLabels.label(n), WeightLabels.value(w, n), note(intervals.get(n))));
    return rows;
  }

  private static String note(WeightInterval iv) {
    if (iv == null) return "";
    return "equally good from " + Fmt.number(iv.low()) + " to " + Fmt.number(iv.high())
        + (iv.exact() ? " (exact)" : " (on the search-path pool)");
  }

  /**
   * Two-sided p-value of the paired bootstrap: twice the smaller share of resamples in which one side is better,
   * capped at 1 (the percentile-bootstrap test of Koehn 2004, two-sided).
   */
  static double twoSidedBootstrapP(PairedComparison c) {
    double p = 2 * Math.min(c.paired().probABetter(), c.paired().probBBetter());
    return Double.isNaN(p) ? Double.NaN : Math.min(1, p);
  }

  private static ReportModel.Rate rate(long errors, long n, Bootstrap.Interval iv) {
    return new ReportModel.Rate(fraction(errors, n), iv.low(), iv.high());
  }

  private static double fraction(long errors, long n) {
    return n == 0 ? Double.NaN : (double) errors / n;
  }
}
