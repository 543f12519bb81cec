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

  static Stream<Arguments> vocabularyCases() {
    List<Arguments> out = new ArrayList<>();
    for (Smoothing s : Smoothing.values()) for (long seed : new long[] {5, 6}) out.add(Arguments.of(s, 3, seed));
    return out.stream();
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("vocabularyCases")
  void withAMinimumCountTheModelIsTheReferenceOnTheCorpusWithRareWordsReplaced(Smoothing smoothing, int order, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    List<List<String>> corpus = TrainTestSupport.randomCorpus(random, 80, 60, 9);
    java.util.Map<String, Integer> freq = new java.util.HashMap<>();
    for (List<String> s : corpus) for (String w : s) freq.merge(w, 1, Integer::sum);
    List<List<String>> mapped = new ArrayList<>();
    for (List<String> s : corpus) {
      List<String> m = new ArrayList<>();
      for (String w : s) m.add(freq.get(w) >= 3 ? w : "<unk>");
      mapped.add(m);
    }
    assertThat(mapped.stream().flatMap(List::stream)).as("some words are rare, seed %d", seed).contains("<unk>");
    LanguageModel lm = new Trainer(TrainingOptions.of(order, smoothing).withAddK(0.5).withVocabulary(3, 0))
        .train(SentenceSource.of(corpus)).model();
    ReferenceModel ref = new ReferenceModel(mapped, order, smoothing, 0.5);
    List<String> tokens = TrainTestSupport.predicted(lm);
    assertThat(new TreeSet<>(tokens)).as("vocabulary, seed %d", seed).isEqualTo(ref.vocabulary);
    for (List<String> context : TrainTestSupport.randomContexts(random, tokens, 30, order)) {
      for (String w : tokens) {
        assertThat(TrainTestSupport.prob(lm, context, w)).as("P(%s | %s), seed %d", w, context, seed)
            .isCloseTo(ref.prob(context.stream().map(c -> ref.vocabulary.contains(c) || c.equals("<s>") ? c : "<unk>")
                .toList(), w), within(1e-9));
      }
    }
  }
}
