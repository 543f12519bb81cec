package steelyard.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import steelyard.cli.Main;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.SyntheticHypotheses;

/**
 * End-to-end {@code rescore --method nbest} on 10 000 utterances × 100 hypotheses × about 15 words (1 M rows,
 * from {@link SyntheticHypotheses}) with a word 3-gram model trained on 50 000 sentences of the same invented
 * grammar, against merely parsing the same CSV: the ratio shows what rescoring adds to import.
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" org.openjdk.jmh.Main RescoreBenchmark -f 1 -wi 1 -i 3
 * </pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
@Fork(value = 1, jvmArgsAppend = {"-Xmx2g"})
public class RescoreBenchmark {
  @Param({"10000"})
  int utterances;

  @Param({"100"})
  int perUtterance;

  @Param({"2"})
  int threads;

  Path dir;
  Path hyps;
  Path model;
  Path picks;

  @Setup(Level.Trial)
  public void generate() throws IOException {
    dir = Files.createTempDirectory("steelyard-rescore-bench");
    hyps = dir.resolve("hyps.csv");
    model = dir.resolve("lm3.arpa");
    picks = dir.resolve("picks.csv");
    SyntheticModel.train(dir, model);
    SyntheticHypotheses.write(hyps, (long) utterances * perUtterance, perUtterance, 42L);
  }

  @TearDown(Level.Trial)
  public void clean() throws IOException {
    for (Path p : new Path[] {hyps, model, picks, dir.resolve("corpus.txt")}) Files.deleteIfExists(p);
    Files.deleteIfExists(dir);
  }

  @Benchmark
  public int rescoreNbest() {
    int code = Main.run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,lm", "--lm", model.toString(),
        "--lm-weight", "8", "--length-weight", "-0.5", "--method", "nbest", "--threads", Integer.toString(threads),
        "--out", picks.toString());
    if (code != 0) throw new IllegalStateException("rescore failed: " + code);
    return code;
  }

  @Benchmark
  public long parseOnly() {
    long rows = 0;
    try (HypothesesReader r = HypothesesReader.open(hyps, ImportOptions.strict(List.of(FeatureSpec.parse("acoustic"), FeatureSpec.parse("lm"))))) {
      while (r.hasNext()) rows += r.next().size();
    }
    return rows;
  }
}
