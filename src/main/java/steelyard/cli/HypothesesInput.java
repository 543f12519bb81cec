package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.io.SkippedRow;

/** {@code --hyps FILE} and the import options, shared by every command that reads one hypotheses file. */
public final class HypothesesInput {
  @Option(names = "--hyps", required = true, paramLabel = "FILE", description = "Hypotheses CSV (.gz accepted).")
  public Path hyps;

  @Mixin public ImportInput imports;

  public List<FeatureSpec> featureSpecs() {
    return imports.featureSpecs();
  }

  /** Rows skipped in lenient mode, for the JSON summary's {@code skipped_rows}. */
  public List<SkippedRow> skipped() {
    return imports.skipped;
  }

  /** Import options; warnings and skipped rows go to {@code err}, skipped rows are also collected. */
  public ImportOptions importOptions(PrintWriter err) {
    return imports.importOptions(err);
  }
}
