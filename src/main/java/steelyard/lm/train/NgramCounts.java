package steelyard.lm.train;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;

/**
 * Raw n-gram counts of orders 1 … N as a trie of entries, filled one sentence at a time.
 *
 * <p>Storage per order k (array index k−1): parallel {@link IntArrayList}s {@code parent} (entry index of
 * the (k−1)-gram prefix, −1 for unigrams), {@code word} (token id) and {@code count}, plus a
 * {@link Long2IntOpenHashMap} from {@code (parent+1) << 32 | word} to the entry index. Cost: 12 bytes of
 * arrays plus about 16–21 bytes of hash table per distinct n-gram (up to twice that while a table grows);
 * nothing per corpus token, so memory is proportional to the number of distinct n-grams. Limits: at most
 * 2^31−1 entries per order and counts up to 2^31−1. After {@link #freeze()} the hash tables are dropped
 * and every entry gets a {@code suffix} link (4 bytes): the entry of the n-gram without its first token
 * (−1 for unigrams), which always exists because every substring of a counted n-gram is counted.
 *
 * <p>Entries keep first-seen order, so the same corpus gives the same indices. Not thread-safe.
 */
final class NgramCounts {
  private final int order;
  private final IntArrayList[] parent;
  private final IntArrayList[] word;
  private final IntArrayList[] count;
  private Long2IntOpenHashMap[] index;
  private int[][] suffix;

  NgramCounts(int order) {
    this.order = order;
    parent = new IntArrayList[order];
    word = new IntArrayList[order];
    count = new IntArrayList[order];
    index = new Long2IntOpenHashMap[order];
    for (int k = 0; k < order; k++) {
      parent[k] = new IntArrayList();
      word[k] = new IntArrayList();
      count[k] = new IntArrayList();
      index[k] = new Long2IntOpenHashMap(k == 0 ? 1 << 10 : 1 << 16);
      index[k].defaultReturnValue(-1);
    }
  }

  int order() {
    return order;
  }

  /**
   * Counts every n-gram of orders 1 … N inside {@code ids[0..length)} (a sentence already framed by
   * {@code <s>} … {@code </s>}), except n-grams that start with {@code </s>} and are longer than one token
   * (there are none: it is last).
   */
  void addSentence(int[] ids, int length) {
    for (int s = 0; s < length; s++) {
      int e = -1;
      int end = Math.min(length, s + order);
      for (int j = s; j < end; j++) e = increment(j - s, e, ids[j]);
    }
  }

  private int increment(int k, int p, int w) {
    Long2IntOpenHashMap map = index[k];
    int size = word[k].size();
    int e = map.putIfAbsent(key(p, w), size);
    if (e < 0) {
      parent[k].add(p);
      word[k].add(w);
      count[k].add(1);
      return size;
    }
    IntArrayList c = count[k];
    c.set(e, c.getInt(e) + 1);
    return e;
  }

  /** Entry index of (prefix entry {@code p} of order k, token w) at order k+1 (0-based k), or −1. */
  int find(int k, int p, int w) {
    return index[k].get(key(p, w));
  }

  /** Computes suffix links and drops the hash tables (no more counting or {@link #find} afterwards). */
  void freeze() {
    if (suffix != null) return;
    suffix = new int[order][];
    for (int k = 0; k < order; k++) {
      int n = word[k].size();
      int[] s = new int[n];
      if (k == 0) {
        java.util.Arrays.fill(s, -1);
      } else {
        int[] par = parent[k].elements();
        int[] wd = word[k].elements();
        int[] parentSuffix = suffix[k - 1];
        for (int i = 0; i < n; i++) {
          s[i] = index[k - 1].get(key(parentSuffix[par[i]], wd[i]));
          if (s[i] < 0) throw new IllegalStateException("suffix of an n-gram missing at order " + k);
        }
      }
      suffix[k] = s;
    }
    index = null;
  }

  boolean frozen() {
    return suffix != null;
  }

  /** Number of distinct n-grams of order k (1-based). */
  int size(int k) {
    return word[k - 1].size();
  }

  /** Backing array of parents of order k (1-based); valid up to {@link #size}. */
  int[] parents(int k) {
    return parent[k - 1].elements();
  }

  int[] words(int k) {
    return word[k - 1].elements();
  }

  int[] counts(int k) {
    return count[k - 1].elements();
  }

  /** Suffix links of order k (1-based), after {@link #freeze()}. */
  int[] suffixes(int k) {
    return suffix[k - 1];
  }

  /** The token ids of entry {@code e} of order k (1-based), oldest first. */
  int[] ngram(int k, int e) {
    return ngram(k, e, new int[k]);
  }

  /** Writes the token ids of entry {@code e} of order k into {@code out[0..k)} and returns it. */
  int[] ngram(int k, int e, int[] out) {
    for (int j = k - 1; j >= 0; j--) {
      out[j] = word[j].elements()[e];
      e = parent[j].elements()[e];
    }
    return out;
  }

  private static long key(int p, int w) {
    return ((long) (p + 1) << 32) | (w & 0xffffffffL);
  }
}
