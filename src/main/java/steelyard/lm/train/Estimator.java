package steelyard.lm.train;

import java.util.ArrayList;
import java.util.List;
import steelyard.lm.BackoffModel;

/**
 * Turns frozen {@link NgramCounts} into an interpolated back-off model (modified Kneser-Ney, Witten-Bell or
 * absolute discounting), in double precision.
 *
 * <p>For every listed n-gram h·w it computes the interpolated probability
 * {@code P(w|h) = α(h w) + γ(h)·P(w|h')} (h' = h without its first token, the unigram level interpolating
 * with the uniform 1/|V| over the vocabulary without {@code <s>}), and for every history its interpolation
 * weight γ(h), which is then exactly its back-off weight: a history never seen in training backs off with
 * weight 1, which is what interpolation with zero counts gives. When minimum counts drop n-grams, the back-off
 * weights are recomputed so that every context still sums to 1:
 * {@code bow(h) = (1 − Σ_listed P(w|h)) / (1 − Σ_listed P'(w|h'))}, P' being the pruned lower-order model.
 *
 * <p>Working storage: per entry an {@code int} adjusted count and a {@code double} probability (12 bytes),
 * per history a {@code long} total, a {@code double} discounted mass and a {@code double} weight (24 bytes),
 * a keep flag per entry when minimum counts drop n-grams.
 */
final class Estimator {
  private final NgramCounts counts;
  private final TrainingOptions options;
  private final int order;
  private final int vocabularyWithoutStart;
  private final int bos;
  private final int unk;
  final List<String> warnings = new ArrayList<>();
  final List<Discounts> discounts = new ArrayList<>();
  final long[] listed;

  private int[][] adjusted;
  private double[][] prob;
  private double[][] gamma;
  private boolean[][] keep;
  private double[][] bow;
  private int bosEntry = -1;
  private int unkEntry = -1;
  private double rootGamma;

  Estimator(NgramCounts counts, TrainingOptions options, int vocabularySize, int bos, int unk) {
    this.counts = counts;
    this.options = options;
    this.order = options.order();
    this.vocabularyWithoutStart = vocabularySize - 1;
    this.bos = bos;
    this.unk = unk;
    this.listed = new long[order];
    counts.freeze();
  }

  /** Runs the estimation; afterwards {@link #addTo} writes the model. */
  void estimate() {
    adjustCounts();
    for (int k = 1; k <= order; k++) discounts.add(discountsOf(k));
    interpolate();
    adjusted = null;
    applyMinCounts();
  }

  // ---- counts ----

  private void adjustCounts() {
    int[] unigramWords = counts.words(1);
    for (int e = 0; e < counts.size(1); e++) {
      if (unigramWords[e] == bos) bosEntry = e;
      if (unigramWords[e] == unk) unkEntry = e;
    }
    adjusted = new int[order + 1][];
    for (int k = 1; k <= order; k++) adjusted[k] = java.util.Arrays.copyOf(counts.counts(k), counts.size(k));
    if (options.smoothing() != Smoothing.MKN) return;
    // Kneser & Ney 1995: below the highest order, count distinct left extensions N1+(• w…); n-grams that
    // begin with <s> have no left extension and keep their raw counts.
    for (int k = 1; k < order; k++) {
      boolean[] startsWithBos = startsWithBos(k);
      int[] a = adjusted[k];
      for (int e = 0; e < a.length; e++) if (!startsWithBos[e]) a[e] = 0;
      int[] suffix = counts.suffixes(k + 1);
      int n = counts.size(k + 1);
      for (int e = 0; e < n; e++) {
        int s = suffix[e];
        if (!startsWithBos[s]) a[s]++;
      }
    }
  }

  private boolean[] startsWithBos(int k) {
    boolean[] first = new boolean[counts.size(1)];
    if (bosEntry >= 0) first[bosEntry] = true;
    for (int j = 2; j <= k; j++) {
      int[] par = counts.parents(j);
      boolean[] next = new boolean[counts.size(j)];
      for (int e = 0; e < next.length; e++) next[e] = first[par[e]];
      first = next;
    }
    return first;
  }

  private Discounts discountsOf(int k) {
    long[] n = new long[4];
    int[] a = adjusted[k];
    for (int e = 0; e < a.length; e++) {
      if (k == 1 && e == bosEntry) continue;
      int c = a[e];
      if (c >= 1 && c <= 4) n[c - 1]++;
    }
    return switch (options.smoothing()) {
      case MKN -> Discounts.modifiedKneserNey(k, n, warnings);
      case ABS -> Discounts.absolute(k, n, warnings);
      default -> Discounts.none(k, n);
    };
  }

  // ---- interpolation ----

  private void interpolate() {
    prob = new double[order + 1][];
    gamma = new double[order + 1][];
    double[] total = new double[1];
    double[] mass = new double[1];
    int[] distinct = new int[1];
    accumulate(1, null, total, mass, distinct, true);
    rootGamma = weight(total[0], mass[0], distinct[0]);
    double uniform = 1.0 / vocabularyWithoutStart;
    prob[1] = new double[counts.size(1)];
    fillUnigrams(total[0], distinct[0], rootGamma, uniform);
    for (int k = 2; k <= order; k++) {
      int histories = counts.size(k - 1);
      total = new double[histories];
      mass = new double[histories];
      distinct = new int[histories];
      accumulate(k, counts.parents(k), total, mass, distinct, false);
      double[] g = new double[histories];
      for (int h = 0; h < histories; h++) g[h] = total[h] > 0 ? weight(total[h], mass[h], distinct[h]) : 1.0;
      gamma[k - 1] = g;
      prob[k] = new double[counts.size(k)];
      fillHigher(k, total, g);
    }
  }

  /** Sums, per history, the adjusted counts of its children, their discounts and their number. */
  private void accumulate(int k, int[] parentOf, double[] total, double[] mass, int[] distinct, boolean root) {
    int[] a = adjusted[k];
    Discounts d = discounts.get(k - 1);
    boolean discounted = d.values().length > 0;
    int n = counts.size(k);
    for (int e = 0; e < n; e++) {
      if (root && e == bosEntry) continue;
      int c = a[e];
      if (c == 0) continue;
      int h = root ? 0 : parentOf[e];
      total[h] += c;
      distinct[h]++;
      if (discounted) mass[h] += d.forCount(c);
    }
  }

  private double weight(double total, double mass, int distinct) {
    if (options.smoothing() == Smoothing.WB) return distinct / (total + distinct);
    return mass / total;
  }

  /**
   * The share α(h w) of an n-gram with adjusted count c in a history with the given total and number of
   * distinct followers: (c − D(c)) / total for the discounting methods, c / (total + distinct) for Witten-Bell.
   */
  private double alpha(int k, int c, double total, int distinct) {
    if (c == 0) return 0;
    if (options.smoothing() == Smoothing.WB) return c / (total + distinct);
    return (c - discounts.get(k - 1).forCount(c)) / total;
  }

  private void fillUnigrams(double total, int distinct, double g, double uniform) {
    int[] a = adjusted[1];
    for (int e = 0; e < a.length; e++) {
      prob[1][e] = e == bosEntry ? 0 : alpha(1, a[e], total, distinct) + g * uniform;
    }
  }

  private void fillHigher(int k, double[] total, double[] g) {
    int[] a = adjusted[k];
    int[] par = counts.parents(k);
    int[] suffix = counts.suffixes(k);
    double[] lower = prob[k - 1];
    int n = counts.size(k);
    int[] distinct = null;
    if (options.smoothing() == Smoothing.WB) {
      distinct = new int[counts.size(k - 1)];
      for (int e = 0; e < n; e++) distinct[par[e]]++;
    }
    for (int e = 0; e < n; e++) {
      int h = par[e];
      prob[k][e] = alpha(k, a[e], total[h], distinct == null ? 0 : distinct[h]) + g[h] * lower[suffix[e]];
    }
  }

  /** Probability of a vocabulary word that was never seen (only {@code <unk>} can be): γ(ε)/|V|. */
  double unseenUnigram() {
    return rootGamma / vocabularyWithoutStart;
  }

  // ---- minimum counts ----

  private void applyMinCounts() {
    keep = new boolean[order + 1][];
    bow = new double[order + 1][];
    boolean dropped = false;
    boolean[] keptChild = null;
    for (int k = order; k >= 1; k--) {
      int n = counts.size(k);
      boolean[] kk = new boolean[n];
      int[] raw = counts.counts(k);
      int min = options.minCount(k);
      for (int e = 0; e < n; e++) {
        kk[e] = k == 1 || raw[e] >= min || (keptChild != null && keptChild[e]);
        if (!kk[e]) dropped = true;
      }
      keep[k] = kk;
      if (k > 1) {
        keptChild = new boolean[counts.size(k - 1)];
        int[] par = counts.parents(k);
        for (int e = 0; e < n; e++) if (kk[e]) keptChild[par[e]] = true;
      }
    }
    for (int k = 1; k <= order; k++) {
      long c = 0;
      for (boolean b : keep[k]) if (b) c++;
      listed[k - 1] = c + (k == 1 && unkEntry < 0 ? 1 : 0);
    }
    for (int k = 1; k < order; k++) bow[k] = dropped ? recomputedBackoff(k) : gamma[k];
  }

  /** Back-off weights of the histories of order k so that the pruned model normalises (orders below done). */
  private double[] recomputedBackoff(int k) {
    int histories = counts.size(k);
    double[] listedMass = new double[histories];
    double[] lowerMass = new double[histories];
    int[] par = counts.parents(k + 1);
    int[] suffix = counts.suffixes(k + 1);
    boolean[] kept = keep[k + 1];
    for (int e = 0; e < kept.length; e++) {
      if (!kept[e]) continue;
      listedMass[par[e]] += prob[k + 1][e];
      lowerMass[par[e]] += pruned(k, suffix[e]);
    }
    double[] b = new double[histories];
    for (int h = 0; h < histories; h++) {
      double den = 1 - lowerMass[h];
      b[h] = den > 1e-12 ? (1 - listedMass[h]) / den : gamma[k + 1 - 1][h];
      if (!(b[h] > 0)) b[h] = Double.MIN_NORMAL;
    }
    return b;
  }

  /** P(last token of entry e | its context) in the pruned model (orders ≤ k complete). */
  private double pruned(int k, int e) {
    double weight = 1;
    for (int j = k; j >= 1; j--) {
      if (keep[j][e]) return weight * prob[j][e];
      int h = counts.parents(j)[e];
      if (keep[j - 1][h]) weight *= bow[j - 1][h];
      e = counts.suffixes(j)[e];
    }
    throw new IllegalStateException("unigrams are always kept");
  }

  // ---- output ----

  /**
   * Adds every listed n-gram to {@code builder}, whose token ids must equal the counting ids. N-grams go in
   * depth-first trie order (each unigram, then its listed extensions, …): with the trie numbering of
   * {@link NgramCounts#freeze()} this reads every array front to back. A kept entry's parent is always kept
   * (see {@link #applyMinCounts()}) and is added just before its subtree, so the builder entry of every
   * prefix is on the walk's stack ({@code entry[k]}) and each n-gram costs one
   * {@link BackoffModel.Builder#addChild} (one hash-table put). Call once: it converts the working arrays to
   * log10 in place and releases the counts.
   */
  void addTo(BackoffModel.Builder builder) {
    counts.releaseCountsAndSuffixes();
    for (int k = 1; k <= order; k++) builder.expectEntries(k, (int) listed[k - 1]);
    toLog10();
    int[][] childStart = new int[order + 1][];
    for (int k = 1; k < order; k++) childStart[k + 1] = counts.childStarts(k);
    int[][] words = new int[order + 1][];
    for (int k = 1; k <= order; k++) words[k] = counts.words(k);
    int[] entry = new int[order + 1];
    int[] position = new int[order + 1];
    int[] end = new int[order + 1];
    for (int u = 0; u < counts.size(1); u++) {
      double lu = u == bosEntry ? START_LOG10 : prob[1][u];
      entry[1] = builder.addChild(1, -1, words[1][u], lu, order > 1 ? bow[1][u] : 0);
      if (u == 0 && unkEntry < 0) builder.addChild(1, -1, unk, Math.log10(unseenUnigram()), 0);
      if (order == 1) continue;
      int k = 2;
      position[2] = childStart[2][u];
      end[2] = childStart[2][u + 1];
      while (k >= 2) {
        if (position[k] == end[k]) {
          k--;
          continue;
        }
        int e = position[k]++;
        if (!keep[k][e]) continue;
        entry[k] = builder.addChild(k, entry[k - 1], words[k][e], prob[k][e], k < order ? bow[k][e] : 0);
        if (k < order) {
          k++;
          position[k] = childStart[k][e];
          end[k] = childStart[k][e + 1];
        }
      }
    }
  }

  /** Turns the probabilities and back-off weights into log10 in place (independent per entry: in parallel). */
  private void toLog10() {
    for (int k = 1; k <= order; k++) {
      double[] p = prob[k];
      java.util.Arrays.parallelSetAll(p, i -> Math.log10(p[i]));
      if (k < order && bow[k] != null) {
        double[] b = bow[k];
        java.util.Arrays.parallelSetAll(b, i -> Math.log10(b[i]));
      }
    }
  }

  /** The customary log10 "probability" of {@code <s>}, which is never predicted. */
  static final double START_LOG10 = -99;
}
