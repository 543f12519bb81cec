package steelyard.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import steelyard.audit.AuditInput;
import steelyard.audit.AuditReport;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.ErrorSurface;
import steelyard.tune.Sweep;
import steelyard.tune.TuneResult;

/**
 * What {@link ReportSections#section} maps onto one section of the HTML report: one data set's audit, the weights in
 * effect and whatever figures the caller has. Only the name, the method, the unit's error name and the weights are
 * required; every other part is optional and is left out of the page when absent. Built with {@link #builder}.
 *
 * <pre>{@code
 * SectionInput in = SectionInput.builder("Voice logs, test", RescoreMethod.NBEST, weights)
 *     .audit(report, auditInputs)                     // overrules table and summary
 *     .errors(ReportSections.errorRow("test", summary, versusFirst))
 *     .pairedTest(ReportSections.pairedTest("test", versusFirst))
 *     .charts(series).groups(groupFigures).build();
 * ReportModel.Section s = ReportSections.section(in);
 * }</pre>
 *
 * @param name       heading, e.g. "Voice logs, test"
 * @param method     the rescoring method of the picks
 * @param weights    the weights in effect
 * @param characters whether the error is counted in characters (CER) rather than words (WER)
 * @param audit      the audit of the picks; null: no summary and no overrules table
 * @param audited    the audited utterances (their references and the optional-token flags of every hypothesis),
 *                   used to align each overrule's two sides against the reference; utterances absent here are
 *                   shown unaligned
 * @param errors     error rows, in page order (e.g. dev in-sample, dev cross-validated, test)
 * @param pairedTest the paired test against rank 1; null: not run
 * @param tuning     the tuning result whose weights these are; null: not tuned (adds each weight's best interval)
 * @param charts     the series behind the charts; null: no λ curve, helped/hurt chart or surface
 * @param groups     error counts per group; empty: no group chart
 * @param notes      notes shown under the heading (warnings, provenance)
 */
public record SectionInput(
    String name, RescoreMethod method, RescoreWeights weights, boolean characters, AuditReport audit,
    List<AuditInput> audited, List<ReportModel.ErrorRow> errors, ReportModel.PairedTest pairedTest, TuneResult tuning,
    ChartSeries charts, List<GroupCounts> groups, List<String> notes) {

  public SectionInput {
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(method, "method");
    Objects.requireNonNull(weights, "weights");
    audited = List.copyOf(audited);
    errors = List.copyOf(errors);
    groups = List.copyOf(groups);
    notes = List.copyOf(notes);
  }

  /**
   * The series the charts draw, from the tuner's exact sweeps ({@link steelyard.tune.WeightSweep}; see
   * {@link ReportSweeps} for a run without tuning). Error counts of the sweeps cover the utterances that have
   * hypotheses; {@code missingTokens}, the reference tokens of references without any hypothesis, are added to every
   * error count and to N (all deleted), as the corpus figures count them.
   *
   * @param lmSweep       error and helped/hurt counts along λ (N-best) or λ′ (lattice); null: none
   * @param surface       error over λ × μ (or λ′ × μ′); null: none
   * @param oracleErrors  errors of the N-best oracle over the sweep's utterances (the level drawn); −1: unknown
   * @param missingTokens reference tokens of references without hypotheses (≥ 0)
   */
  public record ChartSeries(Sweep lmSweep, ErrorSurface surface, long oracleErrors, long missingTokens) {
    public ChartSeries {
      if (missingTokens < 0) throw new IllegalArgumentException("missingTokens must be >= 0: " + missingTokens);
    }

    /** The same series with another surface (e.g. the tuner's own, {@link TuneResult#surface()}). */
    public ChartSeries withSurface(ErrorSurface s) {
      return new ChartSeries(lmSweep, s, oracleErrors, missingTokens);
    }
  }

  /**
   * Error counts of one group (speaker, sheet) over its utterances with a reference.
   *
   * @param group           the group ("" for none)
   * @param referenceTokens N of the group (optional tokens excluded)
   * @param firstErrors     errors of rank 1
   * @param chosenErrors    errors of the picks
   */
  public record GroupCounts(String group, long referenceTokens, long firstErrors, long chosenErrors) {
    public GroupCounts {
      group = group == null ? "" : group;
    }
  }

  /** A builder with the required parts; the unit is words until {@link Builder#characters} says otherwise. */
  public static Builder builder(String name, RescoreMethod method, RescoreWeights weights) {
    return new Builder(name, method, weights);
  }

  /** Collects the optional parts; not thread-safe. */
  public static final class Builder {
    private final String name;
    private final RescoreMethod method;
    private final RescoreWeights weights;
    private boolean characters;
    private AuditReport audit;
    private List<AuditInput> audited = List.of();
    private final List<ReportModel.ErrorRow> errors = new ArrayList<>();
    private ReportModel.PairedTest pairedTest;
    private TuneResult tuning;
    private ChartSeries charts;
    private List<GroupCounts> groups = List.of();
    private final List<String> notes = new ArrayList<>();

    private Builder(String name, RescoreMethod method, RescoreWeights weights) {
      this.name = name;
      this.method = method;
      this.weights = weights;
    }

    /** Errors counted in characters (CER) when true, in words (WER) otherwise. */
    public Builder characters(boolean c) {
      characters = c;
      return this;
    }

    /** The audit and the utterances it audited (for the alignments; may be empty). */
    public Builder audit(AuditReport report, List<AuditInput> inputs) {
      audit = report;
      audited = inputs;
      return this;
    }

    /** Appends error rows in page order (nulls skipped). */
    public Builder errors(ReportModel.ErrorRow... rows) {
      for (ReportModel.ErrorRow r : rows) if (r != null) errors.add(r);
      return this;
    }

    public Builder pairedTest(ReportModel.PairedTest p) {
      pairedTest = p;
      return this;
    }

    public Builder tuning(TuneResult t) {
      tuning = t;
      return this;
    }

    public Builder charts(ChartSeries c) {
      charts = c;
      return this;
    }

    public Builder groups(List<GroupCounts> g) {
      groups = g;
      return this;
    }

    /** Appends notes in order. */
    public Builder notes(List<String> n) {
      notes.addAll(n);
      return this;
    }

    public SectionInput build() {
      return new SectionInput(name, method, weights, characters, audit, audited, errors, pairedTest, tuning, charts, groups, notes);
    }
  }
}
