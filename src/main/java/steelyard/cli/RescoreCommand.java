package steelyard.cli;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.eval.Aligner;
import steelyard.eval.Bootstrap;
import steelyard.eval.UtteranceOverlap;
import steelyard.io.AtomicOutput;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.OutputSet;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.lm.LanguageModel;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.ModelIdentity;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.OrderedBatches;
import steelyard.rescore.PicksWriter;
import steelyard.rescore.ReferenceScorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.UtteranceErrors;
import steelyard.rescore.UtteranceResult;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

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

  @Option(names = "--lm", paramLabel = "FILE", description = "Language model (.arpa, .arpa.gz or .bin); needed when λ, ω or λ′ is not 0.")
  Path lm;

  @Option(names = "--method", paramLabel = "nbest|mbr|consensus|lattice", defaultValue = "nbest",
      description = "How to choose: best total, minimum expected errors, consensus of the confusion network, or LM search over it. Default ${DEFAULT-VALUE}.")
  RescoreMethod method;

  @Option(names = "--max-hyps", paramLabel = "N", defaultValue = "0", description = "Keep at most N hypotheses per system, by rank (0 = all).")
  int maxHyps;

  @Option(names = "--weights", paramLabel = "FILE", description = "Weights file (JSON) to start from; options given here override it.")
  Path weightsFile;

  @Option(names = "--save-weights", paramLabel = "FILE", description = "Write the weights in effect to this file (JSON).")
  Path saveWeights;

  @Option(names = "--refs", paramLabel = "FILE", description = "References CSV: adds error rates of the choice, of rank 1 and of the oracle.")
  Path refs;

  @Option(names = "--out", paramLabel = "FILE", description = "picks.csv: one row per utterance (default: stdout unless --json is given).")
  Path out;

  @Option(names = "--breakdown", paramLabel = "FILE", description = "CSV with the score breakdown of every hypothesis (for audits).")
  Path breakdown;

  @Option(names = "--json", paramLabel = "FILE|-", description = "JSON summary ('-' for stdout).")
  Path json;

  private final List<String> warnings = new ArrayList<>();

  @Override
  public Integer call() throws Exception {
    if (maxHyps < 0) throw InputException.option("--max-hyps", "is " + maxHyps, "0 (all) or a positive number");
    if (run.threads < 0) throw InputException.option("--threads", "is " + run.threads, "0 (all cores) or a positive number");
    Path picks = out != null ? out : (json == null ? Path.of("-") : null);
    Map<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--out", picks);
    outputs.put("--breakdown", breakdown);
    outputs.put("--json", json);
    outputs.put("--save-weights", saveWeights);
    OutputSet outputSet = OutputSet.open(outputs, Arrays.asList(input.hyps, lm, refs, weightsFile, normalisation.rules));

    List<FeatureSpec> specs = input.featureSpecs();
    List<String> names = new ArrayList<>();
    WeightsSpec fileSpec = RescoreSupport.readWeights(weightsFile, specs, names);
    RescoreWeights weights = fileSpec.overlay(weightOptions.spec(names)).resolve(names);
    LanguageModel model = loadModel(weights);
    if (lm != null && !modelNeeded(weights))
      warn("the model " + lm + " is loaded but scores nothing: every LM weight is 0 (--lm-weight, --oov-weight, and --lattice-lm-weight with --method lattice)");
    for (String ignored : weightOptions.ignoredBy(method)) warn(ignored + " has no effect with --method " + method.label());
    if (json != null && out == null)
      warn("the picks are not written anywhere: --json was given without --out (picks go to standard output only when neither is given); add --out FILE to keep them");
    if (weights.voteConfidence() != null && !method.usesNetwork())
      warn("--vote-confidence " + weights.voteConfidence() + " weighs only the consensus and lattice methods, not " + method.label());
    Unit unit = unit(fileSpec, model);
    if (!spec.commandLine().getParseResult().hasMatchedOption("--unit") && unit != normalisation.unit)
      warn("the scoring unit is " + label(unit) + ", taken from " + (fileSpec.unit != null ? "the weights in " + weightsFile : "the model " + lm)
          + " because --unit was not given: lengths, MBR and error rates (" + (unit == Unit.CHAR ? "CER" : "WER") + ") count " + (unit == Unit.CHAR ? "characters" : "words"));
    if (fileSpec.unit != null && fileSpec.unit != unit)
      warn("the weights in " + weightsFile + " were tuned at unit " + label(fileSpec.unit) + "; this run uses " + label(unit));
    ModelIdentity identity = lm != null && (saveWeights != null || fileSpec.model != null) ? ModelIdentity.of(lm, model.order()) : null;
    if (fileSpec.model != null && identity != null && !fileSpec.model.sameModel(identity))
      warn("the weights in " + weightsFile + " were tuned with model " + fileSpec.model.describe() + ", not " + lm + " " + identity.describe());

    Normaliser scoring = Normaliser.create(normalisation.options());
    Tokenizer unitTokens = raw -> scoring.tokens(raw, unit);
    Tokenizer lmTokens = RescoreSupport.lmTokens(model, unit, normalisation.options(), unitTokens);
    if (model != null && model.unit() != unit) warn("the model's unit is " + label(model.unit()) + ", the scoring unit " + label(unit));
    ImportOptions importOptions = withFeatures(input.importOptions(), specs);
    Map<String, Reference> references = refs == null ? null : ReferencesReader.readAll(refs, importOptions);

    HypothesisScorer scorer = new HypothesisScorer(model, lmTokens, unitTokens, names.size(), maxHyps);
    NbestRescorer rescorer = new NbestRescorer(scorer, names, weights, method, model, () -> new Aligner()::distance);
    ThreadLocal<ReferenceScorer> refScorer = ThreadLocal.withInitial(
        () -> new ReferenceScorer(unitTokens, method.usesNetwork() ? weights.latticeSettings() : null));
    RescoreSummary summary = new RescoreSummary();
    PicksWriter writer = new PicksWriter(names, unit);
    Set<String> seen = new HashSet<>();
    Set<String> systemsSeen = new HashSet<>();

    withOutput(picks, pw -> withOutput(breakdown, bw -> {
      writer.picksHeader(pw);
      if (breakdown != null) writer.breakdownHeader(bw);
      try (HypothesesReader reader = HypothesesReader.open(input.hyps, importOptions)) {
        OrderedBatches.run(reader, u -> {
          UtteranceResult r = rescorer.rescore(u);
          Reference ref = references == null ? null : references.get(u.uttId());
          UtteranceErrors e = ref == null ? null : refScorer.get().score(r, ref.text());
          return new Outcome(r, e);
        }, run.effectiveThreads(), OrderedBatches.DEFAULT_BATCH, o -> {
          if (references != null) seen.add(o.result.uttId());
          systemsSeen.addAll(o.result.scores().systems());
          summary.add(o.result, o.errors);
          if (references != null && o.errors == null) summary.missingReference(o.result.uttId());
          writer.pick(pw, o.result);
          if (breakdown != null) writer.breakdown(bw, o.result);
        });
      } catch (IOException | RuntimeException e) {
        throw e;
      } catch (Exception e) {
        throw new IllegalStateException(e);
      }
    }));
    if (references != null) {
      ReferenceScorer rs = refScorer.get();
      for (Reference r : references.values())
        if (!seen.contains(r.uttId())) summary.missingHypotheses(r.uttId(), rs.missingHypotheses(r.text()));
      String overlap = UtteranceOverlap.check(input.hyps.toString(), refs, new ArrayList<>(references.keySet()),
          summary.missingHypothesisIds(), summary.missingReferenceIds());
      if (overlap != null) warn(overlap);
    }
    RescoreWeights.requireSystemsPresent(weightOptions.systems.keySet(), systemsSeen, input.hyps);
    finish(summary, weights, unit, identity);
    outputSet.commit();
    return Main.OK;
  }

  /** --unit when given, else the weights file's unit, else the model's, else words. */
  private Unit unit(WeightsSpec fileSpec, LanguageModel model) {
    return RescoreSupport.unit(spec.commandLine().getParseResult().hasMatchedOption("--unit"), normalisation.unit, fileSpec, model);
  }

  private LanguageModel loadModel(RescoreWeights w) {
    return RescoreSupport.loadModel(lm, modelNeeded(w));
  }

  private boolean modelNeeded(RescoreWeights w) {
    return w.lmWeight() != 0 || w.oovWeight() != 0 || (method == RescoreMethod.LATTICE && w.latticeLmWeight() != 0);
  }

  private void finish(RescoreSummary summary, RescoreWeights weights, Unit unit, ModelIdentity identity) throws IOException {
    double[] ci = null;
    if (refs != null) {
      Bootstrap.Interval iv = Bootstrap.corpusRate(summary.errorsPerUtterance(), summary.referenceTokensPerUtterance(),
          Bootstrap.DEFAULT_RESAMPLES, run.seed, run.effectiveThreads());
      ci = new double[] {iv.low(), iv.high()};
    }
    var node = summary.toJson(method.label(), label(unit), run.seed, refs != null, ci);
    if (refs != null) node.put("resamples", Bootstrap.DEFAULT_RESAMPLES);
    var skipped = node.putArray("skipped_rows");
    synchronized (input.skipped) {
      input.skipped.forEach(s -> skipped.addObject().put("file", s.file()).put("line", s.line()).put("reason", s.reason()));
    }
    var warn = node.putArray("warnings");
    warnings.forEach(warn::add);
    WeightsSpec effective = WeightsSpec.of(weights, unit, identity);
    node.set("weights", RescoreSupport.parse(WeightsFile.toJson(effective)));
    if (json != null) AtomicOutput.writeText(json, w -> RescoreSupport.writeJson(w, node));
    if (saveWeights != null) WeightsFile.save(saveWeights, effective);
    RescoreSupport.printSummary(System.err, summary, method, refs != null, unit);
  }

  private void warn(String w) {
    warnings.add(w);
    System.err.println("steelyard: warning: " + w);
  }

  private static ImportOptions withFeatures(ImportOptions o, List<FeatureSpec> specs) {
    return RescoreSupport.withFeatures(o, specs);
  }

  private static String label(Unit u) {
    return RescoreSupport.label(u);
  }

  private interface Body {
    void write(Writer w) throws IOException;
  }

  private static void withOutput(Path target, Body body) throws IOException {
    if (target == null) {
      body.write(Writer.nullWriter());
    } else {
      AtomicOutput.writeText(target, body::write);
    }
  }

  private record Outcome(UtteranceResult result, UtteranceErrors errors) {}
}
