package steelyard.audit;

import java.util.List;
import steelyard.rescore.LineEnvelope;

/**
 * Reads {@link FlipWeights} off the upper envelope ({@link LineEnvelope}) of candidate score lines
 * a<sub>i</sub> + b<sub>i</sub>·x. Adjacent segments whose winners have the same tokens form one interval.
 */
final class FlipFinder {
  /** Relative distance within which the current weight counts as lying on a breakpoint (rounding of the totals). */
  private static final double ON_BREAKPOINT = 1e-9;

  private FlipFinder() {}

  /**
   * The flip weights around {@code weight}, or null when no segment next to {@code weight} is won by
   * {@code pick} (the pick then wins only at an isolated tie point).
   *
   * @param tokens the tokens of each line's transcript
   */
  static FlipWeights find(FlipWeights.Basis basis, double[] intercepts, double[] slopes, int[] tieOrder,
      List<List<String>> tokens, double weight, List<String> pick, List<String> first) {
    LineEnvelope env = LineEnvelope.of(intercepts, slopes, tieOrder);
    int k = pickSegment(env, tokens, weight, pick);
    if (k < 0) return null;
    int lo = k;
    while (lo > 0 && winnerTokens(env, tokens, lo - 1).equals(pick)) lo--;
    int hi = k;
    while (hi + 1 < env.segments() && winnerTokens(env, tokens, hi + 1).equals(pick)) hi++;
    List<String> below = lo > 0 ? winnerTokens(env, tokens, lo - 1) : null;
    List<String> above = hi + 1 < env.segments() ? winnerTokens(env, tokens, hi + 1) : null;
    double[] back = nearestRun(env, tokens, first, lo, hi, weight);
    return new FlipWeights(
        basis, weight, env.start(lo), env.end(hi), below, above, back[0], back[1], intercepts.length);
  }

  /**
   * The segment at {@code weight} when the pick wins it, else a neighbour it wins when {@code weight} lies on their
   * breakpoint; −1 when neither.
   */
  private static int pickSegment(LineEnvelope env, List<List<String>> tokens, double weight, List<String> pick) {
    int k = env.segmentAt(weight);
    if (winnerTokens(env, tokens, k).equals(pick)) return k;
    double tol = ON_BREAKPOINT * Math.max(1, Math.abs(weight));
    if (k > 0 && weight - env.start(k) <= tol && winnerTokens(env, tokens, k - 1).equals(pick)) return k - 1;
    boolean next = k + 1 < env.segments() && env.end(k) - weight <= tol;
    if (next && winnerTokens(env, tokens, k + 1).equals(pick)) return k + 1;
    return -1;
  }

  /**
   * {start, end} of the run of segments won by {@code first} nearest to {@code weight}, searched outwards from the
   * pick's run [lo, hi] (ties: the lower run); {NaN, NaN} when rank 1 wins nowhere.
   */
  private static double[] nearestRun(LineEnvelope env, List<List<String>> tokens, List<String> first, int lo, int hi,
      double weight) {
    double[] best = {Double.NaN, Double.NaN};
    for (int k = lo - 1; k >= 0; k--) {
      if (!winnerTokens(env, tokens, k).equals(first)) continue;
      int s = k;
      while (s > 0 && winnerTokens(env, tokens, s - 1).equals(first)) s--;
      best = new double[] {env.start(s), env.end(k)};
      break;
    }
    for (int k = hi + 1; k < env.segments(); k++) {
      if (!winnerTokens(env, tokens, k).equals(first)) continue;
      int e = k;
      while (e + 1 < env.segments() && winnerTokens(env, tokens, e + 1).equals(first)) e++;
      boolean nearer = Double.isNaN(best[0]) || env.start(k) - weight < weight - best[1];
      if (nearer) best = new double[] {env.start(k), env.end(e)};
      break;
    }
    return best;
  }

  private static List<String> winnerTokens(LineEnvelope env, List<List<String>> tokens, int k) {
    return tokens.get(env.winner(k));
  }
}
