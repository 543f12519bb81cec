package steelyard.tune;

import java.util.Arrays;

/**
 * The dev error along one weight, the others fixed: an exact step function. Interval j (0 ≤ j &lt; {@link
 * #intervals()}) is the open interval ({@link #intervalLow}(j), {@link #intervalHigh}(j)) of the weight's value;
 * on it the picks, and so {@code errors[j]}, {@code helped[j]}, {@code hurt[j]} and {@code changed[j]}, are
 * constant. Helped / hurt: utterances whose pick has fewer / more errors than the recogniser's rank 1; changed:
 * whose pick's tokens differ from rank 1's.
 *
 * @param weight          the swept weight's name ({@link WeightNames})
 * @param low, high       the swept range
 * @param breakpoints     values where some pick changes, ascending, inside (low, high)
 * @param referenceTokens N of the error rate
 * @param firstErrors     errors of rank 1 (the level to compare with)
 * @param exact           true over all N-best hypotheses; false over the lattice method's path pools
 */
public record Sweep(
    String weight, double low, double high, double[] breakpoints, long[] errors, int[] helped, int[] hurt, int[] changed,
    long referenceTokens, long firstErrors, boolean exact) {

  public int intervals() {
    return errors.length;
  }

  public double intervalLow(int j) {
    return j == 0 ? low : breakpoints[j - 1];
  }

  public double intervalHigh(int j) {
    return j == breakpoints.length ? high : breakpoints[j];
  }

  /** The interval holding {@code value}; a breakpoint belongs to the interval on its right. */
  public int intervalAt(double value) {
    int k = Arrays.binarySearch(breakpoints, value);
    return k >= 0 ? k + 1 : -k - 1;
  }

  public long errorsAt(double value) {
    return errors[intervalAt(value)];
  }

  /** The error rate on interval j. */
  public double rate(int j) {
    return referenceTokens == 0 ? Double.NaN : (double) errors[j] / referenceTokens;
  }
}
