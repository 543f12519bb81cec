package steelyard.cli;

import picocli.CommandLine.Option;
import steelyard.io.InputException;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;

/** {@code --method} and {@code --max-hyps}: how the commands that pick transcripts ({@code rescore}, {@code audit}) choose. */
public final class RescoreChoiceOptions {
  @Option(names = "--method", paramLabel = "nbest|mbr|consensus|lattice",
      description = "How to choose: best total, minimum expected errors, consensus of the confusion network, or LM search over it. "
          + "Default: the method the --weights file was tuned for, else nbest.")
  public RescoreMethod method;

  @Option(names = "--max-hyps", paramLabel = "N", defaultValue = "0", description = "Keep at most N hypotheses per system, by rank (0 = all).")
  public int maxHyps;

  /** Sets method and hypothesis cap on {@code config}, after checking the cap. */
  RescoreConfig.Builder apply(RescoreConfig.Builder config) {
    if (maxHyps < 0) throw InputException.option("--max-hyps", "is " + maxHyps, "0 (all) or a positive number");
    return config.method(method).maxHyps(maxHyps);
  }
}
