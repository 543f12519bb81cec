package steelyard.tune;

import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Minimum-error tuning of the weights of a {@link CandidateTable} by exact line searches ({@link LineSearch}):
 * coordinate ascent over the tunable columns, then seeded random directions, repeated until neither lowers
 * the error, from the start point and from seeded random restart points (Cer, Jurafsky &amp; Manning 2008,
 * "Regularization and search for minimum error rate training"). The best point over all runs is kept; every
 * accepted move is checked by re-evaluating the picks at the new weights, so the error never rises.
 *
 * <p>Directions are scaled per column by its spread s_c (mean over utterances of max − min of the column): the
 * coordinate direction of column c is e_c / s_c, a random direction has components g_c / (|g|·s_c) with g
 * standard normal, so one unit along any direction changes a typical utterance's score spread by about one
 * nat. Along a coordinate the point moves to the middle of the best interval even when that interval holds
 * the current point (more margin, same error); along a random direction only a strictly lower error moves it.
 * Restart points draw each tunable weight uniformly from start ± max(|start|, |best so far|, 1/s_c), clipped
 * to its range. A run stops after {@code maxPasses} passes at the latest.
 */
final class LinearTuner {
  /** The tuned weights, their errors over the tuned utterances, passes and line searches made. */
  record Outcome(double[] weights, long errors, int passes, int lineSearches) {}

  /** How hard to search. */
  record Effort(int restarts, int randomDirections, int maxPasses) {}

  private final CandidateTable table;
  private final int[] utts;
  private final int[] dims;
  private final double[] low;
  private final double[] high;
  private final double[] scale;
  private final Effort effort;
  private final Workers workers;
  private int passes;
  private int lineSearches;
  /** Totals of every candidate at the climb's current weights (exact, as {@link CandidateTable#total} sums them). */
  private double[] totals;

  /**
   * @param dims      the tunable columns; the others keep their start values
   * @param low, high allowed range of each column's weight (closed; infinite ends allowed)
   */
  LinearTuner(CandidateTable table, int[] utts, int[] dims, double[] low, double[] high, Effort effort, Workers workers) {
    this.table = table;
    this.utts = utts;
    this.dims = dims;
    this.low = low;
    this.high = high;
    this.effort = effort;
    this.workers = workers;
    this.scale = new double[table.dimensions()];
    for (int c = 0; c < scale.length; c++) scale[c] = spread(table, c, utts);
  }

  /** Mean over {@code utts} of the column's max − min within the utterance; 1 when that is 0. */
  static double spread(CandidateTable t, int c, int[] utts) {
    double sum = 0;
    for (int u : utts) {
      double min = Double.POSITIVE_INFINITY;
      double max = Double.NEGATIVE_INFINITY;
      for (int h = t.start[u]; h < t.start[u + 1]; h++) {
        min = Math.min(min, t.column[c][h]);
        max = Math.max(max, t.column[c][h]);
      }
      sum += max - min;
    }
    double mean = utts.length == 0 ? 0 : sum / utts.length;
    return mean > 0 && Double.isFinite(mean) ? mean : 1;
  }

  /** Tunes from {@code start} (clipped to the ranges); {@code rnd} draws the random directions and restarts. */
  Outcome run(double[] start, SplittableRandom rnd) {
    double[] from = clip(start.clone());
    Outcome best = climb(from.clone(), rnd);
    for (int r = 0; r < effort.restarts() && dims.length > 0; r++) {
      Outcome o = climb(restartPoint(from, best.weights(), rnd), rnd);
      if (o.errors() < best.errors()) best = o;
    }
    return new Outcome(best.weights(), best.errors(), passes, lineSearches);
  }

  private Outcome climb(double[] w, SplittableRandom rnd) {
    totals = table.totalsAt(utts, w, workers);
    long[] current = {table.errorsFrom(utts, totals, workers)};
    for (int pass = 0; pass < effort.maxPasses(); pass++) {
      passes++;
      boolean improved = false;
      for (int c : dims) improved |= step(w, coordinate(c), true, current);
      if (!improved && dims.length > 1) {
        for (int r = 0; r < effort.randomDirections(); r++) improved |= step(w, random(rnd), false, current);
      }
      if (!improved) break;
    }
    return new Outcome(w, current[0], 0, 0);
  }

  /** One exact line search from w along d; moves w (and updates current) when allowed; true when errors fell. */
  private boolean step(double[] w, double[] d, boolean centre, long[] current) {
    double[] r = range(w, d);
    if (!(r[0] < r[1])) return false;
    StepFunction f = LineSearch.run(table, w, totals, d, r[0], r[1], utts, false, workers);
    lineSearches++;
    StepFunction.Choice c = f.best();
    if (c.errors() > current[0] || (c.errors() == current[0] && !centre) || c.x() == 0) return false;
    double[] moved = w.clone();
    for (int k = 0; k < moved.length; k++) if (d[k] != 0) moved[k] = w[k] + c.x() * d[k];
    clip(moved);
    double[] movedTotals = table.totalsAt(utts, moved, workers);
    long e = table.errorsFrom(utts, movedTotals, workers);
    if (e > current[0]) return false;
    boolean better = e < current[0];
    System.arraycopy(moved, 0, w, 0, w.length);
    totals = movedTotals;
    current[0] = e;
    return better;
  }

  /** The x range [lo, hi] that keeps every moving weight inside its allowed range. */
  private double[] range(double[] w, double[] d) {
    double lo = Double.NEGATIVE_INFINITY;
    double hi = Double.POSITIVE_INFINITY;
    for (int k = 0; k < d.length; k++) {
      if (d[k] == 0) continue;
      double a = (low[k] - w[k]) / d[k];
      double b = (high[k] - w[k]) / d[k];
      lo = Math.max(lo, Math.min(a, b));
      hi = Math.min(hi, Math.max(a, b));
    }
    return new double[] {lo, hi};
  }

  private double[] coordinate(int c) {
    double[] d = new double[scale.length];
    d[c] = 1 / scale[c];
    return d;
  }

  private double[] random(SplittableRandom rnd) {
    double[] g = new double[dims.length];
    double norm = 0;
    for (int i = 0; i < g.length; i++) {
      g[i] = gaussian(rnd);
      norm += g[i] * g[i];
    }
    norm = Math.sqrt(norm);
    double[] d = new double[scale.length];
    for (int i = 0; i < g.length; i++) d[dims[i]] = norm > 0 ? g[i] / (norm * scale[dims[i]]) : 0;
    return d;
  }

  /** A standard normal draw (Box–Muller), using two uniforms of {@code rnd}. */
  static double gaussian(SplittableRandom rnd) {
    double u = 1 - rnd.nextDouble();
    double v = rnd.nextDouble();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  private double[] restartPoint(double[] start, double[] best, SplittableRandom rnd) {
    double[] p = start.clone();
    for (int c : dims) {
      double r = Math.max(Math.max(Math.abs(start[c]), Math.abs(best[c])), 1 / scale[c]);
      p[c] = start[c] + (2 * rnd.nextDouble() - 1) * r;
    }
    return clip(p);
  }

  private double[] clip(double[] w) {
    for (int k = 0; k < w.length; k++) w[k] = Math.min(high[k], Math.max(low[k], w[k]));
    return w;
  }

  /**
   * For each tunable column, the open interval of its weight around {@code w} (the others fixed) over which the
   * errors stay those at {@code w}'s interval: the exact best interval of a converged point. Rows: {low, high}.
   */
  double[][] intervals(double[] w) {
    double[][] out = new double[dims.length][];
    for (int i = 0; i < dims.length; i++) {
      double[] d = new double[w.length];
      d[dims[i]] = 1;
      double[] r = range(w, d);
      if (!(r[0] < r[1])) {
        out[i] = new double[] {w[dims[i]], w[dims[i]]};
        continue;
      }
      StepFunction f = LineSearch.run(table, w, d, r[0], r[1], utts, false, workers);
      int j = f.intervalAt(0);
      out[i] = new double[] {w[dims[i]] + f.low(j), w[dims[i]] + f.high(j)};
    }
    return out;
  }

  static double[] copyOf(double[] w) {
    return Arrays.copyOf(w, w.length);
  }
}
