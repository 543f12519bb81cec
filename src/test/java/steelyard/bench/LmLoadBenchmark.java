package steelyard.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import steelyard.lm.BackoffModel;
import steelyard.lm.CompactModel;
import steelyard.lm.ModelFiles;

/**
 * Loading time of a 3-gram model of about 1 M n-grams (the model of {@link LmQueryBenchmark}) from ARPA text
 * (into the exact model, and on into the compact engine) and from the binary file. Files sit in the page cache
 * after the first read, so this measures parsing, not the disk.
 *
 * <pre>
 * mvn -o -q -B test-compile &amp;&amp; java -cp "target/test-classes:target/classes:$(cat cp.txt)" org.openjdk.jmh.Main LmLoadBenchmark -f 1 -wi 2 -i 3
 * </pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgs = {"-Xmx3g"})
@Warmup(iterations = 2, time = 3)
@Measurement(iterations = 3, time = 4)
public class LmLoadBenchmark {
  private static final ModelFiles.LoadOptions QUIET = new ModelFiles.LoadOptions(-7, w -> { }, null);
  private Path dir;
  private Path arpa;
  private Path bin;

  @Setup(Level.Trial)
  public void setUp() throws IOException {
    BackoffModel m = LmBenchData.model(LmBenchData.zipfStream(LmBenchData.TRAIN_TOKENS, LmBenchData.VOCAB, LmBenchData.EXPONENT, 1), LmBenchData.VOCAB);
    dir = Files.createTempDirectory("steelyard-lm-load");
    arpa = dir.resolve("zipf.arpa");
    bin = dir.resolve("zipf.bin");
    ModelFiles.save(m, arpa);
    ModelFiles.save(m, bin);
    System.out.printf("%nmodel: %d n-grams; ARPA %d bytes, binary %d bytes%n", LmBenchData.ngrams(m), Files.size(arpa), Files.size(bin));
  }

  @TearDown(Level.Trial)
  public void tearDown() throws IOException {
    Files.deleteIfExists(arpa);
    Files.deleteIfExists(bin);
    Files.deleteIfExists(dir);
  }

  @Benchmark
  public BackoffModel arpaToExactModel() {
    return ModelFiles.loadExact(arpa, QUIET);
  }

  @Benchmark
  public CompactModel arpaToCompactEngine() {
    return ModelFiles.load(arpa, QUIET);
  }

  @Benchmark
  public CompactModel binaryToCompactEngine() {
    return ModelFiles.load(bin, QUIET);
  }
}
