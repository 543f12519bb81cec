package steelyard.bench;

import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.apache.commons.text.similarity.LevenshteinDistance;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;
import steelyard.eval.Aligner;
import steelyard.eval.EditCounts;

/**
 * Word alignment of 15-token pairs on one thread: full C/S/D/I counts with {@link Aligner} against commons-text's
 * distance-only {@link LevenshteinDistance} on the same pairs as strings (one code point per token).
 *
 * <p>Pairs: a seeded reference of 15 tokens from a 2000-word vocabulary and a hypothesis made from it with about
 * 25 % word errors (substitutions, deletions, insertions), then cut or padded to 15 tokens. Scores are in
 * operations per second where one operation is one pair ({@link OperationsPerInvocation}).
 *
 * <pre>{@code
 * mvn -o -q -B test-compile
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" org.openjdk.jmh.Main AlignmentBenchmark -f 1 -wi 2 -i 3
 * }</pre>
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Threads(1)
@Fork(1)
@Warmup(iterations = 2, time = 2)
@Measurement(iterations = 3, time = 2)
public class AlignmentBenchmark {
  static final int PAIRS = 4096;
  static final int LENGTH = 15;

  int[][] refs;
  int[][] hyps;
  String[] refStrings;
  String[] hypStrings;
  final Aligner aligner = new Aligner();
  final LevenshteinDistance levenshtein = LevenshteinDistance.getDefaultInstance();

  @Setup
  public void setUp() {
    SplittableRandom rnd = new SplittableRandom(15L);
    refs = new int[PAIRS][];
    hyps = new int[PAIRS][];
    refStrings = new String[PAIRS];
    hypStrings = new String[PAIRS];
    for (int p = 0; p < PAIRS; p++) {
      int[] ref = new int[LENGTH];
      for (int i = 0; i < LENGTH; i++) ref[i] = rnd.nextInt(2000);
      int[] hyp = new int[LENGTH];
      int j = 0;
      for (int i = 0; i < LENGTH && j < LENGTH; i++) {
        double u = rnd.nextDouble();
        if (u < 0.15) hyp[j++] = rnd.nextInt(2000);
        else if (u < 0.20) continue;
        else if (u < 0.25 && j < LENGTH - 1) {
          hyp[j++] = ref[i];
          hyp[j++] = rnd.nextInt(2000);
        } else hyp[j++] = ref[i];
      }
      while (j < LENGTH) hyp[j++] = rnd.nextInt(2000);
      refs[p] = ref;
      hyps[p] = hyp;
      refStrings[p] = codePoints(ref);
      hypStrings[p] = codePoints(hyp);
    }
  }

  private static String codePoints(int[] ids) {
    StringBuilder sb = new StringBuilder();
    for (int id : ids) sb.appendCodePoint(0x4E00 + id);
    return sb.toString();
  }

  /** Full counts through the allocation-free path. */
  @Benchmark
  @OperationsPerInvocation(PAIRS)
  public long alignerCounts() {
    long sum = 0;
    for (int p = 0; p < PAIRS; p++) {
      sum += aligner.measure(refs[p], hyps[p]);
      sum += aligner.lastDeletions() - aligner.lastInsertions() + aligner.lastSubstitutions();
    }
    return sum;
  }

  /** Full counts returned as an {@link EditCounts} record. */
  @Benchmark
  @OperationsPerInvocation(PAIRS)
  public void alignerCountRecords(Blackhole bh) {
    for (int p = 0; p < PAIRS; p++) bh.consume(aligner.count(refs[p], hyps[p]));
  }

  /** Distance only, two rows. */
  @Benchmark
  @OperationsPerInvocation(PAIRS)
  public long alignerDistance() {
    long sum = 0;
    for (int p = 0; p < PAIRS; p++) sum += aligner.distance(refs[p], hyps[p]);
    return sum;
  }

  /** The reference library's distance-only Levenshtein on the same pairs. */
  @Benchmark
  @OperationsPerInvocation(PAIRS)
  public long commonsTextDistance() {
    long sum = 0;
    for (int p = 0; p < PAIRS; p++) sum += levenshtein.apply(refStrings[p], hypStrings[p]);
    return sum;
  }
}
