package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.rescore.Fixtures.row;
import static steelyard.rescore.Fixtures.utterance;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.RepetitionInfo;
import org.junit.jupiter.api.Test;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.LatticeSettings;
import steelyard.lm.BackoffModel;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

class NbestRescorerTest {
  private static final List<String> ACOUSTIC = List.of("acoustic");

  private static RescoreWeights weights(double lm, double oov, double length) {
    return new RescoreWeights(Map.of("acoustic", 1.0), lm, oov, length, 1.0, Map.of(), 100, 0, 0,
        LatticeSettings.DEFAULT_BEAM, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
  }

  @Nested
  class WithOnlyTheRecognisersScore {
    /** Invariant: with λ = μ = ω = 0 the total is the one feature, so the best total is the best rank. */
    @RepeatedTest(value = 50, name = "[{currentRepetition}]")
    void returnsRankOneWhenRanksFollowTheFeature(RepetitionInfo info) {
      long seed = 9100 + info.getCurrentRepetition();
      SplittableRandom rnd = new SplittableRandom(seed);
      int n = 1 + rnd.nextInt(30);
      double[] scores = new double[n];
      for (int i = 0; i < n; i++) scores[i] = -rnd.nextInt(40) - rnd.nextDouble();
      java.util.Arrays.sort(scores);
      List<Object[]> rows = new ArrayList<>();
      for (int i = 0; i < n; i++) rows.add(row("", i + 1, "w" + rnd.nextInt(5) + " w" + i, scores[n - 1 - i]));
      Collections.shuffle(rows, new java.util.Random(seed));
      UtteranceHypotheses u = utterance("u", rows.toArray(new Object[0][]));
      UtteranceResult r = Fixtures.rescorer(weights(0, 0, 0), RescoreMethod.NBEST, null, ACOUSTIC).rescore(u);
      assertThat(r.chosenHypothesis().rank()).as("seed %d", seed).isEqualTo(1);
      assertThat(r.changed()).as("seed %d", seed).isFalse();
    }
  }

  @Nested
  class HandWorkedExample {
    /**
     * Worked by hand. Bigram model, log10: unigrams {@code </s>} −1.0, {@code <unk>} −2.0, ten −1.0,
     * crates −1.5, cranes −2.5 (all back-off weights 0); bigrams (&lt;s&gt; ten) −0.5, (ten crates) −0.3.
     * <pre>
     * h1 "ten cranes"         acoustic −9.0  : log10 P = −0.5 + P(cranes)−2.5 + P(&lt;/s&gt;)−1.0        = −4.0
     * h2 "ten crates"         acoustic −10.0 : log10 P = −0.5 + −0.3 + −1.0                          = −1.8
     * h3 "ten crates please"  acoustic −10.2 : log10 P = −0.5 + −0.3 + P(&lt;unk&gt;)−2.0 + −1.0           = −3.8 (1 OOV)
     * ln P = log10 P × ln 10 (2.302585093): h1 −9.210340372, h2 −4.144653167, h3 −8.749823353
     * λ = 0.5, ω = −1.0, μ = 0.4:
     * h1 = −9.0  + 0.5·(−9.210340372) + 0      + 0.4·2 = −9.0 − 4.605170186 + 0.8       = −12.805170186
     * h2 = −10.0 + 0.5·(−4.144653167) + 0      + 0.4·2 = −10.0 − 2.072326584 + 0.8      = −11.272326584
     * h3 = −10.2 + 0.5·(−8.749823353) − 1.0·1  + 0.4·3 = −10.2 − 4.374911677 − 1 + 1.2 = −14.374911677
     * → h2 wins although the recogniser ranked h1 first.
     * </pre>
     */
    @Test
    void choosesTheHypothesisWithTheBestWeightedTotal() {
      BackoffModel.Builder b = new BackoffModel.Builder(2, Unit.WORD, NormalisationOptions.EXACT);
      int bos = b.tokenId("<s>"), eos = b.tokenId("</s>"), unk = b.tokenId("<unk>");
      int ten = b.tokenId("ten"), crates = b.tokenId("crates"), cranes = b.tokenId("cranes");
      b.add(new int[] {bos}, -99, 0);
      b.add(new int[] {eos}, -1.0, 0);
      b.add(new int[] {unk}, -2.0, 0);
      b.add(new int[] {ten}, -1.0, 0);
      b.add(new int[] {crates}, -1.5, 0);
      b.add(new int[] {cranes}, -2.5, 0);
      b.add(new int[] {bos, ten}, -0.5, 0);
      b.add(new int[] {ten, crates}, -0.3, 0);
      BackoffModel lm = b.build();
      UtteranceHypotheses u = utterance("dock-7",
          row("", 1, "ten cranes", -9.0), row("", 2, "ten crates", -10.0), row("", 3, "ten crates please", -10.2));

      UtteranceResult r = Fixtures.rescorer(weights(0.5, -1.0, 0.4), RescoreMethod.NBEST, lm, ACOUSTIC).rescore(u);

      assertThat(r.totals()).containsExactly(new double[] {-12.805170186, -11.272326584, -14.374911677}, within(1e-8));
      assertThat(r.chosen()).isEqualTo(1);
      assertThat(r.chosenHypothesis().text()).isEqualTo("ten crates");
      assertThat(r.changed()).isTrue();
      LogLinear w = r.weighting();
      ScoredUtterance s = r.scores();
      assertThat(s.oovCount(2)).isEqualTo(1);
      assertThat(s.tokenCount(2)).isEqualTo(3);
      assertThat(w.term(s, 2, 0)).isCloseTo(-10.2, within(1e-12));
      assertThat(w.term(s, 2, 1 + LogLinear.LM_TERM)).isCloseTo(-4.374911677, within(1e-8));
      assertThat(w.term(s, 2, 1 + LogLinear.OOV_TERM)).isCloseTo(-1.0, within(1e-12));
      assertThat(w.term(s, 2, 1 + LogLinear.LENGTH_TERM)).isCloseTo(1.2, within(1e-12));
    }
  }

  @Nested
  class Ties {
    @Test
    void equalTotalsGoToTheSmallerRankThenTheSystemNameThenTheFileOrder() {
      UtteranceHypotheses u = utterance("u",
          row("zeta", 2, "a", -1.0), row("beta", 1, "b", -1.0), row("alpha", 1, "c", -1.0), row("alpha", 3, "d", -1.0));
      UtteranceResult r = Fixtures.rescorer(weights(0, 0, 0), RescoreMethod.NBEST, null, ACOUSTIC).rescore(u);
      assertThat(r.chosenHypothesis().text()).isEqualTo("c");
    }

    /** Invariant: the choice does not depend on the order of rows (all keys distinct). */
    @RepeatedTest(value = 30, name = "[{currentRepetition}]")
    void choiceDoesNotDependOnRowOrder(RepetitionInfo info) {
      long seed = 4400 + info.getCurrentRepetition();
      SplittableRandom rnd = new SplittableRandom(seed);
      List<Object[]> rows = new ArrayList<>();
      int n = 2 + rnd.nextInt(12);
      for (int i = 0; i < n; i++) rows.add(row("s" + (i % 3), i + 1, "t" + i, -rnd.nextInt(3)));
      String first = null;
      for (int k = 0; k < 5; k++) {
        Collections.shuffle(rows, new java.util.Random(seed + k));
        UtteranceResult r = Fixtures.rescorer(weights(0, 0, 0), RescoreMethod.NBEST, null, ACOUSTIC)
            .rescore(utterance("u", rows.toArray(new Object[0][])));
        if (first == null) first = r.chosenHypothesis().text();
        assertThat(r.chosenHypothesis().text()).as("seed %d", seed).isEqualTo(first);
      }
    }
  }

  @Test
  void maxHypsKeepsTheBestRanksOfEachSystem() {
    UtteranceHypotheses u = utterance("u",
        row("a", 3, "a3", 9.0), row("a", 1, "a1", 0.0), row("b", 2, "b2", 5.0), row("a", 2, "a2", 1.0), row("b", 1, "b1", 0.0));
    HypothesisScorer scorer = new HypothesisScorer(null, Fixtures.WHITESPACE, Fixtures.WHITESPACE, 1, 2);
    ScoredUtterance s = scorer.score(u);
    List<String> kept = new ArrayList<>();
    for (int i = 0; i < s.size(); i++) kept.add(s.hypothesis(i).text());
    assertThat(kept).containsExactly("a1", "b2", "a2", "b1");
  }

  @Test
  void reweightingAScoredUtteranceGivesTheSameAsRescoringIt() {
    UtteranceHypotheses u = utterance("u", row("", 1, "a b", -1.0, -3.0), row("", 2, "a b c", -1.5, -1.0));
    Map<String, Double> f = new LinkedHashMap<>();
    f.put("acoustic", 1.0);
    f.put("lm", 2.0);
    RescoreWeights w = new RescoreWeights(f, 0, 0, -0.1, 1, Map.of(), 100, 0, 0, 64, 200);
    NbestRescorer r = Fixtures.rescorer(w, RescoreMethod.NBEST, null, List.of("acoustic", "lm"));
    ScoredUtterance s = new HypothesisScorer(null, Fixtures.WHITESPACE, Fixtures.WHITESPACE, 2, 0).score(u);
    assertThat(r.choose(s).totals()).containsExactly(r.rescore(u).totals());
    // by hand: h1 = -1 + 2·(-3) - 0.1·2 = -7.2; h2 = -1.5 + 2·(-1) - 0.1·3 = -3.8
    assertThat(r.choose(s).totals()).containsExactly(new double[] {-7.2, -3.8}, within(1e-12));
  }
}
