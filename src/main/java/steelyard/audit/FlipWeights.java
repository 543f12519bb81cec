package steelyard.audit;

import java.util.List;
import java.util.Locale;

/**
 * How close an overrule was along the LM weight (λ for N-best, λ′ for the network search), every other weight
 * held: the interval of weights around the current one in which the same transcript is picked, what is picked
 * just outside it, and the nearest interval in which rank 1's transcript would be picked again. Intervals come
 * from the upper envelope of the candidates' score lines a + b·weight (b = ln P_LM): exact over all hypotheses
 * for N-best ({@link Basis#EXACT}); over the k-best path pool of the network for the network methods
 * ({@link Basis#POOL}), where a full re-search at another weight may find paths outside the pool. Candidates with
 * the same tokens count as one transcript. Weights range over all reals, negative ones included.
 *
 * @param basis       exact or pool
 * @param weight      the current weight
 * @param lower       lower edge of the pick's interval: below it another transcript is picked; −∞ when none
 * @param upper       upper edge: above it another transcript is picked; +∞ when none
 * @param belowTokens the transcript picked just below {@code lower} (null when {@code lower} is −∞)
 * @param aboveTokens the transcript picked just above {@code upper} (null when {@code upper} is +∞)
 * @param firstLow    start of the nearest interval where rank 1's transcript is picked (may be −∞); NaN when never
 * @param firstHigh   end of that interval (may be +∞); NaN when never
 * @param lines       candidates on which the envelope was built (hypotheses, or pool paths)
 */
public record FlipWeights(
    Basis basis, double weight, double lower, double upper, List<String> belowTokens, List<String> aboveTokens,
    double firstLow, double firstHigh, int lines) {

  public FlipWeights {
    belowTokens = belowTokens == null ? null : List.copyOf(belowTokens);
    aboveTokens = aboveTokens == null ? null : List.copyOf(aboveTokens);
  }

  /** Whether rank 1's transcript wins somewhere along the weight. */
  public boolean returnsToFirst() {
    return !Double.isNaN(firstLow);
  }

  /** The weight nearest the current one at which rank 1's transcript is picked again (an edge); NaN when never. */
  public double returnWeight() {
    if (!returnsToFirst()) return Double.NaN;
    return firstHigh <= weight ? firstHigh : firstLow;
  }

  /** Distance from the current weight to the nearer edge of the pick's interval (+∞ when it has none). */
  public double distance() {
    return Math.min(weight - lower, upper - weight);
  }

  /** Where the intervals come from. */
  public enum Basis {
    /** The envelope of every hypothesis' total along λ: exact. */
    EXACT,
    /** The envelope of the k-best network paths along λ′: exact for that pool only. */
    POOL;

    public String label() {
      return name().toLowerCase(Locale.ROOT);
    }
  }
}
