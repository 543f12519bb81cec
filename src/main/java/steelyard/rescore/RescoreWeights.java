package steelyard.rescore;

import java.nio.file.Path;
import java.util.Collection;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import steelyard.io.InputException;
import steelyard.io.Messages;
import steelyard.lattice.LatticeSettings;

/**
 * The weights in effect for one run, fully resolved (no gaps). All weights multiply natural-log scores.
 *
 * @param features             feature column name → weight wᵢ, in the order of the selected features
 * @param lmWeight             λ, weight of the model's ln P(sentence)
 * @param oovWeight            ω, added per out-of-vocabulary token
 * @param lengthWeight         μ, added per token (negative penalises long hypotheses)
 * @param posteriorScale       α &gt; 0, the posterior sharpness ({@code --posterior-sharpness}): multiplies totals before the softmax
 * @param systemWeights        system name → weight &gt; 0 (systems not listed weigh 1 before normalising)
 * @param mbrMaxHypotheses     cap on distinct texts (by posterior) entering the MBR sum
 * @param latticeLmWeight      λ′, LM weight of the confusion-network search
 * @param latticeLengthWeight  μ′, per-token weight of the confusion-network search
 * @param beam                 states kept per slot in the confusion-network search
 * @param latticeMaxHypotheses cap on hypotheses (by posterior) entering one confusion network
 * @param voteConfidence       feature column holding a natural-log confidence c per hypothesis, or null; when
 *                             given, the network methods weigh each hypothesis's mass by exp(c) (see
 *                             {@link Posteriors#weighByConfidence})
 */
public record RescoreWeights(
    Map<String, Double> features,
    double lmWeight,
    double oovWeight,
    double lengthWeight,
    double posteriorScale,
    Map<String, Double> systemWeights,
    int mbrMaxHypotheses,
    double latticeLmWeight,
    double latticeLengthWeight,
    int beam,
    int latticeMaxHypotheses,
    String voteConfidence) {

  public static final int DEFAULT_MBR_MAX_HYPOTHESES = 100;

  public RescoreWeights {
    features = Collections.unmodifiableMap(new LinkedHashMap<>(features));
    systemWeights = Collections.unmodifiableMap(new TreeMap<>(systemWeights));
    if (!(posteriorScale > 0) || !Double.isFinite(posteriorScale))
      throw new IllegalArgumentException("posterior sharpness must be finite and > 0: " + posteriorScale);
    if (mbrMaxHypotheses < 1 || beam < 1 || latticeMaxHypotheses < 1)
      throw new IllegalArgumentException("caps and beam must be >= 1");
  }

  /** Weights without a vote confidence. */
  public RescoreWeights(Map<String, Double> features, double lmWeight, double oovWeight, double lengthWeight,
      double posteriorScale, Map<String, Double> systemWeights, int mbrMaxHypotheses, double latticeLmWeight,
      double latticeLengthWeight, int beam, int latticeMaxHypotheses) {
    this(features, lmWeight, oovWeight, lengthWeight, posteriorScale, systemWeights, mbrMaxHypotheses, latticeLmWeight,
        latticeLengthWeight, beam, latticeMaxHypotheses, null);
  }

  /** Weight 1 for every feature, everything else at its default. */
  public static RescoreWeights defaults(List<String> featureNames) {
    Map<String, Double> f = new LinkedHashMap<>();
    for (String n : featureNames) f.put(n, 1.0);
    return new RescoreWeights(f, 0, 0, 0, 1, Map.of(), DEFAULT_MBR_MAX_HYPOTHESES, 0, 0,
        LatticeSettings.DEFAULT_BEAM, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
  }

  /** Feature weights as an array aligned with {@code featureNames} (absent names weigh 1). */
  public double[] featureWeights(List<String> featureNames) {
    double[] w = new double[featureNames.size()];
    for (int i = 0; i < w.length; i++) w[i] = features.getOrDefault(featureNames.get(i), 1.0);
    return w;
  }

  /** Weight of a system before normalisation: its listed weight, else 1. */
  public double systemWeight(String system) {
    return systemWeights.getOrDefault(system, 1.0);
  }

  /**
   * Refuses system names given a weight ({@code named}) that never occurred in the hypotheses file
   * ({@code present}): a misspelt system would otherwise weigh nothing and change nothing, silently.
   */
  public static void requireSystemsPresent(Collection<String> named, Set<String> present, Path hypotheses) {
    for (String name : named) {
      if (present.contains(name)) continue;
      boolean none = present.isEmpty() || present.equals(Set.of(""));
      throw InputException.option("--system-weight", "system '" + Messages.shown(name, 40) + "' does not occur in " + hypotheses,
          none ? "no --system-weight: the file has no system values" : "one of the systems present: " + Messages.shown(String.join(", ", new TreeSet<>(present)), 200));
    }
  }

  /** The confusion-network settings of these weights. */
  public LatticeSettings latticeSettings() {
    return new LatticeSettings(latticeLmWeight, latticeLengthWeight, beam, latticeMaxHypotheses);
  }
}
