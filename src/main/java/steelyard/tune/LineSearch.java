package steelyard.tune;

import it.unimi.dsi.fastutil.doubles.DoubleArrayList;
import it.unimi.dsi.fastutil.doubles.DoubleArrays;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import steelyard.rescore.LineEnvelope;

/**
 * Exact line search (Och 2003, "Minimum error rate training in statistical machine translation", §5): along
 * {@code w + x·d} every candidate's total is a line {@code a + b·x} with {@code a = total(w)} and
 * {@code b = total(d)}; per utterance the upper envelope ({@link LineEnvelope}) says which candidate wins on
 * which interval, so the utterance's error changes only at the envelope's breakpoints. Each breakpoint inside
 * (lo, hi) becomes an event (x, Δerrors); all utterances' events are sorted once by x and summed left to right
 * into the corpus step function, so the corpus is never re-evaluated per interval.
 *
 * <p>Cost: per utterance of n candidates O(n·D) for the lines, O(n) to find the winners just inside both ends of
 * the range and to drop the lines that cannot reach the envelope between them ({@link #reaching}; typically all
 * but a handful), O(m log m) for the envelope of the m lines left; then
 * O(E log E) for E events (a stable radix sort). Utterances whose candidates all have the same error count
 * add a constant and are skipped unless the helped/hurt/changed counts are wanted. Memory: three
 * {@code double[n]}/{@code int[n]} per utterance while it is processed, and 12 bytes per event (28 with counts).
 * Blocks of utterances run on the {@link Workers}; events are concatenated in block order and sorted stably, so
 * the result is the same for any thread count.
 */
final class LineSearch {
  private LineSearch() {}

  /** Events of one block of utterances, and the errors (and counts) at x just above lo. */
  private static final class Events {
    final DoubleArrayList x = new DoubleArrayList();
    final IntArrayList dErrors = new IntArrayList();
    final IntArrayList dCounts = new IntArrayList();
    long base;
    int helped;
    int hurt;
    int changed;
  }

  /**
   * The corpus step function of {@code t} over utterances {@code utts} along {@code w + x·d}, lo &lt; x &lt; hi.
   *
   * @param counts also count, per interval, the utterances helped, hurt and changed against rank 1
   */
  static StepFunction run(CandidateTable t, double[] w, double[] d, double lo, double hi, int[] utts, boolean counts,
      Workers workers) {
    if (!(lo < hi)) throw new IllegalArgumentException("empty range: " + lo + " .. " + hi);
    Events[] blocks = new Events[Workers.blockCount(utts.length)];
    workers.blocks(utts.length, (b, from, to) -> {
      Events e = new Events();
      for (int i = from; i < to; i++) utterance(t, utts[i], w, d, lo, hi, counts, e);
      blocks[b] = e;
    });
    return merge(blocks, lo, hi, counts);
  }

  private static void utterance(CandidateTable t, int u, double[] w, double[] d, double lo, double hi, boolean counts, Events e) {
    int s = t.start[u];
    int n = t.start[u + 1] - s;
    int first = t.firstErrors[u];
    if (!counts && t.constant[u]) {
      e.base += t.errors[s];
      return;
    }
    double[] a = t.totals(s, n, w, new double[n]);
    double[] b = t.totals(s, n, d, new double[n]);
    int left = leftWinner(a, b, t.tie, s, lo);
    int right = rightWinner(a, b, t.tie, s, hi);
    if (left == right) { // by convexity the same line wins on all of (lo, hi)
      start(t, s + left, first, counts, e);
      return;
    }
    int[] keep = reaching(a, b, left, right);
    double[] ka = new double[keep.length];
    double[] kb = new double[keep.length];
    int[] tie = new int[keep.length];
    for (int i = 0; i < keep.length; i++) {
      ka[i] = a[keep[i]];
      kb[i] = b[keep[i]];
      tie[i] = t.tie[s + keep[i]];
    }
    LineEnvelope env = LineEnvelope.of(ka, kb, tie);
    int k = env.segmentAt(lo);
    int win = s + keep[env.winner(k)];
    start(t, win, first, counts, e);
    for (; k + 1 < env.segments() && env.end(k) < hi; k++) {
      int next = s + keep[env.winner(k + 1)];
      int dErr = t.errors[next] - t.errors[win];
      int dCounts = counts ? packedCounts(t, win, next, first) : 0;
      if (dErr != 0 || dCounts != 0) {
        e.x.add(env.end(k));
        e.dErrors.add(dErr);
        e.dCounts.add(dCounts);
      }
      win = next;
    }
  }

  /** Adds the pick just right of lo to the block's starting errors (and counts). */
  private static void start(CandidateTable t, int win, int first, boolean counts, Events e) {
    e.base += t.errors[win];
    if (counts) {
      e.helped += t.errors[win] < first ? 1 : 0;
      e.hurt += t.errors[win] > first ? 1 : 0;
      e.changed += t.unchanged[win] ? 0 : 1;
    }
  }

  /**
   * The line that is highest just right of {@code lo}: at −∞ the smallest slope; else the highest value at lo,
   * ties to the larger slope (it wins right of lo); identical lines to the smaller tie order.
   */
  private static int leftWinner(double[] a, double[] b, int[] tieOrder, int s, double lo) {
    int best = 0;
    for (int i = 1; i < a.length; i++) {
      int c = lo == Double.NEGATIVE_INFINITY ? Double.compare(b[best], b[i]) : Double.compare(a[i] + lo * b[i], a[best] + lo * b[best]);
      if (c == 0) c = lo == Double.NEGATIVE_INFINITY ? Double.compare(a[i], a[best]) : Double.compare(b[i], b[best]);
      if (c > 0 || (c == 0 && a[i] == a[best] && b[i] == b[best] && tieOrder[s + i] < tieOrder[s + best])) best = i;
    }
    return best;
  }

  /** The line that is highest just left of {@code hi}: at +∞ the largest slope; else ties to the smaller slope. */
  private static int rightWinner(double[] a, double[] b, int[] tieOrder, int s, double hi) {
    int best = 0;
    for (int i = 1; i < a.length; i++) {
      int c = hi == Double.POSITIVE_INFINITY ? Double.compare(b[i], b[best]) : Double.compare(a[i] + hi * b[i], a[best] + hi * b[best]);
      if (c == 0) c = hi == Double.POSITIVE_INFINITY ? Double.compare(a[i], a[best]) : Double.compare(b[best], b[i]);
      if (c > 0 || (c == 0 && a[i] == a[best] && b[i] == b[best] && tieOrder[s + i] < tieOrder[s + best])) best = i;
    }
    return best;
  }

  /**
   * The lines that can reach the upper envelope between the left and the right winner: a pre-filter in O(n), not
   * an envelope. A line highest somewhere in (lo, hi) has a slope between theirs and, the envelope being convex,
   * reaches their common value at their crossing x* (if it is highest left of x*, it rises at least as fast as
   * the left winner from there; right of x*, it falls at most as fast as the right winner). Kept with a margin of
   * 10⁻⁹ relative, so rounding can only keep a line too many.
   */
  private static int[] reaching(double[] a, double[] b, int left, int right) {
    double x = (a[left] - a[right]) / (b[right] - b[left]);
    double level = a[left] + b[left] * x;
    double margin = 1e-9 * (1 + Math.abs(a[left]) + Math.abs(b[left] * x));
    int[] keep = new int[a.length];
    int n = 0;
    for (int i = 0; i < a.length; i++) {
      boolean inside = b[left] <= b[i] && b[i] <= b[right] && a[i] + b[i] * x >= level - margin;
      if (inside || i == left || i == right) keep[n++] = i;
    }
    return java.util.Arrays.copyOf(keep, n);
  }

  /** Changes of (helped, hurt, changed), each in −1 … 1, packed as three 2-bit fields (0 when none changes). */
  private static int packedCounts(CandidateTable t, int from, int to, int first) {
    int helped = (t.errors[to] < first ? 1 : 0) - (t.errors[from] < first ? 1 : 0);
    int hurt = (t.errors[to] > first ? 1 : 0) - (t.errors[from] > first ? 1 : 0);
    int changed = (t.unchanged[to] ? 0 : 1) - (t.unchanged[from] ? 0 : 1);
    if (helped == 0 && hurt == 0 && changed == 0) return 0;
    return (helped + 1) | (hurt + 1) << 2 | (changed + 1) << 4;
  }

  private static int field(int packed, int shift) {
    return packed == 0 ? 0 : ((packed >> shift) & 3) - 1;
  }

  private static StepFunction merge(Events[] blocks, double lo, double hi, boolean counts) {
    int total = 0;
    long base = 0;
    int helped = 0;
    int hurt = 0;
    int changed = 0;
    for (Events e : blocks) {
      total += e.x.size();
      base += e.base;
      helped += e.helped;
      hurt += e.hurt;
      changed += e.changed;
    }
    double[] x = new double[total];
    int[] dErr = new int[total];
    int[] dCnt = new int[total];
    int at = 0;
    for (Events e : blocks) {
      int n = e.x.size();
      e.x.getElements(0, x, at, n);
      e.dErrors.getElements(0, dErr, at, n);
      e.dCounts.getElements(0, dCnt, at, n);
      at += n;
    }
    int[] perm = new int[total];
    for (int i = 0; i < total; i++) perm[i] = i;
    DoubleArrays.radixSortIndirect(perm, x, true);
    int distinct = 0;
    for (int i = 0; i < total; i++) if (i == 0 || x[perm[i]] != x[perm[i - 1]]) distinct++;
    double[] breaks = new double[distinct];
    long[] errors = new long[distinct + 1];
    int[][] cnt = counts ? new int[3][distinct + 1] : null;
    errors[0] = base;
    if (counts) {
      cnt[0][0] = helped;
      cnt[1][0] = hurt;
      cnt[2][0] = changed;
    }
    int j = 0;
    for (int i = 0; i < total; i++) {
      int p = perm[i];
      if (i == 0 || x[p] != x[perm[i - 1]]) {
        breaks[j] = x[p];
        j++;
        errors[j] = errors[j - 1];
        if (counts) for (int c = 0; c < 3; c++) cnt[c][j] = cnt[c][j - 1];
      }
      errors[j] += dErr[p];
      if (counts) for (int c = 0; c < 3; c++) cnt[c][j] += field(dCnt[p], 2 * c);
    }
    return counts
        ? new StepFunction(lo, hi, breaks, errors, cnt[0], cnt[1], cnt[2])
        : new StepFunction(lo, hi, breaks, errors, null, null, null);
  }
}
