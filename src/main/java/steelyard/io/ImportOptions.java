package steelyard.io;

import java.util.List;
import java.util.function.Consumer;

/**
 * How to import a hypotheses or references file.
 *
 * @param features      score columns to read as features, each with its convention (may be empty)
 * @param primarySystem system that wins ties for "rank 1" between systems; null for none
 * @param maxBadRows    how many malformed rows may be skipped (each reported) before the import fails; 0 = strict
 * @param warnings      receives one human-readable warning per call (rank gaps, …); never null
 * @param skipped       receives every row skipped in lenient mode; never null
 */
public record ImportOptions(
    List<FeatureSpec> features,
    String primarySystem,
    int maxBadRows,
    Consumer<String> warnings,
    Consumer<SkippedRow> skipped) {

  public ImportOptions {
    features = List.copyOf(features);
    if (maxBadRows < 0)
      throw InputException.option("--max-bad-rows", "is " + maxBadRows, "0 (any bad row fails) or the number of bad rows that may be skipped");
  }

  /** Strict import of the given features, warnings to stderr. */
  public static ImportOptions strict(List<FeatureSpec> features) {
    return new ImportOptions(features, null, 0, w -> System.err.println("warning: " + w), s -> {});
  }
}
