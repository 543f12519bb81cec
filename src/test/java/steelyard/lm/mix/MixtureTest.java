package steelyard.lm.mix;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.LmState;
import steelyard.lm.MixtureModel;
import steelyard.lm.RandomBackoffModels;

class MixtureTest {

  /** Held-out token log-probabilities of each component for a random token stream. */
  private static double[][] heldOut(List<BackoffModel> comps, MixtureModel mix, long seed, int sentences) {
    SplittableRandom rnd = new SplittableRandom(seed);
    it.unimi.dsi.fastutil.doubles.DoubleArrayList[] rows = new it.unimi.dsi.fastutil.doubles.DoubleArrayList[comps.size()];
    for (int i = 0; i < rows.length; i++) rows[i] = new it.unimi.dsi.fastutil.doubles.DoubleArrayList();
    LmState s = mix.newState();
    for (int n = 0; n < sentences; n++) {
      mix.beginSentence(s);
      int len = 1 + rnd.nextInt(8);
      for (int t = 0; t <= len; t++) {
        int w = t == len ? mix.sentenceEndId() : mix.wordId("w" + rnd.nextInt(6));
        for (int i = 0; i < comps.size(); i++) rows[i].add(mix.componentLogProb(i, s, w));
        mix.score(s, w, s);
      }
    }
    double[][] out = new double[comps.size()][];
    for (int i = 0; i < out.length; i++) out[i] = rows[i].toDoubleArray();
    return out;
  }

  @Nested
  class Em {
    @ParameterizedTest(name = "[{index}] seed {0}")
    @ValueSource(longs = {1, 2, 3})
    void perplexityNeverIncreasesFromOneIterationToTheNext(long seed) {
      List<BackoffModel> comps = List.of(RandomBackoffModels.create(seed, 8, 3, 0.6), RandomBackoffModels.create(seed + 100, 8, 3, 0.6),
          RandomBackoffModels.create(seed + 200, 8, 2, 0.6));
      MixtureModel mix = new MixtureModel(comps, new double[] {1 / 3.0, 1 / 3.0, 1 / 3.0});
      MixtureWeights.Fit fit = MixtureWeights.fit(heldOut(comps, mix, seed, 200), 50, 0);
      List<Double> pps = fit.perplexities();
      for (int i = 1; i < pps.size(); i++)
        assertThat(pps.get(i)).as("seed %d iteration %d", seed, i).isLessThanOrEqualTo(pps.get(i - 1) * (1 + 1e-12));
      assertThat(java.util.Arrays.stream(fit.weights()).sum()).isCloseTo(1.0, within(1e-12));
    }

    @Test
    void aComponentThatExplainsTheDataBestGetsTheLargestWeight() {
      // Component 0 assigns all held-out tokens probability 0.5, component 1 only 0.01 (invented inputs,
      // checked against the EM fixed point: λ₀ → 1 when P₀ dominates every token).
      double[][] ln = new double[2][100];
      java.util.Arrays.fill(ln[0], Math.log(0.5));
      java.util.Arrays.fill(ln[1], Math.log(0.01));
      MixtureWeights.Fit fit = MixtureWeights.fit(ln, 200, 0);
      assertThat(fit.weights()[0]).isGreaterThan(0.99);
    }
  }

  @Nested
  class ExactMixture {
    /** Mathematical invariant: a convex combination of distributions is a distribution. */
    @Test
    void normalisesInEveryContext() {
      List<BackoffModel> comps = List.of(RandomBackoffModels.create(5, 8, 3, 0.6), RandomBackoffModels.create(6, 8, 3, 0.6));
      assertSumsToOneAfterRandomHistories(new MixtureModel(comps, new double[] {0.3, 0.7}), 8, 5);
    }

    /**
     * Mathematical invariant, with vocabularies that differ (w0…w7 and w0…w11): scoring a token a component lacks
     * as that component's {@code <unk>} would give each of w8…w11 the whole {@code <unk>} mass again (sum above 1).
     */
    @Test
    void normalisesInEveryContextWhenTheVocabulariesDiffer() {
      List<BackoffModel> comps = List.of(RandomBackoffModels.create(15, 8, 3, 0.6), RandomBackoffModels.create(16, 12, 2, 0.6));
      MixtureModel mix = new MixtureModel(comps, new double[] {0.6, 0.4});
      assertThat(mix.vocabularySize()).isEqualTo(3 + 12);
      assertSumsToOneAfterRandomHistories(mix, 12, 15);
    }

    /** Σ_w P(w | h) = 1 over the mixture's vocabulary (without {@code <s>}) after 20 random histories of words w0… */
    private void assertSumsToOneAfterRandomHistories(MixtureModel mix, int words, long seed) {
      SplittableRandom rnd = new SplittableRandom(seed);
      LmState s = mix.newState(), t = mix.newState();
      for (int trial = 0; trial < 20; trial++) {
        mix.beginSentence(s);
        for (int j = rnd.nextInt(3); j > 0; j--) mix.score(s, mix.wordId("w" + rnd.nextInt(words)), s);
        double sum = 0;
        for (int w = 0; w < mix.vocabularySize(); w++) if (w != mix.sentenceStartId()) sum += Math.exp(mix.score(s, w, t));
        assertThat(sum).as("seed %d trial %d", seed, trial).isCloseTo(1.0, within(1e-9));
      }
    }

    @Test
    void weightOneOnAComponentReproducesIt() {
      BackoffModel a = RandomBackoffModels.create(7, 8, 3, 0.6);
      MixtureModel mix = new MixtureModel(List.of(a, RandomBackoffModels.create(8, 8, 3, 0.6)), new double[] {1, 0});
      List<String> sentence = List.of("w1", "w3", "w3", "w0");
      assertThat(mix.sentenceLogProb(sentence)).isCloseTo(a.sentenceLogProb(sentence), within(1e-9));
    }
  }

  @Nested
  class StaticApproximation {
    /**
     * Weights 1, 0 must give the first model back: the same vocabulary (the second model's extra words stay
     * out of vocabulary, as for the first model alone) and the same held-out perplexity. Before the fix the
     * written model scored worse than its only weighted component.
     */
    @Test
    void aMixWithWeightsOneAndZeroScoresLikeTheFirstModel() {
      BackoffModel first = RandomBackoffModels.create(21, 8, 3, 0.6);
      BackoffModel second = RandomBackoffModels.create(22, 12, 3, 0.6);
      MixtureModel mix = new MixtureModel(List.of(first, second), new double[] {1, 0});
      BackoffModel written = StaticMixture.approximate(mix);
      assertThat(written.vocabularySize()).isEqualTo(first.vocabularySize());
      SplittableRandom rnd = new SplittableRandom(21);
      steelyard.lm.eval.Perplexity alone = new steelyard.lm.eval.Perplexity(first);
      steelyard.lm.eval.Perplexity mixed = new steelyard.lm.eval.Perplexity(written);
      for (int n = 0; n < 200; n++) {
        List<String> sentence = new java.util.ArrayList<>();
        for (int j = rnd.nextInt(8); j >= 0; j--) sentence.add("w" + rnd.nextInt(12));
        assertThat(written.sentenceLogProb(sentence)).isCloseTo(first.sentenceLogProb(sentence), within(1e-9));
        alone.add(n, sentence);
        mixed.add(n, sentence);
      }
      assertThat(mixed.result().oov()).isEqualTo(alone.result().oov()).isPositive();
      assertThat(mixed.result().perplexity()).isCloseTo(alone.result().perplexity(), within(1e-9));
    }

    @ParameterizedTest(name = "[{index}] seed {0}")
    @ValueSource(longs = {9, 10})
    void normalisesAndKeepsExactMixtureProbabilitiesOnListedNgrams(long seed) {
      List<BackoffModel> comps = List.of(RandomBackoffModels.create(seed, 8, 3, 0.6), RandomBackoffModels.create(seed + 50, 8, 3, 0.6));
      MixtureModel mix = new MixtureModel(comps, new double[] {0.4, 0.6});
      BackoffModel approx = StaticMixture.approximate(mix);
      SplittableRandom rnd = new SplittableRandom(seed);
      for (int t = 0; t < 20; t++) {
        int[] ctx = RandomBackoffModels.randomContext(approx, rnd, rnd.nextInt(approx.order()), rnd.nextBoolean());
        assertThat(RandomBackoffModels.totalProbability(approx, ctx)).as("seed %d", seed).isCloseTo(1.0, within(1e-9));
      }
      int[] ids = new int[3];
      for (int i = 0; i < approx.entryCount(3); i++) {
        if (Double.isNaN(approx.log10Prob(3, i))) continue;
        approx.ngram(3, i, ids);
        assertThat(approx.log10Prob(3, i)).isCloseTo(StaticMixture.mixtureLog10(mix, ids), within(1e-9));
      }
    }
  }
}
