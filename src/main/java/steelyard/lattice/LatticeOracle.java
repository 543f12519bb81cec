package steelyard.lattice;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Lattice oracle: the path of a {@link ConfusionNetwork} with the fewest unit-cost edit errors against a
 * reference, by DP over (slot boundary i, reference position j). Through slot i a path takes one arc: the
 * empty arc (when the slot has one) costs nothing, a token arc either aligns to reference token j (0 or 1)
 * or is an insertion (1); between slots the reference may lose a token (a deletion, 1). Every entered
 * hypothesis is a path, so the result is at most the best entered hypothesis's edit distance.
 *
 * <p>Work O(slots × reference × arcs per slot); memory (slots+1)×(ref+1) ints and a back-pointer each.
 * Ties keep the first candidate found: arcs in slot order (for a token arc, aligned before inserted), then
 * reference deletions.
 */
final class LatticeOracle {
  private static final int UNREACHED = Integer.MAX_VALUE / 2;

  private LatticeOracle() {}

  static OraclePath best(ConfusionNetwork net, List<String> reference) {
    int n = net.slotCount();
    int m = reference.size();
    int[] ref = new int[m];
    for (int j = 0; j < m; j++) {
      int id = net.vocabulary().idOf(reference.get(j));
      ref[j] = id < 0 ? -2 : id; // never equal to a token id nor to EMPTY
    }
    int w = m + 1;
    int[] d = new int[(n + 1) * w];
    int[] back = new int[(n + 1) * w]; // arc used to enter the cell (≥ 0), or -1: a reference deletion
    int[] from = new int[(n + 1) * w];
    java.util.Arrays.fill(d, UNREACHED);
    d[0] = 0;
    for (int i = 0; i <= n; i++) {
      int row = i * w;
      for (int j = 0; j < m; j++) relax(d, back, from, row + j + 1, d[row + j] + 1, -1, row + j);
      if (i == n) break;
      for (int j = 0; j <= m; j++) {
        int c = d[row + j];
        int down = row + w + j;
        for (int a = net.arcStart(i); a < net.arcEnd(i); a++) {
          int tok = net.arcToken(a);
          if (tok == ConfusionNetwork.EMPTY) {
            relax(d, back, from, down, c, a, row + j);
          } else {
            if (j < m) relax(d, back, from, down + 1, c + (tok == ref[j] ? 0 : 1), a, row + j);
            relax(d, back, from, down, c + 1, a, row + j);
          }
        }
      }
    }
    List<String> tokens = new ArrayList<>();
    int cell = n * w + m;
    while (cell != 0) {
      int a = back[cell];
      if (a >= 0 && !net.isEmpty(a)) tokens.add(net.arcText(a));
      cell = from[cell];
    }
    Collections.reverse(tokens);
    return new OraclePath(tokens, d[n * w + m]);
  }

  private static void relax(int[] d, int[] back, int[] from, int cell, int cost, int arc, int prev) {
    if (cost < d[cell]) {
      d[cell] = cost;
      back[cell] = arc;
      from[cell] = prev;
    }
  }
}
