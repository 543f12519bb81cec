package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;

/**
 * Mathematical invariant: in every context, seen or unseen, the probabilities of all vocabulary words plus
 * {@code </s>} and {@code <unk>} (not {@code <s>}) sum to 1 — with and without minimum counts and vocabulary limits.
 */
class NormalisationInvariantTest {

  static Stream<Arguments> cases() {
    List<Arguments> out = new ArrayList<>();
    long seed = 5150;
    for (Smoothing s : Smoothing.values()) {
      for (int order = 1; order <= 6; order++) {
        out.add(Arguments.of(s, order, "none", seed++));
        if (s.hasBackoffForm() && order > 1) out.add(Arguments.of(s, order, "min-counts", seed++));
        out.add(Arguments.of(s, order, "vocabulary", seed++));
      }
    }
    return out.stream();
  }

  static TrainingOptions options(Smoothing s, int order, String variant) {
    TrainingOptions o = TrainingOptions.of(order, s).withAddK(0.3);
    return switch (variant) {
      case "min-counts" -> TrainTestSupport.minCounts(o, 2, 3, 2, 2, 2);
      case "vocabulary" -> o.withVocabulary(3, 25);
      default -> o;
    };
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("cases")
  void probabilitiesSumToOneInEveryContext(Smoothing smoothing, int order, String variant, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    List<List<String>> corpus = TrainTestSupport.randomCorpus(random, 80, 40, 10);
    LanguageModel lm = new Trainer(options(smoothing, order, variant)).train(SentenceSource.of(corpus)).model();
    List<List<String>> contexts = new ArrayList<>(TrainTestSupport.randomContexts(
        random, TrainTestSupport.predicted(lm), 30, order + 1));
    for (int i = 0; i < 30; i++) {
      List<String> s = corpus.get(random.nextInt(corpus.size()));
      int end = random.nextInt(s.size() + 1);
      List<String> c = new ArrayList<>(List.of("<s>"));
      c.addAll(s.subList(Math.max(0, end - order), end));
      contexts.add(c);
    }
    for (List<String> context : contexts) {
      assertThat(TrainTestSupport.sum(lm, context)).as("sum over the vocabulary after %s, seed %d", context, seed)
          .isCloseTo(1.0, within(1e-9));
    }
    if (lm instanceof BackoffModel b) {
      assertThat(b.hasUnknownUnigram()).as("<unk> is listed, seed %d", seed).isTrue();
    }
    if (variant.equals("min-counts")) listedProbabilitiesAreThoseOfTheUncutModel((BackoffModel) lm, corpus, smoothing, order, seed);
  }

  /**
   * With the sums checked above, this pins the recomputed back-off weights down completely: a history's
   * weight is the only value that makes its context sum to 1 once its listed probabilities are fixed.
   */
  private static void listedProbabilitiesAreThoseOfTheUncutModel(
      BackoffModel cut, List<List<String>> corpus, Smoothing smoothing, int order, long seed) {
    BackoffModel full = new Trainer(TrainingOptions.of(order, smoothing)).train(SentenceSource.of(corpus)).backoffModel();
    int dropped = 0;
    for (int k = 1; k <= order; k++) {
      int[] ids = new int[k];
      for (int i = 0; i < cut.entryCount(k); i++) {
        cut.ngram(k, i, ids);
        if (ids[k - 1] == cut.sentenceStartId()) continue;
        int[] context = java.util.Arrays.copyOf(ids, k - 1);
        assertThat(cut.log10Prob(k, i)).as("listed n-gram %s, seed %d", java.util.Arrays.toString(ids), seed)
            .isCloseTo(full.log10Prob(context, ids[k - 1]), within(1e-12));
      }
      dropped += full.ngramCount(k) - cut.ngramCount(k);
    }
    assertThat(dropped).as("the minimum counts dropped n-grams, seed %d", seed).isPositive();
  }
}
