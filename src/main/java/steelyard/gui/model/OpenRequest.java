package steelyard.gui.model;

import java.nio.file.Path;
import java.util.List;
import steelyard.io.FeatureSpec;
import steelyard.lm.BackoffModel;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.WeightsSpec;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * The files and conventions the window opens: the same inputs as {@code steelyard rescore}.
 *
 * @param hyps         hypotheses CSV (required)
 * @param refs         references CSV, or null (no error figures then)
 * @param lm           model file (.arpa, .arpa.gz, .bin), or null
 * @param lmText       a text file to train a model from instead of {@code lm} (word or character unit as
 *                     {@code unit}), or null
 * @param trainOrder   n-gram order of the model trained from {@code lmText} (1 … 6)
 * @param weights      weights file (JSON) to start from, or null
 * @param overrides    weights that override the file's (the command line's {@code --lm-weight} …), or null
 * @param features     score columns with their conventions; empty = those of the weights file
 * @param primarySystem system that wins ties for rank 1 between systems, or null
 * @param unit         token unit, or null for: the weights file's, else the model's, else words
 * @param normalisation how text is normalised before scoring (case, punctuation, rules file), as {@code --rules} etc.
 * @param method       how to choose; null = N-best
 * @param maxBadRows   lenient import: skip at most this many malformed rows (0 = strict)
 * @param oovLog10Prob log10 probability of an out-of-vocabulary token for a model that lists no {@code <unk>}
 */
public record OpenRequest(
    Path hyps, Path refs, Path lm, Path lmText, int trainOrder, Path weights, WeightsSpec overrides, List<FeatureSpec> features,
    String primarySystem, Unit unit, NormalisationOptions normalisation, RescoreMethod method, int maxBadRows, double oovLog10Prob) {

  public OpenRequest {
    if (hyps == null) throw new IllegalArgumentException("a hypotheses file is required");
    features = List.copyOf(features);
    if (normalisation == null) normalisation = NormalisationOptions.EXACT;
    if (lmText != null && (trainOrder < 1 || trainOrder > 6))
      throw new IllegalArgumentException("training order must be 1 to 6: " + trainOrder);
    if (maxBadRows < 0) throw new IllegalArgumentException("maxBadRows must be >= 0: " + maxBadRows);
  }

  /** The request for the files as given on the command line, strict import, no model training. */
  public static OpenRequest of(Path hyps, Path refs, Path lm, Path weights, List<FeatureSpec> features, Unit unit,
      NormalisationOptions normalisation, RescoreMethod method) {
    return new OpenRequest(hyps, refs, lm, null, 3, weights, null, features, null, unit, normalisation, method, 0,
        BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10);
  }

  /** The bundled demo: voice dev set, rules, word 3-gram and the weights chosen on it, under {@code root}. */
  public static OpenRequest demo(Path root) {
    Path data = root.resolve("sample-hypotheses");
    Path models = root.resolve("models");
    return of(data.resolve("voice-dev.nbest.csv"), data.resolve("voice-dev.refs.csv"), models.resolve("voice-3gram.arpa.gz"),
        models.resolve("voice-demo.weights.json"), FeatureSpec.parseList("acoustic,lm"), null,
        new NormalisationOptions(false, false, false, false, data.resolve("voice.rules")),
        RescoreMethod.NBEST);
  }

  /** This request with other weight overrides and, when not null, another method. */
  public OpenRequest with(WeightsSpec newOverrides, RescoreMethod newMethod) {
    return new OpenRequest(hyps, refs, lm, lmText, trainOrder, weights, newOverrides, features, primarySystem, unit, normalisation,
        newMethod != null ? newMethod : method, maxBadRows, oovLog10Prob);
  }

  /** The effective method. */
  public RescoreMethod methodOrDefault() {
    return method == null ? RescoreMethod.NBEST : method;
  }
}
