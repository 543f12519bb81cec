package steelyard.lm.train;

import java.util.Arrays;
import java.util.Objects;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * What to train.
 *
 * @param order          n-gram order, 1 … 6
 * @param unit           word or character (grapheme cluster) tokens
 * @param normalisation  applied to every corpus line before tokenising; recorded in the model
 * @param smoothing      estimation method
 * @param vocabMinCount  words seen fewer than this many times become {@code <unk>} (0 or 1: keep all)
 * @param maxVocab       keep at most this many words, the most frequent (ties: lexicographic order); 0: no limit
 * @param cutoffs        per-order count cut-offs, index 0 = unigrams (must be 0); an n-gram of order k whose raw
 *                       count is ≤ cutoffs[k−1] is not listed, unless it is the context of a listed longer
 *                       n-gram; missing trailing orders repeat the last value; empty: no cut-offs
 * @param addK           the k of add-k smoothing (&gt; 0); ignored by the other methods
 */
public record TrainingOptions(
    int order, Unit unit, NormalisationOptions normalisation, Smoothing smoothing,
    int vocabMinCount, int maxVocab, int[] cutoffs, double addK) {

  public TrainingOptions {
    if (order < 1 || order > 6) throw new IllegalArgumentException("order must be 1..6: " + order);
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(normalisation, "normalisation");
    Objects.requireNonNull(smoothing, "smoothing");
    if (vocabMinCount < 0) throw new IllegalArgumentException("vocabMinCount must be >= 0");
    if (maxVocab < 0) throw new IllegalArgumentException("maxVocab must be >= 0");
    cutoffs = cutoffs == null ? new int[0] : cutoffs.clone();
    for (int c : cutoffs) if (c < 0) throw new IllegalArgumentException("cut-offs must be >= 0");
    if (cutoffs.length > 0 && cutoffs[0] != 0)
      throw new IllegalArgumentException("the unigram cut-off must be 0 (use a vocabulary limit instead)");
    if (!(addK > 0) || Double.isInfinite(addK)) throw new IllegalArgumentException("addK must be > 0: " + addK);
  }

  /** Word model with the given order and smoothing, exact normalisation, no limits, k = 1. */
  public static TrainingOptions of(int order, Smoothing smoothing) {
    return new TrainingOptions(order, Unit.WORD, NormalisationOptions.EXACT, smoothing, 0, 0, new int[0], 1.0);
  }

  public TrainingOptions withCutoffs(int... values) {
    return new TrainingOptions(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, values, addK);
  }

  public TrainingOptions withVocabulary(int minCount, int max) {
    return new TrainingOptions(order, unit, normalisation, smoothing, minCount, max, cutoffs, addK);
  }

  public TrainingOptions withAddK(double k) {
    return new TrainingOptions(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, cutoffs, k);
  }

  /** The cut-off of order {@code k} (1-based). */
  public int cutoff(int k) {
    if (cutoffs.length == 0) return 0;
    return cutoffs[Math.min(k, cutoffs.length) - 1];
  }

  /** Whether any cut-off is positive. */
  public boolean hasCutoffs() {
    for (int c : cutoffs) if (c > 0) return true;
    return false;
  }

  /** Whether the vocabulary is limited (needs a first pass over the corpus). */
  public boolean limitsVocabulary() {
    return vocabMinCount > 1 || maxVocab > 0;
  }

  @Override public int[] cutoffs() { return cutoffs.clone(); }

  @Override
  public boolean equals(Object o) {
    return o instanceof TrainingOptions t && order == t.order && unit == t.unit
        && normalisation.equals(t.normalisation) && smoothing == t.smoothing && vocabMinCount == t.vocabMinCount
        && maxVocab == t.maxVocab && Arrays.equals(cutoffs, t.cutoffs) && Double.compare(addK, t.addK) == 0;
  }

  @Override
  public int hashCode() {
    return Objects.hash(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, Arrays.hashCode(cutoffs), addK);
  }

  @Override
  public String toString() {
    return "TrainingOptions[order=" + order + ", unit=" + unit + ", smoothing=" + smoothing + ", vocabMinCount="
        + vocabMinCount + ", maxVocab=" + maxVocab + ", cutoffs=" + Arrays.toString(cutoffs) + ", addK=" + addK + "]";
  }
}
