package steelyard.tune;

import java.util.Arrays;

/**
 * Corpus errors along a line {@code w + x·d}, {@code lo < x < hi}: a step function, constant between breakpoints
 * (Och 2003, "Minimum error rate training in statistical machine translation", §5). Interval j, 0 ≤ j ≤ m, is
 * the open interval ({@link #low}(j), {@link #high}(j)) with {@code low(0) = lo} and {@code high(m) = hi}; at a
 * breakpoint itself the pick follows the tie order and may take either side's value, which is why the tuner
 * moves only to points inside intervals.
 *
 * <p>Storage: {@code double[m]} breakpoints, {@code long[m+1]} errors and, when counted, three {@code int[m+1]}
 * (utterances whose pick has fewer errors than rank 1, more errors, other tokens than rank 1).
 */
final class StepFunction {
  /** Where to go on one line: the chosen interval, its ends, the point inside it, and its errors. */
  record Choice(int interval, double low, double high, double x, long errors) {}

  final double lo;
  final double hi;
  final double[] breaks;
  final long[] errors;
  final int[] helped;
  final int[] hurt;
  final int[] changed;

  StepFunction(double lo, double hi, double[] breaks, long[] errors, int[] helped, int[] hurt, int[] changed) {
    this.lo = lo;
    this.hi = hi;
    this.breaks = breaks;
    this.errors = errors;
    this.helped = helped;
    this.hurt = hurt;
    this.changed = changed;
  }

  int intervals() {
    return errors.length;
  }

  double low(int j) {
    return j == 0 ? lo : breaks[j - 1];
  }

  double high(int j) {
    return j == breaks.length ? hi : breaks[j];
  }

  /** The interval holding {@code x}; a breakpoint belongs to the interval on its right. */
  int intervalAt(double x) {
    int k = Arrays.binarySearch(breaks, x);
    return k >= 0 ? k + 1 : -k - 1;
  }

  /**
   * The interval with the fewest errors; among equals the one nearest to x = 0 (the current weights), then
   * the one further left. Its point is {@link #pointIn}.
   */
  Choice best() {
    int best = 0;
    for (int j = 1; j < errors.length; j++) {
      if (errors[j] < errors[best] || (errors[j] == errors[best] && distanceToZero(j) < distanceToZero(best))) best = j;
    }
    return new Choice(best, low(best), high(best), pointIn(low(best), high(best)), errors[best]);
  }

  private double distanceToZero(int j) {
    if (low(j) < 0 && 0 < high(j)) return 0;
    return Math.min(Math.abs(low(j)), Math.abs(high(j)));
  }

  /**
   * The point chosen inside the open interval (low, high): its middle when both ends are finite. When one end
   * is infinite: x = 0 (stay) if the interval holds 0; else the finite end moved away from 0 by its own distance
   * from 0, at least 1 unit of the direction (the tuner scales directions so that one unit changes a typical
   * utterance's score spread by about 1 nat). No finite end: 0.
   */
  static double pointIn(double low, double high) {
    boolean finiteLow = low != Double.NEGATIVE_INFINITY;
    boolean finiteHigh = high != Double.POSITIVE_INFINITY;
    if (finiteLow && finiteHigh) return low + (high - low) / 2;
    if (low < 0 && 0 < high) return 0;
    if (finiteLow) return low + Math.max(1, Math.abs(low));
    if (finiteHigh) return high - Math.max(1, Math.abs(high));
    return 0;
  }
}
