package steelyard.report;

import java.util.ArrayList;
import java.util.List;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.WeightNames;

/** Display names of the tunable weights ({@link WeightNames}) and their values in a {@link RescoreWeights}. */
final class WeightLabels {
  private WeightLabels() {}

  /** "LM weight λ", "length weight μ", "feature acoustic", "system weight line-gray"… */
  static String label(String name) {
    return switch (name) {
      case WeightNames.LM -> "LM weight λ";
      case WeightNames.OOV -> "OOV weight ω";
      case WeightNames.LENGTH -> "length weight μ";
      case WeightNames.POSTERIOR_SHARPNESS -> "posterior sharpness α";
      case WeightNames.LATTICE_LM -> "network LM weight λ′";
      case WeightNames.LATTICE_LENGTH -> "network length weight μ′";
      default -> name.startsWith(WeightNames.SYSTEM_PREFIX)
          ? "system weight " + name.substring(WeightNames.SYSTEM_PREFIX.length()) : "feature " + name;
    };
  }

  /**
   * The names of the weights that shape {@code method}'s picks: the feature weights, λ, ω and μ (the totals every
   * method starts from), α and listed system weights for the methods that use posteriors, λ′ and μ′ for the
   * lattice search.
   */
  static List<String> shaping(RescoreWeights w, RescoreMethod method) {
    List<String> names = new ArrayList<>(w.features().keySet());
    names.addAll(List.of(WeightNames.LM, WeightNames.OOV, WeightNames.LENGTH));
    if (method != RescoreMethod.NBEST) {
      names.add(WeightNames.POSTERIOR_SHARPNESS);
      for (String system : w.systemWeights().keySet()) names.add(WeightNames.system(system));
    }
    if (method == RescoreMethod.LATTICE) names.addAll(List.of(WeightNames.LATTICE_LM, WeightNames.LATTICE_LENGTH));
    return names;
  }

  /** The value of weight {@code name} in {@code w} ({@link WeightNames#valueOf}). */
  static double value(RescoreWeights w, String name) {
    return WeightNames.valueOf(w, name);
  }
}
