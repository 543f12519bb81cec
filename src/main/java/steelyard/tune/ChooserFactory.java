package steelyard.tune;

import java.util.List;
import java.util.function.Function;
import steelyard.eval.Aligner;
import steelyard.lm.LanguageModel;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;

/**
 * Makes the choice the rescoring service would make with given weights and method: the tuner's reference for
 * every reported error (its fast paths, the envelope and the path pools, only decide where to look).
 */
@FunctionalInterface
public interface ChooserFactory {
  /** A chooser for these weights and method; it is called from several threads at once, one utterance each. */
  Function<ScoredUtterance, UtteranceResult> create(RescoreWeights weights, RescoreMethod method);

  /** The standard choice: {@link NbestRescorer#choose} with one edit-distance instance per thread. */
  static ChooserFactory standard(List<String> featureNames, LanguageModel model) {
    List<String> names = List.copyOf(featureNames);
    return (w, m) -> new NbestRescorer(null, names, w, m, model, () -> new Aligner()::distance)::choose;
  }
}
