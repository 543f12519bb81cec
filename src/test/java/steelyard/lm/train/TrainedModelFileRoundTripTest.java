package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.lm.ModelFiles;

/**
 * Round trip of a trained model through both file formats: train → ARPA → read → binary → read. Held-out
 * sentences (including out-of-vocabulary words) must score the same at every step within 1e-5 in log10 per
 * sentence: ARPA keeps seven significant digits and the binary format single precision, so agreement beyond
 * that is not expected; anything larger would be a reading or writing error.
 */
class TrainedModelFileRoundTripTest {
  @TempDir Path dir;

  @ParameterizedTest(name = "[{index}] {0} order {1}")
  @CsvSource({"MKN,3", "WB,4", "ABS,2", "MKN,5"})
  void heldOutScoresSurviveArpaAndBinary(Smoothing smoothing, int order) {
    SplittableRandom random = new SplittableRandom(4000 + order);
    List<List<String>> corpus = TrainTestSupport.randomCorpus(random, 200, 40, 12);
    BackoffModel trained = new Trainer(TrainingOptions.of(order, smoothing)).train(SentenceSource.of(corpus)).backoffModel();
    Path arpa = dir.resolve("m.arpa.gz");
    Path bin = dir.resolve("m.bin");
    ModelFiles.save(trained, arpa);
    LanguageModel fromArpa = ModelFiles.load(arpa);
    ModelFiles.save(ModelFiles.loadExact(arpa), bin);
    LanguageModel fromBinary = ModelFiles.load(bin);

    List<List<String>> heldOut = TrainTestSupport.randomCorpus(new SplittableRandom(99 + order), 50, 45, 12);
    heldOut.add(List.of("pumpkins", "w1", "never-seen"));
    for (List<String> sentence : heldOut) {
      double expected = trained.sentenceLogProb(sentence) / Math.log(10);
      assertThat(fromArpa.sentenceLogProb(sentence) / Math.log(10)).as("ARPA, %s", sentence).isCloseTo(expected, within(1e-5));
      assertThat(fromBinary.sentenceLogProb(sentence) / Math.log(10)).as("binary, %s", sentence).isCloseTo(expected, within(1e-5));
    }
  }
}
