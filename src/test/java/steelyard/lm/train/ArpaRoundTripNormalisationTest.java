package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;

/**
 * Mathematical invariant after the trip through the ARPA text format: every context of the model read back
 * still sums to 1 within 1e-5 (ARPA keeps about seven significant digits of each log10 value), and every
 * probability agrees with the in-memory model within 1e-5 in log10.
 */
class ArpaRoundTripNormalisationTest {
  @TempDir Path dir;

  static Stream<Arguments> cases() {
    List<Arguments> out = new ArrayList<>();
    long seed = 777;
    for (Smoothing s : List.of(Smoothing.MKN, Smoothing.WB, Smoothing.ABS))
      for (int order = 1; order <= 4; order++)
        for (boolean cut : new boolean[] {false, true})
          out.add(Arguments.of(s, order, cut, seed++));
    return out.stream();
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("cases")
  void theModelReadBackFromArpaStillNormalises(Smoothing smoothing, int order, boolean minCounts, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    List<List<String>> corpus = TrainTestSupport.randomCorpus(random, 80, 30, 10);
    TrainingOptions options = TrainingOptions.of(order, smoothing);
    if (minCounts) options = TrainTestSupport.minCounts(options, 2, 2, 2);
    BackoffModel trained = new Trainer(options).train(SentenceSource.of(corpus)).backoffModel();
    Path file = dir.resolve("m-" + seed + ".arpa");
    ModelFiles.save(trained, file);
    LanguageModel read = ModelFiles.loadExact(file);

    List<List<String>> contexts = TrainTestSupport.randomContexts(random, TrainTestSupport.predicted(trained), 25, order);
    for (List<String> c : contexts) {
      assertThat(TrainTestSupport.sum(read, c)).as("sum after %s, seed %d", c, seed).isCloseTo(1, within(1e-5));
      for (String w : List.of("w0", "w3", "</s>", "<unk>")) {
        assertThat(Math.log10(TrainTestSupport.prob(read, c, w)))
            .as("log10 P(%s | %s), seed %d", w, c, seed)
            .isCloseTo(Math.log10(TrainTestSupport.prob(trained, c, w)), within(1e-5));
      }
    }
  }
}
