package steelyard.audit;

/**
 * The confusion-network search terms of the chosen path and of rank 1's path in the same network (natural log,
 * higher is better): score = Σ ln(arc posterior) + λ′·ln P_LM(path) + μ′·(non-empty tokens). Rank 1's path is
 * the one its own hypothesis laid through the network when it was built (its arcs, empty arcs included); the
 * search may score the same words higher along another path, so this is a lower bound on the best path with
 * rank 1's words. For the consensus method λ′ = μ′ = 0 and the score is Σ ln(arc posterior).
 *
 * @param lmWeight     λ′ of the search (0 for consensus)
 * @param lengthWeight μ′ of the search (0 for consensus)
 * @param pick         the chosen path's terms
 * @param first        rank 1's path terms; null when rank 1 did not enter the network (the hypothesis cap)
 */
public record PathComparison(double lmWeight, double lengthWeight, PathTerms pick, PathTerms first) {

  /** Pick score − rank 1 score; NaN when rank 1 did not enter. −∞ … +∞ when an arc posterior is 0. */
  public double margin() {
    return first == null ? Double.NaN : score(pick) - score(first);
  }

  /** The search objective of {@code p} under this comparison's λ′ and μ′. */
  public double score(PathTerms p) {
    return p.logPosterior() + lmWeight * p.lmLogProb() + lengthWeight * p.tokens();
  }

  /**
   * Unweighted terms of one path.
   *
   * @param logPosterior Σ natural log of the path's arc posteriors (−∞ when one is 0)
   * @param lmLogProb    ln P_LM of the path's tokens with {@code <s>}/{@code </s>}, as the search scores them (0
   *                     without a model)
   * @param tokens       non-empty tokens on the path
   */
  public record PathTerms(double logPosterior, double lmLogProb, int tokens) {}
}
