package steelyard.cli;

import java.io.PrintWriter;
import java.util.Locale;
import steelyard.eval.EditCounts;
import steelyard.eval.PairedComparison;
import steelyard.report.Numbers;
import steelyard.rescore.RescoreRun;
import picocli.CommandLine.Model.CommandSpec;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;

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

  /** The run's own warnings, then the summary (with references: error rates and the paired test against rank 1). */
  static void printSummary(PrintWriter err, RescoreRun.Result r, RescoreMethod method) {
    r.runWarnings().forEach(w -> warn(err, w));
    RescoreSummary s = r.summary();
    boolean withReferences = r.versusFirst() != null;
    err.printf(Locale.ROOT, "steelyard rescore: %d utterances by %s; %d choices differ from rank 1%s%s%n",
        s.utterances(), method.label(), s.changed(),
        s.newTranscripts() > 0 ? ", " + s.newTranscripts() + " are new transcripts" : "",
        s.cappedUtterances() > 0 ? "; the hypothesis cap applied in " + s.cappedUtterances() : "");
    if (withReferences) {
      err.printf(Locale.ROOT, "  error rate %s (rank 1 %s, N-best oracle %s) over %d utterances%n",
          percent(s.chosen()), percent(s.first()), percent(s.oracle()), s.scored());
      PairedComparison c = r.versusFirst();
      err.printf(Locale.ROOT, "  versus rank 1: better on %d, worse on %d, tied on %d utterances; difference %s points "
              + "(95 %% interval %s to %s); sign test p %s%n",
          c.bBetter(), c.aBetter(), c.ties(), Numbers.signedPoints(c.difference(), 2),
          Numbers.signedPoints(c.paired().difference().low(), 2), Numbers.signedPoints(c.paired().difference().high(), 2),
          Numbers.pValue(c.signTestP()));
    }
    err.println("  note: " + RescoreSummary.NOTICE);
    err.flush();
  }

  private static String percent(EditCounts c) {
    return c.referenceTokens() == 0 ? "n/a" : String.format(Locale.ROOT, "%.2f %%", 100.0 * c.errors() / c.referenceTokens());
  }
}
