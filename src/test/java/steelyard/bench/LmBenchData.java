package steelyard.bench;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.Long2IntOpenHashMap;
import java.util.SplittableRandom;
import steelyard.lm.BackoffModel;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Benchmark data for the language-model store: a seeded Zipf-distributed token stream (P(rank r) ∝ 1/(r+1)^s
 * over a fixed vocabulary, sentences of 4 … 26 tokens) and a 3-gram back-off model built directly from its
 * counted uni-, bi- and trigrams (relative frequencies with a constant back-off weight: the query cost does not
 * depend on the smoothing, so no trainer is involved).
 */
public final class LmBenchData {
  public static final int VOCAB = 50_000;
  public static final double EXPONENT = 1.0;
  /** Training tokens giving about 1 M distinct n-grams of orders 1 to 3 with the vocabulary above. */
  public static final int TRAIN_TOKENS = 600_000;
  public static final int QUERY_TOKENS = 1_000_000;

  private LmBenchData() {}

  /** Token ranks in 0 … vocab−1; −1 marks a sentence end. Same seed, same stream. */
  public static int[] zipfStream(int tokens, int vocab, double exponent, long seed) {
    double[] cumulative = new double[vocab];
    double sum = 0;
    for (int r = 0; r < vocab; r++) cumulative[r] = sum += Math.pow(r + 1, -exponent);
    SplittableRandom rnd = new SplittableRandom(seed);
    IntArrayList out = new IntArrayList(tokens + tokens / 8);
    int n = 0;
    while (n < tokens) {
      int len = 4 + rnd.nextInt(23);
      for (int i = 0; i < len; i++, n++) {
        double u = rnd.nextDouble() * sum;
        int lo = 0;
        int hi = vocab - 1;
        while (lo < hi) {
          int mid = (lo + hi) >>> 1;
          if (cumulative[mid] < u) lo = mid + 1; else hi = mid;
        }
        out.add(lo);
      }
      out.add(-1);
    }
    return out.toIntArray();
  }

  public static String word(int rank) {
    return "w" + rank;
  }

  /** A 3-gram model from the counts of {@code stream} (ranks, −1 = sentence end). */
  public static BackoffModel model(int[] stream, int vocab) {
    int bos = vocab;
    int eos = vocab + 1;
    Long2IntOpenHashMap[] counts = {new Long2IntOpenHashMap(), new Long2IntOpenHashMap(), new Long2IntOpenHashMap()};
    int a = bos;
    int b = -1;
    long tokens = 0;
    for (int x : stream) {
      int w = x < 0 ? eos : x;
      counts[0].addTo(w, 1);
      tokens++;
      if (b < 0) {
        counts[1].addTo(key(0, a, w), 1);
      } else {
        counts[1].addTo(key(0, b, w), 1);
        counts[2].addTo(key(a, b, w), 1);
      }
      if (x < 0) {
        a = bos;
        b = -1;
      } else if (b < 0) {
        b = w;
      } else {
        a = b;
        b = w;
      }
    }
    BackoffModel.Builder builder = new BackoffModel.Builder(3, Unit.WORD, NormalisationOptions.EXACT);
    builder.metadata("steelyard.bench=zipf vocab " + vocab);
    int[] id = new int[vocab + 2];
    id[bos] = builder.tokenId(BackoffModel.SENTENCE_START);
    id[eos] = builder.tokenId(BackoffModel.SENTENCE_END);
    builder.add(new int[] {builder.tokenId(BackoffModel.UNKNOWN)}, -7, 0);
    for (int r = 0; r < vocab; r++) id[r] = builder.tokenId(word(r));
    builder.add(new int[] {id[bos]}, -99, -0.3);
    Long2IntOpenHashMap history = new Long2IntOpenHashMap();
    for (var e : counts[1].long2IntEntrySet()) history.addTo(e.getLongKey() >>> 21, e.getIntValue());
    for (var e : counts[2].long2IntEntrySet()) history.addTo((1L << 62) | (e.getLongKey() >>> 21), e.getIntValue());
    for (var e : counts[0].long2IntEntrySet()) {
      builder.add(new int[] {id[(int) e.getLongKey()]}, Math.log10((double) e.getIntValue() / tokens), -0.3);
    }
    // n-grams grouped by context (sorted keys), as estimators usually write ARPA files
    for (long k : sortedKeys(counts[1])) {
      int h = (int) (k >>> 21);
      double p = (double) counts[1].get(k) / history.get(h);
      builder.add(new int[] {id[h], id[(int) (k & 0x1fffff)]}, Math.log10(p * 0.8), -0.2);
    }
    for (long k : sortedKeys(counts[2])) {
      double p = (double) counts[2].get(k) / history.get((1L << 62) | (k >>> 21));
      builder.add(new int[] {id[(int) (k >>> 42)], id[(int) ((k >>> 21) & 0x1fffff)], id[(int) (k & 0x1fffff)]}, Math.log10(p * 0.8), 0);
    }
    return builder.build();
  }

  private static long[] sortedKeys(Long2IntOpenHashMap counts) {
    long[] keys = counts.keySet().toLongArray();
    java.util.Arrays.sort(keys);
    return keys;
  }

  /** Packs three ids below 2^21 into a long. */
  public static long key(int a, int b, int c) {
    return ((long) a << 42) | ((long) b << 21) | c;
  }

  public static long ngrams(BackoffModel m) {
    long n = 0;
    for (int k = 1; k <= m.order(); k++) n += m.ngramCount(k);
    return n;
  }

  public static void main(String[] args) {
    long t0 = System.nanoTime();
    BackoffModel m = model(zipfStream(Integer.parseInt(args[0]), VOCAB, EXPONENT, 1), VOCAB);
    System.out.printf("%d %d %d total %d in %.1f s%n", m.ngramCount(1), m.ngramCount(2), m.ngramCount(3), ngrams(m), (System.nanoTime() - t0) / 1e9);
  }
}
