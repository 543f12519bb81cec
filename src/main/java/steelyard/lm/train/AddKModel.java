package steelyard.lm.train;

import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Add-k (additive) smoothing, for teaching comparisons: {@code P(w | h) = (c(h w) + k) / (c(h ·) + k·|V|)}
 * with raw counts, |V| the vocabulary without {@code <s>} (so {@code </s>} and {@code <unk>} included), and h
 * the longest suffix of the history (at most order−1 tokens) that occurred in training; with no such
 * suffix, h is empty (the add-k unigram). Held in memory only: it has no exact back-off form, since the
 * share of unseen words is not a constant multiple of a lower-order distribution.
 *
 * <p>Storage: the raw {@link NgramCounts} (about 30 bytes per n-gram), a {@code long} child total per
 * history, and a {@link BackoffModel} over the n-grams of orders below N used only to track states.
 * Immutable; safe for concurrent readers.
 */
final class AddKModel implements LanguageModel {
  private final NgramCounts counts;
  private final BackoffModel states;
  private final double k;
  private final int vocabularyWithoutStart;
  private final long[][] childTotal;
  private final long rootTotal;

  AddKModel(NgramCounts counts, BackoffModel states, double k) {
    this.counts = counts;
    this.states = states;
    this.k = k;
    this.vocabularyWithoutStart = states.vocabularySize() - 1;
    int order = counts.order();
    childTotal = new long[order][];
    long root = 0;
    int[] uw = counts.words(1);
    int[] uc = counts.counts(1);
    for (int e = 0; e < counts.size(1); e++) if (uw[e] != states.sentenceStartId()) root += uc[e];
    rootTotal = root;
    for (int j = 1; j < order; j++) {
      long[] t = new long[counts.size(j)];
      int[] par = counts.parents(j + 1);
      int[] c = counts.counts(j + 1);
      for (int e = 0; e < counts.size(j + 1); e++) t[par[e]] += c[e];
      childTotal[j] = t;
    }
  }

  @Override
  public double score(LmState in, int word, LmState out) {
    double p = probability(in, word);
    states.score(in, word, out);
    return Math.log(p);
  }

  private double probability(LmState in, int word) {
    int start = historyStart(in);
    if (start < 0) return 1.0 / vocabularyWithoutStart;
    int len = in.length() - start;
    int e = historyEntry(in, start);
    long total = len == 0 ? rootTotal : childTotal[len][e];
    int child = counts.find(len, e, word);
    long c = child < 0 ? 0 : counts.counts(len + 1)[child];
    return (c + k) / (total + k * vocabularyWithoutStart);
  }

  /** Add-k has no back-off: the order is that of the history suffix used, plus the word (0: the uniform floor). */
  @Override
  public int matchedOrder(LmState in, int word) {
    int start = historyStart(in);
    return start < 0 ? 0 : in.length() - start + 1;
  }

  /** Where the longest history suffix that occurred in training (with a non-zero child total) starts; −1: none. */
  private int historyStart(LmState in) {
    for (int start = 0; start <= in.length(); start++) {
      int len = in.length() - start;
      int e = historyEntry(in, start);
      if (len > 0 && e < 0) continue;
      if ((len == 0 ? rootTotal : childTotal[len][e]) > 0) return start;
    }
    return -1;
  }

  /** Count entry of the history suffix from {@code start}, −1 when absent (−1 also for the empty suffix). */
  private int historyEntry(LmState in, int start) {
    int e = -1;
    for (int j = 0; j < in.length() - start && (j == 0 || e >= 0); j++) e = counts.find(j, e, in.word(start + j));
    return e;
  }

  @Override public int order() { return states.order(); }
  @Override public Unit unit() { return states.unit(); }
  @Override public NormalisationOptions normalisation() { return states.normalisation(); }
  @Override public int vocabularySize() { return states.vocabularySize(); }
  @Override public int wordId(String token) { return states.wordId(token); }
  @Override public String token(int id) { return states.token(id); }
  @Override public int unknownId() { return states.unknownId(); }
  @Override public int sentenceStartId() { return states.sentenceStartId(); }
  @Override public int sentenceEndId() { return states.sentenceEndId(); }
  @Override public LmState newState() { return states.newState(); }
  @Override public void beginSentence(LmState out) { states.beginSentence(out); }

  /** The k added to every count. */
  double k() {
    return k;
  }
}
