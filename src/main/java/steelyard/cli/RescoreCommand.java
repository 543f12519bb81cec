package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.InputException;
import steelyard.report.OutputPaths;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreRun;
import steelyard.rescore.RescoreSession;

/**
 * {@code steelyard rescore}: chooses one transcript per utterance by log-linear N-best rescoring, MBR, or a
 * confusion network, writes picks.csv, an optional per-hypothesis breakdown and a JSON summary (with error
 * rates when references are given). Results are identical for any thread count.
 */
@Command(
    name = "rescore",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = "Choose the best transcript per utterance with an n-gram model and tunable weights.")
public final class RescoreCommand implements Callable<Integer> {
  @Mixin HypothesesInput input;
  @Mixin NormalisationInput normalisation;
  @Mixin RunInput run;
  @Mixin RescoreWeightOptions weightOptions;
  @Spec CommandSpec spec;

  @Mixin LmModelInput model;

  @Option(names = "--method", paramLabel = "nbest|mbr|consensus|lattice", defaultValue = "nbest",
      description = "How to choose: best total, minimum expected errors, consensus of the confusion network, or LM search over it. Default ${DEFAULT-VALUE}.")
  RescoreMethod method;

  @Option(names = "--max-hyps", paramLabel = "N", defaultValue = "0", description = "Keep at most N hypotheses per system, by rank (0 = all).")
  int maxHyps;


  @Option(names = "--save-weights", paramLabel = "FILE", description = "Write the weights in effect to this file (JSON).")
  Path saveWeights;

  @Mixin ReferencesInput references;

  @Option(names = "--out", paramLabel = "FILE", description = "picks.csv: one row per utterance (default: stdout unless --json is given).")
  Path out;

  @Option(names = "--breakdown", paramLabel = "FILE", description = "CSV with the score breakdown of every hypothesis (for audits).")
  Path breakdown;

  @Mixin JsonOutputOption json;
  @Override
  public Integer call() {
    if (maxHyps < 0) throw InputException.option("--max-hyps", "is " + maxHyps, "0 (all) or a positive number");
    if (run.threads < 0) throw InputException.option("--threads", "is " + run.threads, "0 (all cores) or a positive number");
    Path picks = out != null ? out : (json.file == null ? Path.of("-") : null);
    Map<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--out", picks);
    outputs.put("--breakdown", breakdown);
    outputs.put("--json", json.file);
    outputs.put("--save-weights", saveWeights);
    OutputPaths.refuseClashes(outputs, Arrays.asList(input.hyps, model.lm, references.refs, weightOptions.weightsFile, normalisation.rules));

    PrintWriter err = spec.commandLine().getErr();
    RescoreSession session = RescoreSession.open(
        RescoreSupport.config(spec, input, normalisation, model, weightOptions).method(method).maxHyps(maxHyps).build());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    RescoreRun.Result result = RescoreRun.run(session, input.hyps, references.refs, new RescoreRun.Outputs(picks, breakdown, json.file, saveWeights),
        run.effectiveThreads(), run.seed, input.skipped(), spec.commandLine().getOut());
    RescoreSupport.printSummary(err, result, session.method());
    return Main.OK;
  }
}
