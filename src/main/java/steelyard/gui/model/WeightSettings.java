package steelyard.gui.model;

import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * The weights the window's sliders set, over a base that supplies everything else (feature and system
 * weights, ω, caps, beam, vote confidence). All weights multiply natural-log scores.
 *
 * @param lmWeight            λ, weight of the model's ln P(sentence)
 * @param lengthWeight        μ, added per token
 * @param posteriorScale      α &gt; 0, multiplies totals before the softmax (MBR and the network methods)
 * @param latticeLmWeight     λ′, LM weight of the confusion-network search
 * @param latticeLengthWeight μ′, per-token weight of the confusion-network search
 * @param method              how to choose
 */
public record WeightSettings(
    double lmWeight, double lengthWeight, double posteriorScale, double latticeLmWeight, double latticeLengthWeight,
    RescoreMethod method) {

  public WeightSettings {
    if (!(posteriorScale > 0) || !Double.isFinite(posteriorScale))
      throw new IllegalArgumentException("posterior sharpness must be finite and > 0: " + posteriorScale);
  }

  /** The settings that {@code w} states. */
  public static WeightSettings of(RescoreWeights w, RescoreMethod method) {
    return new WeightSettings(w.lmWeight(), w.lengthWeight(), w.posteriorScale(), w.latticeLmWeight(), w.latticeLengthWeight(),
        method);
  }

  /** {@code base} with these five weights. */
  public RescoreWeights apply(RescoreWeights base) {
    return new RescoreWeights(base.features(), lmWeight, base.oovWeight(), lengthWeight, posteriorScale, base.systemWeights(),
        base.mbrMaxHypotheses(), latticeLmWeight, latticeLengthWeight, base.beam(), base.latticeMaxHypotheses(),
        base.voteConfidence());
  }

  public WeightSettings withLmWeight(double v) {
    return new WeightSettings(v, lengthWeight, posteriorScale, latticeLmWeight, latticeLengthWeight, method);
  }

  public WeightSettings withLengthWeight(double v) {
    return new WeightSettings(lmWeight, v, posteriorScale, latticeLmWeight, latticeLengthWeight, method);
  }

  public WeightSettings withPosteriorScale(double v) {
    return new WeightSettings(lmWeight, lengthWeight, v, latticeLmWeight, latticeLengthWeight, method);
  }

  public WeightSettings withLatticeLmWeight(double v) {
    return new WeightSettings(lmWeight, lengthWeight, posteriorScale, v, latticeLengthWeight, method);
  }

  public WeightSettings withLatticeLengthWeight(double v) {
    return new WeightSettings(lmWeight, lengthWeight, posteriorScale, latticeLmWeight, v, method);
  }

  public WeightSettings withMethod(RescoreMethod m) {
    return new WeightSettings(lmWeight, lengthWeight, posteriorScale, latticeLmWeight, latticeLengthWeight, m);
  }

  /** Whether a change from {@code before} to this needs only the N-best re-rank (no worker). */
  public boolean rerankOnly(WeightSettings before) {
    return method == RescoreMethod.NBEST && before != null && before.method == RescoreMethod.NBEST;
  }
}
