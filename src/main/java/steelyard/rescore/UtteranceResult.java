package steelyard.rescore;

import java.util.List;
import steelyard.io.Hypothesis;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;

/**
 * The choice for one utterance with everything needed to explain it: the unweighted terms
 * ({@link ScoredUtterance}), the weighting ({@link LogLinear}), every hypothesis' total and posterior, and
 * what the method chose. Each term's weighted contribution is {@code weighting().term(scores(), i, t)}, so
 * nothing is recomputed to explain a choice.
 *
 * <p>Storage: the scores plus two {@code double[n]} (totals, posteriors), and for the network methods the
 * confusion network the choice was made in (kept so that scoring against a reference, e.g. the lattice oracle,
 * never builds it a second time).
 *
 * @param chosen    kept index of the chosen hypothesis, or −1 when a network method produced a new transcript
 * @param newTokens the chosen tokens when {@code chosen} is −1 (else empty)
 * @param mbr       the MBR details for {@link RescoreMethod#MBR}, else null
 * @param lattice   the network path for {@link RescoreMethod#CONSENSUS} and {@link RescoreMethod#LATTICE}, else null
 * @param network   the confusion network {@code lattice} was chosen in (built from {@code posteriors}), else null
 */
public record UtteranceResult(
    ScoredUtterance scores,
    LogLinear weighting,
    RescoreMethod method,
    double[] totals,
    double[] posteriors,
    int chosen,
    List<String> newTokens,
    MbrChoice mbr,
    LatticeChoice lattice,
    ConfusionNetwork network) {

  public UtteranceResult {
    newTokens = List.copyOf(newTokens);
  }

  public String uttId() {
    return scores.uttId();
  }

  public boolean isNewTranscript() {
    return chosen < 0;
  }

  /** The chosen row, or null for a new transcript. */
  public Hypothesis chosenHypothesis() {
    return chosen < 0 ? null : scores.hypothesis(chosen);
  }

  /** The chosen tokens in the scoring unit. */
  public List<String> chosenTokens() {
    return chosen < 0 ? newTokens : scores.tokens(chosen).tokens();
  }

  /** Whether the MBR cap or the network's cap/beam limited the work. */
  public boolean capped() {
    return (mbr != null && mbr.capped()) || (lattice != null && lattice.capped());
  }

  /** Whether the chosen tokens differ from those of the recogniser's rank 1. */
  public boolean changed() {
    return !chosenTokens().equals(scores.tokens(scores.firstIndex()).tokens());
  }
}
