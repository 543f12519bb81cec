package steelyard.report;

import java.util.List;
import steelyard.eval.Bootstrap;
import steelyard.io.SkippedRow;
import steelyard.text.RuleUsage;
import steelyard.text.Unit;

/**
 * What a score report states besides the counts: where the inputs came from and how the run was set up.
 *
 * @param hypothesesFile the hypotheses file as given on the command line
 * @param referencesFile the references file as given
 * @param unit           the token unit
 * @param normalisation  the normaliser's one-line description ({@code Normaliser.describe()})
 * @param ruleUsage      how many words each rule of the rules file touched ({@link RuleUsage#NONE} without one)
 * @param seed           bootstrap seed
 * @param resamples      bootstrap resamples
 * @param ci95           95 % bootstrap interval of the corpus rate
 * @param skippedRows    rows the importer skipped in lenient mode
 * @param importWarnings warnings from the importers and the normaliser, in order
 */
public record ScoreContext(
    String hypothesesFile,
    String referencesFile,
    Unit unit,
    String normalisation,
    RuleUsage ruleUsage,
    long seed,
    int resamples,
    Bootstrap.Interval ci95,
    List<SkippedRow> skippedRows,
    List<String> importWarnings) {

  public ScoreContext {
    skippedRows = List.copyOf(skippedRows);
    importWarnings = List.copyOf(importWarnings);
  }
}
