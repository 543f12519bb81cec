package steelyard.lm;

import java.util.List;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * A back-off n-gram language model queried left to right through caller-owned {@link LmState}s.
 *
 * <p>All scores are <b>natural-log probabilities</b> (≤ 0, higher is better). Token ids are the model's own;
 * a token the model does not know maps to {@link #unknownId()} and scores as {@code <unk>} (never −∞).
 * Implementations are immutable after loading and safe for concurrent readers.
 *
 * <pre>{@code
 * LmState s = lm.newState(), t = lm.newState();
 * lm.beginSentence(s);
 * double ln = 0;
 * for (String w : words) { ln += lm.score(s, lm.wordId(w), t); s.copyFrom(t); }
 * ln += lm.score(s, lm.sentenceEndId(), t);
 * }</pre>
 */
public interface LanguageModel {

  /** The n-gram order (1 … 6). */
  int order();

  /** Word or character units (character models use {@link steelyard.text.Normaliser#SPACE_TOKEN}). */
  Unit unit();

  /** The normalisation the model was trained with; text is normalised the same way before scoring. */
  NormalisationOptions normalisation();

  /** Number of token ids, including {@code <s>}, {@code </s>} and {@code <unk>}. */
  int vocabularySize();

  /** The model's id for {@code token}, or {@link #unknownId()} when it is out of vocabulary. */
  int wordId(String token);

  /** The token with id {@code id}. */
  String token(int id);

  int unknownId();

  int sentenceStartId();

  int sentenceEndId();

  /** A state holder sized for this model. */
  LmState newState();

  /** Sets {@code out} to the state after {@code <s>}. */
  void beginSentence(LmState out);

  /**
   * ln P({@code word} | history of {@code in}); sets {@code out} to the state after {@code word}.
   * {@code in} and {@code out} may be the same object.
   */
  double score(LmState in, int word, LmState out);

  /**
   * The length of the n-gram whose own listed probability decided {@link #score}{@code (in, word, …)}: k when the
   * k-gram made of the last k−1 history tokens of {@code in} and {@code word} is listed and every longer one was
   * backed off from (each adding its history's back-off weight); 1 for a unigram, including a token scored as the
   * {@code <unk>} unigram; 0 when no n-gram decided (the unknown-token floor of a closed-vocabulary model). Does
   * not change {@code in}. A model without back-off structure may not support it.
   *
   * @throws UnsupportedOperationException when this model cannot say which n-gram decided a score
   */
  default int matchedOrder(LmState in, int word) {
    throw new UnsupportedOperationException(getClass().getSimpleName() + " does not report matched n-gram orders");
  }

  /** ln P of a whole tokenised sentence including {@code </s>}, starting after {@code <s>}. */
  default double sentenceLogProb(List<String> tokens) {
    LmState s = newState();
    beginSentence(s);
    double ln = 0;
    for (String t : tokens) ln += score(s, wordId(t), s);
    return ln + score(s, sentenceEndId(), s);
  }
}
