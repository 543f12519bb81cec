package steelyard.lm.eval;

/**
 * Perplexity and OOV rate of a model on a text, by the common convention: every word and one {@code </s>}
 * per sentence is a token; out-of-vocabulary words are scored as {@code <unk>} for the state but excluded
 * from the log-probability and from the token count of the perplexity, and counted separately.
 *
 * @param sentences       sentences (lines) scored
 * @param words           tokens of the text, {@code </s>} not counted
 * @param oov             out-of-vocabulary words
 * @param log10Prob       log10 P summed over the in-vocabulary tokens and the {@code </s>} tokens
 * @param log10ProbWithOov the same plus the {@code <unk>} scores of the out-of-vocabulary words
 */
public record PerplexityResult(long sentences, long words, long oov, double log10Prob, double log10ProbWithOov) {
  /** The convention in one sentence (reported with the figures). */
  public static final String CONVENTION = "tokens are words plus one </s> per sentence; out-of-vocabulary words "
      + "are excluded from log10_prob and from the perplexity's token count and are counted in oov";

  /** Words plus one {@code </s>} per sentence. */
  public long tokens() {
    return words + sentences;
  }

  /** Tokens that count for the perplexity: {@link #tokens()} − {@link #oov()}. */
  public long scoredTokens() {
    return tokens() - oov;
  }

  /** Natural-log probability of the scored tokens. */
  public double lnProb() {
    return log10Prob * Math.log(10);
  }

  /** 10^(−log10Prob / scoredTokens); NaN when nothing was scored. */
  public double perplexity() {
    long n = scoredTokens();
    return n == 0 ? Double.NaN : Math.pow(10, -log10Prob / n);
  }

  /** oov / words; 0 for an empty text. */
  public double oovRate() {
    return words == 0 ? 0 : (double) oov / words;
  }
}
