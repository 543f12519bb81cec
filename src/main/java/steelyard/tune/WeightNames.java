package steelyard.tune;

import steelyard.rescore.RescoreWeights;

/**
 * Names of the tunable weights, as a {@code --tune} list and the result spell them, and their default ranges.
 * A feature weight is named by its feature column; the other names are fixed (a feature column cannot use them).
 */
public final class WeightNames {
  /** λ, weight of the model's ln P(sentence). */
  public static final String LM = "lm_weight";
  /** ω, added per out-of-vocabulary token. */
  public static final String OOV = "oov_weight";
  /** μ, added per token. */
  public static final String LENGTH = "length_weight";
  /** α, multiplies totals before the softmax of the posteriors. */
  public static final String POSTERIOR_SHARPNESS = "posterior_sharpness";
  /** The release 0.1 spelling of {@link #POSTERIOR_SHARPNESS}, still accepted by {@link #canonical}. */
  static final String POSTERIOR_SHARPNESS_OLD = "posterior_scale";
  /** λ′, LM weight of the confusion-network search. */
  public static final String LATTICE_LM = "lattice_lm_weight";
  /** μ′, per-token weight of the confusion-network search. */
  public static final String LATTICE_LENGTH = "lattice_length_weight";
  /** Prefix of a system's mixing weight: {@code system:NAME}. */
  public static final String SYSTEM_PREFIX = "system:";

  /** α and system weights are searched on a log scale inside these bounds. */
  static final double MIN_SCALE = 1e-6;
  static final double MAX_SCALE = 1e6;
  static final double MIN_SYSTEM = 1e-3;
  static final double MAX_SYSTEM = 1e3;

  private WeightNames() {}

  /** The name of {@code system}'s mixing weight. */
  public static String system(String system) {
    return SYSTEM_PREFIX + system;
  }

  /**
   * The value of weight {@code name} in {@code w}: a feature not listed weighs 1 and a system not listed 1, as
   * rescoring counts them.
   */
  public static double valueOf(RescoreWeights w, String name) {
    return switch (name) {
      case LM -> w.lmWeight();
      case OOV -> w.oovWeight();
      case LENGTH -> w.lengthWeight();
      case POSTERIOR_SHARPNESS -> w.posteriorScale();
      case LATTICE_LM -> w.latticeLmWeight();
      case LATTICE_LENGTH -> w.latticeLengthWeight();
      default -> name.startsWith(SYSTEM_PREFIX) ? w.systemWeight(name.substring(SYSTEM_PREFIX.length())) : w.features().getOrDefault(name, 1.0);
    };
  }

  /** {@code name} with an old spelling replaced by the current one ({@code posterior_scale} → {@link #POSTERIOR_SHARPNESS}). */
  public static String canonical(String name) {
    return POSTERIOR_SHARPNESS_OLD.equals(name) ? POSTERIOR_SHARPNESS : name;
  }

  /** Whether {@code name} is one of the fixed names or a system weight (not a feature). */
  public static boolean isReserved(String name) {
    return name.equals(LM) || name.equals(OOV) || name.equals(LENGTH) || name.equals(POSTERIOR_SHARPNESS)
        || name.equals(POSTERIOR_SHARPNESS_OLD) || name.equals(LATTICE_LM) || name.equals(LATTICE_LENGTH) || name.startsWith(SYSTEM_PREFIX);
  }

  /**
   * The default range: λ ≥ 0 and λ′ ≥ 0 (a negative LM weight would prefer improbable text); α in
   * [{@value #MIN_SCALE}, {@value #MAX_SCALE}] and system weights in [{@value #MIN_SYSTEM}, {@value #MAX_SYSTEM}]
   * (both must be positive and are searched on a log scale); feature weights, ω, μ and μ′ unbounded (features are
   * higher-is-better by import convention, but two correlated features, such as a first-pass LM next to the
   * domain model, may call for a negative weight on one of them).
   */
  public static WeightRange defaultRange(String name) {
    if (name.equals(LM) || name.equals(LATTICE_LM)) return WeightRange.NON_NEGATIVE;
    if (name.equals(POSTERIOR_SHARPNESS)) return new WeightRange(MIN_SCALE, MAX_SCALE);
    if (name.startsWith(SYSTEM_PREFIX)) return new WeightRange(MIN_SYSTEM, MAX_SYSTEM);
    return WeightRange.ANY;
  }
}
