package steelyard.rescore;

/**
 * Hypothesis posteriors from log-linear totals: a softmax of α·total computed by log-sum-exp, so totals
 * of any magnitude (±1e6 and beyond) give finite posteriors. With several systems, whose scores need not
 * share a scale, the softmax runs within each system and the systems are mixed by their weights
 * normalised over the systems present in the utterance: p(h) = w_s(h) · softmax_s(h).
 */
public final class Posteriors {
  /**
   * Largest magnitude of α·total that is used as it is; beyond it values are clamped (so that a sum or
   * difference of two cannot overflow), which makes them indistinguishable. Rescoring refuses such values.
   */
  public static final double MAX_SCALED_TOTAL = Double.MAX_VALUE / 4;

  private Posteriors() {}

  /** ln Σ exp(x[i]) over {@code x[0..n)}, stable for large magnitudes; −∞ for n = 0. */
  public static double logSumExp(double[] x, int n) {
    double max = Double.NEGATIVE_INFINITY;
    for (int i = 0; i < n; i++) if (x[i] > max) max = x[i];
    if (max == Double.NEGATIVE_INFINITY || max == Double.POSITIVE_INFINITY) return max;
    double sum = 0;
    for (int i = 0; i < n; i++) sum += Math.exp(x[i] - max);
    return max + Math.log(sum);
  }

  /**
   * Posteriors of every hypothesis of {@code s} into {@code out}, which is returned.
   *
   * @param totals        log-linear totals, natural log
   * @param scale         α &gt; 0
   * @param systemWeights weight of each of {@code s.systems()} (any positive scale; normalised here)
   */
  public static double[] compute(ScoredUtterance s, double[] totals, double scale, double[] systemWeights, double[] out) {
    int n = s.size();
    int systems = s.systems().size();
    double[] max = new double[systems];
    double[] sum = new double[systems];
    java.util.Arrays.fill(max, Double.NEGATIVE_INFINITY);
    for (int i = 0; i < n; i++) {
      int k = s.systemIndex(i);
      double v = clamp(scale * totals[i]);
      if (v > max[k]) max[k] = v;
    }
    for (int i = 0; i < n; i++) {
      int k = s.systemIndex(i);
      sum[k] += Math.exp(clamp(scale * totals[i]) - max[k]);
    }
    double wsum = 0;
    for (int k = 0; k < systems; k++) wsum += systemWeights[k];
    for (int i = 0; i < n; i++) {
      int k = s.systemIndex(i);
      out[i] = (systemWeights[k] / wsum) * Math.exp(clamp(scale * totals[i]) - max[k]) / sum[k];
    }
    return out;
  }

  /**
   * Confidence-weighted vote mass: {@code post[i] · exp(c_i)} renormalised to sum 1, where c_i is feature
   * {@code feature} of hypothesis i, a natural-log confidence. Computed in log space, so confidences of any
   * magnitude stay finite. Writes into {@code out} (may be {@code post}) and returns it.
   */
  public static double[] weighByConfidence(ScoredUtterance s, double[] post, int feature, double[] out) {
    int n = s.size();
    double[] log = new double[n];
    for (int i = 0; i < n; i++) log[i] = post[i] > 0 ? Math.log(post[i]) + clamp(s.feature(i, feature)) : Double.NEGATIVE_INFINITY;
    // Relative to the maximum, not via ln Σ: at magnitudes where ln 2 vanishes next to c, ties must stay ties.
    double max = Double.NEGATIVE_INFINITY;
    for (int i = 0; i < n; i++) if (log[i] > max) max = log[i];
    double sum = 0;
    for (int i = 0; i < n; i++) sum += (out[i] = Math.exp(log[i] - max));
    for (int i = 0; i < n; i++) out[i] /= sum;
    return out;
  }

  /** Keeps α·total finite so that an overflow cannot turn the softmax into NaN. */
  private static double clamp(double v) {
    if (v > MAX_SCALED_TOTAL) return MAX_SCALED_TOTAL;
    if (v < -MAX_SCALED_TOTAL || Double.isNaN(v)) return -MAX_SCALED_TOTAL;
    return v;
  }
}
