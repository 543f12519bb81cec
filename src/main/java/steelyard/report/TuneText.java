package steelyard.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.RescoreWeights;
import steelyard.text.Unit;
import steelyard.tune.MethodFigures;
import steelyard.tune.TuneJob;
import steelyard.tune.TuneResult;
import steelyard.tune.WeightNames;

/**
 * The plain-text summary of a tuning run ({@code tune} prints it on stderr): the dev error of rank 1 and of every
 * tuned method with its cross-validated error, the method kept with its 95 % bootstrap interval, its weights, the
 * weights the tuning changed, where the weights went, and the notice. Warnings (over-fitting among them) are the
 * caller's to print.
 */
public final class TuneText {
  private TuneText() {}

  /** The summary of {@code o}; {@code weightsFile} is where the weights were written. */
  public static String summary(TuneJob.Outcome o, Path weightsFile) {
    TuneResult r = o.result();
    String measure = o.dev().session().unit() == Unit.CHAR ? "CER" : "WER";
    StringBuilder sb = new StringBuilder();
    sb.append(String.format(Locale.ROOT, "steelyard tune: %d dev utterances, %d reference tokens, %s; kept %s (%s)%n",
        r.utterances(), r.referenceTokens(), measure, r.method().label(),
        r.folds() > 0 ? "lowest " + r.folds() + "-fold cross-validated error" : "lowest dev error, no cross-validation"));
    sb.append(String.format(Locale.ROOT, "  %-10s %s %8s%n", "rank 1", measure, Numbers.percent(r.devFirstErrorRate(), 2)));
    for (MethodFigures f : r.perMethod()) {
      String cv = Double.isNaN(f.cvErrorRate()) ? "" : ", cross-validated " + Numbers.percent(f.cvErrorRate(), 2);
      String kept = f.method() == r.method() ? String.format(Locale.ROOT, " (95 %% interval %s to %s; kept)",
          Numbers.percent(r.devInterval().low(), 2), Numbers.percent(r.devInterval().high(), 2)) : "";
      sb.append(String.format(Locale.ROOT, "  %-10s %s %8s%s%s%s%n", f.method().label(), measure, Numbers.percent(f.devErrorRate(), 2),
          cv, kept, f.keptStart() ? " (starting weights)" : ""));
    }
    sb.append("  weights: ").append(weights(r.weights(), r.method())).append(System.lineSeparator());
    List<String> changed = o.weights().tuning.changed();
    sb.append("  changed from the start: ").append(changed.isEmpty() ? "none" : String.join(", ", changed)).append(System.lineSeparator());
    sb.append("  written to ").append(weightsFile).append(" (use with rescore --weights)").append(System.lineSeparator());
    sb.append("  note: ").append(RescoreSummary.NOTICE).append(System.lineSeparator());
    return sb.toString();
  }

  /** The weights that shape {@code method}'s picks, {@code name value} with four significant digits. */
  public static String weights(RescoreWeights w, RescoreMethod method) {
    List<String> parts = new ArrayList<>();
    for (String n : WeightLabels.shaping(w, method)) parts.add(n + " " + Numbers.significant(WeightNames.valueOf(w, n), 4).toPlainString());
    return String.join(", ", parts);
  }
}
