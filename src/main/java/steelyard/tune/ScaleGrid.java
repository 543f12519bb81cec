package steelyard.tune;

import java.util.Arrays;

/**
 * The posterior scales α the network tuning tries: a geometric grid spanning every regime of the posteriors,
 * measured from the dev set's N-best totals at the tuned N-best weights. With D the median over utterances of
 * (highest − lowest total) and G the median of (highest − second-highest distinct total), the grid runs from
 * α = 0.1 / D (every hypothesis's posterior within a factor e^0.1 of the others: nearly uniform) to α = 10 / G
 * (the best hypothesis e^10 ≈ 22 000 times the second in half the utterances: collapsed), at most half a decade
 * apart and at most {@value #MAX_POINTS} points. Outside that span the posteriors, and so the network methods'
 * choices, hardly change any more. The refinement factors halve the grid step twice, in log space. Values are
 * rounded to three significant digits (readable weights files; a grid point moves by at most 0.05 %).
 */
final class ScaleGrid {
  static final int MAX_POINTS = 13;
  private static final double UNIFORM = 0.1;
  private static final double COLLAPSED = 10;
  private static final double STEP = Math.sqrt(10);

  private final double[] coarse;
  private final double[] refinements;

  private ScaleGrid(double[] coarse, double[] refinements) {
    this.coarse = coarse;
    this.refinements = refinements;
  }

  /** The grid for totals {@code Σ w[c]·column[c]} of {@code t}; only {@code start} when no utterance has two distinct totals. */
  static ScaleGrid of(CandidateTable t, double[] w, WeightRange range, double start) {
    int u = t.utterances();
    double[] spread = new double[u];
    double[] gap = new double[u];
    int n = 0;
    for (int k = 0; k < u; k++) {
      double top = Double.NEGATIVE_INFINITY;
      double second = Double.NEGATIVE_INFINITY;
      double low = Double.POSITIVE_INFINITY;
      for (int h = t.start[k]; h < t.start[k + 1]; h++) {
        double x = t.total(h, w);
        low = Math.min(low, x);
        if (x > top) {
          second = top;
          top = x;
        } else if (x < top && x > second) {
          second = x;
        }
      }
      if (second == Double.NEGATIVE_INFINITY) continue;
      spread[n] = top - low;
      gap[n++] = top - second;
    }
    if (n == 0) return new ScaleGrid(new double[] {start}, new double[0]);
    double lo = range.clip(UNIFORM / median(spread, n));
    double hi = range.clip(COLLAPSED / median(gap, n));
    if (!(hi / lo >= 10)) {
      double mid = Math.sqrt(lo * hi);
      lo = range.clip(mid / STEP);
      hi = range.clip(mid * STEP);
    }
    int points = Math.min(MAX_POINTS, (int) Math.ceil(Math.log(hi / lo) / Math.log(STEP)) + 1);
    if (points < 2) return new ScaleGrid(new double[] {round3(lo)}, new double[0]);
    double ratio = Math.pow(hi / lo, 1.0 / (points - 1));
    double[] grid = new double[points];
    for (int i = 0; i < points; i++) grid[i] = round3(lo * Math.pow(ratio, i));
    return new ScaleGrid(grid, new double[] {Math.sqrt(ratio), Math.sqrt(Math.sqrt(ratio))});
  }

  private static double median(double[] x, int n) {
    double[] c = Arrays.copyOf(x, n);
    Arrays.sort(c);
    return n % 2 == 1 ? c[n / 2] : (c[n / 2 - 1] + c[n / 2]) / 2;
  }

  /** x rounded to three significant digits. */
  static double round3(double x) {
    if (x == 0 || !Double.isFinite(x)) return x;
    return new java.math.BigDecimal(x).round(new java.math.MathContext(3)).doubleValue();
  }

  double[] coarse() {
    return coarse.clone();
  }

  /** Factors for successive refinements around the best α (each tries α / f and α · f). */
  double[] refinements() {
    return refinements.clone();
  }
}
