package steelyard.lm.train;

import java.util.List;
import java.util.Locale;

/**
 * The discounts of one order and the count-of-counts they came from.
 *
 * @param order       n-gram order (1-based)
 * @param countOfCounts n1 … n4: how many n-grams of this order have (adjusted) count 1, 2, 3, 4
 * @param values      modified Kneser-Ney: D1, D2, D3+; absolute discounting: D; Witten-Bell and add-k: empty
 * @param replaced    per value: true where the estimate was invalid and was replaced by the middle of its range
 */
public record Discounts(int order, long[] countOfCounts, double[] values, boolean[] replaced) {
  public Discounts {
    countOfCounts = countOfCounts.clone();
    values = values.clone();
    replaced = replaced.clone();
  }

  @Override public long[] countOfCounts() { return countOfCounts.clone(); }
  @Override public double[] values() { return values.clone(); }
  @Override public boolean[] replaced() { return replaced.clone(); }

  /** The discount for an n-gram with (adjusted) count {@code c} ≥ 1. */
  double forCount(int c) {
    if (values.length == 1) return values[0];
    return values[Math.min(c, values.length) - 1];
  }

  /** Comma-separated values with six decimals, e.g. {@code 0.612500,1.020000,1.440000}. */
  public String formatted() {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < values.length; i++) {
      if (i > 0) sb.append(',');
      sb.append(String.format(Locale.ROOT, "%.6f", values[i]));
    }
    return sb.toString();
  }

  /**
   * Modified Kneser-Ney discounts (Chen &amp; Goodman 1998, eq. 26): Y = n1/(n1+2·n2), D1 = 1 − 2Y·n2/n1,
   * D2 = 2 − 3Y·n3/n2, D3+ = 3 − 4Y·n4/n3. D_k is invalid when one of n1, n2, n_k, n_k+1 is zero or the
   * value is not in (0, k]; it is then replaced by {@link #defaultModifiedKneserNey()}[k−1], k/2, the middle of
   * that range, with a warning.
   */
  static Discounts modifiedKneserNey(int order, long[] n, List<String> warnings) {
    double y = (double) n[0] / (n[0] + 2.0 * n[1]);
    double[] d = new double[3];
    boolean[] replaced = new boolean[3];
    for (int k = 1; k <= 3; k++) {
      double value = k - (k + 1) * y * n[k] / n[k - 1];
      boolean valid = n[0] > 0 && n[1] > 0 && n[k - 1] > 0 && n[k] > 0 && value > 0 && value <= k;
      if (valid) {
        d[k - 1] = value;
      } else {
        d[k - 1] = DEFAULT_MKN[k - 1];
        replaced[k - 1] = true;
        String name = "D" + (k == 3 ? "3+" : Integer.toString(k));
        String reason = zeroCount(n, k) != 0
            ? "undefined since n" + zeroCount(n, k) + " = 0"
            : String.format(Locale.ROOT, "%.6f, not in (0, %d]", value, k);
        warnings.add(String.format(Locale.ROOT,
            "order %d: discount %s from count-of-counts n1=%d n2=%d n3=%d n4=%d is %s; using the default %.1f",
            order, name, n[0], n[1], n[2], n[3], reason, DEFAULT_MKN[k - 1]));
      }
    }
    return new Discounts(order, n, d, replaced);
  }

  /**
   * Absolute discounting (Ney, Essen &amp; Kneser 1994): D = n1/(n1 + 2·n2); invalid when n1 = 0 or the value
   * is not in (0, 1]; then {@link #DEFAULT_ABS}, the middle of that range, with a warning.
   */
  static Discounts absolute(int order, long[] n, List<String> warnings) {
    double value = (double) n[0] / (n[0] + 2.0 * n[1]);
    boolean valid = n[0] > 0 && value > 0 && value <= 1;
    if (!valid) {
      warnings.add(String.format(Locale.ROOT,
          "order %d: discount D from count-of-counts n1=%d n2=%d is %s; using the default %.1f",
          order, n[0], n[1], n[0] == 0 ? "undefined since n1 = 0" : describe(value) + ", not in (0, 1]", DEFAULT_ABS));
    }
    return new Discounts(order, n, new double[] {valid ? value : DEFAULT_ABS}, new boolean[] {!valid});
  }

  /** No discounts (Witten-Bell, add-k); the count-of-counts are still reported. */
  static Discounts none(int order, long[] n) {
    return new Discounts(order, n, new double[0], new boolean[0]);
  }

  private static final double[] DEFAULT_MKN = {0.5, 1.0, 1.5};

  /** Replacements for invalid modified Kneser-Ney discounts: D1 = 0.5, D2 = 1.0, D3+ = 1.5, the middle k/2 of each valid range (0, k]. */
  public static double[] defaultModifiedKneserNey() {
    return DEFAULT_MKN.clone();
  }

  /** Replacement for an invalid absolute discount: 0.5, the middle of the valid range (0, 1]. */
  public static final double DEFAULT_ABS = 0.5;

  /** The first of n1, n2, n_k, n_k+1 that is zero (its index 1 … 4), or 0 when none is. */
  private static int zeroCount(long[] n, int k) {
    for (int i : new int[] {1, 2, k, k + 1}) if (n[i - 1] == 0) return i;
    return 0;
  }

  private static String describe(double v) {
    return Double.isFinite(v) ? String.format(Locale.ROOT, "%.6f", v) : "undefined";
  }
}
