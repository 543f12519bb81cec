package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import steelyard.lm.LanguageModel;

/**
 * Definition of perplexity, exp(−(1/N) Σ ln P) over words plus {@code </s>}: a model that is uniform over V
 * predicted tokens has perplexity exactly V (mathematical identity).
 */
class UniformPerplexityTest {

  @ParameterizedTest(name = "[{index}] {arguments}")
  @EnumSource(Smoothing.class)
  void aUniformUnigramModelOverVTokensHasPerplexityV(Smoothing smoothing) {
    // Every line is a permutation of w0 … w9 and <unk>: each of the 12 predicted tokens (with </s>) is seen
    // equally often, so every method's unigram estimate is the uniform 1/12.
    long seed = 424242;
    SplittableRandom random = new SplittableRandom(seed);
    List<String> words = new ArrayList<>();
    for (int i = 0; i < 10; i++) words.add("w" + i);
    words.add("<unk>");
    List<List<String>> corpus = new ArrayList<>();
    for (int i = 0; i < 7; i++) {
      List<String> line = new ArrayList<>(words);
      Collections.shuffle(line, new java.util.Random(random.nextLong()));
      corpus.add(line);
    }
    LanguageModel lm = new Trainer(TrainingOptions.of(1, smoothing)).train(SentenceSource.of(corpus)).model();
    assertThat(lm.vocabularySize() - 1).isEqualTo(12);

    double ln = 0;
    long tokens = 0;
    for (int i = 0; i < 20; i++) {
      List<String> sentence = new ArrayList<>();
      int n = 1 + random.nextInt(15);
      for (int j = 0; j < n; j++) sentence.add(words.get(random.nextInt(10)));
      ln += lm.sentenceLogProb(sentence);
      tokens += n + 1;
    }
    assertThat(Math.exp(-ln / tokens)).as("perplexity, seed %d", seed).isCloseTo(12.0, within(1e-9));
  }
}
