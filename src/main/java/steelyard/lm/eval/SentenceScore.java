package steelyard.lm.eval;

/**
 * One sentence scored by a language model.
 *
 * @param line      1-based line number in the text file
 * @param words     number of tokens of the line after normalisation ({@code </s>} not counted)
 * @param oov       tokens among them that the model does not know (scored as {@code <unk>})
 * @param log10Prob log10 P of the whole sentence including {@code </s>} and the {@code <unk>} scores of
 *                  out-of-vocabulary tokens (≤ 0, higher is better): the value rescoring uses
 * @param log10ProbInVocabulary the same sum without the out-of-vocabulary tokens (what perplexity uses)
 */
public record SentenceScore(long line, int words, int oov, double log10Prob, double log10ProbInVocabulary) {}
