package steelyard.lm.eval;

import java.util.List;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;

/**
 * Scores tokenised sentences with a {@link LanguageModel} and accumulates perplexity figures
 * ({@link PerplexityResult} states the convention). One instance per thread: it owns two states and the sums.
 */
public final class Perplexity {
  private static final double LN_10 = Math.log(10);

  private final LanguageModel lm;
  private final LmState s;
  private long sentences;
  private long words;
  private long oov;
  private double log10;
  private double log10WithOov;

  public Perplexity(LanguageModel lm) {
    this.lm = lm;
    this.s = lm.newState();
  }

  /** Scores one sentence (tokens already normalised, without markers), adds it to the totals and returns it. */
  public SentenceScore add(long line, List<String> tokens) {
    lm.beginSentence(s);
    int unk = lm.unknownId();
    int unknown = 0;
    double all = 0;
    double known = 0;
    for (String t : tokens) {
      int id = lm.wordId(t);
      double lp = lm.score(s, id, s) / LN_10;
      all += lp;
      if (id == unk) unknown++;
      else known += lp;
    }
    double end = lm.score(s, lm.sentenceEndId(), s) / LN_10;
    all += end;
    known += end;
    sentences++;
    words += tokens.size();
    oov += unknown;
    log10 += known;
    log10WithOov += all;
    return new SentenceScore(line, tokens.size(), unknown, all, known);
  }

  /** The totals so far. */
  public PerplexityResult result() {
    return new PerplexityResult(sentences, words, oov, log10, log10WithOov);
  }
}
