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
 * the range and to drop the lines that cannot reach the envelope between them ({@link LineFilter}; typically
 * all but a handful), O(m log m) for the envelope of the m lines left; then
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
    return run(t, w, null, d, lo, hi, utts, counts, workers);
  }

  /** As above, with the totals at {@code w} already computed ({@link CandidateTable#totalsAt}; null: compute them). */
  static StepFunction run(CandidateTable t, double[] w, double[] totals, double[] d, double lo, double hi, int[] utts,
      boolean counts, Workers workers) {
    if (!(lo < hi)) throw new IllegalArgumentException("empty range: " + lo + " .. " + hi);
    Events[] blocks = new Events[Workers.blockCount(utts.length)];
    workers.blocks(utts.length, (b, from, to) -> {
      Events e = new Events();
      for (int i = from; i < to; i++) utterance(t, utts[i], w, totals, d, lo, hi, counts, e);
      blocks[b] = e;
    });
    return merge(blocks, lo, hi, counts);
  }

  private static void utterance(CandidateTable t, int u, double[] w, double[] totals, double[] d, double lo, double hi,
      boolean counts, Events e) {
    int s = t.start[u];
    int n = t.start[u + 1] - s;
    int first = t.firstErrors[u];
    if (!counts && t.constant[u]) {
      e.base += t.errors[s];
      return;
    }
    double[] a = totals == null ? t.totals(s, n, w, new double[n]) : java.util.Arrays.copyOfRange(totals, s, s + n);
    double[] b = t.totals(s, n, d, new double[n]);
    int[] keep = LineFilter.reaching(a, b, t.tie, s, lo, hi);
    if (keep.length == 1) { // one line wins on all of (lo, hi)
      start(t, s + keep[0], first, counts, e);
      return;
    }
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
