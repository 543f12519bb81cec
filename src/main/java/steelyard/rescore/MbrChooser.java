package steelyard.rescore;

import it.unimi.dsi.fastutil.ints.IntArrays;
import it.unimi.dsi.fastutil.objects.Object2IntOpenCustomHashMap;

/**
 * Minimum-Bayes-risk choice over an N-best list (Stolcke, Konig &amp; Weintraub 1997; Goel &amp; Byrne 2000):
 * the hypothesis h minimising Σⱼ pⱼ·L(h, hⱼ), L the edit distance of the normalised token sequences.
 *
 * <p>Hypotheses with identical token sequences are merged first (their posteriors add up; the member with the
 * highest posterior, then the earliest in the tie order, stands for the group). Only the {@code maxTexts}
 * groups of highest mass enter the sum, both as candidates and as evidence, which bounds the work at
 * maxTexts²/2 distances; the result says when the cap applied. Ties in expected errors go to the group with
 * more mass, then to the earlier tie order, so results are reproducible.
 *
 * <p>Work arrays are allocated per call ({@code int[n]}, {@code double[n]}); not shared, thread-safe when each
 * thread uses its own {@link EditDistance}.
 */
public final class MbrChooser {
  private final EditDistance distance;
  private final int maxTexts;

  public MbrChooser(EditDistance distance, int maxTexts) {
    if (maxTexts < 1) throw new IllegalArgumentException("maxTexts must be >= 1: " + maxTexts);
    this.distance = distance;
    this.maxTexts = maxTexts;
  }

  /**
   * @param ids        token ids of each hypothesis (same vocabulary)
   * @param posteriors posterior of each hypothesis (summing to 1)
   * @param tieOrder   tie-order position of each hypothesis (smaller first)
   */
  public MbrChoice choose(int[][] ids, double[] posteriors, int[] tieOrder) {
    int n = ids.length;
    Object2IntOpenCustomHashMap<int[]> groupOf = new Object2IntOpenCustomHashMap<>(n, IntArrays.HASH_STRATEGY);
    groupOf.defaultReturnValue(-1);
    int[] rep = new int[n];
    double[] mass = new double[n];
    int groups = 0;
    for (int i = 0; i < n; i++) {
      int g = groupOf.getInt(ids[i]);
      if (g < 0) {
        g = groups++;
        groupOf.put(ids[i], g);
        rep[g] = i;
      } else if (better(i, rep[g], posteriors, tieOrder)) {
        rep[g] = i;
      }
      mass[g] += posteriors[i];
    }
    int[] order = new int[groups];
    for (int g = 0; g < groups; g++) order[g] = g;
    IntArrays.quickSort(order, (a, b) -> {
      int c = Double.compare(mass[b], mass[a]);
      return c != 0 ? c : Integer.compare(tieOrder[rep[a]], tieOrder[rep[b]]);
    });
    int k = Math.min(groups, maxTexts);
    double kept = 0;
    for (int a = 0; a < k; a++) kept += mass[order[a]];
    double[] loss = new double[k];
    for (int a = 0; a < k; a++) {
      int[] x = ids[rep[order[a]]];
      for (int b = a + 1; b < k; b++) {
        int d = distance.distance(x, ids[rep[order[b]]]);
        loss[a] += mass[order[b]] * d;
        loss[b] += mass[order[a]] * d;
      }
    }
    int best = 0;
    for (int a = 1; a < k; a++) if (loss[a] < loss[best]) best = a;
    double expected = kept > 0 ? loss[best] / kept : 0;
    return new MbrChoice(rep[order[best]], expected, groups, groups > k);
  }

  private static boolean better(int i, int j, double[] p, int[] tieOrder) {
    return p[i] > p[j] || (p[i] == p[j] && tieOrder[i] < tieOrder[j]);
  }
}
