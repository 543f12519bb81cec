package steelyard.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import picocli.CommandLine.Option;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.io.SkippedRow;

/** How hypotheses (and references) files are imported: feature columns, rank-1 ties, lenient mode. */
public final class ImportInput {
  @Option(
      names = "--features",
      paramLabel = "SPECS",
      description = "Score columns to use, comma-separated NAME[:ln|log10|cost|linear][:scale=S]; validated as numbers.")
  public String features;

  @Option(names = "--primary-system", paramLabel = "NAME", description = "System that wins ties for rank 1 between systems.")
  public String primarySystem;

  @Option(names = "--max-bad-rows", paramLabel = "N", defaultValue = "0",
      description = "Skip at most N malformed rows per file, reporting each (default ${DEFAULT-VALUE}).")
  public int maxBadRows;

  /** Rows skipped in lenient mode, for the JSON summary's {@code skipped_rows}. */
  public final List<SkippedRow> skipped = new ArrayList<>();

  public List<FeatureSpec> featureSpecs() {
    return FeatureSpec.parseOption(features);
  }

  /** Import options; warnings and skipped rows go to {@code err}, skipped rows are also collected. */
  public ImportOptions importOptions(PrintWriter err) {
    return importOptions(err, w -> { });
  }

  /** As {@link #importOptions(PrintWriter)}, each warning also handed to {@code warnings}. */
  public ImportOptions importOptions(PrintWriter err, Consumer<String> warnings) {
    return new ImportOptions(
        featureSpecs(),
        primarySystem,
        maxBadRows,
        w -> {
          warnings.accept(w);
          RescoreSupport.warn(err, w);
        },
        s -> {
          synchronized (skipped) {
            skipped.add(s);
          }
          err.println("steelyard: skipped " + s.file() + ":" + s.line() + ": " + s.reason());
          err.flush();
        });
  }
}
