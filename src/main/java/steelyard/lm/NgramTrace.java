package steelyard.lm;

import java.util.List;

/**
 * One sentence scored prediction by prediction: for every token and the final {@code </s>}, its natural-log
 * probability as {@link LanguageModel#score} gives it, the order of the n-gram that decided it
 * ({@link LanguageModel#matchedOrder}: where the model backed off) and the model's context before it. The
 * predictions are scored exactly as rescoring scores a hypothesis ({@code <s>} first, an unknown token as
 * {@code <unk>}), so {@link #total()} equals the hypothesis' ln P bit for bit.
 *
 * <pre>{@code
 * NgramTrace t = NgramTrace.of(lm, List.of("bay", "four"));
 * for (int k = 0; k < t.size(); k++) System.out.println(t.token(k) + " " + t.matchedOrder(k) + " " + t.logProb(k));
 * }</pre>
 *
 * <p>Storage: per prediction one {@code double}, two {@code int}s and a copy of the state before it (two
 * {@code int[order−1]}); meant for explaining single sentences, not for hot loops. Immutable.
 */
public final class NgramTrace {
  private final List<String> tokens;
  private final int[] ids;
  private final double[] logProb;
  private final int[] order;
  private final LmState[] before;
  private final double total;

  private NgramTrace(List<String> tokens, int[] ids, double[] logProb, int[] order, LmState[] before, double total) {
    this.tokens = tokens;
    this.ids = ids;
    this.logProb = logProb;
    this.order = order;
    this.before = before;
    this.total = total;
  }

  /**
   * Scores {@code <s> tokens </s>} with {@code lm}.
   *
   * @throws UnsupportedOperationException when the model cannot report matched orders
   */
  public static NgramTrace of(LanguageModel lm, List<String> tokens) {
    int n = tokens.size() + 1;
    int[] ids = new int[n];
    double[] lp = new double[n];
    int[] ord = new int[n];
    LmState[] before = new LmState[n];
    LmState s = lm.newState();
    lm.beginSentence(s);
    double ln = 0;
    for (int k = 0; k < n; k++) {
      ids[k] = k < n - 1 ? lm.wordId(tokens.get(k)) : lm.sentenceEndId();
      before[k] = s.copy();
      ord[k] = lm.matchedOrder(s, ids[k]);
      lp[k] = lm.score(s, ids[k], s);
      // Summed in the order of HypothesisScorer (tokens, then </s>), so the total is the same double.
      if (k < n - 1) ln += lp[k];
    }
    return new NgramTrace(List.copyOf(tokens), ids, lp, ord, before, ln + lp[n - 1]);
  }

  /** Number of predictions: the tokens plus {@code </s>}. */
  public int size() {
    return ids.length;
  }

  /** The predicted token of prediction {@code k} as given, {@code </s>} for the last. */
  public String token(int k) {
    return k < tokens.size() ? tokens.get(k) : BackoffModel.SENTENCE_END;
  }

  /** The model's id of prediction {@code k} ({@link LanguageModel#unknownId()} for an unknown token). */
  public int id(int k) {
    return ids[k];
  }

  /** ln P(token k | its history), natural log. */
  public double logProb(int k) {
    return logProb[k];
  }

  /** Order of the n-gram that decided prediction {@code k} (0: the unknown-token floor). */
  public int matchedOrder(int k) {
    return order[k];
  }

  /**
   * The n-gram that decided prediction {@code k}, oldest first: the last {@code matchedOrder(k) − 1} tokens
   * before it ({@code <s>} before the first token), then the token itself (alone when the order is 0).
   */
  public List<String> ngram(int k) {
    int m = Math.max(1, order[k]);
    String[] g = new String[m];
    for (int j = 0; j < m; j++) {
      int pos = k - (m - 1) + j;
      g[j] = pos < 0 ? BackoffModel.SENTENCE_START : token(pos);
    }
    return List.of(g);
  }

  /**
   * Whether prediction {@code k} of this trace and prediction {@code j} of {@code other} (same model) start
   * from the same model context: then the same token gets the same probability on both sides.
   */
  public boolean sameContext(int k, NgramTrace other, int j) {
    return before[k].equals(other.before[j]);
  }

  /** ln P of the whole sentence including {@code </s>} (natural log). */
  public double total() {
    return total;
  }
}
