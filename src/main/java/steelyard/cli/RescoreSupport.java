package steelyard.cli;

import java.io.PrintWriter;
import java.util.Locale;
import steelyard.eval.EditCounts;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;

/** Printing shared by the rescoring commands: warnings and the stderr summary. */
final class RescoreSupport {
  private RescoreSupport() {}

  static void warn(PrintWriter err, String message) {
    err.println("steelyard: warning: " + message);
    err.flush();
  }

  static void printSummary(PrintWriter err, RescoreSummary s, RescoreMethod method, boolean withReferences) {
    err.printf(Locale.ROOT, "steelyard rescore: %d utterances by %s; %d choices differ from rank 1%s%s%n",
        s.utterances(), method.label(), s.changed(),
        s.newTranscripts() > 0 ? ", " + s.newTranscripts() + " are new transcripts" : "",
        s.cappedUtterances() > 0 ? "; the hypothesis cap applied in " + s.cappedUtterances() : "");
    if (withReferences) {
      err.printf(Locale.ROOT, "  error rate %s (rank 1 %s, N-best oracle %s) over %d utterances%n",
          percent(s.chosen()), percent(s.first()), percent(s.oracle()), s.scored());
    }
    err.println("  note: " + RescoreSummary.NOTICE);
    err.flush();
  }

  private static String percent(EditCounts c) {
    return c.referenceTokens() == 0 ? "n/a" : String.format(Locale.ROOT, "%.2f %%", 100.0 * c.errors() / c.referenceTokens());
  }
}
