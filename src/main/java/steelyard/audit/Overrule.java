package steelyard.audit;

import java.util.List;
import steelyard.eval.TokenTally;
import steelyard.rescore.RescoreMethod;

/**
 * One utterance whose pick differs from the recogniser's rank 1 (its tokens in the scoring unit differ, as
 * {@link steelyard.rescore.UtteranceResult#changed()} says), with everything that explains it.
 *
 * @param uttId      the utterance id
 * @param group      the group of the summary (see {@link AuditInput#effectiveGroup()})
 * @param method     the rescoring method that picked
 * @param verdict    helped, hurt, neutral or unverified
 * @param pick       the picked transcript
 * @param first      the recogniser's rank 1 ({@link steelyard.rescore.ScoredUtterance#firstIndex()})
 * @param reference  the reference tokens joined as text (normalised); null when unverified
 * @param fixed      error pairs (reference, hypothesis) of rank 1 that the pick no longer has, most frequent first
 * @param broken     error pairs of the pick that rank 1 did not have
 * @param breakdown  the log-linear terms side by side; null when the pick is a new transcript (no hypothesis)
 * @param path       the network search terms of both paths; null for N-best and MBR
 * @param flip       how close the call was along the LM weight; null for MBR, and for the network methods without
 *                   a model (or when the pick wins only at an isolated tie point)
 * @param ngrams     the decisive n-grams; null without a model
 */
public record Overrule(
    String uttId, String group, RescoreMethod method, Verdict verdict, Side pick, Side first, String reference,
    List<TokenTally> fixed, List<TokenTally> broken, ScoreBreakdown breakdown, PathComparison path, FlipWeights flip,
    DecisiveNgrams ngrams) {

  public Overrule {
    fixed = List.copyOf(fixed);
    broken = List.copyOf(broken);
  }

  /** errors(rank 1) − errors(pick): positive when the overrule helped; 0 when unverified. */
  public long errorChange() {
    return verdict == Verdict.UNVERIFIED ? 0 : first.errors() - pick.errors();
  }

  /**
   * One side of the comparison.
   *
   * @param index  kept index of the hypothesis in the utterance's scores; −1 for a new transcript
   * @param system the hypothesis' system ("" when none, or for a new transcript)
   * @param rank   the hypothesis' rank; 0 for a new transcript
   * @param text   the raw text as imported; for a new transcript its tokens joined as the unit requires
   * @param tokens the tokens in the scoring unit
   * @param errors errors against the reference (substitutions + deletions + insertions); −1 when unverified
   */
  public record Side(int index, String system, int rank, String text, List<String> tokens, long errors) {
    public Side {
      tokens = List.copyOf(tokens);
    }

    public boolean isNewTranscript() {
      return index < 0;
    }
  }
}
