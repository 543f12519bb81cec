package steelyard.lm;

import java.util.Arrays;

/**
 * Recomputes back-off weights so that every context of a back-off model normalises: the step shared by the
 * static mixture approximation and by pruning, which both change the set of listed n-grams.
 *
 * <p>Given listed n-gram probabilities P*(w | h), the back-off weight of a context h is
 * <pre>
 *   bow(h) = (1 − Σ_{w listed after h} P*(w | h)) / (1 − Σ_{w listed after h} P(w | h′))
 * </pre>
 * where h′ is h without its first token and P(· | h′) is the (already renormalised) lower-order back-off
 * distribution (Katz 1987; the same identity underlies Stolcke 1998, eq. 4). Contexts are processed by
 * increasing length so that every lower-order distribution is final before it is used. Two further steps
 * make the result a proper ARPA model: the unigram distribution is rescaled to sum to 1 over every token but
 * {@code <s>}, and a context that is not listed itself (a context-only entry, which in the ARPA format has
 * back-off weight 1) is listed with its own back-off probability, which leaves the distribution of its
 * parent context unchanged while letting it carry a weight.
 *
 * <p>Guards: when the listed mass of a context reaches 1 the numerator is clamped to {@value #MIN_MASS};
 * when the lower-order mass of the listed words reaches 1 the weight is 1 (nothing is left to back off to).
 *
 * <p>Cost: O(n·k²) hash look-ups for n entries of order up to k, plus three {@code double} and one
 * {@code int} per entry of working arrays.
 */
public final class BackoffRenormaliser {
  /** Smallest probability mass left for backing off. */
  public static final double MIN_MASS = 1e-12;

  private final BackoffModel draft;
  private final int order;
  private final double[][] prob;
  private final double[][] bow;
  private final int[][] parent;

  private BackoffRenormaliser(BackoffModel draft) {
    this.draft = draft;
    this.order = draft.order();
    prob = new double[order][];
    bow = new double[order][];
    parent = new int[order][];
    int[] ids = new int[order];
    for (int k = 1; k <= order; k++) {
      int n = draft.entryCount(k);
      prob[k - 1] = new double[n];
      bow[k - 1] = new double[n];
      parent[k - 1] = new int[n];
      for (int i = 0; i < n; i++) {
        prob[k - 1][i] = draft.log10Prob(k, i);
        draft.ngram(k, i, ids);
        parent[k - 1][i] = k == 1 ? -1 : draft.entryIndex(Arrays.copyOf(ids, k - 1));
      }
    }
  }

  /**
   * A model with the same listed probabilities as {@code draft} (whose back-off weights are ignored), every
   * context's back-off weight recomputed, unigrams rescaled and context-only entries listed.
   */
  public static BackoffModel renormalise(BackoffModel draft) {
    BackoffRenormaliser r = new BackoffRenormaliser(draft);
    r.normaliseUnigrams();
    for (int k = 1; k < r.order; k++) {
      r.listContextOnlyEntries(k);
      r.computeWeights(k);
    }
    return r.build();
  }

  private void normaliseUnigrams() {
    double[] p = prob[0];
    int bos = draft.sentenceStartId();
    double total = 0;
    int[] id = new int[1];
    for (int i = 0; i < p.length; i++) {
      draft.ngram(1, i, id);
      if (id[0] != bos && !Double.isNaN(p[i])) total += Math.pow(10, p[i]);
    }
    if (!(total > 0)) return;
    double shift = Math.log10(total);
    for (int i = 0; i < p.length; i++) {
      draft.ngram(1, i, id);
      if (id[0] != bos && !Double.isNaN(p[i])) p[i] -= shift;
    }
  }

  private void listContextOnlyEntries(int k) {
    int[] ids = new int[k];
    for (int i = 0; i < prob[k - 1].length; i++) {
      if (!Double.isNaN(prob[k - 1][i])) continue;
      draft.ngram(k, i, ids);
      prob[k - 1][i] = backoffLog10(ids, 0, k - 1, ids[k - 1]);
    }
  }

  private void computeWeights(int k) {
    int contexts = prob[k - 1].length;
    double[] listedHigh = new double[contexts];
    double[] listedLow = new double[contexts];
    int[] ids = new int[k + 1];
    for (int i = 0; i < prob[k].length; i++) {
      double p = prob[k][i];
      if (Double.isNaN(p)) continue;
      int c = parent[k][i];
      draft.ngram(k + 1, i, ids);
      listedHigh[c] += Math.pow(10, p);
      listedLow[c] += Math.pow(10, backoffLog10(ids, 1, k, ids[k]));
    }
    for (int c = 0; c < contexts; c++) {
      double num = Math.max(MIN_MASS, 1 - listedHigh[c]);
      double den = 1 - listedLow[c];
      bow[k - 1][c] = den <= MIN_MASS ? 0.0 : Math.log10(num / den);
    }
  }

  /** log10 P(w | ids[from..to)) by back-off over the working arrays (bows of shorter contexts final). */
  private double backoffLog10(int[] ids, int from, int to, int w) {
    double acc = 0;
    int[] probe = new int[to - from + 1];
    for (int start = from; start <= to; start++) {
      int len = to - start;
      System.arraycopy(ids, start, probe, 0, len);
      probe[len] = w;
      int e = draft.entryIndex(Arrays.copyOf(probe, len + 1));
      if (e >= 0 && !Double.isNaN(prob[len][e])) return prob[len][e] + acc;
      if (len > 0) {
        int c = draft.entryIndex(Arrays.copyOfRange(ids, start, to));
        if (c >= 0) acc += bow[len - 1][c];
      }
    }
    int unk = draft.unknownId();
    int e = draft.entryIndex(new int[] {unk});
    if (w != unk && e >= 0 && !Double.isNaN(prob[0][e])) return prob[0][e] + acc;
    return draft.unknownFloorLog10() + acc;
  }

  private BackoffModel build() {
    BackoffModel.Builder b = new BackoffModel.Builder(order, draft.unit(), draft.normalisation());
    for (int id = 0; id < draft.vocabularySize(); id++) b.tokenId(draft.token(id));
    for (String line : draft.metadata()) b.metadata(line);
    b.unknownFloorLog10(draft.unknownFloorLog10());
    for (int k = 1; k <= order; k++) {
      int[] ids = new int[k];
      for (int i = 0; i < prob[k - 1].length; i++) {
        if (Double.isNaN(prob[k - 1][i])) continue;
        draft.ngram(k, i, ids);
        b.add(ids.clone(), prob[k - 1][i], k < order ? bow[k - 1][i] : 0.0);
      }
    }
    return b.build();
  }
}
