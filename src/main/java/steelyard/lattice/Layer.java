package steelyard.lattice;

import it.unimi.dsi.fastutil.ints.IntArrays;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.Arrays;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;

/**
 * The search states at one slot boundary of a {@link LatticeSearch}: each a distinct LM state with up to k
 * partial paths (node indices, best first). Storage: parallel arrays indexed by state ({@code states},
 * {@code count}, {@code best}, {@code order}) plus {@code nodes[state × k + r]}, and an
 * {@link Object2IntOpenHashMap} keyed by the pooled {@link LmState}s (about 60 bytes per state plus the
 * state's own arrays). The pool is reused slot after slot: {@link #clear} empties the map before any pooled
 * state is overwritten. Without an LM there is exactly one state.
 */
final class Layer {
  private final LanguageModel lm;
  private final int k;
  private final Object2IntOpenHashMap<LmState> index = new Object2IntOpenHashMap<>();
  LmState[] states = new LmState[16];
  int[] nodes;
  int[] count = new int[16];
  double[] best = new double[16];
  int[] order = new int[16];
  int size;
  /** Min-heap of the first scores of the states created so far, at most beam of them (see {@link #bound}). */
  private double[] heap = new double[16];
  private int heapSize;
  private final int beam;

  Layer(LanguageModel lm, int k, int beam) {
    this.beam = beam;
    this.lm = lm;
    this.k = k;
    this.nodes = new int[16 * k];
    index.defaultReturnValue(-1);
  }

  void clear() {
    index.clear();
    size = 0;
    heapSize = 0;
  }

  /**
   * A lower bound on the beam-th best state score this layer will end with, or −∞ while fewer than beam
   * states exist. It is the beam-th best of the states' first scores: scores only rise and states are never
   * removed, so it never exceeds the final beam-th best, and a path scoring below it can neither create a
   * state that survives the beam nor improve one that does.
   */
  double bound() {
    return heapSize == beam ? heap[0] : Double.NEGATIVE_INFINITY;
  }

  /** Records the first score of a newly created state. */
  void created(double score) {
    if (beam == Integer.MAX_VALUE) return;
    if (heapSize < beam) {
      if (heapSize == heap.length) heap = Arrays.copyOf(heap, Math.min(beam, heap.length * 2));
      int i = heapSize++;
      while (i > 0 && heap[(i - 1) >> 1] > score) {
        heap[i] = heap[(i - 1) >> 1];
        i = (i - 1) >> 1;
      }
      heap[i] = score;
    } else if (score > heap[0]) {
      int i = 0;
      while (true) {
        int c = 2 * i + 1;
        if (c >= heapSize) break;
        if (c + 1 < heapSize && heap[c + 1] < heap[c]) c++;
        if (heap[c] >= score) break;
        heap[i] = heap[c];
        i = c;
      }
      heap[i] = score;
    }
  }

  /** Index of the state equal to {@code s} (null without an LM), created empty when new. */
  int find(LmState s) {
    if (lm == null) return size == 0 ? create(null) : 0;
    int i = index.getInt(s);
    return i >= 0 ? i : create(s);
  }

  private int create(LmState s) {
    if (size == states.length) grow();
    if (s != null) {
      if (states[size] == null) states[size] = lm.newState();
      states[size].copyFrom(s);
      index.put(states[size], size);
    }
    count[size] = 0;
    best[size] = Double.NEGATIVE_INFINITY;
    return size++;
  }

  private void grow() {
    int c = states.length * 2;
    states = Arrays.copyOf(states, c);
    count = Arrays.copyOf(count, c);
    best = Arrays.copyOf(best, c);
    order = new int[c];
    nodes = Arrays.copyOf(nodes, c * k);
  }

  /** Orders the states best first (ties: created first); returns whether the beam drops any. */
  boolean finish(int beam) {
    for (int i = 0; i < size; i++) order[i] = i;
    double[] b = best;
    IntArrays.mergeSort(order, 0, size, (x, y) -> {
      int c = Double.compare(b[y], b[x]);
      return c != 0 ? c : Integer.compare(x, y);
    });
    return size > beam;
  }
}
