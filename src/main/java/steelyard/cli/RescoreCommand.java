package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.InputException;
import steelyard.io.OutputSet;
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

  @Mixin RescoreChoiceOptions choice;


  @Option(names = "--save-weights", paramLabel = "FILE", description = "Write the weights in effect to this file (JSON).")
  Path saveWeights;

  @Mixin ReferencesInput references;

  @Option(names = "--out", paramLabel = "FILE", description = "picks.csv: one row per utterance (default: stdout unless --json is given).")
  Path out;

  @Option(names = "--breakdown", paramLabel = "FILE", description = "CSV with the score breakdown of every hypothesis (for audits).")
  Path breakdown;

  @Mixin JsonOutputOption json;
  @Mixin HistoryOption history;

  @Override
  public Integer call() {
    if (run.threads < 0) throw InputException.option("--threads", "is " + run.threads, "0 (all cores) or a positive number");
    Path picks = out != null ? out : (json.file == null ? Path.of("-") : null);
    Map<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--out", picks);
    outputs.put("--breakdown", breakdown);
    outputs.put("--json", json.file);
    outputs.put("--save-weights", saveWeights);
    // All outputs or none: checked now, staged while the run writes them, moved into place together at the end.
    OutputSet outputSet = OutputSet.open(outputs, Arrays.asList(input.hyps, model.lm, references.refs, weightOptions.weightsFile, normalisation.rules));

    PrintWriter err = spec.commandLine().getErr();
    RescoreSession session = RescoreSession.open(
        choice.apply(RescoreSupport.config(spec, input, normalisation, model, weightOptions)).build());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    List<String> surprises = surprises(session);
    surprises.forEach(w -> RescoreSupport.warn(err, w));
    RescoreRun.Result result = RescoreRun.run(session, input.hyps, references.refs, new RescoreRun.Outputs(picks, breakdown, json.file, saveWeights),
        run.effectiveThreads(), run.seed, input.skipped(), spec.commandLine().getOut(), surprises);
    outputSet.commit();
    RescoreSupport.printSummary(err, result, session.method(), session.unit());
    if (references.refs != null) {
      RescoreSupport.record(history, session, new RescoreSupport.InputsUsed(input.hyps, references.refs, normalisation.rules,
          weightOptions.weightsFile), result.summary(), result.ci95(), run.seed);
    } else if (history.file != null) {
      RescoreSupport.warn(err, "run not recorded in the history: --history records rescoring runs with --refs only");
    }
    return Main.OK;
  }

  /**
   * Where the run silently differs from what the command line suggests: a model given but weighted 0, options
   * the method ignores, picks that go nowhere.
   */
  private List<String> surprises(RescoreSession session) {
    List<String> w = new ArrayList<>();
    if (model.lm != null && !session.usesModel())
      w.add("the model " + model.lm + " is loaded but scores nothing: every LM weight is 0 (--lm-weight, --oov-weight, and --lattice-lm-weight with --method lattice)");
    for (String ignored : weightOptions.ignoredBy(session.method())) w.add(ignored + " has no effect with --method " + session.method().label());
    if (json.file != null && out == null)
      w.add("the picks are not written anywhere: --json was given without --out (picks go to standard output only when neither is given); add --out FILE to keep them");
    return w;
  }
}
