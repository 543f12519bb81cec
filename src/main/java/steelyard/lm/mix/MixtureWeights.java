package steelyard.lm.mix;

import java.util.ArrayList;
import java.util.List;

/**
 * EM estimation of linear-interpolation weights that minimise held-out perplexity (the standard mixture EM;
 * Dempster, Laird &amp; Rubin 1977, as applied to interpolated language models by Jelinek &amp; Mercer 1980).
 *
 * <p>Input: for every held-out token t and component i, the natural-log probability ln Pᵢ(t) (a dense
 * {@code double[components][tokens]}). Each iteration sets λᵢ ← mean over t of λᵢPᵢ(t) / Σⱼ λⱼPⱼ(t); the
 * held-out log-likelihood never decreases from one iteration to the next (the EM guarantee), so perplexity
 * never increases. Iteration stops when the relative perplexity change falls below the tolerance.
 */
public final class MixtureWeights {
  private MixtureWeights() {}

  /**
   * The result of an EM run.
   *
   * @param weights          final mixture weights, summing to 1
   * @param perplexities     held-out perplexity before the first iteration (uniform weights) and after each
   * @param iterations       iterations run
   */
  public record Fit(double[] weights, List<Double> perplexities, int iterations) {
    public double finalPerplexity() {
      return perplexities.get(perplexities.size() - 1);
    }
  }

  /** Runs EM from uniform weights. */
  public static Fit fit(double[][] lnProbs, int maxIterations, double tolerance) {
    int k = lnProbs.length;
    if (k == 0) throw new IllegalArgumentException("no components");
    int n = lnProbs[0].length;
    for (double[] row : lnProbs)
      if (row.length != n) throw new IllegalArgumentException("components disagree on token count");
    double[] w = new double[k];
    java.util.Arrays.fill(w, 1.0 / k);
    List<Double> pps = new ArrayList<>();
    pps.add(perplexity(lnProbs, w));
    int it = 0;
    double[] next = new double[k];
    double[] terms = new double[k];
    while (it < maxIterations && n > 0) {
      java.util.Arrays.fill(next, 0);
      for (int t = 0; t < n; t++) {
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < k; i++) {
          terms[i] = w[i] > 0 ? Math.log(w[i]) + lnProbs[i][t] : Double.NEGATIVE_INFINITY;
          max = Math.max(max, terms[i]);
        }
        double z = 0;
        for (int i = 0; i < k; i++) z += Math.exp(terms[i] - max);
        for (int i = 0; i < k; i++) next[i] += Math.exp(terms[i] - max) / z;
      }
      for (int i = 0; i < k; i++) w[i] = next[i] / n;
      it++;
      double pp = perplexity(lnProbs, w);
      double prev = pps.get(pps.size() - 1);
      pps.add(pp);
      if (Math.abs(prev - pp) <= tolerance * prev) break;
    }
    return new Fit(w.clone(), List.copyOf(pps), it);
  }

  /** exp(−mean ln Σᵢ λᵢPᵢ(t)) over the tokens. */
  public static double perplexity(double[][] lnProbs, double[] weights) {
    int n = lnProbs[0].length;
    if (n == 0) return Double.NaN;
    double sum = 0;
    for (int t = 0; t < n; t++) {
      double max = Double.NEGATIVE_INFINITY;
      for (int i = 0; i < weights.length; i++)
        if (weights[i] > 0) max = Math.max(max, Math.log(weights[i]) + lnProbs[i][t]);
      double z = 0;
      for (int i = 0; i < weights.length; i++)
        if (weights[i] > 0) z += Math.exp(Math.log(weights[i]) + lnProbs[i][t] - max);
      sum += max + Math.log(z);
    }
    return Math.exp(-sum / n);
  }
}
