package steelyard.report;

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
      case WeightNames.POSTERIOR_SCALE -> "posterior sharpness α";
      case WeightNames.LATTICE_LM -> "network LM weight λ′";
      case WeightNames.LATTICE_LENGTH -> "network length weight μ′";
      default -> name.startsWith(WeightNames.SYSTEM_PREFIX)
          ? "system weight " + name.substring(WeightNames.SYSTEM_PREFIX.length()) : "feature " + name;
    };
  }

  /** The value of weight {@code name} in {@code w} (a feature not listed weighs 1, as rescoring counts it). */
  static double value(RescoreWeights w, String name) {
    return switch (name) {
      case WeightNames.LM -> w.lmWeight();
      case WeightNames.OOV -> w.oovWeight();
      case WeightNames.LENGTH -> w.lengthWeight();
      case WeightNames.POSTERIOR_SCALE -> w.posteriorScale();
      case WeightNames.LATTICE_LM -> w.latticeLmWeight();
      case WeightNames.LATTICE_LENGTH -> w.latticeLengthWeight();
      default -> name.startsWith(WeightNames.SYSTEM_PREFIX)
          ? w.systemWeight(name.substring(WeightNames.SYSTEM_PREFIX.length())) : w.features().getOrDefault(name, 1.0);
    };
  }
}
