package steelyard.lm;

import it.unimi.dsi.fastutil.doubles.DoubleArrayList;
import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * An exact back-off n-gram model in double precision: the form that training, ARPA reading, mixing and
 * pruning produce and consume, and a correct (not the most compact) {@link LanguageModel}.
 *
 * <p>Semantics are those of the ARPA format, with probabilities stored as <b>log10</b> (as on disk) and
 * returned by {@link #score} as <b>natural log</b>: {@code P(w | h) = P*(h w)} when {@code h w} is listed,
 * else {@code bow(h) · P(w | h')} with {@code h'} = h without its first word and {@code bow(h) = 1} when
 * {@code h} is not listed. A token with no unigram scores as {@code <unk>}; when {@code <unk>} has no
 * unigram either (a closed-vocabulary model), it gets {@link #unknownFloorLog10()}.
 *
 * <p>Storage, per order k (array index k−1): parallel arrays {@code parent[i]} (entry index of the
 * (k−1)-gram prefix, −1 for unigrams), {@code word[i]}, {@code log10Prob[i]} ({@code NaN} marks a
 * <em>context-only</em> entry: an n-gram not listed itself but needed as the prefix of a listed longer one,
 * as in pruned files; it has back-off weight 0 unless given one) and {@code log10Backoff[i]}, plus a
 * {@link Long2IntOpenHashMap} from {@code (parent+1) << 32 | word} to the entry index. Cost: 24 bytes of
 * arrays plus about 16 bytes of hash table per n-gram (≈ 40 bytes); the compact query engine is the
 * form to use for large models. Entries keep their insertion order, so output is deterministic.
 *
 * <p>Immutable after {@link Builder#build()}; safe for concurrent readers.
 */
public final class BackoffModel implements LanguageModel {
  /** Documented default for a closed-vocabulary model's {@code <unk>}: log10 P = −7. */
  public static final double DEFAULT_UNKNOWN_FLOOR_LOG10 = -7.0;

  public static final String SENTENCE_START = "<s>";
  public static final String SENTENCE_END = "</s>";
  public static final String UNKNOWN = "<unk>";

  private static final double LN_10 = Math.log(10);

  private final int order;
  private final Unit unit;
  private final NormalisationOptions normalisation;
  private final List<String> metadata;
  private final String[] tokens;
  private final Object2IntOpenHashMap<String> ids;
  private final int bos;
  private final int eos;
  private final int unk;
  private final double unknownFloorLog10;
  private final int[][] parent;
  private final int[][] word;
  private final double[][] log10Prob;
  private final double[][] log10Backoff;
  private final Long2IntOpenHashMap[] index;

  private BackoffModel(Builder b) {
    order = b.order;
    unit = b.unit;
    normalisation = b.normalisation;
    metadata = List.copyOf(b.metadata);
    tokens = b.tokens.toArray(new String[0]);
    ids = b.ids;
    bos = ids.getInt(SENTENCE_START);
    eos = ids.getInt(SENTENCE_END);
    unk = ids.getInt(UNKNOWN);
    unknownFloorLog10 = b.unknownFloorLog10;
    parent = new int[order][];
    word = new int[order][];
    log10Prob = new double[order][];
    log10Backoff = new double[order][];
    index = b.index;
    for (int k = 0; k < order; k++) {
      parent[k] = b.parent[k].toIntArray();
      word[k] = b.word[k].toIntArray();
      log10Prob[k] = b.prob[k].toDoubleArray();
      log10Backoff[k] = b.backoff[k].toDoubleArray();
    }
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
    if (order > 1) advance(out, bos, out);
  }

  @Override
  public double score(LmState in, int w, LmState out) {
    double lp = log10Score(in, w);
    advance(in, w, out);
    return lp * LN_10;
  }

  /** log10 P(w | history of {@code in}) by ARPA back-off; does not change the state. */
  public double log10Score(LmState in, int w) {
    double bow = 0;
    for (int len = in.length; len >= 0; len--) {
      int ctx = len == 0 ? -1 : in.contextIndex[len - 1];
      int e = find(len, ctx, w);
      if (e >= 0 && !Double.isNaN(log10Prob[len][e])) return log10Prob[len][e] + bow;
      if (len > 0) bow += log10Backoff[len - 1][ctx];
    }
    if (w != unk && unk >= 0) {
      int e = find(0, -1, unk);
      if (e >= 0 && !Double.isNaN(log10Prob[0][e])) return log10Prob[0][e] + bow;
    }
    return unknownFloorLog10 + bow;
  }

  /** The order of the n-gram that decided {@link #log10Score}, by the same back-off walk (see {@link LanguageModel}). */
  @Override
  public int matchedOrder(LmState in, int w) {
    for (int len = in.length; len >= 0; len--) {
      int e = find(len, len == 0 ? -1 : in.contextIndex[len - 1], w);
      if (e >= 0 && !Double.isNaN(log10Prob[len][e])) return len + 1;
    }
    return w != unk && hasUnknownUnigram() ? 1 : 0;
  }

  /**
   * Sets {@code out} to the state after {@code w}: the longest suffix of (history, w) of at most order−1
   * tokens that is listed as an entry. {@code in} and {@code out} may be the same object.
   */
  void advance(LmState in, int w, LmState out) {
    int m = Math.min(in.length, order - 2);
    int newLength = 0;
    // Descending j so that writing out.contextIndex[j] never clobbers in.contextIndex[j-1] when aliased.
    int[] found = out.contextIndex;
    boolean chain = true;
    int maxLen = Math.min(m + 1, order - 1);
    for (int j = maxLen - 1; j >= 0; j--) {
      int ctx = j == 0 ? -1 : in.contextIndex[j - 1];
      found[j] = (j > 0 && ctx < 0) ? -1 : find(j, ctx, w);
    }
    for (int j = 0; j < maxLen && chain; j++) {
      if (found[j] >= 0) newLength = j + 1; else chain = false;
    }
    if (newLength > 0) {
      System.arraycopy(in.history, in.length + 1 - newLength, out.history, 0, newLength - 1);
      out.history[newLength - 1] = w;
    }
    out.length = newLength;
    out.handle = 0;
  }

  private int find(int k, int parentIndex, int w) {
    return index[k].get(key(parentIndex, w));
  }

  private static long key(int parentIndex, int w) {
    return ((long) (parentIndex + 1) << 32) | (w & 0xffffffffL);
  }

  // ---- direct access for writers, mixing and pruning ----

  /** Number of entries of order {@code k} (1-based), including context-only entries. */
  public int entryCount(int k) {
    return word[k - 1].length;
  }

  /** Number of listed n-grams of order {@code k} (excludes context-only entries). */
  public int ngramCount(int k) {
    int n = 0;
    for (double p : log10Prob[k - 1]) if (!Double.isNaN(p)) n++;
    return n;
  }

  /** Writes the token ids of entry {@code i} of order {@code k} into {@code out[0..k)} (oldest first). */
  public void ngram(int k, int i, int[] out) {
    int e = i;
    for (int j = k - 1; j >= 0; j--) {
      out[j] = word[j][e];
      e = parent[j][e];
    }
  }

  /** Entry index of the n-gram {@code ids} (any order ≤ {@link #order()}), or −1 when not stored. */
  public int entryIndex(int[] ids) {
    int e = -1;
    for (int j = 0; j < ids.length; j++) {
      e = find(j, e, ids[j]);
      if (e < 0) return -1;
    }
    return e;
  }

  /** Entry index (order k−1) of the prefix of entry {@code i} of order {@code k}; −1 for unigrams. */
  int parentEntry(int k, int i) {
    return parent[k - 1][i];
  }

  /** Last token id of entry {@code i} of order {@code k}. */
  int lastWord(int k, int i) {
    return word[k - 1][i];
  }

  /** Stored log10 probability of entry {@code i} of order {@code k}; NaN for a context-only entry. */
  public double log10Prob(int k, int i) {
    return log10Prob[k - 1][i];
  }

  /** Stored log10 back-off weight of entry {@code i} of order {@code k} (0 when none). */
  public double log10Backoff(int k, int i) {
    return log10Backoff[k - 1][i];
  }

  /** log10 P(word | context) by back-off, for any context (ids oldest first; may be longer than order−1). */
  public double log10Prob(int[] context, int w) {
    LmState s = newState();
    for (int c : context) advance(s, c, s);
    return log10Score(s, w);
  }

  /** log10 probability given to a token with no unigram when {@code <unk>} has none either. */
  public double unknownFloorLog10() {
    return unknownFloorLog10;
  }

  /** Whether the model lists {@code <unk>} as a unigram (an open-vocabulary model). */
  public boolean hasUnknownUnigram() {
    int e = unk < 0 ? -1 : find(0, -1, unk);
    return e >= 0 && !Double.isNaN(log10Prob[0][e]);
  }

  /** Free-form provenance lines (smoothing, corpus, normalisation), written as ARPA comment lines. */
  public List<String> metadata() {
    return metadata;
  }

  /** Approximate heap bytes of the n-gram storage (see class javadoc). */
  public long ramBytesUsed() {
    long bytes = 0;
    for (int k = 0; k < order; k++) {
      bytes += 24L * word[k].length;
      bytes += (long) index[k].size() * 12 * 4 / 3;
    }
    return bytes;
  }

  /**
   * Collects n-grams and then builds a {@link BackoffModel}. N-grams may be added in any order; a prefix
   * that is never added itself becomes a context-only entry. Not thread-safe.
   */
  public static final class Builder {
    private final int order;
    private final Unit unit;
    private final NormalisationOptions normalisation;
    private final List<String> metadata = new ArrayList<>();
    private final List<String> tokens = new ArrayList<>();
    private final Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
    private final IntArrayList[] parent;
    private final IntArrayList[] word;
    private final DoubleArrayList[] prob;
    private final DoubleArrayList[] backoff;
    private final Long2IntOpenHashMap[] index;
    private double unknownFloorLog10 = DEFAULT_UNKNOWN_FLOOR_LOG10;
    private boolean built;
    private final int[] cachedPrefix = new int[6];
    private final int[] cachedEntry = new int[6];
    private int cachedLength;

    /** A builder for a model of the given order (1 … 6); {@code <s>}, {@code </s>}, {@code <unk>} get ids 0, 1, 2. */
    public Builder(int order, Unit unit, NormalisationOptions normalisation) {
      if (order < 1 || order > 6) throw new IllegalArgumentException("order must be 1..6: " + order);
      this.order = order;
      this.unit = Objects.requireNonNull(unit, "unit");
      this.normalisation = Objects.requireNonNull(normalisation, "normalisation");
      ids.defaultReturnValue(-1);
      parent = new IntArrayList[order];
      word = new IntArrayList[order];
      prob = new DoubleArrayList[order];
      backoff = new DoubleArrayList[order];
      index = new Long2IntOpenHashMap[order];
      for (int k = 0; k < order; k++) {
        parent[k] = new IntArrayList();
        word[k] = new IntArrayList();
        prob[k] = new DoubleArrayList();
        backoff[k] = new DoubleArrayList();
        index[k] = new Long2IntOpenHashMap();
        index[k].defaultReturnValue(-1);
      }
      tokenId(SENTENCE_START);
      tokenId(SENTENCE_END);
      tokenId(UNKNOWN);
    }

    /** The id of {@code token}, adding it to the vocabulary when new. */
    public int tokenId(String token) {
      int id = ids.getInt(token);
      if (id >= 0) return id;
      id = tokens.size();
      tokens.add(token);
      ids.put(token, id);
      return id;
    }

    /**
     * Presizes the storage of order {@code k} (1-based) for about {@code n} entries, e.g. from the counts of an
     * ARPA {@code \data\} section; only effective before the first entry of that order. Purely a speed hint.
     */
    public Builder expectEntries(int k, int n) {
      int i = k - 1;
      if (i < 0 || i >= order || n <= 0 || !word[i].isEmpty()) return this;
      parent[i].ensureCapacity(n);
      word[i].ensureCapacity(n);
      prob[i].ensureCapacity(n);
      backoff[i].ensureCapacity(n);
      index[i] = new Long2IntOpenHashMap(n);
      index[i].defaultReturnValue(-1);
      return this;
    }

    public Builder metadata(String line) {
      metadata.add(line);
      return this;
    }

    public Builder unknownFloorLog10(double value) {
      if (!(value <= 0)) throw new IllegalArgumentException("log10 floor must be <= 0: " + value);
      unknownFloorLog10 = value;
      return this;
    }

    /**
     * Adds a listed n-gram (ids oldest first, length 1 … order) with its log10 probability and log10
     * back-off weight. Returns false, changing nothing, when the n-gram was already listed.
     */
    public boolean add(int[] ngram, double log10Probability, double log10BackoffWeight) {
      if (built) throw new IllegalStateException("already built");
      if (ngram.length < 1 || ngram.length > order)
        throw new IllegalArgumentException("n-gram length " + ngram.length + " not in 1.." + order);
      if (Double.isNaN(log10Probability)) throw new IllegalArgumentException("log10 probability is NaN");
      int p = -1;
      boolean same = true;
      for (int j = 0; j < ngram.length - 1; j++) {
        // Files list n-grams grouped by context: reuse the previous call's prefix entries while they match.
        same &= j < cachedLength && cachedPrefix[j] == ngram[j];
        if (same) {
          p = cachedEntry[j];
        } else {
          p = entry(j, p, ngram[j]);
          cachedPrefix[j] = ngram[j];
          cachedEntry[j] = p;
        }
      }
      cachedLength = ngram.length - 1;
      int k = ngram.length - 1;
      long key = key(p, ngram[k]);
      int e = index[k].get(key);
      if (e >= 0) {
        if (!Double.isNaN(prob[k].getDouble(e))) return false;
        prob[k].set(e, log10Probability);
        backoff[k].set(e, log10BackoffWeight);
        return true;
      }
      e = newEntry(k, p, ngram[k], log10Probability, log10BackoffWeight);
      return e >= 0;
    }

    /**
     * Fast path of {@link #add} for callers that add n-grams parent first and know the parent's entry index:
     * appends the listed n-gram (n-gram of entry {@code parentEntry} of order k−1) + {@code word} of order
     * {@code k} and returns its entry index. One hash-table put; no prefix look-ups. Contract (checked by
     * assertions only): 1 ≤ k ≤ order; {@code parentEntry} is −1 for k = 1, else an existing entry of order
     * k−1; the n-gram is not stored yet. Under that contract the result equals {@link #add} of the full n-gram.
     */
    public int addChild(int k, int parentEntry, int word, double log10Probability, double log10BackoffWeight) {
      if (built) throw new IllegalStateException("already built");
      if (Double.isNaN(log10Probability)) throw new IllegalArgumentException("log10 probability is NaN");
      int i = k - 1;
      assert i >= 0 && i < order : "order " + k + " not in 1.." + order;
      assert i == 0 ? parentEntry == -1 : parentEntry >= 0 && parentEntry < this.word[i - 1].size()
          : "no entry " + parentEntry + " of order " + (k - 1);
      int e = this.word[i].size();
      int previous = index[i].put(key(parentEntry, word), e);
      assert previous < 0 : "n-gram already stored as entry " + previous + " of order " + k;
      parent[i].add(parentEntry);
      this.word[i].add(word);
      prob[i].add(log10Probability);
      backoff[i].add(log10BackoffWeight);
      cachedLength = 0;
      return e;
    }

    /** Whether an n-gram is listed (not merely a context). */
    public boolean contains(int[] ngram) {
      int p = -1;
      for (int j = 0; j < ngram.length; j++) {
        p = index[j].get(key(p, ngram[j]));
        if (p < 0) return false;
      }
      return !Double.isNaN(prob[ngram.length - 1].getDouble(p));
    }

    public BackoffModel build() {
      if (built) throw new IllegalStateException("already built");
      built = true;
      return new BackoffModel(this);
    }

    private int entry(int k, int p, int w) {
      int e = index[k].get(key(p, w));
      return e >= 0 ? e : newEntry(k, p, w, Double.NaN, 0.0);
    }

    private int newEntry(int k, int p, int w, double lp, double bow) {
      int e = word[k].size();
      parent[k].add(p);
      word[k].add(w);
      prob[k].add(lp);
      backoff[k].add(bow);
      index[k].put(key(p, w), e);
      return e;
    }
  }
}
