package steelyard.tune;

import java.util.Objects;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.TokenSequence;

/**
 * One dev utterance for tuning.
 *
 * @param scores    its scored hypotheses (features, ln P_LM, OOV and token counts, tie order, systems, tokens)
 * @param reference the reference in the scoring unit, normalised like the hypotheses' scoring tokens; tokens
 *                  flagged optional never count as errors
 * @param group     speaker, channel, sheet… (empty when none)
 */
public record DevUtterance(ScoredUtterance scores, TokenSequence reference, String group) {
  public DevUtterance {
    Objects.requireNonNull(scores, "scores");
    Objects.requireNonNull(reference, "reference");
    group = group == null ? "" : group;
  }

  /** Reference tokens that count (not optional): N of the error rate. */
  public int referenceTokens() {
    int n = 0;
    for (boolean o : reference.optional()) if (!o) n++;
    return n;
  }
}
