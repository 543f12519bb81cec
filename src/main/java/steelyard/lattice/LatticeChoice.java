package steelyard.lattice;

import java.util.List;

/**
 * The path a confusion-network method chose for one utterance.
 *
 * @param tokens           the chosen tokens (empty arcs removed), in the network's unit
 * @param sourceHypothesis index of an input hypothesis whose normalised tokens equal {@code tokens}, or −1 when
 *                         the path is a new transcript that no input contains
 * @param score            the search objective of the path: logPosterior + λ′·lmLogProb + μ′·tokenCount (natural log, higher is better)
 * @param logPosterior     Σ natural log of the chosen arcs' posteriors (empty arcs included)
 * @param lmLogProb        natural-log LM probability of the path with sentence markers (0 when no LM was used)
 * @param tokenCount       number of non-empty tokens on the path
 * @param capped           true when the hypothesis cap or the beam limited the work
 */
public record LatticeChoice(
    List<String> tokens, int sourceHypothesis, double score, double logPosterior, double lmLogProb, int tokenCount, boolean capped) {
  public LatticeChoice {
    tokens = List.copyOf(tokens);
  }

  public boolean isNewTranscript() {
    return sourceHypothesis < 0;
  }
}
