package steelyard.rescore;

import java.util.List;
import steelyard.eval.EditCounts;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * A whole hypotheses file scored once and held in memory ({@link RescoreSession#loadAll}): what weight tuning,
 * the audit and the window re-weigh any number of times with {@link RescoreSession#choose} without scoring again.
 *
 * <p>Memory: per hypothesis about 8·F + 28 bytes of score terms plus its imported row and token lists (see
 * {@link ScoredUtterance}); per reference its token list.
 *
 * @param utterances        every utterance of the hypotheses file, in file order
 * @param missingHypotheses references without any hypothesis (in reference-file order); they count as all
 *                          deletions in a corpus error rate, as in {@code rescore} and {@code score}
 * @param missingReferences ids of utterances without a reference, when references were given (else empty)
 * @param withReferences    whether a references file was read
 * @param unit              the scoring unit of every token list
 * @param featureNames      the feature columns, in the order of {@link ScoredUtterance#feature}
 */
public record ScoredSet(
    List<Entry> utterances,
    List<Missing> missingHypotheses,
    List<String> missingReferences,
    boolean withReferences,
    Unit unit,
    List<String> featureNames) {

  public ScoredSet {
    utterances = List.copyOf(utterances);
    missingHypotheses = List.copyOf(missingHypotheses);
    missingReferences = List.copyOf(missingReferences);
    featureNames = List.copyOf(featureNames);
  }

  /**
   * One utterance.
   *
   * @param scores    its hypotheses' unweighted score terms
   * @param reference its reference in the scoring unit (with optional-token flags), or null when it has none
   * @param group     the reference's group, else the recogniser rank 1's group ({@code ""} when neither has one)
   */
  public record Entry(ScoredUtterance scores, TokenSequence reference, String group) {
    public String uttId() {
      return scores.uttId();
    }
  }

  /**
   * A reference without hypotheses.
   *
   * @param reference its tokens in the scoring unit
   */
  public record Missing(String uttId, TokenSequence reference, String group) {
    /** Its errors: every token that is not optional deleted. */
    public EditCounts errors() {
      return ReferenceScorer.allDeleted(reference);
    }
  }

  public int size() {
    return utterances.size();
  }

  /** Total hypotheses kept over all utterances. */
  public long hypotheses() {
    long n = 0;
    for (Entry e : utterances) n += e.scores().size();
    return n;
  }
}
