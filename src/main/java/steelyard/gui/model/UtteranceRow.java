package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import steelyard.text.Normaliser;

/**
 * One row of the utterance list.
 *
 * @param index         the utterance's position in the corpus
 * @param uttId         its id
 * @param group         its group (speaker, sheet…), may be empty
 * @param firstErrors   errors of rank 1, or {@link Corpus#NO_REFERENCE}
 * @param pickErrors    errors of the choice, or {@link Corpus#NO_REFERENCE}
 * @param verdict       the choice against rank 1
 * @param newTranscript whether the choice is a path no hypothesis contains
 * @param pickText      the chosen transcript (the raw row text, or the joined tokens of a new transcript)
 * @param firstText     rank 1's raw text
 * @param referenceText the reference's raw text, or null
 */
public record UtteranceRow(
    int index, String uttId, String group, int firstErrors, int pickErrors, Choices.Verdict verdict, boolean newTranscript,
    String pickText, String firstText, String referenceText) {

  /** Pick errors − rank-1 errors (negative: the choice is better), or null without a reference. */
  public Integer difference() {
    return firstErrors == Corpus.NO_REFERENCE ? null : pickErrors - firstErrors;
  }

  /** Every utterance's row under {@code choices}, in corpus order. */
  public static List<UtteranceRow> all(Corpus corpus, Choices choices) {
    List<UtteranceRow> out = new ArrayList<>(corpus.size());
    for (int u = 0; u < corpus.size(); u++) out.add(of(corpus, choices, u));
    return out;
  }

  /** The rows passing {@code filter} and matching {@code query}, in corpus order. */
  public static List<UtteranceRow> filtered(Corpus corpus, Choices choices, UtteranceFilter filter, String query) {
    List<UtteranceRow> out = new ArrayList<>();
    for (UtteranceRow r : all(corpus, choices)) if (filter.accepts(r) && UtteranceFilter.matches(r, query)) out.add(r);
    return out;
  }

  /** The row of utterance {@code u}. */
  public static UtteranceRow of(Corpus corpus, Choices choices, int u) {
    var s = corpus.scored(u);
    String pick = choices.isNew(u) ? Normaliser.join(choices.newTokens(u), corpus.unit()) : s.hypothesis(choices.chosen()[u]).text();
    var ref = corpus.reference(u);
    return new UtteranceRow(u, corpus.uttId(u), corpus.group(u), corpus.firstErrors(u), choices.errors()[u],
        choices.verdict(corpus, u), choices.isNew(u), pick, s.hypothesis(s.firstIndex()).text(), ref == null ? null : ref.text());
  }
}
