package steelyard.lattice;

/**
 * Weights and limits of a confusion-network search.
 *
 * @param lmWeight       λ′: weight of the LM's natural-log probability of the path (0 = consensus decoding)
 * @param lengthWeight   μ′: added per non-empty token on the path (natural-log units; negative penalises length)
 * @param beam           states kept per slot in the LM-rescored search (larger = fewer search errors, slower)
 * @param maxHypotheses  cap on how many hypotheses (by posterior) enter the network; the result says when it applied
 */
public record LatticeSettings(double lmWeight, double lengthWeight, int beam, int maxHypotheses) {
  /** Default beam, documented in the README with its measured search-error rate. */
  public static final int DEFAULT_BEAM = 64;
  /** Default cap on hypotheses entering one network. */
  public static final int DEFAULT_MAX_HYPOTHESES = 200;

  public LatticeSettings {
    if (beam < 1) throw new IllegalArgumentException("beam must be >= 1: " + beam);
    if (maxHypotheses < 1) throw new IllegalArgumentException("maxHypotheses must be >= 1: " + maxHypotheses);
  }

  public static LatticeSettings consensusOnly() {
    return new LatticeSettings(0, 0, DEFAULT_BEAM, DEFAULT_MAX_HYPOTHESES);
  }
}
