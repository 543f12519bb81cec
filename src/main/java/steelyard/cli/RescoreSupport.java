package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import steelyard.eval.Bootstrap;
import steelyard.history.InputFile;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.WeightsSpec;
import steelyard.eval.EditCounts;
import steelyard.eval.PairedComparison;
import steelyard.report.Numbers;
import steelyard.rescore.RescoreRun;
import picocli.CommandLine.Model.CommandSpec;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;
import steelyard.text.Unit;

/** Printing shared by the rescoring commands: warnings and the stderr summary. */
final class RescoreSupport {
  private RescoreSupport() {}

  /**
   * The configuration the rescoring options describe (features, weights layers, model, normalisation; the unit
   * only when {@code --unit} was given, else inferred); the caller adds method and hypothesis cap.
   */
  static RescoreConfig.Builder config(CommandSpec spec, HypothesesInput input, NormalisationInput normalisation,
      LmModelInput model, RescoreWeightOptions weights) {
    PrintWriter err = spec.commandLine().getErr();
    return RescoreConfig.builder()
        .features(input.featureSpecs())
        .weightsFile(weights.weightsFile)
        .overrides(weights.spec())
        .modelPath(model.lm)
        .modelLoading(model.sessionLoading(err))
        .normalisation(normalisation.options())
        .unit(spec.commandLine().getParseResult().hasMatchedOption("--unit") ? normalisation.unit : null)
        .importOptions(input.importOptions(err));
  }

  static void warn(PrintWriter err, String message) {
    err.println("steelyard: warning: " + message);
    err.flush();
  }

  /**
   * The run's own warnings, then the summary (with references: error rates, named WER or CER after the scoring
   * {@code unit}, and the paired test against rank 1).
   */
  static void printSummary(PrintWriter err, RescoreRun.Result r, RescoreMethod method, Unit unit) {
    r.runWarnings().forEach(w -> warn(err, w));
    RescoreSummary s = r.summary();
    boolean withReferences = r.versusFirst() != null;
    err.printf(Locale.ROOT, "steelyard rescore: %d utterances by %s; %d choices differ from rank 1%s%s%n",
        s.utterances(), method.label(), s.changed(),
        s.newTranscripts() > 0 ? ", " + s.newTranscripts() + " are new transcripts" : "",
        s.cappedUtterances() > 0 ? "; the hypothesis cap applied in " + s.cappedUtterances() : "");
    if (withReferences) {
      err.printf(Locale.ROOT, "  %s %s (rank 1 %s, N-best oracle %s) over %d utterances%n",
          unit == Unit.CHAR ? "CER" : "WER", percent(s.chosen()), percent(s.first()), percent(s.oracle()), s.scored());
      printVersusFirst(err, r.versusFirst());
    }
    err.println("  note: " + RescoreSummary.NOTICE);
    err.flush();
  }

  /** One line: the paired test of the picks against rank 1. */
  static void printVersusFirst(PrintWriter err, PairedComparison c) {
    err.printf(Locale.ROOT, "  versus rank 1: better on %d, worse on %d, tied on %d utterances; difference %s points "
            + "(95 %% interval %s to %s); sign test p %s%n",
        c.bBetter(), c.aBetter(), c.ties(), Numbers.signedPoints(c.difference(), 2),
        Numbers.signedPoints(c.paired().difference().low(), 2), Numbers.signedPoints(c.paired().difference().high(), 2),
        Numbers.pValue(c.signTestP()));
  }

  /**
   * Records a rescoring run with references in the run history when history is on (the session's warnings, then
   * the run's): method, unit, model, the weights in effect, the inputs, the totals and per-utterance rows in
   * reference-file order. Nothing is hashed when history is off.
   */
  static void record(HistoryOption history, RescoreSession s, InputsUsed in, RescoreSummary summary, Bootstrap.Interval ci, long seed) {
    if (history.target() == null) return;
    record(history, s, in, summary, ci, seed, WeightsSpec.of(s.weights(), s.unit(), s.modelIdentity()));
  }

  /** As above, recording {@code weights} (e.g. a tuned weights file with its tuning record) as the weights in effect. */
  static void record(HistoryOption history, RescoreSession s, InputsUsed in, RescoreSummary summary, Bootstrap.Interval ci, long seed,
      WeightsSpec weights) {
    if (history.target() == null) return;
    history.record(history.run().warnings(s.warnings()).rescored(s.method().label(), summary, ci, Bootstrap.DEFAULT_RESAMPLES, seed)
        .unit(s.unit(), s.normalisationDescription()).model(s.config().modelPath(), s.modelIdentity())
        .weights(weights)
        .input(InputFile.HYPOTHESES, in.hyps(), InputFile.UNKNOWN_ROWS)
        .input(InputFile.REFERENCES, in.refs(), summary.referenceOrder().size())
        .input(InputFile.RULES, in.rules(), InputFile.UNKNOWN_ROWS)
        .input(InputFile.WEIGHTS, in.weights(), InputFile.UNKNOWN_ROWS));
  }

  /** The input files of a rescoring run (any may be null). */
  record InputsUsed(Path hyps, Path refs, Path rules, Path weights) {}

  static String percent(EditCounts c) {
    return c.referenceTokens() == 0 ? "n/a" : String.format(Locale.ROOT, "%.2f %%", 100.0 * c.errors() / c.referenceTokens());
  }
}
