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
 * @param minCounts      per-order minimum counts, index k−1 = order k: an n-gram of order k is listed only when
 *                       its raw count is at least {@code minCounts[k−1]}, or when it is the context of a listed
 *                       longer n-gram. Every value is ≥ 1 and the unigram value is 1 (words are limited through
 *                       the vocabulary); orders beyond the array keep every n-gram (1); empty: keep everything
 * @param addK           the k of add-k smoothing (&gt; 0); ignored by the other methods
 */
public record TrainingOptions(
    int order, Unit unit, NormalisationOptions normalisation, Smoothing smoothing,
    int vocabMinCount, int maxVocab, int[] minCounts, double addK) {

  public TrainingOptions {
    if (order < 1 || order > 6) throw new IllegalArgumentException("order must be 1..6: " + order);
    Objects.requireNonNull(unit, "unit");
    Objects.requireNonNull(normalisation, "normalisation");
    Objects.requireNonNull(smoothing, "smoothing");
    if (vocabMinCount < 0) throw new IllegalArgumentException("vocabMinCount must be >= 0");
    if (maxVocab < 0) throw new IllegalArgumentException("maxVocab must be >= 0");
    minCounts = minCounts == null ? new int[0] : minCounts.clone();
    for (int c : minCounts) if (c < 1) throw new IllegalArgumentException("minimum counts must be >= 1: " + Arrays.toString(minCounts));
    if (minCounts.length > 0 && minCounts[0] != 1)
      throw new IllegalArgumentException("the unigram minimum count must be 1 (use a vocabulary limit instead): " + minCounts[0]);
    if (minCounts.length > order)
      throw new IllegalArgumentException("minimum counts for " + minCounts.length + " orders in a model of order " + order);
    if (!(addK > 0) || Double.isInfinite(addK)) throw new IllegalArgumentException("addK must be > 0: " + addK);
  }

  /** Word model with the given order and smoothing, exact normalisation, no limits, k = 1. */
  public static TrainingOptions of(int order, Smoothing smoothing) {
    return new TrainingOptions(order, Unit.WORD, NormalisationOptions.EXACT, smoothing, 0, 0, new int[0], 1.0);
  }

  /** These options, listing n-grams of order {@code k} (2 … order) only when seen at least {@code count} times. */
  public TrainingOptions withMinCount(int k, int count) {
    if (k < 2 || k > order) throw new IllegalArgumentException("order " + k + " is not in 2.." + order);
    int[] m = new int[Math.max(k, minCounts.length)];
    Arrays.fill(m, 1);
    System.arraycopy(minCounts, 0, m, 0, minCounts.length);
    m[k - 1] = count;
    return new TrainingOptions(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, m, addK);
  }

  public TrainingOptions withVocabulary(int minCount, int max) {
    return new TrainingOptions(order, unit, normalisation, smoothing, minCount, max, minCounts, addK);
  }

  public TrainingOptions withAddK(double k) {
    return new TrainingOptions(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, minCounts, k);
  }

  /** The minimum count of order {@code k} (1-based): n-grams seen fewer times are not listed; 1 keeps all. */
  public int minCount(int k) {
    return k <= minCounts.length ? minCounts[k - 1] : 1;
  }

  /** Whether the vocabulary is limited (needs a first pass over the corpus). */
  public boolean limitsVocabulary() {
    return vocabMinCount > 1 || maxVocab > 0;
  }

  @Override public int[] minCounts() { return minCounts.clone(); }

  @Override
  public boolean equals(Object o) {
    return o instanceof TrainingOptions t && order == t.order && unit == t.unit
        && normalisation.equals(t.normalisation) && smoothing == t.smoothing && vocabMinCount == t.vocabMinCount
        && maxVocab == t.maxVocab && Arrays.equals(minCounts, t.minCounts) && Double.compare(addK, t.addK) == 0;
  }

  @Override
  public int hashCode() {
    return Objects.hash(order, unit, normalisation, smoothing, vocabMinCount, maxVocab, Arrays.hashCode(minCounts), addK);
  }

  @Override
  public String toString() {
    return "TrainingOptions[order=" + order + ", unit=" + unit + ", smoothing=" + smoothing + ", vocabMinCount="
        + vocabMinCount + ", maxVocab=" + maxVocab + ", minCounts=" + Arrays.toString(minCounts) + ", addK=" + addK + "]";
  }
}
