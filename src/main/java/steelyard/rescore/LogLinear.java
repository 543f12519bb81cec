package steelyard.rescore;

import java.util.List;

/**
 * The log-linear total of a hypothesis and its terms:
 * total = Σᵢ wᵢ·featureᵢ + λ·ln P_LM + ω·OOV + μ·tokens (natural-log units, higher is better).
 * Terms are summed in that fixed order so that the same weights always give bit-identical totals.
 *
 * <p>Immutable and thread-safe; holds the feature weights as a {@code double[F]} aligned with the features.
 */
public final class LogLinear {
  /** Index of the LM term in {@link #terms} after the F feature terms. */
  public static final int LM_TERM = 0;
  public static final int OOV_TERM = 1;
  public static final int LENGTH_TERM = 2;

  private final double[] featureWeights;
  private final double lmWeight;
  private final double oovWeight;
  private final double lengthWeight;

  public LogLinear(double[] featureWeights, double lmWeight, double oovWeight, double lengthWeight) {
    this.featureWeights = featureWeights.clone();
    this.lmWeight = lmWeight;
    this.oovWeight = oovWeight;
    this.lengthWeight = lengthWeight;
  }

  public static LogLinear of(RescoreWeights w, List<String> featureNames) {
    return new LogLinear(w.featureWeights(featureNames), w.lmWeight(), w.oovWeight(), w.lengthWeight());
  }

  /** λ, the weight of the LM's ln P (the direction along which the audit finds flip weights). */
  public double lmWeight() {
    return lmWeight;
  }

  /** Number of terms: F features, then LM, OOV, length. */
  public int termCount() {
    return featureWeights.length + 3;
  }

  /** The weighted contribution of term {@code t} (features first, then LM, OOV, length) to hypothesis {@code i}. */
  public double term(ScoredUtterance s, int i, int t) {
    int f = featureWeights.length;
    if (t < f) return featureWeights[t] * s.feature(i, t);
    switch (t - f) {
      case LM_TERM: return lmWeight * s.lmLogProb(i);
      case OOV_TERM: return oovWeight * s.oovCount(i);
      case LENGTH_TERM: return lengthWeight * s.tokenCount(i);
      default: throw new IndexOutOfBoundsException("term " + t);
    }
  }

  public double total(ScoredUtterance s, int i) {
    double t = 0;
    for (int f = 0; f < featureWeights.length; f++) t += featureWeights[f] * s.feature(i, f);
    t += lmWeight * s.lmLogProb(i);
    t += oovWeight * s.oovCount(i);
    t += lengthWeight * s.tokenCount(i);
    return t;
  }

  /**
   * The terms of hypothesis {@code i} written out for a message, e.g.
   * {@code feature.acoustic 2 × 1e+308 = Infinity, lm_term 0 × -31.2 = 0, …}.
   */
  public String describeTerms(ScoredUtterance s, int i, List<String> featureNames) {
    StringBuilder sb = new StringBuilder();
    for (int f = 0; f < featureWeights.length; f++)
      term(sb, "feature." + featureNames.get(f), featureWeights[f], s.feature(i, f));
    term(sb, "lm_term", lmWeight, s.lmLogProb(i));
    term(sb, "oov_term", oovWeight, s.oovCount(i));
    term(sb, "length_term", lengthWeight, s.tokenCount(i));
    return sb.toString();
  }

  private static void term(StringBuilder sb, String name, double weight, double value) {
    if (sb.length() > 0) sb.append(", ");
    sb.append(name).append(' ').append(weight).append(" × ").append(value).append(" = ").append(weight * value);
  }

  /** Totals of every hypothesis into {@code out} (length ≥ size), which is returned. */
  public double[] totals(ScoredUtterance s, double[] out) {
    for (int i = 0, n = s.size(); i < n; i++) out[i] = total(s, i);
    return out;
  }

  /**
   * The hypothesis with the highest total; ties go to the smaller rank, then the system name that sorts
   * first, then the earlier row of the file.
   */
  public static int best(ScoredUtterance s, double[] totals) {
    int best = 0;
    for (int i = 1, n = s.size(); i < n; i++) {
      if (totals[i] > totals[best] || (totals[i] == totals[best] && s.tieOrder(i) < s.tieOrder(best))) best = i;
    }
    return best;
  }
}
