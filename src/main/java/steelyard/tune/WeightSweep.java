package steelyard.tune;

import java.util.List;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * What a report or a window draws: the exact dev error along one weight with the helped / hurt / changed counts
 * against rank 1 ({@link Sweep}), and the error over a grid of two weights ({@link ErrorSurface}). Both come from
 * the envelope events of the exact line search ({@link LineSearch}), so a sweep costs one line search and a
 * surface one line search per row, whatever the number of grid columns.
 *
 * <pre>{@code
 * WeightSweep sweeps = WeightSweep.of(input, 2);
 * Sweep s = sweeps.nbest(tuned, WeightNames.LM, 0, 30);
 * for (int j = 0; j < s.intervals(); j++) plot(s.intervalLow(j), s.intervalHigh(j), s.rate(j));
 * }</pre>
 */
public final class WeightSweep {
  private final TuneInput input;
  private final CandidateTable table;
  private final int threads;

  private WeightSweep(TuneInput input, CandidateTable table, int threads) {
    this.input = input;
    this.table = table;
    this.threads = threads;
  }

  /**
   * Prepares sweeps over the dev set of {@code input}: scores every hypothesis against its reference once (the
   * costly part; about 9 + 8·(F+3) bytes per hypothesis are kept), so that each later sweep costs one exact line
   * search. Sweeps run on {@code threads} threads and give the same result for any count. Not thread-safe.
   */
  public static WeightSweep of(TuneInput input, int threads) {
    if (threads < 1) throw new IllegalArgumentException("threads must be >= 1: " + threads);
    try (Workers w = new Workers(threads, () -> false)) {
      return new WeightSweep(input, NbestTuning.table(input, w), threads);
    }
  }

  /**
   * The N-best method's errors along {@code weight} (a feature name, {@link WeightNames#LM}, {@link WeightNames#OOV}
   * or {@link WeightNames#LENGTH}) over [low, high], the other weights as in {@code at}.
   */
  public Sweep nbest(RescoreWeights at, String weight, double low, double high) {
    int dim = column(NbestTuning.columnNames(input.featureNames()), weight);
    try (Workers w = new Workers(threads, () -> false)) {
      return sweep(table, NbestTuning.vector(at, input.featureNames()), dim, weight, low, high, true, w);
    }
  }

  /** The N-best method's errors over {@code rows} × {@code columns} of two N-best weights, the others as in {@code at}. */
  public ErrorSurface nbestSurface(RescoreWeights at, String rowWeight, double[] rows, String columnWeight, double[] columns) {
    List<String> names = NbestTuning.columnNames(input.featureNames());
    double[] v = NbestTuning.vector(at, input.featureNames());
    try (Workers w = new Workers(threads, () -> false)) {
      long[][] e = grid(table, v, column(names, rowWeight), rows, column(names, columnWeight), columns, w);
      return new ErrorSurface(RescoreMethod.NBEST, rowWeight, rows.clone(), columnWeight, columns.clone(), e,
          table.referenceTokens(table.all()), true);
    }
  }

  /**
   * The lattice method's errors along λ′ over [low, high] (low ≥ 0), at the posteriors of {@code at} (its N-best
   * weights, α, system weights) and its μ′. The confusion networks are built once; each utterance's k best paths
   * are pooled from searches at {@code samples} evenly spaced λ′ of the range and at {@code at}'s λ′; the step
   * function is exact over the pooled paths ({@link Sweep#exact()} is false: a path no search found cannot show).
   * Cost: one network build and {@code samples + 1} searches per utterance.
   */
  public Sweep lattice(RescoreWeights at, double low, double high, int kBest, int samples) {
    double[] lm = linear(low, high, Math.max(2, samples));
    double[][] points = new double[lm.length + 1][];
    for (int i = 0; i < lm.length; i++) points[i] = new double[] {lm[i], at.latticeLengthWeight()};
    points[lm.length] = new double[] {at.latticeLmWeight(), at.latticeLengthWeight()};
    try (Workers w = new Workers(threads, () -> false)) {
      CandidateTable pool = pools(at, kBest, points, w);
      double[] v = {1, at.latticeLmWeight(), at.latticeLengthWeight()};
      return sweep(pool, v, 1, WeightNames.LATTICE_LM, low, high, false, w);
    }
  }

  /**
   * The lattice method's errors over μ′ = {@code rows} × λ′ = {@code columns} at the posteriors of {@code at}, exact
   * over paths pooled from searches at the grid's four corners, its centre and {@code at}'s (λ′, μ′).
   */
  public ErrorSurface latticeSurface(RescoreWeights at, double[] rows, double[] columns, int kBest) {
    double r0 = rows[0];
    double r1 = rows[rows.length - 1];
    double c0 = columns[0];
    double c1 = columns[columns.length - 1];
    double[][] points = {{c0, r0}, {c0, r1}, {c1, r0}, {c1, r1}, {(c0 + c1) / 2, (r0 + r1) / 2},
        {at.latticeLmWeight(), at.latticeLengthWeight()}};
    try (Workers w = new Workers(threads, () -> false)) {
      CandidateTable pool = pools(at, kBest, points, w);
      long[][] e = grid(pool, new double[] {1, at.latticeLmWeight(), at.latticeLengthWeight()}, 2, rows, 1, columns, w);
      return new ErrorSurface(RescoreMethod.LATTICE, WeightNames.LATTICE_LENGTH, rows.clone(), WeightNames.LATTICE_LM,
          columns.clone(), e, table.referenceTokens(table.all()), false);
    }
  }

  private CandidateTable pools(RescoreWeights at, int kBest, double[][] points, Workers w) {
    if (input.model() == null && at.latticeLmWeight() != 0) throw new IllegalArgumentException("λ′ needs a model");
    TuneSettings s = TuneSettings.builder().pools(kBest, 1).build();
    return new LatticeRound(new NetworkData(input, table), s, w).gather(at, table.all(), points);
  }

  private static int column(List<String> names, String weight) {
    int dim = names.indexOf(weight);
    if (dim < 0) throw new IllegalArgumentException("not an N-best weight: '" + weight + "'; expected one of " + names);
    return dim;
  }

  /** The sweep of column {@code dim} of {@code t} from {@code at} over [low, high] (weight values). */
  static Sweep sweep(CandidateTable t, double[] at, int dim, String name, double low, double high, boolean exact, Workers w) {
    if (!(low < high)) throw new IllegalArgumentException("empty range for " + name + ": " + low + " .. " + high);
    double[] d = new double[at.length];
    d[dim] = 1;
    StepFunction f = LineSearch.run(t, at, d, low - at[dim], high - at[dim], t.all(), true, w);
    double[] breaks = f.breaks.clone();
    for (int i = 0; i < breaks.length; i++) breaks[i] += at[dim];
    int[] all = t.all();
    return new Sweep(name, low, high, breaks, f.errors, f.helped, f.hurt, f.changed, t.referenceTokens(all), t.firstErrors(all), exact);
  }

  /** errors[r][c] at column {@code rowDim} = rows[r] and {@code colDim} = cols[c], one line search per row. */
  static long[][] grid(CandidateTable t, double[] at, int rowDim, double[] rows, int colDim, double[] cols, Workers w) {
    if (rowDim == colDim) throw new IllegalArgumentException("a surface needs two different weights");
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    for (double c : cols) {
      min = Math.min(min, c);
      max = Math.max(max, c);
    }
    long[][] out = new long[rows.length][cols.length];
    double[] d = new double[at.length];
    d[colDim] = 1;
    for (int r = 0; r < rows.length; r++) {
      double[] p = at.clone();
      p[rowDim] = rows[r];
      p[colDim] = 0;
      StepFunction f = LineSearch.run(t, p, d, min - 1, max + 1, t.all(), false, w);
      for (int c = 0; c < cols.length; c++) out[r][c] = f.errors[f.intervalAt(cols[c])];
    }
    return out;
  }

  /** Grid points per axis of the surfaces the tuner computes. */
  static final int SURFACE_COLUMNS = 41;
  static final int SURFACE_ROWS = 21;

  /**
   * The surface the tuner reports around its result {@code at}: columns are an LM weight (column {@code lmDim})
   * over [at − H, at + H] clipped to its range, H = max(at, 1); rows a length weight (column {@code lenDim})
   * over at ± M, M = max(|at|, H·s_LM / s_len) with s the columns' spreads, so that both axes move the totals
   * about equally.
   */
  static ErrorSurface around(CandidateTable t, double[] at, RescoreMethod method, int lmDim, String lmName, WeightRange lmRange,
      int lenDim, String lenName, WeightRange lenRange, boolean exact, Workers w) {
    int[] all = t.all();
    double h = Math.max(at[lmDim], 1);
    double m = Math.max(Math.abs(at[lenDim]), h * LinearTuner.spread(t, lmDim, all) / LinearTuner.spread(t, lenDim, all));
    double[] cols = linear(lmRange.clip(at[lmDim] - h), lmRange.clip(at[lmDim] + h), SURFACE_COLUMNS);
    double[] rows = linear(lenRange.clip(at[lenDim] - m), lenRange.clip(at[lenDim] + m), SURFACE_ROWS);
    long[][] e = grid(t, at, lenDim, rows, lmDim, cols, w);
    return new ErrorSurface(method, lenName, rows, lmName, cols, e, t.referenceTokens(all), exact);
  }

  /** {@code n} evenly spaced values from {@code a} to {@code b}. */
  static double[] linear(double a, double b, int n) {
    double[] v = new double[n];
    for (int i = 0; i < n; i++) v[i] = n == 1 ? a : a + (b - a) * i / (n - 1);
    return v;
  }
}
