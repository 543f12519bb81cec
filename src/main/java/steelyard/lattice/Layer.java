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

  Layer(LanguageModel lm, int k) {
    this.lm = lm;
    this.k = k;
    this.nodes = new int[16 * k];
    index.defaultReturnValue(-1);
  }

  void clear() {
    index.clear();
    size = 0;
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
