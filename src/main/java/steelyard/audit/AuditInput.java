package steelyard.audit;

import java.util.Objects;
import steelyard.rescore.UtteranceResult;
import steelyard.text.TokenSequence;

/**
 * What the audit needs of one rescored utterance.
 *
 * @param result    the rescoring result: scores, weighting, totals, posteriors, the choice (and its network path)
 * @param reference the reference in the scoring unit, with the optional-token flags of the rules file (the same
 *                  tokenisation that scored the hypotheses); null when the utterance has no reference
 * @param group     speaker, sheet… for the per-group summary; null to take the picked hypothesis' {@code group}
 *                  column (rank 1's for a new transcript)
 */
public record AuditInput(UtteranceResult result, TokenSequence reference, String group) {
  public AuditInput {
    Objects.requireNonNull(result, "result");
  }

  /** An input without a group of its own. */
  public static AuditInput of(UtteranceResult result, TokenSequence reference) {
    return new AuditInput(result, reference, null);
  }

  /** The group used in the summary: the given one, else the picked (or rank 1's) hypothesis' group column. */
  public String effectiveGroup() {
    if (group != null) return group;
    var h = result.chosenHypothesis();
    return h != null ? h.group() : result.scores().hypothesis(result.scores().firstIndex()).group();
  }
}
