package steelyard.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.ArrayList;
import java.util.List;
import steelyard.eval.CorpusScore;
import steelyard.eval.EditCounts;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.PairedComparison;
import steelyard.eval.Pick;
import steelyard.io.JsonOutput;
import steelyard.io.SkippedRow;
import steelyard.text.Unit;

/** Renders the comparison of two systems on the same references as plain text and JSON. */
public final class CompareReport {
  private CompareReport() {}

  /**
   * One compared system.
   *
   * @param name           display name (from {@code --names}, else A and B)
   * @param hypothesesFile its hypotheses file as given
   * @param score          what the report states of its own score over every reference
   */
  public record SystemRun(String name, String hypothesesFile, SystemScore score) {
    /** A system scored from its files just now. */
    public SystemRun(String name, String hypothesesFile, CorpusScore score) {
      this(name, hypothesesFile, SystemScore.of(score));
    }
  }

  /**
   * The part of one system's {@link CorpusScore} the comparison report shows, so that a comparison can also be
   * rendered from stored per-utterance counts (the run history).
   *
   * @param pick                which hypothesis was scored per utterance
   * @param missingPolicy       how utterances without a hypothesis were counted
   * @param totals              summed C/S/D/I over the included utterances
   * @param utterances          included utterances
   * @param sentencesWithErrors included utterances with at least one error
   * @param missingHypotheses   ids of references with no hypothesis, in reference-file order
   * @param missingReferences   ids of hypothesis utterances with no reference
   * @param warnings            the scorer's warnings
   */
  public record SystemScore(
      Pick pick, MissingHypothesisPolicy missingPolicy, EditCounts totals, int utterances, int sentencesWithErrors,
      List<String> missingHypotheses, List<String> missingReferences, List<String> warnings) {
    public SystemScore {
      missingHypotheses = List.copyOf(missingHypotheses);
      missingReferences = List.copyOf(missingReferences);
      warnings = List.copyOf(warnings);
    }

    public static SystemScore of(CorpusScore s) {
      return new SystemScore(s.pick(), s.missingPolicy(), s.totals(), s.utterances(), s.sentencesWithErrors(),
          s.missingHypotheses(), s.missingReferences(), s.warnings());
    }

    /** Corpus error rate; NaN when N = 0. */
    public double errorRate() {
      return totals.errorRate();
    }

    /** Share of included utterances with at least one error; NaN when none is included. */
    public double sentenceErrorRate() {
      return utterances == 0 ? Double.NaN : (double) sentencesWithErrors / utterances;
    }
  }

  /**
   * Everything the comparison report states.
   *
   * @param referencesFile the references file as given
   * @param unit           token unit
   * @param normalisation  the normaliser's one-line description
   * @param a              system A
   * @param b              system B
   * @param comparison     the paired statistics on the common set
   * @param seed           bootstrap seed
   * @param skippedRows    rows skipped by the importers
   * @param importWarnings importer and normaliser warnings
   */
  public record CompareRun(
      String referencesFile, Unit unit, String normalisation, SystemRun a, SystemRun b, PairedComparison comparison, long seed,
      List<SkippedRow> skippedRows, List<String> importWarnings) {
    public CompareRun {
      skippedRows = List.copyOf(skippedRows);
      importWarnings = List.copyOf(importWarnings);
    }

    /** All warnings in order: importers first, then each system's scorer warnings (prefixed with its name). */
    public List<String> warnings() {
      List<String> w = new ArrayList<>(importWarnings);
      for (SystemRun s : List.of(a, b)) for (String x : s.score().warnings()) w.add(s.name() + ": " + x);
      return w;
    }
  }

  private static final int D = ScoreReport.RATE_DIGITS;

  /** The JSON summary, keys always in the same order. */
  public static ObjectNode json(CompareRun r) {
    PairedComparison c = r.comparison();
    ObjectNode o = JsonOutput.object();
    o.put("references_file", r.referencesFile());
    o.put("unit", ReportText.unitLabel(r.unit()));
    o.put("normalisation", r.normalisation());
    o.put("pick", r.a().score().pick().label());
    o.put("missing_hypothesis_policy", r.a().score().missingPolicy().label());
    o.put("seed", r.seed());
    o.put("resamples", c.paired().resamples());
    ArrayNode systems = o.putArray("systems");
    for (SystemRun s : List.of(r.a(), r.b())) system(systems.addObject(), s);
    o.put("common_utterances", c.utterances());
    o.put("common_reference_tokens", c.referenceTokens());
    o.put("error_rate_a", Numbers.decimal(c.rateA(), D));
    o.put("ci95_low_a", Numbers.decimal(c.intervalA().low(), D));
    o.put("ci95_high_a", Numbers.decimal(c.intervalA().high(), D));
    o.put("error_rate_b", Numbers.decimal(c.rateB(), D));
    o.put("ci95_low_b", Numbers.decimal(c.intervalB().low(), D));
    o.put("ci95_high_b", Numbers.decimal(c.intervalB().high(), D));
    o.put("difference_b_minus_a", Numbers.decimal(c.difference(), D));
    o.put("difference_ci95_low", Numbers.decimal(c.paired().difference().low(), D));
    o.put("difference_ci95_high", Numbers.decimal(c.paired().difference().high(), D));
    o.put("prob_b_better", Numbers.decimal(c.paired().probBBetter(), D));
    o.put("prob_a_better", Numbers.decimal(c.paired().probABetter(), D));
    o.put("utterances_a_better", c.aBetter());
    o.put("utterances_b_better", c.bBetter());
    o.put("utterances_tied", c.ties());
    o.put("sign_test_p", Numbers.significant(c.signTestP(), 10));
    o.set("skipped_rows", ScoreReport.skipped(r.skippedRows()));
    o.set("warnings", JsonOutput.strings(r.warnings()));
    return o;
  }

  private static void system(ObjectNode o, SystemRun s) {
    SystemScore sc = s.score();
    o.put("name", s.name());
    o.put("hypotheses_file", s.hypothesesFile());
    o.put("utterances", sc.utterances());
    ScoreReport.putCounts(o, sc.totals());
    o.put("error_rate", Numbers.decimal(sc.errorRate(), D));
    o.put("sentence_error_rate", Numbers.decimal(sc.sentenceErrorRate(), D));
    o.put("missing_hypotheses", sc.missingHypotheses().size());
    o.put("missing_references", sc.missingReferences().size());
    o.set("missing_hypothesis_ids", JsonOutput.strings(sc.missingHypotheses()));
    o.set("missing_reference_ids", JsonOutput.strings(sc.missingReferences()));
  }

  /** The plain-text report. */
  public static String text(CompareRun r) {
    PairedComparison c = r.comparison();
    String rate = ReportText.rateName(r.unit());
    String a = r.a().name();
    String b = r.b().name();
    StringBuilder sb = new StringBuilder();
    ScoreText.line(sb, "Steelyard compare: " + rate + " of " + a + " and " + b + ", each scored on "
        + ScoreText.pickWording(r.a().score().pick()));
    ScoreText.line(sb, "  references  " + r.referencesFile());
    ScoreText.line(sb, "  " + a + "  " + r.a().hypothesesFile());
    ScoreText.line(sb, "  " + b + "  " + r.b().hypothesesFile());
    ScoreText.line(sb, "  normalised  " + r.normalisation());
    ScoreText.line(sb, "");
    ScoreText.line(sb, "On the " + c.utterances() + " utterances both systems are scored on (" + c.referenceTokens()
        + " reference " + ReportText.tokenNoun(r.unit()) + "):");
    ScoreText.line(sb, "  " + a + ": " + rate + " " + Numbers.percent(c.rateA(), 2) + "   95% interval "
        + Numbers.percent(c.intervalA().low(), 2) + " to " + Numbers.percent(c.intervalA().high(), 2));
    ScoreText.line(sb, "  " + b + ": " + rate + " " + Numbers.percent(c.rateB(), 2) + "   95% interval "
        + Numbers.percent(c.intervalB().low(), 2) + " to " + Numbers.percent(c.intervalB().high(), 2));
    ScoreText.line(sb, "  " + b + " minus " + a + ": " + Numbers.signedPoints(c.difference(), 2) + " points   95% interval "
        + Numbers.signedPoints(c.paired().difference().low(), 2) + " to " + Numbers.signedPoints(c.paired().difference().high(), 2)
        + "   (paired bootstrap, " + c.paired().resamples() + " resamples, seed " + r.seed() + ")");
    ScoreText.line(sb, "  " + b + " makes fewer errors than " + a + " in " + Numbers.percent(c.paired().probBBetter(), 1)
        + " of the resamples, " + a + " fewer than " + b + " in " + Numbers.percent(c.paired().probABetter(), 1));
    ScoreText.line(sb, "  per utterance: " + b + " better on " + c.bBetter() + ", " + a + " better on " + c.aBetter()
        + ", equal on " + c.ties() + "; exact two-sided sign test p " + Numbers.pValue(c.signTestP()) + " (ties dropped)");
    for (SystemRun s : List.of(r.a(), r.b())) {
      SystemScore sc = s.score();
      if (!sc.missingHypotheses().isEmpty())
        ScoreText.line(sb, "  " + s.name() + ": " + sc.missingHypotheses().size() + " reference utterance(s) without a hypothesis ("
            + ScoreReport.policyWording(sc.missingPolicy()) + "): " + ReportText.ids(sc.missingHypotheses()));
      if (!sc.missingReferences().isEmpty())
        ScoreText.line(sb, "  " + s.name() + ": " + sc.missingReferences().size() + " hypothesis utterance(s) without a reference (not scored): "
            + ReportText.ids(sc.missingReferences()));
    }
    List<String> warnings = r.warnings();
    if (!warnings.isEmpty()) {
      ScoreText.line(sb, "");
      ScoreText.line(sb, "Warnings");
      for (String w : warnings) ScoreText.line(sb, "  - " + w);
    }
    ScoreText.line(sb, "");
    ScoreText.line(sb, ReportText.REVIEW_NOTE);
    return sb.toString();
  }
}
