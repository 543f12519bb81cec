package steelyard.rescore;

import it.unimi.dsi.fastutil.ints.IntArrays;
import java.util.Arrays;

/**
 * The upper envelope of n lines y<sub>i</sub>(x) = a<sub>i</sub> + b<sub>i</sub>·x: for every x, which line is
 * highest. Along a direction in weight space every hypothesis's log-linear total is such a line (x is the step
 * size), so one utterance's pick can change only at the envelope's breakpoints; this is the exact line search of
 * Och (2003), "Minimum error rate training in statistical machine translation", §5, and the flip-weight
 * computation of the audit.
 *
 * <p>The envelope is a list of segments k = 0 … {@link #segments()}−1, left to right: segment k is the open
 * interval ({@link #start}(k), {@link #end}(k)) on which line {@link #winner}(k) is strictly highest; segment 0
 * starts at −∞ and the last ends at +∞. At a breakpoint itself two (or more) lines tie; {@link #winnerAt}
 * breaks ties like {@link LogLinear#best}: the smaller tie order wins.
 *
 * <p>Cost: O(n log n) to build (a sort by slope, then one stack pass). Memory: one {@code int[s]} of winners and
 * one {@code double[s]} of segment starts for s ≤ n segments, plus the caller's arrays, which are kept (not
 * copied) for {@link #winnerAt}. Immutable once built; do not change the arrays passed in.
 *
 * <pre>{@code
 * LineEnvelope e = LineEnvelope.of(totalsAtZero, slopes, tieOrders);
 * for (int k = 0; k < e.segments(); k++) System.out.println(e.start(k) + " " + e.winner(k));
 * }</pre>
 */
public final class LineEnvelope {
  private final double[] intercepts;
  private final double[] slopes;
  private final int[] tieOrder;
  /** winners[k]: the line that is highest on segment k. */
  private final int[] winners;
  /** starts[k]: left end of segment k; starts[0] = −∞. */
  private final double[] starts;

  private LineEnvelope(double[] intercepts, double[] slopes, int[] tieOrder, int[] winners, double[] starts) {
    this.intercepts = intercepts;
    this.slopes = slopes;
    this.tieOrder = tieOrder;
    this.winners = winners;
    this.starts = starts;
  }

  /**
   * The envelope of the lines {@code intercepts[i] + slopes[i]·x}.
   *
   * @param tieOrder distinct per line; where lines coincide or tie, the smaller tie order wins (as in
   *                 {@link LogLinear#best}: rank, then system, then file order)
   * @throws IllegalArgumentException when the arrays differ in length, are empty, or hold a non-finite value
   */
  public static LineEnvelope of(double[] intercepts, double[] slopes, int[] tieOrder) {
    int n = intercepts.length;
    if (n == 0 || slopes.length != n || tieOrder.length != n)
      throw new IllegalArgumentException("need n >= 1 lines with one slope and one tie order each: "
          + n + ", " + slopes.length + ", " + tieOrder.length);
    for (int i = 0; i < n; i++)
      if (!Double.isFinite(intercepts[i]) || !Double.isFinite(slopes[i]))
        throw new IllegalArgumentException("line " + i + " is not finite: " + intercepts[i] + " + " + slopes[i] + "·x");
    int[] order = bySlope(intercepts, slopes, tieOrder);
    int[] stack = new int[n];
    double[] start = new double[n];
    int top = -1;
    for (int idx : order) {
      if (top >= 0 && slopes[stack[top]] == slopes[idx]) continue; // same slope, lower or tied line: never strictly highest
      double x = Double.NEGATIVE_INFINITY;
      while (top >= 0) {
        x = crossing(stack[top], idx, intercepts, slopes);
        if (x > start[top]) break;
        top--; // the new line overtakes the top before the top's segment begins: the top never wins
        x = Double.NEGATIVE_INFINITY;
      }
      stack[++top] = idx;
      start[top] = x;
    }
    return new LineEnvelope(intercepts, slopes, tieOrder, Arrays.copyOf(stack, top + 1), Arrays.copyOf(start, top + 1));
  }

  /** Line indexes by slope ascending; equal slopes: higher intercept first, then smaller tie order. */
  private static int[] bySlope(double[] a, double[] b, int[] tie) {
    int[] order = new int[a.length];
    for (int i = 0; i < order.length; i++) order[i] = i;
    IntArrays.quickSort(order, (i, j) -> {
      int c = Double.compare(b[i], b[j]);
      if (c != 0) return c;
      c = Double.compare(a[j], a[i]);
      return c != 0 ? c : Integer.compare(tie[i], tie[j]);
    });
    return order;
  }

  /** x where line {@code hi} (the larger slope) reaches line {@code lo}. */
  private static double crossing(int lo, int hi, double[] a, double[] b) {
    return (a[lo] - a[hi]) / (b[hi] - b[lo]);
  }

  /** Number of segments (≥ 1). */
  public int segments() {
    return winners.length;
  }

  /** Left end of segment {@code k}: −∞ for k = 0, else the breakpoint where {@link #winner}(k) takes over. */
  public double start(int k) {
    return starts[k];
  }

  /** Right end of segment {@code k}: +∞ for the last segment. */
  public double end(int k) {
    return k + 1 < starts.length ? starts[k + 1] : Double.POSITIVE_INFINITY;
  }

  /** The line that is strictly highest inside segment {@code k}. */
  public int winner(int k) {
    return winners[k];
  }

  /** The segment whose closed interval [start, end) holds {@code x} (binary search, O(log s)). */
  public int segmentAt(double x) {
    int k = Arrays.binarySearch(starts, x);
    return k >= 0 ? k : -k - 2;
  }

  /**
   * The highest line at {@code x}, ties to the smaller tie order: the pick {@link LogLinear#best} makes when every
   * total is evaluated at {@code x} exactly. O(n): compares every line at x, so that a breakpoint where three or
   * more lines meet is decided exactly.
   */
  public int winnerAt(double x) {
    int best = 0;
    double bestY = intercepts[0] + slopes[0] * x;
    for (int i = 1; i < intercepts.length; i++) {
      double y = intercepts[i] + slopes[i] * x;
      if (y > bestY || (y == bestY && tieOrder[i] < tieOrder[best])) {
        best = i;
        bestY = y;
      }
    }
    return best;
  }
}
