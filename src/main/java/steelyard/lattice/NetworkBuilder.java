package steelyard.lattice;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import java.util.ArrayList;
import java.util.List;
import steelyard.text.Vocabulary;

/**
 * Progressive multiple alignment of hypotheses into a {@link ConfusionNetwork} (after Fiscus 1997).
 *
 * <p>The hypotheses enter in order of posterior (descending, ties by input order); the first is the
 * backbone. Each next hypothesis is aligned to the current slots by an edit-distance DP whose costs are the
 * expected mismatch against the E hypotheses already in: placing token x into a slot costs
 * E − (number of hypotheses with x there), leaving a slot empty costs E − (number with no token there), and
 * a new slot (all earlier hypotheses empty there) costs E. Costs count hypotheses rather than posterior
 * mass, so one very confident backbone does not make every later disagreement free, and they are integers,
 * so ties are exact. Tokens are mapped to dense per-network ids so that each slot's counts for the
 * hypothesis's tokens are found in one pass over its arcs. Ties in the backtrace (from the end) prefer a slot match, then leaving the slot empty,
 * then a new slot. Work: O(slots × (tokens + arcs per slot)) per hypothesis.
 */
final class NetworkBuilder {
  private static final byte DIAG = 0;
  private static final byte SKIP = 1;
  private static final byte INSERT = 2;

  /** A slot under construction: local arcs (token, hypothesis count) and each entered hypothesis's arc. */
  private static final class Slot {
    final IntArrayList tokens = new IntArrayList(4);
    final IntArrayList counts = new IntArrayList(4);
    final IntArrayList hypArc = new IntArrayList();

    void add(int token) {
      for (int a = 0; a < tokens.size(); a++) {
        if (tokens.getInt(a) == token) {
          counts.set(a, counts.getInt(a) + 1);
          hypArc.add(a);
          return;
        }
      }
      tokens.add(token);
      counts.add(1);
      hypArc.add(tokens.size() - 1);
    }
  }

  private List<Slot> slots = new ArrayList<>();
  private int[] cost = new int[0];
  private byte[] op = new byte[0];
  private final it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap localOf = new it.unimi.dsi.fastutil.ints.Int2IntOpenHashMap();
  private final IntArrayList vocabOf = new IntArrayList();
  /** Per local token: first position in the current hypothesis (valid when {@code headStamp} = k + 1). */
  private int[] head = new int[64];
  private int[] headStamp = new int[64];
  /** Per position of the current hypothesis: next position with the same token, or −1. */
  private int[] nextPos = new int[64];
  /** Per position: how many entered hypotheses have that position's token in the current slot. */
  private int[] match = new int[64];

  private NetworkBuilder() {
    localOf.defaultReturnValue(-1);
  }

  static ConfusionNetwork build(List<List<String>> hypotheses, double[] posteriors, int maxHypotheses, Vocabulary vocab) {
    int[] entered = enteredOrder(hypotheses, posteriors, maxHypotheses);
    NetworkBuilder b = new NetworkBuilder();
    for (int k = 0; k < entered.length; k++) b.align(b.local(vocab.internAll(hypotheses.get(entered[k]))), k);
    return b.freeze(vocab, hypotheses.size(), entered, posteriors);
  }

  /** Maps vocabulary ids to dense per-network ids, so that the DP can index plain arrays by token. */
  private int[] local(int[] ids) {
    int[] out = new int[ids.length];
    for (int i = 0; i < ids.length; i++) {
      int l = localOf.get(ids[i]);
      if (l < 0) {
        l = vocabOf.size();
        localOf.put(ids[i], l);
        vocabOf.add(ids[i]);
      }
      out[i] = l;
    }
    return out;
  }

  /** Input indices of the hypotheses that enter, in entry order; validates the posteriors. */
  static int[] enteredOrder(List<List<String>> hypotheses, double[] posteriors, int maxHypotheses) {
    if (hypotheses.isEmpty()) throw new IllegalArgumentException("no hypotheses");
    if (posteriors.length != hypotheses.size())
      throw new IllegalArgumentException(posteriors.length + " posteriors for " + hypotheses.size() + " hypotheses");
    if (maxHypotheses < 1) throw new IllegalArgumentException("maxHypotheses must be >= 1: " + maxHypotheses);
    for (double p : posteriors)
      if (!(p >= 0) || Double.isInfinite(p)) throw new IllegalArgumentException("posterior must be finite and >= 0: " + p);
    int n = hypotheses.size();
    int[] order = new int[n];
    for (int i = 0; i < n; i++) order[i] = i;
    it.unimi.dsi.fastutil.ints.IntArrays.mergeSort(order, (x, y) -> {
      int c = Double.compare(posteriors[y], posteriors[x]);
      return c != 0 ? c : Integer.compare(x, y);
    });
    int[] entered = java.util.Arrays.copyOf(order, Math.min(n, maxHypotheses));
    double sum = 0;
    for (int i : entered) sum += posteriors[i];
    if (!(sum > 0)) throw new IllegalArgumentException("posteriors of the hypotheses entering the network sum to 0");
    return entered;
  }

  /** Aligns hypothesis {@code k} (local token ids {@code t}) to the current slots and adds it. */
  private void align(int[] t, int k) {
    int n = slots.size();
    int m = t.length;
    int w = m + 1;
    int cells = (n + 1) * w;
    if (cost.length < cells) {
      cost = new int[Math.max(cells, cost.length * 2)];
      op = new byte[cost.length];
    }
    indexPositions(t, k);
    cost[0] = 0;
    for (int j = 1; j <= m; j++) {
      cost[j] = cost[j - 1] + k;
      op[j] = INSERT;
    }
    for (int i = 1; i <= n; i++) {
      int skip = k - matchRow(slots.get(i - 1), k, m);
      int row = i * w;
      cost[row] = cost[row - w] + skip;
      op[row] = SKIP;
      for (int j = 1; j <= m; j++) {
        int best = cost[row - w + j - 1] + k - match[j - 1];
        byte o = DIAG;
        int c = cost[row - w + j] + skip;
        if (c < best) { best = c; o = SKIP; }
        c = cost[row + j - 1] + k;
        if (c < best) { best = c; o = INSERT; }
        cost[row + j] = best;
        op[row + j] = o;
      }
    }
    apply(t, k, backtrace(n, m, w));
  }

  /** Chains the positions of each token of the hypothesis (head → nextPos), stamped with k + 1. */
  private void indexPositions(int[] t, int k) {
    int locals = vocabOf.size();
    if (head.length < locals) {
      head = java.util.Arrays.copyOf(head, Math.max(locals, head.length * 2));
      headStamp = java.util.Arrays.copyOf(headStamp, head.length);
    }
    if (nextPos.length < t.length) {
      nextPos = new int[Math.max(t.length, nextPos.length * 2)];
      match = new int[nextPos.length];
    }
    for (int j = t.length - 1; j >= 0; j--) {
      int x = t[j];
      if (headStamp[x] != k + 1) {
        headStamp[x] = k + 1;
        head[x] = -1;
      }
      nextPos[j] = head[x];
      head[x] = j;
    }
  }

  /** Fills {@code match[0..m)} for slot {@code s}; returns the slot's empty-arc count. */
  private int matchRow(Slot s, int k, int m) {
    java.util.Arrays.fill(match, 0, m, 0);
    int empty = 0;
    int[] tokens = s.tokens.elements();
    int[] counts = s.counts.elements();
    for (int a = 0, arcs = s.tokens.size(); a < arcs; a++) {
      int x = tokens[a];
      if (x == ConfusionNetwork.EMPTY) empty = counts[a];
      else if (headStamp[x] == k + 1) for (int j = head[x]; j >= 0; j = nextPos[j]) match[j] = counts[a];
    }
    return empty;
  }

  private byte[] backtrace(int n, int m, int w) {
    byte[] ops = new byte[n + m];
    int len = 0;
    int i = n, j = m;
    while (i > 0 || j > 0) {
      byte o = op[i * w + j];
      ops[len++] = o;
      if (o != INSERT) i--;
      if (o != SKIP) j--;
    }
    byte[] forward = new byte[len];
    for (int x = 0; x < len; x++) forward[x] = ops[len - 1 - x];
    return forward;
  }

  private void apply(int[] t, int k, byte[] ops) {
    List<Slot> next = new ArrayList<>(slots.size() + t.length);
    int i = 0, j = 0;
    for (byte o : ops) {
      if (o == INSERT) {
        Slot s = new Slot();
        if (k > 0) {
          s.tokens.add(ConfusionNetwork.EMPTY);
          s.counts.add(k);
          for (int h = 0; h < k; h++) s.hypArc.add(0);
        }
        s.add(t[j++]);
        next.add(s);
      } else {
        Slot s = slots.get(i++);
        s.add(o == DIAG ? t[j++] : ConfusionNetwork.EMPTY);
        next.add(s);
      }
    }
    slots = next;
  }

  private ConfusionNetwork freeze(Vocabulary vocab, int inputCount, int[] entered, double[] posteriors) {
    int n = slots.size();
    int e = entered.length;
    double sum = 0;
    for (int i : entered) sum += posteriors[i];
    int[] slotStart = new int[n + 1];
    for (int s = 0; s < n; s++) slotStart[s + 1] = slotStart[s] + slots.get(s).tokens.size();
    int arcs = slotStart[n];
    int[] arcToken = new int[arcs];
    double[] arcPosterior = new double[arcs];
    int[] hypStart = new int[arcs + 1];
    int[] pathArc = new int[e * n];
    for (int s = 0; s < n; s++) {
      Slot slot = slots.get(s);
      for (int a = 0; a < slot.tokens.size(); a++) {
        int x = slot.tokens.getInt(a);
        arcToken[slotStart[s] + a] = x == ConfusionNetwork.EMPTY ? x : vocabOf.getInt(x);
        hypStart[slotStart[s] + a + 1] = slot.counts.getInt(a);
      }
      for (int k = 0; k < e; k++) {
        int arc = slotStart[s] + slot.hypArc.getInt(k);
        pathArc[k * n + s] = arc;
        arcPosterior[arc] += posteriors[entered[k]];
      }
    }
    for (int a = 0; a < arcs; a++) {
      arcPosterior[a] /= sum;
      hypStart[a + 1] += hypStart[a];
    }
    int[] hypList = hypotheses(entered, pathArc, n, hypStart);
    return new ConfusionNetwork(
        vocab, inputCount, entered, inputCount > e, slotStart, arcToken, arcPosterior, hypStart, hypList, pathArc);
  }

  /** Per-arc lists of input indices, ascending: fill in input-index order (a counting sort). */
  private static int[] hypotheses(int[] entered, int[] pathArc, int n, int[] hypStart) {
    int e = entered.length;
    int[] byInput = new int[e];
    for (int k = 0; k < e; k++) byInput[k] = k;
    it.unimi.dsi.fastutil.ints.IntArrays.quickSort(byInput, (x, y) -> Integer.compare(entered[x], entered[y]));
    int[] fill = java.util.Arrays.copyOf(hypStart, hypStart.length - 1);
    int[] hypList = new int[e * n];
    for (int k : byInput) {
      for (int s = 0; s < n; s++) {
        int arc = pathArc[k * n + s];
        hypList[fill[arc]++] = entered[k];
      }
    }
    return hypList;
  }
}
