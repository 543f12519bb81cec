package steelyard.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
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

/**
 * End-to-end {@code rescore --method nbest} on 10 000 utterances × 100 hypotheses × about 15 words (1 M rows)
 * with a word 3-gram model trained on a corpus from the same invented grammar, against merely parsing the
 * same CSV: the ratio shows what rescoring adds to import.
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

  private static final String[] COUNT = {"one", "two", "three", "four", "five", "six", "seven", "eight", "nine", "ten", "twelve", "twenty"};
  private static final String[] PRODUCE = {"apples", "pears", "onions", "potatoes", "carrots", "leeks", "plums", "beets", "lemons", "cabbages"};
  private static final String[] BOX = {"crates", "pallets", "boxes", "sacks", "trays", "bins"};
  private static final String[] PLACE = {"bay", "dock", "aisle", "door", "rack"};
  private static final String[] VERB = {"move", "load", "send", "check", "stack", "hold"};
  private static final String[] TAIL = {"before noon", "by six tonight", "after the morning run", "first thing tomorrow", "on the late shift"};
  private static final String[] CONFUSE = {"to", "for", "late", "pairs", "grates", "day", "dark", "sax", "leaks", "low", "night", "then", "a", "the"};

  @Setup(Level.Trial)
  public void generate() throws IOException {
    dir = Files.createTempDirectory("steelyard-rescore-bench");
    hyps = dir.resolve("hyps.csv");
    model = dir.resolve("lm3.arpa");
    picks = dir.resolve("picks.csv");
    Path corpus = dir.resolve("corpus.txt");
    SplittableRandom rnd = new SplittableRandom(42);
    try (BufferedWriter w = Files.newBufferedWriter(corpus)) {
      for (int i = 0; i < 50_000; i++) w.write(sentence(rnd) + "\n");
    }
    int code = Main.run("lm", "train", "--text", corpus.toString(), "--order", "3", "--out", model.toString());
    if (code != 0) throw new IllegalStateException("lm train failed: " + code);
    try (BufferedWriter w = Files.newBufferedWriter(hyps)) {
      w.write("utt_id,rank,text,acoustic,lm\n");
      for (int u = 0; u < utterances; u++) {
        String[] words = sentence(rnd).split(" ");
        double base = -40.0 * words.length;
        for (int r = 1; r <= perUtterance; r++) {
          String[] v = words.clone();
          int edits = r == 1 ? 0 : 1 + rnd.nextInt(3);
          for (int e = 0; e < edits; e++) v[rnd.nextInt(v.length)] = CONFUSE[rnd.nextInt(CONFUSE.length)];
          w.write(String.format(Locale.ROOT, "utt-%05d,%d,%s,%.2f,%.2f%n", u, r, String.join(" ", v),
              base - r * 0.7 - rnd.nextDouble(), -3.0 * v.length - 4 * rnd.nextDouble()));
        }
      }
    }
  }

  /** About 15 words from a fixed template: "load six crates of leeks to bay four before noon please". */
  private static String sentence(SplittableRandom rnd) {
    return pick(rnd, VERB) + " " + pick(rnd, COUNT) + " " + pick(rnd, BOX) + " of " + pick(rnd, PRODUCE) + " and "
        + pick(rnd, COUNT) + " " + pick(rnd, BOX) + " of " + pick(rnd, PRODUCE) + " to " + pick(rnd, PLACE) + " "
        + pick(rnd, COUNT) + " " + pick(rnd, TAIL);
  }

  private static String pick(SplittableRandom rnd, String[] a) {
    return a[rnd.nextInt(a.length)];
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
