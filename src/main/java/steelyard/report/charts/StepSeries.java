package steelyard.report.charts;

import java.util.Arrays;

/**
 * A step function of a weight, such as the corpus error rate along one tuning direction: {@code y[k]} holds on
 * the half-open interval {@code [x[k], x[k+1])}, and the last value from {@code x[n-1]} to the right end of
 * what the caller measured (add a closing point to show where it ends).
 *
 * <p>The arrays are copied on construction and on access, so the record is immutable.
 *
 * @param name series name shown in the legend
 * @param x    strictly ascending finite positions (the breakpoints)
 * @param y    the value on each interval, same length as {@code x}; NaN leaves a gap
 */
public record StepSeries(String name, double[] x, double[] y) {
  public StepSeries {
    if (name == null) throw new IllegalArgumentException("series name must not be null");
    if (x == null || y == null) throw new IllegalArgumentException("series " + name + ": x and y must not be null");
    if (x.length != y.length) {
      throw new IllegalArgumentException("series " + name + ": x has " + x.length + " values but y has " + y.length);
    }
    for (int k = 0; k < x.length; k++) {
      if (!Double.isFinite(x[k])) throw new IllegalArgumentException("series " + name + ": x[" + k + "] is not finite: " + x[k]);
      if (k > 0 && !(x[k] > x[k - 1])) {
        throw new IllegalArgumentException("series " + name + ": x must be strictly ascending, but x[" + (k - 1) + "] = "
            + x[k - 1] + " and x[" + k + "] = " + x[k]);
      }
    }
    x = x.clone();
    y = y.clone();
  }

  /** An empty series (renders as a chart with a no-data message). */
  public static StepSeries empty(String name) {
    return new StepSeries(name, new double[0], new double[0]);
  }

  /** Number of steps. */
  public int size() {
    return x.length;
  }

  @Override
  public double[] x() {
    return x.clone();
  }

  @Override
  public double[] y() {
    return y.clone();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof StepSeries s && name.equals(s.name) && Arrays.equals(x, s.x) && Arrays.equals(y, s.y);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * name.hashCode() + Arrays.hashCode(x)) + Arrays.hashCode(y);
  }

  @Override
  public String toString() {
    return "StepSeries[" + name + ", " + x.length + " steps]";
  }
}
