package steelyard.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.io.JsonOutput;
import steelyard.report.OutputPaths;
import steelyard.report.SurfaceCsv;
import steelyard.report.TuneJson;
import steelyard.report.TuneText;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.WeightsFile;
import steelyard.tune.TuneJob;
import steelyard.tune.TuneSettings;
import steelyard.tune.WeightNames;

/**
 * {@code steelyard tune}: chooses the weights (and, unless restricted, the method) with the fewest errors on a dev
 * set with references ({@link TuneJob}), cross-validated over utterances, and writes them as a weights file for
 * {@code rescore --weights}. Every output is rendered after the run and then written atomically, so an interrupted
 * run (Ctrl-C) leaves no partial file. Results are identical for any thread count.
 */
@Command(
    name = "tune",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Tune the rescoring weights on a dev set with references: exact line search for the N-best weights, a search "
          + "over the posterior sharpness and system weights for the network methods, k-fold cross-validation.",
      "Writes the weights file (--out) that rescore --weights reads; the summary goes to stderr."
    })
public final class TuneCommand implements Callable<Integer> {
  @Mixin HypothesesInput input;
  @Mixin NormalisationInput normalisation;
  @Mixin RunInput run;
  @Mixin RescoreWeightOptions weightOptions;
  @Mixin LmModelInput model;
  @Mixin ReferencesInput references;
  @Spec CommandSpec spec;

  @Option(names = "--method", paramLabel = "METHODS", split = ",",
      description = "Methods to tune, comma-separated (nbest, mbr, consensus, lattice); the one with the lowest cross-validated "
          + "error is kept. Default: all four.")
  List<RescoreMethod> methods = new ArrayList<>();

  @Option(names = "--tune", paramLabel = "NAMES", split = ",",
      description = "Weights that move, comma-separated: feature columns, lm_weight, oov_weight, length_weight, posterior_sharpness, "
          + "system:NAME, lattice_lm_weight, lattice_length_weight. Default: every weight that can change a pick except the "
          + "first feature's (it sets the scale).")
  List<String> tune;

  @Option(names = "--folds", paramLabel = "K", defaultValue = "5",
      description = "Cross-validation folds over utterances; 0 = none (default ${DEFAULT-VALUE}).")
  int folds;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "The tuned weights file (JSON) to write.")
  Path out;

  @Mixin JsonOutputOption json;

  @Option(names = "--surface", paramLabel = "FILE",
      description = "CSV of the dev error over a grid of the LM weight and the length weight of the kept method (λ × μ, or λ′ × μ′ for lattice).")
  Path surface;

  @Mixin HistoryOption history;

  @Override
  public Integer call() {
    Path refs = references.require();
    TuneSettings settings = settings();
    if (surface != null && model.lm == null)
      throw InputException.option("--surface", "needs a model (the surface is over the LM weight)", "--lm FILE");
    Map<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--out", out);
    outputs.put("--json", json.file);
    outputs.put("--surface", surface);
    OutputPaths.refuseClashes(outputs, Arrays.asList(input.hyps, refs, model.lm, weightOptions.weightsFile, normalisation.rules));
    OutputPaths.requireWritable(outputs.values());

    PrintWriter err = spec.commandLine().getErr();
    RescoreSession session = RescoreSession.open(RescoreSupport.config(spec, input, normalisation, model, weightOptions).build());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    TuneJob.Outcome o;
    try (TuneProgressBar bar = new TuneProgressBar(err, ConsoleProgress.wanted(model.progress), System::nanoTime)) {
      TuneJob.Dev dev = TuneJob.load(session, input.hyps, refs, run.effectiveThreads(),
          (utts, hyps) -> bar.update(0, "reading " + utts + " utterances"), () -> false);
      dev.warnings().forEach(w -> RescoreSupport.warn(err, w));
      o = TuneJob.run(dev, settings, bar, () -> false);
    }
    writeOutputs(o);
    o.result().warnings().forEach(w -> RescoreSupport.warn(err, w));
    err.print(TuneText.summary(o, out));
    err.flush();
    TuneHistory.record(history, o, normalisation.rules, weightOptions.weightsFile, run.effectiveThreads(), run.seed);
    return Main.OK;
  }

  private TuneSettings settings() {
    if (run.threads < 0) throw InputException.option("--threads", "is " + run.threads, "0 (all cores) or a positive number");
    if (folds == 1 || folds < 0)
      throw InputException.option("--folds", "is " + folds, "0 (no cross-validation) or 2 or more folds");
    TuneSettings s = TuneSettings.defaults().withMethods(methods.isEmpty() ? EnumSet.noneOf(RescoreMethod.class) : EnumSet.copyOf(methods))
        .withFolds(folds).withSeed(run.seed).withThreads(run.effectiveThreads()).withSurface(surface != null);
    if (tune == null) return s;
    LinkedHashSet<String> names = new LinkedHashSet<>();
    for (String n : tune) names.add(WeightNames.canonical(n));
    return s.withTune(names);
  }

  /** Renders every output first, then writes each atomically: a failure while rendering writes nothing. */
  private void writeOutputs(TuneJob.Outcome o) {
    String weights = WeightsFile.toJson(o.weights());
    String summary = json.file == null ? null : JsonOutput.render(TuneJson.json(o));
    String grid = surface == null || o.result().surface() == null ? null : surfaceText(o);
    if (surface != null && grid == null)
      RescoreSupport.warn(spec.commandLine().getErr(), "no error surface for " + o.result().method().label() + " (the tuner kept the "
          + "starting weights, or the method has no LM weight to vary); " + surface + " not written");
    PrintWriter stdout = spec.commandLine().getOut();
    AtomicOutput.writeText(out, stdout, w -> w.write(weights));
    if (summary != null) AtomicOutput.writeText(json.file, stdout, w -> w.write(summary));
    if (grid != null) AtomicOutput.writeText(surface, stdout, w -> w.write(grid));
  }

  private static String surfaceText(TuneJob.Outcome o) {
    StringWriter w = new StringWriter();
    try {
      SurfaceCsv.write(w, o.result().surface());
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return w.toString();
  }
}
