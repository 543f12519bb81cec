package steelyard.tune;

import java.util.List;
import java.util.Map;
import steelyard.eval.Bootstrap;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * The outcome of a tuning run: what {@code tune} prints as JSON and what the weights file records. Rates are
 * errors / reference tokens over the dev set (WER or CER by the unit). The dev data's SHA-256, the model's
 * identity and the unit are the caller's to record (it read the files); {@link #utterances} is here.
 *
 * @param method            the method kept: the lowest cross-validated error (without folds: the lowest dev
 *                          error); ties go to the simpler method, in the order nbest, mbr, consensus, lattice
 * @param devFirstErrorRate the recogniser's rank 1
 * @param devErrorRate      the kept method with its tuned weights, in-sample
 * @param devInterval       95 % bootstrap interval of {@code devErrorRate} (utterances resampled)
 * @param cvErrorRate       k-fold cross-validated rate of the kept method; NaN without folds
 * @param weights           the tuned weights of the kept method (never more dev errors than the starting weights)
 * @param bestInterval      the kept method's best intervals ({@link MethodFigures#bestInterval})
 * @param perMethod         every tuned method's figures, in the order nbest, mbr, consensus, lattice
 * @param surface           the kept method's error surface, or null (not asked for, or no second weight)
 * @param warnings          things the user should know (over-fitting, starting weights kept, folds off)
 * @param iterations        the kept method's {@link MethodFigures#iterations}
 */
public record TuneResult(
    RescoreMethod method,
    double devFirstErrorRate,
    double devErrorRate,
    Bootstrap.Interval devInterval,
    double cvErrorRate,
    long referenceTokens,
    RescoreWeights weights,
    Map<String, WeightInterval> bestInterval,
    List<MethodFigures> perMethod,
    ErrorSurface surface,
    List<String> warnings,
    int iterations,
    int utterances,
    int folds,
    long seed) {

  public TuneResult {
    bestInterval = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(bestInterval));
    perMethod = List.copyOf(perMethod);
    warnings = List.copyOf(warnings);
  }

  /** The figures of {@code m}, or null when it was not tuned. */
  public MethodFigures figures(RescoreMethod m) {
    for (MethodFigures f : perMethod) if (f.method() == m) return f;
    return null;
  }
}
