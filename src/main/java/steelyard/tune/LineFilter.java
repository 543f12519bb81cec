package steelyard.tune;

import java.util.Arrays;

/**
 * Which of one utterance's lines {@code a[i] + b[i]·x} can be strictly highest somewhere in (lo, hi): an O(n)
 * pre-filter ahead of {@link steelyard.rescore.LineEnvelope}, not an envelope of its own. Typically all but a
 * handful of lines go, and the envelope then sorts only those.
 *
 * <p>The test (one step of the quickhull idea): between the line P that wins just right of some point and the
 * line Q that wins just left of a later point, a line that is highest somewhere has a slope between theirs and
 * reaches their common value at their crossing x*, because the upper envelope is convex (highest left of x*,
 * it rises at least as fast as P from there on; right of x*, it falls at most as fast as Q). When the current
 * weights (x = 0) lie inside the range, the test runs on (lo, 0) and (0, hi) separately, with the winners at 0,
 * which keeps far fewer lines on unbounded ranges. A margin of 10⁻⁹ relative keeps every line that rounding
 * could hide, so the filter can only keep a line too many. Ties between winners are broken as the envelope
 * breaks them: larger slope just right of a point, smaller slope just left of it, then the smaller tie order.
 */
final class LineFilter {
  private LineFilter() {}

  /**
   * The lines that can be highest somewhere in (lo, hi), ascending; exactly one index when a single line wins on
   * all of it (then it is the winner). {@code tie[s + i]} is line i's tie order.
   */
  static int[] reaching(double[] a, double[] b, int[] tie, int s, double lo, double hi) {
    boolean split = lo < 0 && 0 < hi;
    int left = 0;
    int right = 0;
    int before = 0;
    int after = 0;
    for (int i = 1; i < a.length; i++) {
      if (beatsRightOf(a, b, tie, s, i, left, lo)) left = i;
      if (beatsLeftOf(a, b, tie, s, i, right, hi)) right = i;
      if (split && beatsLeftOf(a, b, tie, s, i, before, 0)) before = i;
      if (split && beatsRightOf(a, b, tie, s, i, after, 0)) after = i;
    }
    if (left == right) return new int[] {left}; // the envelope is convex: one line wins on all of (lo, hi)
    if (!split) {
      before = right;
      after = right;
    }
    Band first = Band.of(a, b, left, before);
    Band second = split ? Band.of(a, b, after, right) : null;
    int[] keep = new int[a.length];
    int n = 0;
    for (int i = 0; i < a.length; i++) {
      boolean winner = i == left || i == right || i == before || i == after;
      if (winner || first.reaches(a, b, i) || (second != null && second.reaches(a, b, i))) keep[n++] = i;
    }
    return Arrays.copyOf(keep, n);
  }

  /** The crossing of a left winner P and a right winner Q, and the level a line must reach there. */
  private record Band(double lowSlope, double highSlope, double x, double level, boolean empty) {
    static Band of(double[] a, double[] b, int p, int q) {
      if (p == q) return new Band(0, 0, 0, 0, true);
      double x = (a[p] - a[q]) / (b[q] - b[p]);
      double level = a[p] + b[p] * x;
      double margin = 1e-9 * (1 + Math.abs(a[p]) + Math.abs(b[p] * x));
      return new Band(b[p], b[q], x, level - margin, false);
    }

    boolean reaches(double[] a, double[] b, int i) {
      return !empty && lowSlope <= b[i] && b[i] <= highSlope && a[i] + b[i] * x >= level;
    }
  }

  /** Whether line i is higher than line j just right of x (x = −∞: the smaller slope). */
  static boolean beatsRightOf(double[] a, double[] b, int[] tie, int s, int i, int j, double x) {
    if (x == Double.NEGATIVE_INFINITY) {
      if (b[i] != b[j]) return b[i] < b[j];
    } else {
      double vi = a[i] + x * b[i];
      double vj = a[j] + x * b[j];
      if (vi != vj) return vi > vj;
      if (b[i] != b[j]) return b[i] > b[j];
    }
    if (a[i] != a[j]) return a[i] > a[j];
    return tie[s + i] < tie[s + j];
  }

  /** Whether line i is higher than line j just left of x (x = +∞: the larger slope). */
  static boolean beatsLeftOf(double[] a, double[] b, int[] tie, int s, int i, int j, double x) {
    if (x == Double.POSITIVE_INFINITY) {
      if (b[i] != b[j]) return b[i] > b[j];
    } else {
      double vi = a[i] + x * b[i];
      double vj = a[j] + x * b[j];
      if (vi != vj) return vi > vj;
      if (b[i] != b[j]) return b[i] < b[j];
    }
    if (a[i] != a[j]) return a[i] > a[j];
    return tie[s + i] < tie[s + j];
  }
}
