package steelyard.lattice;

import java.util.List;
import steelyard.lm.LanguageModel;

/**
 * Entry points of the confusion-network methods, used by the rescore command. Hypotheses are given as
 * normalised token lists in one unit (words, or grapheme clusters with the space token), with their
 * posteriors (summing to 1; the caller computes them, e.g. per system and mixed by system weights).
 */
public final class Lattices {
  private Lattices() {}

  /** Consensus decoding: the highest-posterior arc per slot. */
  public static LatticeChoice consensus(List<List<String>> hypotheses, double[] posteriors, LatticeSettings settings) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** The best path under Σ ln arc-posterior + λ′·LM + μ′·tokens, by beam search over (slot, LM state). */
  public static LatticeChoice search(
      List<List<String>> hypotheses, double[] posteriors, LanguageModel lm, LatticeSettings settings) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Fewest errors (S+D+I against {@code reference}) of any path through the network: the lattice oracle. */
  public static int oracleErrors(List<List<String>> hypotheses, double[] posteriors, List<String> reference, LatticeSettings settings) {
    throw new UnsupportedOperationException("not built yet");
  }
}
