package steelyard.bench;

import it.unimi.dsi.fastutil.longs.Long2FloatOpenHashMap;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;
import steelyard.lm.BackoffModel;
import steelyard.lm.CompactModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;

/**
 * Query speed of the compact engine on a 3-gram model of about 1 M n-grams over a 50 k Zipf vocabulary,
 * over every consecutive trigram of a separate 1 M-token text, against a bare fastutil
 * {@link Long2FloatOpenHashMap#get} loop over the same trigram keys (the floor any hashed store pays), and
 * the exact {@link BackoffModel} for reference. One thread; scores are summed so nothing is optimised away.
 *
 * <pre>
 * mvn -o -q -B test-compile &amp;&amp; java -cp "target/test-classes:target/classes:$(cat cp.txt)" org.openjdk.jmh.Main LmQueryBenchmark -f 1 -wi 2 -i 3
 * </pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Fork(value = 1, jvmArgs = {"-Xmx3g"})
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 3)
public class LmQueryBenchmark {
  private CompactModel compact;
  private BackoffModel exact;
  private int[] ids;
  private boolean[] sentenceStart;
  private long[] keys;
  private Long2FloatOpenHashMap map;

  @Setup(Level.Trial)
  public void setUp() {
    exact = LmBenchData.model(LmBenchData.zipfStream(LmBenchData.TRAIN_TOKENS, LmBenchData.VOCAB, LmBenchData.EXPONENT, 1), LmBenchData.VOCAB);
    compact = CompactModel.of(exact);
    // exactly QUERY_TOKENS queries (words and </s>), to match @OperationsPerInvocation
    int[] text = java.util.Arrays.copyOf(LmBenchData.zipfStream(LmBenchData.QUERY_TOKENS, LmBenchData.VOCAB, LmBenchData.EXPONENT, 2), LmBenchData.QUERY_TOKENS);
    ids = new int[text.length];
    sentenceStart = new boolean[text.length];
    boolean start = true;
    for (int i = 0; i < text.length; i++) {
      ids[i] = text[i] < 0 ? compact.sentenceEndId() : compact.wordId(LmBenchData.word(text[i]));
      sentenceStart[i] = start;
      start = text[i] < 0;
    }
    int[] g = new int[3];
    map = new Long2FloatOpenHashMap(exact.ngramCount(3));
    for (int i = 0; i < exact.entryCount(3); i++) {
      exact.ngram(3, i, g);
      map.put(LmBenchData.key(g[0], g[1], g[2]), (float) exact.log10Prob(3, i));
    }
    keys = new long[ids.length];
    int a = compact.sentenceStartId();
    int b = compact.sentenceStartId();
    for (int i = 0; i < ids.length; i++) {
      if (sentenceStart[i]) a = b = compact.sentenceStartId();
      keys[i] = LmBenchData.key(a, b, ids[i]);
      a = b;
      b = ids[i];
    }
    long n = LmBenchData.ngrams(exact);
    int hits = 0;
    for (long k : keys) if (map.containsKey(k)) hits++;
    System.out.printf("%nmodel: %d n-grams (%d / %d / %d), vocabulary %d; query text %d tokens, trigram hit rate %.1f %%%n",
        n, exact.ngramCount(1), exact.ngramCount(2), exact.ngramCount(3), compact.vocabularySize(), ids.length, 100.0 * hits / keys.length);
    System.out.printf("compact engine: %.2f bytes per n-gram (n-gram arrays %d bytes; with vocabulary %d bytes); exact model ~%d bytes%n",
        compact.bytesPerNgram(), compact.ngramBytesUsed(), compact.ramBytesUsed(), exact.ramBytesUsed());
  }

  @Benchmark
  @OperationsPerInvocation(LmBenchData.QUERY_TOKENS)
  public double compactStateQueries() {
    return stream(compact);
  }

  @Benchmark
  @OperationsPerInvocation(LmBenchData.QUERY_TOKENS)
  public double exactStateQueries() {
    return stream(exact);
  }

  @Benchmark
  @OperationsPerInvocation(LmBenchData.QUERY_TOKENS)
  public double bareHashMapGets() {
    double sum = 0;
    Long2FloatOpenHashMap m = map;
    long[] k = keys;
    for (int i = 0; i < k.length; i++) sum += m.get(k[i]);
    return sum;
  }

  private double stream(LanguageModel lm) {
    LmState s = lm.newState();
    double sum = 0;
    int[] w = ids;
    boolean[] start = sentenceStart;
    for (int i = 0; i < w.length; i++) {
      if (start[i]) lm.beginSentence(s);
      sum += lm.score(s, w[i], s);
    }
    return sum;
  }
}
