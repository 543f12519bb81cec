package steelyard.rescore;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.ModelText;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * The expensive, weight-independent part of a {@link RescoreSession}, resolved once from a
 * {@link RescoreConfig} and shared by every session derived with {@link RescoreSession#withWeights}: feature
 * names, the weights file's layer, the model, the scoring unit, both tokenisers, the hypothesis scorer, the
 * import options and the warnings met while resolving. Immutable after construction, except for the lazily
 * computed (and then cached) model identity.
 */
final class SessionSetup {
  final RescoreConfig config;
  final List<FeatureSpec> featureSpecs;
  final List<String> featureNames;
  final WeightsSpec fileSpec;
  final RescoreWeights weights;
  /** The configured method, else the weights file's, else N-best. */
  final RescoreMethod method;
  final LanguageModel model;
  final Unit unit;
  final Tokenizer unitTokens;
  final Tokenizer lmTokens;
  final String normalisation;
  final HypothesisScorer scorer;
  final ImportOptions importOptions;
  final List<String> warnings;
  private ModelIdentity identity;

  SessionSetup(RescoreConfig c) {
    config = c;
    List<FeatureSpec> specs = new ArrayList<>(c.features());
    List<String> names = new ArrayList<>();
    fileSpec = readWeights(c.weightsFile(), specs, names);
    featureSpecs = List.copyOf(specs);
    featureNames = List.copyOf(names);
    checkOverrideNames(c.overrides(), featureNames);
    weights = fileSpec.overlay(c.overrides()).resolve(featureNames);
    List<String> warn = new ArrayList<>();
    method = c.method() != null ? c.method() : fileSpec.method != null ? fileSpec.method : RescoreMethod.NBEST;
    if (c.method() != null && fileSpec.method != null && c.method() != fileSpec.method)
      warn.add("the weights in " + c.weightsFile() + " were tuned for method " + fileSpec.method.label() + "; this run uses " + c.method().label());
    model = loadModel(c, modelNeeded(weights, method), warn);
    if (weights.voteConfidence() != null && !method.usesNetwork())
      warn.add("--vote-confidence " + weights.voteConfidence() + " weighs only the consensus and lattice methods, not "
          + method.label());
    unit = c.unit() != null ? c.unit() : fileSpec.unit != null ? fileSpec.unit : model != null ? model.unit() : Unit.WORD;
    if (c.unit() == null && unit != Unit.WORD)
      warn.add("the scoring unit is " + unit.label() + ", taken from " + (fileSpec.unit != null ? "the weights in " + c.weightsFile()
          : c.modelPath() != null ? "the model " + c.modelPath() : "the model") + " because --unit was not given: lengths, MBR and error rates ("
          + (unit == Unit.CHAR ? "CER" : "WER") + ") count " + (unit == Unit.CHAR ? "characters" : "words"));
    if (fileSpec.unit != null && fileSpec.unit != unit)
      warn.add("the weights in " + c.weightsFile() + " were tuned at unit " + fileSpec.unit.label() + "; this run uses " + unit.label());
    if (fileSpec.model != null && c.modelPath() != null && model != null && !fileSpec.model.sameModel(modelIdentity()))
      warn.add("the weights in " + c.weightsFile() + " were tuned with model " + fileSpec.model.describe() + ", not " + c.modelPath()
          + " " + modelIdentity().describe());
    Normaliser scoring = Normaliser.create(c.normalisation());
    normalisation = scoring.describe();
    Unit u = unit;
    unitTokens = raw -> scoring.tokens(raw, u);
    lmTokens = lmTokens(model, unit, c, unitTokens);
    if (model != null && model.unit() != unit) warn.add("the model's unit is " + model.unit().label() + ", the scoring unit " + unit.label());
    warnings = Collections.unmodifiableList(warn);
    importOptions = new ImportOptions(featureSpecs, c.importOptions().primarySystem(), c.importOptions().maxBadRows(),
        c.importOptions().warnings(), c.importOptions().skipped());
    scorer = new HypothesisScorer(model, lmTokens, unitTokens, featureNames.size(), c.maxHyps());
  }

  /** The identity (file, order, size, SHA-256) of the model file; null without a model file. Hashes the file once. */
  synchronized ModelIdentity modelIdentity() {
    if (identity == null && config.modelPath() != null && model != null) identity = ModelIdentity.of(config.modelPath(), model.order());
    return identity;
  }

  /** Whether weights {@code w} under method {@code m} use the model: λ, ω, or λ′ of the lattice search not 0. */
  static boolean modelNeeded(RescoreWeights w, RescoreMethod m) {
    return w.lmWeight() != 0 || w.oovWeight() != 0 || (m == RescoreMethod.LATTICE && w.latticeLmWeight() != 0);
  }

  /**
   * The weights file's partial weights (empty without a file). Fills {@code names} with the feature names of
   * {@code specs}; when {@code specs} is empty, the run takes its features from the file (added to both).
   */
  private static WeightsSpec readWeights(Path file, List<FeatureSpec> specs, List<String> names) {
    for (FeatureSpec s : specs) names.add(s.name());
    WeightsSpec fileSpec = file == null ? new WeightsSpec() : WeightsFile.read(file, names);
    if (specs.isEmpty()) {
      for (String n : fileSpec.features.keySet()) specs.add(FeatureSpec.parse(n));
      names.addAll(fileSpec.features.keySet());
    }
    return fileSpec;
  }

  /** A feature weight of the upper layer must name one of the run's features. */
  private static void checkOverrideNames(WeightsSpec overrides, List<String> names) {
    for (String n : overrides.features.keySet()) {
      if (!names.contains(n))
        throw InputException.option("--weight", "unknown weight name '" + n + "'", "one of the --features columns: " + String.join(", ", names));
    }
  }

  /** The configured model, else the file loaded; an {@link InputException} when one is needed but none is given. */
  private static LanguageModel loadModel(RescoreConfig c, boolean needed, List<String> warnings) {
    if (c.model() != null) return c.model();
    if (c.modelPath() == null) {
      if (needed)
        throw InputException.option("--lm", "no model given, but the LM weight, OOV weight or lattice LM weight is not 0",
            "--lm FILE, or weights of 0");
      return null;
    }
    ModelFiles.LoadOptions o = c.modelLoading();
    return ModelFiles.load(c.modelPath(), new ModelFiles.LoadOptions(o.unknownFloorLog10(), w -> {
      warnings.add(w);
      o.warnings().accept(w);
    }, o.progress()));
  }

  /**
   * Tokenisation for the model by the one rule of {@link ModelText} (the user's rules file applies to the model's
   * text too): {@code unitTokens} when that gives the same tokens, else the model's own.
   */
  private static Tokenizer lmTokens(LanguageModel model, Unit unit, RescoreConfig c, Tokenizer unitTokens) {
    if (model == null || ModelText.sameAsScoring(model, c.normalisation(), unit)) return unitTokens;
    Normaliser lmNorm = ModelText.normaliser(model, c.normalisation().rulesFile());
    Unit lmUnit = model.unit();
    return raw -> lmNorm.tokens(raw, lmUnit);
  }
}
