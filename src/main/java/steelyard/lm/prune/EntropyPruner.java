package steelyard.lm.prune;

import java.util.Arrays;
import steelyard.lm.BackoffModel;
import steelyard.lm.BackoffRenormaliser;

/**
 * Relative-entropy pruning of a back-off model (Stolcke 1998, "Entropy-based pruning of backoff language
 * models"): an n-gram (h, w) of order ≥ 2 is removed when removing it alone would raise the relative
 * entropy D(P ‖ P′) between the original and the pruned model by less than the threshold θ (in nats; the
 * relative perplexity increase is e^D − 1 ≈ D). Back-off weights are then recomputed
 * ({@link BackoffRenormaliser}).
 *
 * <p>For one n-gram, with L(h) the words listed after h, bow the back-off weight and h′ the shortened
 * history (Stolcke 1998, eqs. 4–9):
 * <pre>
 *   bow′(h) = (1 − Σ_{v∈L(h)} P(v|h) + P(w|h)) / (1 − Σ_{v∈L(h)} P(v|h′) + P(w|h′))
 *   D = −P(h) · { P(w|h)·[ln P(w|h′) + ln bow′(h) − ln P(w|h)]
 *                 + (1 − Σ_{v∈L(h)} P(v|h))·[ln bow′(h) − ln bow(h)] }
 * </pre>
 * P(h) is the model's own chain-rule probability of the history (with P(&lt;s&gt;) = 1). All D are computed
 * against the original model, as in the paper. An n-gram that is the prefix of a kept longer n-gram is kept
 * (the file must stay prefix-closed), so orders are visited from the highest down; unigrams are never
 * pruned. θ = 0 keeps everything; a larger θ prunes a superset.
 *
 * <p>Kneser-Ney models lose more under heavy entropy pruning than Witten-Bell or absolute-discount models,
 * because their lower-order distributions are built from continuation counts and are poor stand-ins for the
 * pruned higher-order ones (Chelba et al. 2010): train with {@code --smoothing wb} or {@code abs} when
 * the model is to be pruned hard.
 */
public final class EntropyPruner {
  private EntropyPruner() {}

  /**
   * Outcome of pruning.
   *
   * @param model   the pruned, renormalised model
   * @param before  listed n-grams per order before (index 0 = unigrams)
   * @param after   listed n-grams per order after
   */
  public record Result(BackoffModel model, int[] before, int[] after) {}

  /** Prunes {@code model} with threshold {@code theta} (nats, ≥ 0). */
  public static Result prune(BackoffModel model, double theta) {
    if (!(theta >= 0) || Double.isInfinite(theta)) throw new IllegalArgumentException("threshold must be finite and >= 0: " + theta);
    int order = model.order();
    boolean[][] removed = new boolean[order][];
    for (int k = 1; k <= order; k++) removed[k - 1] = new boolean[model.entryCount(k)];
    if (theta > 0) {
      for (int k = order; k >= 2; k--) markOrder(model, k, theta, removed);
    }
    int[] before = new int[order];
    int[] after = new int[order];
    BackoffModel.Builder b = new BackoffModel.Builder(order, model.unit(), model.normalisation());
    for (int id = 0; id < model.vocabularySize(); id++) b.tokenId(model.token(id));
    for (String line : model.metadata()) b.metadata(line);
    b.metadata("steelyard.pruned.threshold=" + theta);
    b.unknownFloorLog10(model.unknownFloorLog10());
    for (int k = 1; k <= order; k++) {
      int[] ids = new int[k];
      for (int i = 0; i < model.entryCount(k); i++) {
        double p = model.log10Prob(k, i);
        if (Double.isNaN(p)) continue;
        before[k - 1]++;
        if (removed[k - 1][i]) continue;
        after[k - 1]++;
        model.ngram(k, i, ids);
        b.add(ids.clone(), p, 0.0);
      }
    }
    BackoffModel pruned = theta > 0 ? BackoffRenormaliser.renormalise(b.build()) : model;
    return new Result(pruned, before, after);
  }

  private static void markOrder(BackoffModel m, int k, double theta, boolean[][] removed) {
    int n = m.entryCount(k);
    int contexts = m.entryCount(k - 1);
    int[] ids = new int[k];
    int[] parent = new int[n];
    double[] listedHigh = new double[contexts];
    double[] listedLow = new double[contexts];
    double[] lowProb = new double[n];
    for (int i = 0; i < n; i++) {
      parent[i] = -1;
      if (Double.isNaN(m.log10Prob(k, i))) continue;
      m.ngram(k, i, ids);
      int c = m.entryIndex(Arrays.copyOf(ids, k - 1));
      parent[i] = c;
      lowProb[i] = Math.pow(10, m.log10Prob(Arrays.copyOfRange(ids, 1, k - 1), ids[k - 1]));
      listedHigh[c] += Math.pow(10, m.log10Prob(k, i));
      listedLow[c] += lowProb[i];
    }
    boolean[] hasKeptChild = keptChildren(m, k, removed);
    double[] historyProb = new double[contexts];
    Arrays.fill(historyProb, Double.NaN);
    for (int i = 0; i < n; i++) {
      int c = parent[i];
      if (c < 0 || hasKeptChild[i]) continue;
      if (Double.isNaN(historyProb[c])) historyProb[c] = historyProbability(m, k - 1, c);
      double pwh = Math.pow(10, m.log10Prob(k, i));
      double pwLow = lowProb[i];
      double bow = Math.pow(10, contextBackoff(m, k - 1, c));
      double d = delta(historyProb[c], pwh, pwLow, bow, listedHigh[c], listedLow[c]);
      if (d < theta) removed[k - 1][i] = true;
    }
  }

  /**
   * The relative-entropy increase (nats) of removing one listed n-gram alone, computed from scratch: slow,
   * for audits and tests. {@code ngram} holds token ids, history first.
   */
  public static double relativeEntropyIncrease(BackoffModel m, int[] ngram) {
    int k = ngram.length;
    if (k < 2) throw new IllegalArgumentException("unigrams are never pruned");
    int e = m.entryIndex(ngram);
    if (e < 0 || Double.isNaN(m.log10Prob(k, e))) throw new IllegalArgumentException("n-gram is not listed");
    int[] history = Arrays.copyOf(ngram, k - 1);
    int c = m.entryIndex(history);
    double listedHigh = 0, listedLow = 0;
    int[] ids = new int[k];
    for (int i = 0; i < m.entryCount(k); i++) {
      if (Double.isNaN(m.log10Prob(k, i))) continue;
      m.ngram(k, i, ids);
      if (!Arrays.equals(ids, 0, k - 1, history, 0, k - 1)) continue;
      listedHigh += Math.pow(10, m.log10Prob(k, i));
      listedLow += Math.pow(10, m.log10Prob(Arrays.copyOfRange(ids, 1, k - 1), ids[k - 1]));
    }
    double pwh = Math.pow(10, m.log10Prob(k, e));
    double pwLow = Math.pow(10, m.log10Prob(Arrays.copyOfRange(ngram, 1, k - 1), ngram[k - 1]));
    return delta(historyProbability(m, k - 1, c), pwh, pwLow, Math.pow(10, contextBackoff(m, k - 1, c)), listedHigh, listedLow);
  }

  /** Stolcke 1998's D for one n-gram; +∞ (never prune) when the renormalised weight would be undefined. */
  private static double delta(double pH, double pwh, double pwLow, double bow, double listedHigh, double listedLow) {
    double numer = 1 - listedHigh + pwh;
    double denom = 1 - listedLow + pwLow;
    if (!(numer > 0) || !(denom > 0)) return Double.POSITIVE_INFINITY;
    double bowNew = numer / denom;
    double rest = Math.max(0, 1 - listedHigh);
    return -pH * (pwh * (Math.log(pwLow) + Math.log(bowNew) - Math.log(pwh)) + rest * (Math.log(bowNew) - Math.log(bow)));
  }

  /** For entries of order k: whether some listed, kept n-gram of order k+1 extends them. */
  private static boolean[] keptChildren(BackoffModel m, int k, boolean[][] removed) {
    boolean[] has = new boolean[m.entryCount(k)];
    if (k == m.order()) return has;
    int[] ids = new int[k + 1];
    for (int i = 0; i < m.entryCount(k + 1); i++) {
      if (Double.isNaN(m.log10Prob(k + 1, i)) || removed[k][i]) continue;
      m.ngram(k + 1, i, ids);
      int c = m.entryIndex(Arrays.copyOf(ids, k));
      if (c >= 0) has[c] = true;
    }
    return has;
  }

  private static double contextBackoff(BackoffModel m, int k, int c) {
    double p = m.log10Prob(k, c);
    return Double.isNaN(p) ? 0.0 : m.log10Backoff(k, c);
  }

  /** Chain-rule probability of the history entry (order k, index c) under the model; P(&lt;s&gt;) = 1. */
  private static double historyProbability(BackoffModel m, int k, int c) {
    int[] ids = new int[k];
    m.ngram(k, c, ids);
    double log10 = 0;
    int start = ids[0] == m.sentenceStartId() ? 1 : 0;
    for (int j = start; j < k; j++) log10 += m.log10Prob(Arrays.copyOfRange(ids, 0, j), ids[j]);
    return Math.pow(10, log10);
  }
}
