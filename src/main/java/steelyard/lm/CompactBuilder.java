package steelyard.lm;

import java.util.Arrays;

/** Converts between {@link BackoffModel} and the array layout of {@link CompactModel} (see its javadoc). */
final class CompactBuilder {
  private CompactBuilder() {}

  /** Slots for a child table of {@code n} entries: full up to 3, else about 80 % full. */
  static int capacity(int n) {
    return n < 4 ? n : n + (n >> 2);
  }

  static CompactModel build(BackoffModel m) {
    int order = m.order();
    int v = m.vocabularySize();
    int[][] levels = new int[order][];
    int[][] slotOf = new int[order][];
    int[] uni = new int[4 * (v + 1)];
    for (int w = 0; w < v; w++) {
      uni[4 * w] = CompactModel.EMPTY;
      uni[4 * w + 1] = Float.floatToIntBits(Float.NaN);
    }
    int n1 = m.entryCount(1);
    slotOf[0] = new int[n1];
    for (int i = 0; i < n1; i++) {
      int w = m.lastWord(1, i);
      slotOf[0][i] = w;
      uni[4 * w] = w;
      uni[4 * w + 1] = Float.floatToIntBits((float) m.log10Prob(1, i));
      uni[4 * w + 2] = Float.floatToIntBits((float) m.log10Backoff(1, i));
    }
    levels[0] = uni;
    for (int k = 2; k <= order; k++) {
      boolean top = k == order;
      int[] parent = levels[k - 2];
      int parentSlots = parent.length / 4 - 1;
      int n = m.entryCount(k);
      int[] parentSlot = new int[n];
      int[] children = new int[parentSlots];
      for (int i = 0; i < n; i++) {
        parentSlot[i] = slotOf[k - 2][m.parentEntry(k, i)];
        children[parentSlot[i]]++;
      }
      long total = 0;
      for (int c = 0; c < parentSlots; c++) {
        parent[4 * c + 3] = (int) total;
        total += capacity(children[c]);
      }
      int stride = top ? 2 : 4;
      if (total * stride + 4 > Integer.MAX_VALUE - 8) throw new IllegalArgumentException("too many " + k + "-grams for the compact layout: " + n);
      parent[4 * parentSlots + 3] = (int) total;
      int[] a = new int[(int) total * stride + (top ? 0 : 4)];
      int wordStride = top ? 1 : 4;
      for (int s = 0; s < total; s++) a[s * wordStride] = CompactModel.EMPTY;
      int[] entryAt = robinHood(m, k, parent, parentSlot, (int) total);
      slotOf[k - 1] = new int[n];
      for (int slot = 0; slot < total; slot++) {
        int i = entryAt[slot];
        if (i < 0) continue;
        slotOf[k - 1][i] = slot;
        int p = Float.floatToIntBits((float) m.log10Prob(k, i));
        if (top) {
          a[slot] = m.lastWord(k, i);
          a[(int) total + slot] = p;
        } else {
          a[slot * 4] = m.lastWord(k, i);
          a[slot * 4 + 1] = p;
          a[slot * 4 + 2] = Float.floatToIntBits((float) m.log10Backoff(k, i));
        }
      }
      levels[k - 1] = a;
    }
    int[] counts = new int[order];
    for (int k = 1; k <= order; k++) counts[k - 1] = m.ngramCount(k);
    String[] tokens = new String[v];
    for (int i = 0; i < v; i++) tokens[i] = m.token(i);
    java.util.List<String> meta = ModelMetadata.linesFor(m, m.metadata());
    CompactModel draft = new CompactModel(order, meta, tokens, levels, counts, m.unknownFloorLog10(), false);
    return new CompactModel(order, meta, tokens, levels, counts, m.unknownFloorLog10(), suffixClosed(m, draft));
  }

  /**
   * Places the entries of order k in their parents' child tables by Robin Hood insertion (an entry displaces a
   * resident that is closer to its home slot), so that a lookup can stop as soon as it meets a resident closer
   * to home than the probe distance: most queries are misses, and this keeps them short. Returns the entry
   * index per slot (−1 = empty). Deterministic for a given entry order.
   */
  private static int[] robinHood(BackoffModel m, int k, int[] parent, int[] parentSlot, int total) {
    int[] entryAt = new int[total];
    Arrays.fill(entryAt, -1);
    for (int i = 0; i < parentSlot.length; i++) {
      int c = parentSlot[i];
      int start = parent[4 * c + 3];
      int size = parent[4 * c + 7] - start;
      int cur = i;
      int w = m.lastWord(k, cur);
      int pos = CompactModel.home(w, size);
      int d = 0;
      while (true) {
        int r = entryAt[start + pos];
        if (r < 0) {
          entryAt[start + pos] = cur;
          break;
        }
        int rw = m.lastWord(k, r);
        int dr = pos - CompactModel.home(rw, size);
        if (dr < 0) dr += size;
        if (dr < d) {
          entryAt[start + pos] = cur;
          cur = r;
          w = rw;
          d = dr;
        }
        if (++pos == size) pos = 0;
        d++;
      }
    }
    return entryAt;
  }

  /** Whether every entry of order ≥ 2 has its suffix (first word dropped) as an entry. */
  static boolean suffixClosed(BackoffModel m, CompactModel c) {
    int[] g = new int[m.order()];
    for (int k = 2; k <= m.order(); k++) {
      int n = m.entryCount(k);
      for (int i = 0; i < n; i++) {
        m.ngram(k, i, g);
        int e = -1;
        for (int j = 1; j < k && (j == 1 || e >= 0); j++) e = c.find(j - 1, e, g[j]);
        if (e < 0) return false;
      }
    }
    return true;
  }

  /** Whether every slot of order ≥ 2 has its suffix as an entry, checked on the arrays alone. */
  static boolean suffixClosed(CompactModel c) {
    int[] g = new int[c.order];
    return walkClosed(c, 0, -1, g, 0);
  }

  private static boolean walkClosed(CompactModel c, int level, int slot, int[] prefix, int len) {
    // Iterates the trie depth first; for each entry of order ≥ 2 looks up its suffix from the root.
    int[] a = c.levels[level];
    int stride = level == c.order - 1 && level > 0 ? 1 : 4;
    int from;
    int to;
    if (level == 0) {
      from = 0;
      to = a.length / 4 - 1;
    } else {
      int[] p = c.levels[level - 1];
      from = p[4 * slot + 3];
      to = p[4 * slot + 7];
    }
    for (int s = from; s < to; s++) {
      int w = a[s * stride];
      if (w == CompactModel.EMPTY) continue;
      prefix[len] = w;
      if (len >= 1) {
        int e = -1;
        for (int j = 1; j <= len && (j == 1 || e >= 0); j++) e = c.find(j - 1, e, prefix[j]);
        if (e < 0) return false;
      }
      if (level < c.order - 1 && !walkClosed(c, level + 1, s, prefix, len + 1)) return false;
    }
    return true;
  }

  static BackoffModel toBackoffModel(CompactModel c) {
    BackoffModel.Builder b = new BackoffModel.Builder(c.order, c.unit, c.normalisation);
    for (String t : c.tokens) b.tokenId(t);
    for (String line : c.metadata) b.metadata(line);
    b.unknownFloorLog10(c.unknownFloorLog10);
    for (int k = 1; k <= c.order; k++) b.expectEntries(k, c.ngramCounts[k - 1]);
    addChildren(c, b, 0, -1, new int[c.order], 0);
    return b.build();
  }

  private static void addChildren(CompactModel c, BackoffModel.Builder b, int level, int slot, int[] prefix, int len) {
    int[] a = c.levels[level];
    boolean top = level == c.order - 1 && level > 0;
    int stride = top ? 1 : 4;
    int from = level == 0 ? 0 : c.levels[level - 1][4 * slot + 3];
    int to = level == 0 ? a.length / 4 - 1 : c.levels[level - 1][4 * slot + 7];
    for (int s = from; s < to; s++) {
      int w = a[s * stride];
      if (w == CompactModel.EMPTY) continue;
      prefix[len] = w;
      float p = Float.intBitsToFloat(top ? a[a.length / 2 + s] : a[s * 4 + 1]);
      if (!Float.isNaN(p)) {
        double bow = top ? 0 : Float.intBitsToFloat(a[s * 4 + 2]);
        b.add(Arrays.copyOf(prefix, len + 1), p, bow);
      }
      if (level < c.order - 1) addChildren(c, b, level + 1, s, prefix, len + 1);
    }
  }
}
