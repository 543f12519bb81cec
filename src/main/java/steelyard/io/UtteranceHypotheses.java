package steelyard.io;

import java.util.List;

/**
 * All hypotheses of one utterance, pooled across systems, in file order.
 *
 * @param uttId          the utterance id
 * @param hypotheses     every row of the utterance, in file order (never empty)
 * @param recognizerPick index into {@code hypotheses} of the recogniser's own choice ("rank 1"): the row with
 *                       the smallest rank; ties between systems go to the primary system when one is set,
 *                       else to the earliest row in the file
 */
public record UtteranceHypotheses(String uttId, List<Hypothesis> hypotheses, int recognizerPick) {
  public UtteranceHypotheses {
    hypotheses = List.copyOf(hypotheses);
    if (hypotheses.isEmpty()) throw new IllegalArgumentException("no hypotheses for " + uttId);
    if (recognizerPick < 0 || recognizerPick >= hypotheses.size())
      throw new IllegalArgumentException("recognizerPick out of range: " + recognizerPick);
  }

  public Hypothesis first() {
    return hypotheses.get(recognizerPick);
  }

  public int size() {
    return hypotheses.size();
  }
}
