package steelyard.lm.train;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;

/**
 * Raw n-gram counts of orders 1 … N as a trie of entries, filled one sentence at a time.
 *
 * <p>Storage per order k (array index k−1): parallel {@link IntArrayList}s {@code parent} (entry index of
 * the (k−1)-gram prefix, −1 for unigrams), {@code word} (token id) and {@code count}, plus a
 * {@link Long2IntOpenHashMap} from {@code (parent+1) << 32 | word} to the entry index, and {@code suffix}:
 * the entry of the n-gram without its first token (−1 for unigrams), which always exists because every
 * substring of a counted n-gram is counted. Cost: 16 bytes of arrays plus about 16–21 bytes of hash table
 * per distinct n-gram (up to twice that while a table grows); nothing per corpus token, so memory is
 * proportional to the number of distinct n-grams. Limits: at most 2^31−1 entries per order and counts up
 * to 2^31−1. {@link #freeze()} drops the hash tables once counting is done.
 *
 * <p>Entries keep first-seen order, so the same corpus gives the same indices. Not thread-safe.
 */
final class NgramCounts {
  private final int order;
  private final IntArrayList[] parent;
  private final IntArrayList[] word;
  private final IntArrayList[] count;
  private final IntArrayList[] suffixLinks;
  private Long2IntOpenHashMap[] index;
  private int[][] suffix;

  NgramCounts(int order) {
    this(order, true);
  }

  private NgramCounts(int order, boolean counting) {
    this.order = order;
    parent = new IntArrayList[order];
    word = new IntArrayList[order];
    count = new IntArrayList[order];
    index = new Long2IntOpenHashMap[order];
    suffixLinks = new IntArrayList[order];
    for (int k = 0; k < order; k++) {
      suffixLinks[k] = new IntArrayList();
      parent[k] = new IntArrayList();
      word[k] = new IntArrayList();
      count[k] = new IntArrayList();
      if (counting) {
        index[k] = new Long2IntOpenHashMap(k == 0 ? 1 << 10 : 1 << 16);
        index[k].defaultReturnValue(-1);
      }
    }
  }

  int order() {
    return order;
  }

  /**
   * Counts every n-gram of orders 1 … N inside {@code ids[0..length)} (a sentence already framed by
   * {@code <s>} … {@code </s>}). Start positions are visited right to left so that the suffix of each new
   * n-gram (the one starting one token later) is already known: suffix links cost no look-up.
   */
  void addSentence(int[] ids, int length) {
    if (previous.length < order) {
      previous = new int[order];
      current = new int[order];
    }
    for (int s = length - 1; s >= 0; s--) {
      int e = -1;
      int end = Math.min(length, s + order);
      for (int j = s; j < end; j++) {
        int k = j - s;
        e = increment(k, e, ids[j], k == 0 ? -1 : previous[k - 1]);
        current[k] = e;
      }
      int[] t = previous;
      previous = current;
      current = t;
    }
  }

  /**
   * Counts only the n-grams whose first token falls in {@code shard} ({@code id % shards}); their suffix
   * links are left unknown (−2) for {@link #merge} to resolve, since suffixes start in other shards.
   */
  void addSentenceShard(int[] ids, int from, int to, int shard, int shards) {
    for (int s = from; s < to; s++) {
      if (ids[s] % shards != shard) continue;
      int e = -1;
      int end = Math.min(to, s + order);
      for (int j = s; j < end; j++) e = increment(j - s, e, ids[j], j == s ? -1 : -2);
    }
  }

  /**
   * One frozen table from per-shard tables (shard i counted the n-grams whose first token id ≡ i mod the
   * number of shards): entries are concatenated shard by shard, parents stay in their shard, and suffix
   * links are looked up in the shard of the n-gram's second token. Renumbered in trie order.
   */
  static NgramCounts merge(NgramCounts[] shards) {
    int order = shards[0].order;
    int n = shards.length;
    NgramCounts m = new NgramCounts(order, false);
    int[][] offset = new int[order][n + 1];
    for (int k = 0; k < order; k++) {
      for (int i = 0; i < n; i++) offset[k][i + 1] = offset[k][i] + shards[i].word[k].size();
      int total = offset[k][n];
      int[] par = new int[total], wd = new int[total], ct = new int[total], sf = new int[total];
      for (int i = 0; i < n; i++) {
        NgramCounts c = shards[i];
        int size = c.word[k].size();
        int base = offset[k][i];
        int[] cp = c.parent[k].elements(), cw = c.word[k].elements(), cc = c.count[k].elements();
        for (int e = 0; e < size; e++) {
          par[base + e] = k == 0 ? -1 : cp[e] + offset[k - 1][i];
          wd[base + e] = cw[e];
          ct[base + e] = cc[e];
        }
      }
      if (k > 0) {
        int[] parentSuffix = m.suffixLinks[k - 1].elements();
        int level = k;
        // read-only look-ups into the shards' tables, independent per entry: split over the cores
        java.util.stream.IntStream.range(0, (total + CHUNK - 1) / CHUNK).parallel().forEach(chunk -> {
          for (int g = chunk * CHUNK, to = Math.min(total, g + CHUNK); g < to; g++) {
            sf[g] = mergedSuffix(shards, offset, level, parentSuffix[par[g]], wd[g]);
          }
        });
      } else {
        java.util.Arrays.fill(sf, -1);
      }
      m.parent[k] = IntArrayList.wrap(par);
      m.word[k] = IntArrayList.wrap(wd);
      m.count[k] = IntArrayList.wrap(ct);
      m.suffixLinks[k] = IntArrayList.wrap(sf);
      for (NgramCounts c : shards) {
        // copied, and no later order looks up entries of order k−1: release them early
        c.parent[k] = c.word[k] = c.count[k] = c.suffixLinks[k] = null;
        if (k > 0) c.index[k - 1] = null;
      }
    }
    for (NgramCounts c : shards) c.index = null;
    m.freeze();
    return m;
  }

  private static final int CHUNK = 1 << 16;

  /** Global index of (suffix of the parent, w) at 0-based level k, looked up in the shard of its first token. */
  private static int mergedSuffix(NgramCounts[] shards, int[][] offset, int k, int parentSuffix, int w) {
    int n = shards.length;
    int shard = parentSuffix < 0 ? w % n : shardOf(offset[k - 2], parentSuffix);
    int local = parentSuffix < 0 ? -1 : parentSuffix - offset[k - 2][shard];
    int e = shards[shard].index[k - 1].get(key(local, w));
    if (e < 0) throw new IllegalStateException("suffix of an n-gram missing at order " + (k + 1));
    return e + offset[k - 1][shard];
  }

  private static int shardOf(int[] offsets, int global) {
    int i = 0;
    while (global >= offsets[i + 1]) i++;
    return i;
  }

  private int[] previous = new int[0];
  private int[] current = new int[0];

  private int increment(int k, int p, int w, int suffixEntry) {
    Long2IntOpenHashMap map = index[k];
    int size = word[k].size();
    int e = map.putIfAbsent(key(p, w), size);
    if (e < 0) {
      parent[k].add(p);
      word[k].add(w);
      count[k].add(1);
      suffixLinks[k].add(suffixEntry);
      return size;
    }
    count[k].elements()[e]++;
    return e;
  }

  /** Entry index of (prefix entry {@code p} of order k, token w) at order k+1 (0-based k), or −1. */
  int find(int k, int p, int w) {
    return index[k].get(key(p, w));
  }

  /**
   * Drops the hash tables (no more counting or {@link #find} afterwards) and renumbers every order above 1
   * in trie order: entries sorted by their parent's (new) index, first-seen order among siblings. Then the
   * children of an entry are a contiguous index range and a depth-first walk reads every order's arrays
   * front to back. Suffix links are renumbered along.
   */
  void freeze() {
    if (suffix != null) return;
    index = null;
    suffix = new int[order][];
    suffix[0] = suffixLinks[0].toIntArray();
    int[] previousNewIndex = null;
    for (int k = 1; k < order; k++) {
      int n = word[k].size();
      int parents = word[k - 1].size();
      int[] par = parent[k].elements();
      int[] oldToNewParent = previousNewIndex;
      int[] start = new int[parents + 1];
      for (int e = 0; e < n; e++) start[newIndex(oldToNewParent, par[e]) + 1]++;
      for (int h = 0; h < parents; h++) start[h + 1] += start[h];
      int[] newIndex = new int[n];
      for (int e = 0; e < n; e++) newIndex[e] = start[newIndex(oldToNewParent, par[e])]++;
      int[] newParent = new int[n];
      int[] newWord = new int[n];
      int[] newCount = new int[n];
      int[] newSuffix = new int[n];
      int[] wd = word[k].elements();
      int[] ct = count[k].elements();
      int[] sf = suffixLinks[k].elements();
      for (int e = 0; e < n; e++) {
        int i = newIndex[e];
        newParent[i] = newIndex(oldToNewParent, par[e]);
        newWord[i] = wd[e];
        newCount[i] = ct[e];
        newSuffix[i] = newIndex(oldToNewParent, sf[e]);
      }
      parent[k] = IntArrayList.wrap(newParent);
      word[k] = IntArrayList.wrap(newWord);
      count[k] = IntArrayList.wrap(newCount);
      suffix[k] = newSuffix;
      suffixLinks[k] = null;
      previousNewIndex = newIndex;
    }
    suffixLinks[0] = null;
  }

  /** After estimation: drops counts and suffix links (8 bytes per entry); parents and words stay. */
  void releaseCountsAndSuffixes() {
    for (int k = 0; k < order; k++) count[k] = null;
    suffix = new int[0][];
  }

  private static int newIndex(int[] oldToNew, int old) {
    return oldToNew == null ? old : oldToNew[old];
  }

  /** After {@link #freeze()}: the first child (order k+1, 1-based k) index range start of each entry of order k. */
  int[] childStarts(int k) {
    int parents = size(k);
    int[] start = new int[parents + 1];
    int[] par = parents(k + 1);
    for (int e = 0; e < size(k + 1); e++) start[par[e] + 1]++;
    for (int h = 0; h < parents; h++) start[h + 1] += start[h];
    return start;
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
