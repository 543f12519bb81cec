package steelyard.tune;

import java.util.Map;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * One method's tuning figures on the dev set. Rates are errors / reference tokens (WER or CER by the unit).
 *
 * @param method        the method
 * @param weights       its tuned weights (the starting weights when nothing beat them)
 * @param devErrors     errors with {@code weights} on the whole dev set (in-sample)
 * @param devErrorRate  {@code devErrors} / reference tokens
 * @param cvErrors      Σ over folds of the held-out errors of weights tuned on the other folds; −1 without folds
 * @param cvErrorRate   {@code cvErrors} / reference tokens; NaN without folds
 * @param startErrors   errors with the starting weights
 * @param keptStart     true when no tuned weights had fewer dev errors than the starting ones
 * @param bestInterval  per tuned linear weight, its best interval ({@link WeightInterval}); empty for α and
 *                      system weights, which are searched on a grid
 * @param iterations    N-best: coordinate-ascent passes on the whole dev set; MBR and consensus: configurations
 *                      evaluated; lattice: search-and-tune rounds summed over the configurations
 */
public record MethodFigures(
    RescoreMethod method,
    RescoreWeights weights,
    long devErrors,
    double devErrorRate,
    long cvErrors,
    double cvErrorRate,
    long startErrors,
    boolean keptStart,
    Map<String, WeightInterval> bestInterval,
    int iterations) {
  public MethodFigures {
    bestInterval = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(bestInterval));
  }
}
