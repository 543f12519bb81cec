package steelyard.rescore;

import java.nio.file.Path;
import java.util.List;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Everything a {@link RescoreSession} is built from. Immutable; make one with {@link #builder()}:
 *
 * <pre>{@code
 * RescoreConfig c = RescoreConfig.builder()
 *     .features(FeatureSpec.parseList("acoustic,lm"))
 *     .weightsFile(Path.of("voice.weights.json"))   // lower layer
 *     .overrides(commandLineWeights)                 // upper layer (null values: not given)
 *     .modelPath(Path.of("voice-3gram.arpa.gz"))
 *     .method(RescoreMethod.NBEST)
 *     .build();
 * }</pre>
 *
 * @param features      feature columns with their conventions; empty: take the features named in the weights file
 * @param weightsFile   weights file (JSON) forming the lower weights layer; null for none
 * @param overrides     the upper weights layer (typically the command line; its feature names are checked
 *                      against {@code features}); never null (empty spec: nothing given)
 * @param modelPath     model file to load, or to identify {@code model} by; null for none
 * @param model         an already loaded model (used instead of loading {@code modelPath}); null to load
 * @param modelLoading  how {@code modelPath} is read (floor for closed vocabularies, progress); its warnings are
 *                      passed on and also collected by the session
 * @param normalisation the scoring normalisation (references, length term, MBR, networks)
 * @param unit          the scoring unit; null to infer it (weights file, then model, then words)
 * @param method        how to choose; null: the method the weights file records (version 3), else N-best
 * @param maxHyps       keep at most this many hypotheses per system, by rank (0: all)
 * @param importOptions how hypotheses and references are imported; the session replaces its features
 */
public record RescoreConfig(
    List<FeatureSpec> features,
    Path weightsFile,
    WeightsSpec overrides,
    Path modelPath,
    LanguageModel model,
    ModelFiles.LoadOptions modelLoading,
    NormalisationOptions normalisation,
    Unit unit,
    RescoreMethod method,
    int maxHyps,
    ImportOptions importOptions) {

  public RescoreConfig {
    features = List.copyOf(features);
    if (overrides == null) overrides = new WeightsSpec();
    if (modelLoading == null) modelLoading = new ModelFiles.LoadOptions(BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10, null, null);
    if (normalisation == null) normalisation = NormalisationOptions.EXACT;
    if (maxHyps < 0) throw new IllegalArgumentException("maxHyps must be >= 0 (0 = all): " + maxHyps);
    if (importOptions == null) importOptions = new ImportOptions(List.of(), null, 0, w -> { }, s -> { });
  }

  public static Builder builder() {
    return new Builder();
  }

  /** This configuration with another method (the rest unchanged). */
  public RescoreConfig withMethod(RescoreMethod m) {
    return new RescoreConfig(features, weightsFile, overrides, modelPath, model, modelLoading, normalisation, unit, m, maxHyps,
        importOptions);
  }

  /** Fluent builder; every value starts at the record's default. Not thread-safe. */
  public static final class Builder {
    private List<FeatureSpec> features = List.of();
    private Path weightsFile;
    private WeightsSpec overrides;
    private Path modelPath;
    private LanguageModel model;
    private ModelFiles.LoadOptions modelLoading;
    private NormalisationOptions normalisation;
    private Unit unit;
    private RescoreMethod method;
    private int maxHyps;
    private ImportOptions importOptions;

    private Builder() {}

    public Builder features(List<FeatureSpec> v) { features = v; return this; }
    public Builder weightsFile(Path v) { weightsFile = v; return this; }
    public Builder overrides(WeightsSpec v) { overrides = v; return this; }
    public Builder modelPath(Path v) { modelPath = v; return this; }
    public Builder model(LanguageModel v) { model = v; return this; }
    public Builder modelLoading(ModelFiles.LoadOptions v) { modelLoading = v; return this; }
    public Builder normalisation(NormalisationOptions v) { normalisation = v; return this; }
    public Builder unit(Unit v) { unit = v; return this; }
    public Builder method(RescoreMethod v) { method = v; return this; }
    public Builder maxHyps(int v) { maxHyps = v; return this; }
    public Builder importOptions(ImportOptions v) { importOptions = v; return this; }

    public RescoreConfig build() {
      return new RescoreConfig(features, weightsFile, overrides, modelPath, model, modelLoading, normalisation, unit, method,
          maxHyps, importOptions);
    }
  }
}
