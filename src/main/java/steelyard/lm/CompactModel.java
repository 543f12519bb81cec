package steelyard.lm;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.List;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * The compact, fast query engine: the same ARPA back-off semantics as {@link BackoffModel} (scores agree up to
 * float rounding), stored in a few primitive arrays with no per-n-gram objects.
 *
 * <p><b>Layout.</b> One {@code int[]} per order, records interleaved so that a probe touches one cache line:
 * <ul>
 *   <li>unigrams: 4 ints per token id (indexed directly by id, plus one sentinel):
 *       {@code [present ? id : −1, float bits log10 P, float bits log10 back-off, first child slot]};</li>
 *   <li>orders 2 … N−1: 4 ints per slot (plus one sentinel): {@code [word id or −1 if empty, P bits, back-off bits, first child slot]};</li>
 *   <li>order N: the word ids of all slots (−1 = empty), then the P bits of all slots, so that probes — mostly
 *       misses — read only the dense word half.</li>
 * </ul>
 * The children of a context slot c (the n-grams one order higher whose prefix is c) occupy the slots
 * {@code [first(c), first(c+1))} of the next order, laid out as a small open-addressing table keyed by word
 * id (multiplicative hash, linear probing in Robin Hood order so that a miss stops early, ≈ 80 % full; tables of
 * up to 3 children are full). A slot
 * number is the n-gram's id, and {@link LmState#contextIndex}{@code [j]} holds the slot of the history suffix of
 * length j+1, so scoring a token probes at most one small table per order and never re-looks-up the
 * context. A context-only entry (an unlisted prefix in a pruned file) has P = NaN.
 *
 * <p><b>Cost.</b> About 16/0.8 = 20 bytes per n-gram of a middle order, 8/0.8 = 10 bytes per n-gram of the
 * highest order, 16 bytes per vocabulary token; for a typical 3-gram model ≈ 14 bytes per n-gram overall
 * ({@link #ngramBytesUsed()} reports the exact figure). The vocabulary strings and their hash map come on top
 * ({@link #ramBytesUsed()} includes an estimate). Limits: at most 2^31/4 − 1 slots per middle order and 2^30 − 1
 * for the highest order; values are single-precision floats (about 7 significant digits, as in ARPA files).
 *
 * <p><b>Speed.</b> In a model whose entries are suffix-closed (every entry's suffix is an entry, as in any file
 * written by the usual estimators) one bottom-up pass both scores and advances the state; otherwise a
 * slower two-pass path keeps the exact semantics.
 *
 * <p>Immutable; safe for concurrent readers (states are per caller).
 */
public final class CompactModel implements LanguageModel {
  static final int EMPTY = -1;
  private static final double LN_10 = Math.log(10);

  final int order;
  final Unit unit;
  final NormalisationOptions normalisation;
  final List<String> metadata;
  final String[] tokens;
  private final Object2IntOpenHashMap<String> ids;
  final int[][] levels;
  final int[] ngramCounts;
  final double unknownFloorLog10;
  final boolean suffixClosed;
  private final int bos;
  private final int eos;
  private final int unk;
  private final boolean unkListed;
  private final double unkLog10;
  /** Slots of the highest order (its array holds the words, then the probabilities). */
  private final int topSlots;

  CompactModel(int order, List<String> metadata, String[] tokens, int[][] levels, int[] ngramCounts,
      double unknownFloorLog10, boolean suffixClosed) {
    this.order = order;
    this.metadata = List.copyOf(metadata);
    this.unit = ModelMetadata.unit(metadata);
    this.normalisation = ModelMetadata.normalisation(metadata);
    this.tokens = tokens;
    this.levels = levels;
    this.ngramCounts = ngramCounts;
    this.unknownFloorLog10 = unknownFloorLog10;
    this.suffixClosed = suffixClosed;
    ids = new Object2IntOpenHashMap<>(tokens.length);
    ids.defaultReturnValue(-1);
    for (int i = 0; i < tokens.length; i++) ids.put(tokens[i], i);
    bos = ids.getInt(BackoffModel.SENTENCE_START);
    eos = ids.getInt(BackoffModel.SENTENCE_END);
    unk = ids.getInt(BackoffModel.UNKNOWN);
    float pu = unk < 0 || levels[0][4 * unk] < 0 ? Float.NaN : Float.intBitsToFloat(levels[0][4 * unk + 1]);
    unkListed = !Float.isNaN(pu);
    unkLog10 = pu;
    topSlots = order > 1 ? levels[order - 1].length / 2 : 0;
  }

  /** Builds the compact form of {@code model} (same token ids, same scores up to float rounding). */
  public static CompactModel of(BackoffModel model) {
    return CompactBuilder.build(model);
  }

  // ---- LanguageModel ----

  @Override public int order() { return order; }
  @Override public Unit unit() { return unit; }
  @Override public NormalisationOptions normalisation() { return normalisation; }
  @Override public int vocabularySize() { return tokens.length; }
  @Override public String token(int id) { return tokens[id]; }
  @Override public int unknownId() { return unk; }
  @Override public int sentenceStartId() { return bos; }
  @Override public int sentenceEndId() { return eos; }

  @Override
  public int wordId(String token) {
    int id = ids.getInt(token);
    return id < 0 ? unk : id;
  }

  @Override
  public LmState newState() {
    return new LmState(order - 1);
  }

  @Override
  public void beginSentence(LmState out) {
    out.length = 0;
    out.handle = 0;
    if (order > 1) score(out, bos, out);
  }

  @Override
  public double score(LmState in, int w, LmState out) {
    return (suffixClosed ? scoreClosed(in, w, out) : scoreGeneric(in, w, out)) * LN_10;
  }

  /** log10 P(w | history of {@code in}) by ARPA back-off; does not change the state. */
  public double log10Score(LmState in, int w) {
    double bow = 0;
    for (int len = in.length; len >= 0; len--) {
      int ctx = len == 0 ? -1 : in.contextIndex[len - 1];
      int e = find(len, ctx, w);
      if (e >= 0) {
        float p = prob(len, e);
        if (!Float.isNaN(p)) return p + bow;
      }
      if (len > 0) bow += backoff(len - 1, ctx);
    }
    return unknownLog10(w) + bow;
  }

  /** The order of the n-gram that decided {@link #log10Score}, by the same back-off walk (see {@link LanguageModel}). */
  @Override
  public int matchedOrder(LmState in, int w) {
    for (int len = in.length; len >= 0; len--) {
      int e = find(len, len == 0 ? -1 : in.contextIndex[len - 1], w);
      if (e >= 0 && !Float.isNaN(prob(len, e))) return len + 1;
    }
    return w != unk && unkListed ? 1 : 0;
  }

  /**
   * One bottom-up pass, valid when every entry's suffix is an entry: the found entries then form a chain
   * without gaps, a miss at one order means misses at all higher ones, and a found bigram implies its
   * unigram. The first probe of the highest order is loaded before the lower orders are searched, so that its
   * cache miss overlaps theirs; the unigram record is read only when no higher order decides.
   */
  private double scoreClosed(LmState in, int w, LmState out) {
    final int hi = in.length;
    int topStart = 0;
    int topSize = 0;
    int topPos = 0;
    int topFirst = EMPTY;
    if (hi >= 2) {
      int c = in.contextIndex[hi - 1];
      int[] p = levels[hi - 1];
      topStart = p[(c << 2) + 3];
      topSize = p[((c + 1) << 2) + 3] - topStart;
      if (topSize > 0) {
        topPos = home(w, topSize);
        topFirst = levels[hi][(topStart + topPos) << (hi == order - 1 ? 0 : 2)];
      }
    }
    double best = Double.NaN;
    double bow = 0;
    int top = 0;
    int ctx = hi > 0 ? in.contextIndex[0] : 0;
    for (int j = 1; j <= hi; j++) {
      int next = j < hi ? in.contextIndex[j] : 0; // read before out.contextIndex[j] may overwrite it
      float b = backoff(j - 1, ctx);
      int e;
      if (j == hi && j >= 2) {
        e = probe(j, topStart, topSize, topPos, topFirst, w);
      } else {
        e = find(j, ctx, w);
      }
      if (e < 0) {
        bow += b;
        for (int jj = j + 1; jj <= hi; jj++) bow += backoff(jj - 1, in.contextIndex[jj - 1]);
        break;
      }
      float p = prob(j, e);
      if (Float.isNaN(p)) {
        bow += b;
      } else {
        best = p;
        bow = 0;
      }
      if (j <= order - 2) out.contextIndex[j] = e;
      top = j;
      ctx = next;
    }
    final int[] uni = levels[0];
    if (top == 0 && uni[w << 2] < 0) {
      out.length = 0;
      out.handle = 0;
      return unknownLog10(w) + bow;
    }
    if (Double.isNaN(best)) {
      float pu = Float.intBitsToFloat(uni[(w << 2) + 1]);
      best = Float.isNaN(pu) ? unknownLog10(w) : pu;
    }
    if (order > 1) out.contextIndex[0] = w;
    finishState(in, w, out, Math.min(top, order - 2) + 1);
    return best + bow;
  }

  /** Exact semantics for any model: score top-down, then advance as {@link BackoffModel} does. */
  private double scoreGeneric(LmState in, int w, LmState out) {
    double lp = log10Score(in, w);
    int maxLen = Math.min(Math.min(in.length, order - 2) + 1, order - 1);
    int[] found = out.contextIndex;
    for (int j = maxLen - 1; j >= 0; j--) {
      int ctx = j == 0 ? -1 : in.contextIndex[j - 1];
      found[j] = (j > 0 && ctx < 0) ? -1 : find(j, ctx, w);
    }
    int newLength = 0;
    while (newLength < maxLen && found[newLength] >= 0) newLength++;
    if (newLength == 0) {
      out.length = 0;
      out.handle = 0;
    } else {
      finishState(in, w, out, newLength);
    }
    return lp;
  }

  private static void finishState(LmState in, int w, LmState out, int newLength) {
    if (newLength <= 0) {
      out.length = 0;
    } else {
      System.arraycopy(in.history, in.length + 1 - newLength, out.history, 0, newLength - 1);
      out.history[newLength - 1] = w;
      out.length = newLength;
    }
    out.handle = 0;
  }

  private double unknownLog10(int w) {
    return w != unk && unkListed ? unkLog10 : unknownFloorLog10;
  }

  /** Slot of (context slot {@code ctx} of order j, word w) in order j+1 (0-based level j), or −1. */
  int find(int level, int ctx, int w) {
    if (level == 0) return levels[0][w << 2] >= 0 ? w : -1;
    int[] parent = levels[level - 1];
    int start = parent[(ctx << 2) + 3];
    int size = parent[((ctx + 1) << 2) + 3] - start;
    if (size == 0) return -1;
    int pos = home(w, size);
    return probe(level, start, size, pos, levels[level][(start + pos) << (level == order - 1 ? 0 : 2)], w);
  }

  /** Robin Hood probe of a child table whose first candidate word {@code first} (at {@code pos}) is already loaded. */
  private int probe(int level, int start, int size, int pos, int first, int w) {
    if (size == 0) return -1;
    int[] a = levels[level];
    int shift = level == order - 1 ? 0 : 2;
    int x = first;
    for (int d = 0; d < size; d++) {
      if (x == w) return start + pos;
      if (x == EMPTY) return -1;
      // A resident closer to its home than we are to ours means w is absent (Robin Hood order).
      int dx = pos - home(x, size);
      if (dx < 0) dx += size;
      if (dx < d) return -1;
      if (++pos == size) pos = 0;
      x = a[(start + pos) << shift];
    }
    return -1;
  }

  /** Home position of word {@code w} in a child table of {@code size} slots (multiply-shift range reduction). */
  static int home(int w, int size) {
    int h = w * 0x9E3779B9;
    return (int) (((h ^ (h >>> 15)) & 0xffffffffL) * size >>> 32);
  }

  private float prob(int level, int slot) {
    if (level == order - 1 && level > 0) return Float.intBitsToFloat(levels[level][topSlots + slot]);
    return Float.intBitsToFloat(levels[level][(slot << 2) + 1]);
  }

  private float backoff(int level, int slot) {
    return Float.intBitsToFloat(levels[level][(slot << 2) + 2]);
  }

  // ---- description ----

  /** Number of listed n-grams of order {@code k} (1-based; context-only entries excluded). */
  public int ngramCount(int k) {
    return ngramCounts[k - 1];
  }

  /** Whether {@code <unk>} is a listed unigram (an open-vocabulary model). */
  public boolean hasUnknownUnigram() {
    return unkListed;
  }

  public double unknownFloorLog10() {
    return unknownFloorLog10;
  }

  public List<String> metadata() {
    return metadata;
  }

  /** Bytes of the n-gram arrays (all orders, including empty slots). */
  public long ngramBytesUsed() {
    long bytes = 0;
    for (int[] a : levels) bytes += 16L + 4L * a.length;
    return bytes;
  }

  /** {@link #ngramBytesUsed()} divided by the number of listed n-grams. */
  public double bytesPerNgram() {
    long n = 0;
    for (int c : ngramCounts) n += c;
    return n == 0 ? 0 : (double) ngramBytesUsed() / n;
  }

  /** Estimated heap bytes: n-gram arrays plus vocabulary strings (about 56 bytes + 1 per char) and their map (about 16 per token). */
  public long ramBytesUsed() {
    long bytes = ngramBytesUsed();
    for (String t : tokens) bytes += 56 + t.length() + 16;
    return bytes;
  }

  /** Rebuilds the exact editable form from the float arrays (values are the stored single-precision ones). */
  public BackoffModel toBackoffModel() {
    return CompactBuilder.toBackoffModel(this);
  }
}
