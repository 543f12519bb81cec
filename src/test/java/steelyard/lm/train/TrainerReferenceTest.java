package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.TreeSet;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import steelyard.lm.LanguageModel;

/**
 * The trainer against {@link ReferenceModel}, a map-based implementation written from Chen &amp; Goodman
 * 1998 with no code in common, probability by probability, on seeded random corpora.
 */
class TrainerReferenceTest {

  static Stream<Arguments> cases() {
    List<Arguments> out = new ArrayList<>();
    for (Smoothing s : Smoothing.values())
      for (int order = 1; order <= 4; order++)
        for (long seed : new long[] {11, 2026})
          out.add(Arguments.of(s, order, seed + 97L * order + s.ordinal()));
    return out.stream();
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("cases")
  void everyProbabilityMatchesTheReference(Smoothing smoothing, int order, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    List<List<String>> corpus = TrainTestSupport.randomCorpus(random, 60 + random.nextInt(60), 40, 9);
    TrainingOptions options = TrainingOptions.of(order, smoothing).withAddK(0.5);
    LanguageModel lm = new Trainer(options).train(SentenceSource.of(corpus)).model();
    ReferenceModel ref = new ReferenceModel(corpus, order, smoothing, 0.5);

    List<List<String>> seen = new ArrayList<>();
    for (List<String> g : ref.raw.keySet()) {
      if (g.size() < order && !g.get(g.size() - 1).equals("</s>")) seen.add(g);
    }
    seen.sort(java.util.Comparator.comparing(Object::toString));
    Set<List<String>> contexts = new LinkedHashSet<>();
    for (int i = 0; i < 60 && !seen.isEmpty(); i++) contexts.add(seen.get(random.nextInt(seen.size())));
    contexts.add(List.of());
    List<String> tokens = TrainTestSupport.predicted(lm);
    contexts.addAll(TrainTestSupport.randomContexts(random, tokens, 25, order + 1));

    assertThat(new TreeSet<>(tokens)).as("vocabulary, seed %d", seed).isEqualTo(ref.vocabulary);
    int compared = 0;
    for (List<String> context : contexts) {
      List<String> refContext = new ArrayList<>();
      for (String c : context) refContext.add(ref.vocabulary.contains(c) || c.equals("<s>") ? c : "<unk>");
      for (String w : tokens) {
        double expected = ref.prob(refContext, w);
        double actual = TrainTestSupport.prob(lm, context, w);
        assertThat(actual).as("P(%s | %s), %s order %d, seed %d", w, context, smoothing, order, seed)
            .isCloseTo(expected, within(1e-9));
        compared++;
      }
    }
    assertThat(compared).isGreaterThan(50);
  }
}
