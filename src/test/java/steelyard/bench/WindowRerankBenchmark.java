package steelyard.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
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
import steelyard.gui.model.Choices;
import steelyard.gui.model.GuiFixtures;
import steelyard.gui.model.OpenRequest;
import steelyard.gui.model.TaskProgress;
import steelyard.gui.model.UtteranceFilter;
import steelyard.gui.model.UtteranceRow;
import steelyard.gui.model.WeightSettings;
import steelyard.gui.model.Workspace;
import steelyard.io.FeatureSpec;
import steelyard.io.SyntheticHypotheses;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.text.NormalisationOptions;

/**
 * What the window does when a weight moves, on generated N-best lists ({@link SyntheticHypotheses}, about 15
 * words each; references are the rank-1 sentences of another seed, so errors are not zero):
 * <ul>
 *   <li>{@code slider}: an N-best re-rank of 10 000 utterances × 100 hypotheses with a new λ and the corpus
 *       figures (error, changed, helped, hurt): what a slider move costs ({@link Workspace#rerank});</li>
 *   <li>{@code sliderAndList}: the same plus the rows of the utterance list (filter "changed");</li>
 *   <li>{@code networkSearch}: the confusion-network search (λ′ = 1, word 3-gram) of 1 000 of those utterances,
 *       what releasing a network slider costs ({@link Workspace#choose}, all cores).</li>
 * </ul>
 *
 * <pre>
 * mvn -o -q -B test-compile
 * java -cp "target/test-classes:target/classes:$(cat cp.txt)" org.openjdk.jmh.Main WindowRerankBenchmark -f 1 -wi 3 -i 5
 * </pre>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3)
@Measurement(iterations = 5)
@Fork(value = 1, jvmArgsAppend = {"-Xmx6g"})
public class WindowRerankBenchmark {
  @Param({"10000"})
  int utterances;

  @Param({"100"})
  int perUtterance;

  @Param({"1000"})
  int networkUtterances;

  Path dir;
  Workspace nbest;
  Workspace network;
  RescoreWeights base;
  RescoreWeights lattice;
  int step;

  @Setup(Level.Trial)
  public void open() throws IOException {
    dir = Files.createTempDirectory("steelyard-window-bench");
    Path hyps = dir.resolve("hyps.csv");
    Path refs = dir.resolve("refs.csv");
    Path small = dir.resolve("small.csv");
    Path smallRefs = dir.resolve("small-refs.csv");
    Path model = dir.resolve("lm3.arpa");
    SyntheticModel.train(dir, model);
    SyntheticHypotheses.write(hyps, (long) utterances * perUtterance, perUtterance, 42L);
    GuiFixtures.writeReferences(hyps, refs, 43L, utterances, false);
    SyntheticHypotheses.write(small, (long) networkUtterances * perUtterance, perUtterance, 44L);
    GuiFixtures.writeReferences(small, smallRefs, 45L, networkUtterances, false);
    List<FeatureSpec> features = FeatureSpec.parseList("acoustic,lm");
    nbest = Workspace.open(OpenRequest.of(hyps, refs, model, null, features, null, NormalisationOptions.EXACT, RescoreMethod.NBEST),
        TaskProgress.NONE);
    network = Workspace.open(OpenRequest.of(small, smallRefs, model, null, features, null, NormalisationOptions.EXACT,
        RescoreMethod.LATTICE), TaskProgress.NONE);
    base = nbest.initialWeights();
    lattice = new WeightSettings(1, 0, 0.1, 1, 0, RescoreMethod.LATTICE).apply(network.initialWeights());
    System.out.printf(Locale.ROOT, "%nopened %d utterances, %d hypotheses%n", nbest.corpus().size(), nbest.corpus().hypothesisCount());
  }


  @TearDown(Level.Trial)
  public void clean() throws IOException {
    try (var files = Files.walk(dir)) {
      files.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  private RescoreWeights next() {
    step = (step + 1) % 40;
    return new WeightSettings(0.25 * step, base.lengthWeight(), 1, 0, 0, RescoreMethod.NBEST).apply(base);
  }

  @Benchmark
  public long slider() {
    return nbest.rerank(next()).figures().errors();
  }

  @Benchmark
  public int sliderAndList() {
    Choices c = nbest.rerank(next());
    return UtteranceRow.filtered(nbest.corpus(), c, UtteranceFilter.CHANGED, "").size();
  }

  @Benchmark
  @BenchmarkMode(Mode.SingleShotTime)
  @Warmup(iterations = 2)
  @Measurement(iterations = 5)
  public long networkSearch() {
    return network.choose(lattice, RescoreMethod.LATTICE, TaskProgress.NONE).figures().errors();
  }
}
