package steelyard.rescore;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import steelyard.io.InputException;
import steelyard.text.Unit;

/**
 * A partial set of weights: what a weights file or the command-line options say, with {@code null} for
 * "not given". Layers combine with {@link #overlay}: the command line overrides the file, the file overrides
 * the defaults. Mutable; build, overlay, then {@link #resolve}.
 */
public final class WeightsSpec {
  /** Feature column name → weight, in the order given. */
  public final Map<String, Double> features = new LinkedHashMap<>();
  /** System name → weight. */
  public final Map<String, Double> systemWeights = new TreeMap<>();
  public Double lmWeight;
  public Double oovWeight;
  public Double lengthWeight;
  public Double posteriorScale;
  public Integer mbrMaxHypotheses;
  public Double latticeLmWeight;
  public Double latticeLengthWeight;
  public Integer beam;
  public Integer latticeMaxHypotheses;
  /** Feature column whose value (natural-log confidence) weighs each hypothesis's vote in the networks; null: none. */
  public String voteConfidence;
  /** The token unit the weights were tuned in; null when not recorded. */
  public Unit unit;
  /** The model the weights were tuned with; null when none or not recorded. */
  public ModelIdentity model;
  /** The method the weights were tuned for (version 3); null when not recorded. */
  public RescoreMethod method;
  /** How tuning made the weights (version 3); null when they were not tuned or not recorded. */
  public TuningRecord tuning;

  /** A new spec: this one with every value {@code top} gives replacing ours (map entries one by one). */
  public WeightsSpec overlay(WeightsSpec top) {
    WeightsSpec r = new WeightsSpec();
    r.features.putAll(features);
    r.features.putAll(top.features);
    r.systemWeights.putAll(systemWeights);
    r.systemWeights.putAll(top.systemWeights);
    r.lmWeight = pick(top.lmWeight, lmWeight);
    r.oovWeight = pick(top.oovWeight, oovWeight);
    r.lengthWeight = pick(top.lengthWeight, lengthWeight);
    r.posteriorScale = pick(top.posteriorScale, posteriorScale);
    r.mbrMaxHypotheses = pick(top.mbrMaxHypotheses, mbrMaxHypotheses);
    r.latticeLmWeight = pick(top.latticeLmWeight, latticeLmWeight);
    r.latticeLengthWeight = pick(top.latticeLengthWeight, latticeLengthWeight);
    r.beam = pick(top.beam, beam);
    r.latticeMaxHypotheses = pick(top.latticeMaxHypotheses, latticeMaxHypotheses);
    r.voteConfidence = pick(top.voteConfidence, voteConfidence);
    r.unit = pick(top.unit, unit);
    r.model = pick(top.model, model);
    r.method = pick(top.method, method);
    r.tuning = pick(top.tuning, tuning);
    return r;
  }

  /**
   * Fills every gap with its default: features listed in {@code featureNames} but not here weigh 1; the
   * features map keeps the order of {@code featureNames}. A vote confidence outside {@code featureNames} is an
   * {@link InputException}.
   */
  public RescoreWeights resolve(List<String> featureNames) {
    RescoreWeights d = RescoreWeights.defaults(featureNames);
    Map<String, Double> f = new LinkedHashMap<>();
    for (String n : featureNames) f.put(n, features.getOrDefault(n, 1.0));
    if (voteConfidence != null && !featureNames.contains(voteConfidence))
      throw InputException.option("--vote-confidence", "unknown feature name '" + voteConfidence + "'",
          "one of the --features columns: " + String.join(", ", featureNames));
    return new RescoreWeights(
        f,
        pick(lmWeight, d.lmWeight()),
        pick(oovWeight, d.oovWeight()),
        pick(lengthWeight, d.lengthWeight()),
        pick(posteriorScale, d.posteriorScale()),
        systemWeights,
        pick(mbrMaxHypotheses, d.mbrMaxHypotheses()),
        pick(latticeLmWeight, d.latticeLmWeight()),
        pick(latticeLengthWeight, d.latticeLengthWeight()),
        pick(beam, d.beam()),
        pick(latticeMaxHypotheses, d.latticeMaxHypotheses()),
        voteConfidence);
  }

  /** A spec that states every value of {@code w} (for saving the weights in effect). */
  public static WeightsSpec of(RescoreWeights w, Unit unit, ModelIdentity model) {
    WeightsSpec s = new WeightsSpec();
    s.features.putAll(w.features());
    s.systemWeights.putAll(w.systemWeights());
    s.lmWeight = w.lmWeight();
    s.oovWeight = w.oovWeight();
    s.lengthWeight = w.lengthWeight();
    s.posteriorScale = w.posteriorScale();
    s.mbrMaxHypotheses = w.mbrMaxHypotheses();
    s.latticeLmWeight = w.latticeLmWeight();
    s.latticeLengthWeight = w.latticeLengthWeight();
    s.beam = w.beam();
    s.latticeMaxHypotheses = w.latticeMaxHypotheses();
    s.voteConfidence = w.voteConfidence();
    s.unit = unit;
    s.model = model;
    return s;
  }

  private static <T> T pick(T preferred, T fallback) {
    return preferred != null ? preferred : fallback;
  }
}
