package steelyard.lm.train;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import steelyard.io.InputException;
import steelyard.lm.BackoffModel;

class VocabularyAndMinCountTest {
  // counts: a 7, b 4, c 2, d 1, e 1; </s> 5; 15 tokens
  static final List<List<String>> CORPUS = TrainTestSupport.corpus(
      "a b a", "a b c", "a b a d", "b a c", "a e");

  @Nested
  class VocabularyLimits {
    @Test
    void wordsBelowTheMinimumCountBecomeUnknownAndUnknownIsTrained() {
      TrainedModel t = new Trainer(TrainingOptions.of(2, Smoothing.MKN).withVocabulary(2, 0))
          .train(SentenceSource.of(CORPUS));
      BackoffModel lm = t.backoffModel();
      assertThat(lm.wordId("d")).isEqualTo(lm.unknownId());
      assertThat(lm.wordId("e")).isEqualTo(lm.unknownId());
      assertThat(lm.wordId("c")).isNotEqualTo(lm.unknownId());
      assertThat(t.report().unknownTokens()).isEqualTo(2);
      assertThat(t.report().vocabularySize()).isEqualTo(3 + 3);
      assertThat(lm.entryIndex(new int[] {lm.wordId("a"), lm.unknownId()}))
          .as("'a d' and 'a e' are counted as the bigram 'a <unk>'").isGreaterThanOrEqualTo(0);
      assertThat(TrainTestSupport.sum(lm, List.of("<s>", "a"))).isCloseTo(1, within(1e-9));
      assertThat(TrainTestSupport.sum(lm, List.of("<unk>"))).isCloseTo(1, within(1e-9));
    }

    @Test
    void maxVocabKeepsTheMostFrequentWordsBreakingTiesByTheToken() {
      BackoffModel lm = new Trainer(TrainingOptions.of(1, Smoothing.WB).withVocabulary(0, 3))
          .train(SentenceSource.of(CORPUS)).backoffModel();
      assertThat(TrainTestSupport.predicted(lm)).containsExactlyInAnyOrder("</s>", "<unk>", "a", "b", "c");
    }

    @Test
    void withEveryWordKeptUnknownGetsTheInterpolationFloor() {
      TrainedModel t = new Trainer(TrainingOptions.of(1, Smoothing.ABS)).train(SentenceSource.of(CORPUS));
      BackoffModel lm = t.backoffModel();
      // absolute discounting, unigrams: n1 = 2 (d, e), n2 = 1 (c) → D = 2/(2+2) = 0.5; 6 seen types;
      // γ = D·6/total = 0.5·6/20 (15 tokens + 5 </s>); P(<unk>) = γ/|V| with |V| = 5 words + </s> + <unk> = 7
      assertThat(TrainTestSupport.prob(lm, List.of(), "<unk>")).isCloseTo(0.5 * 6 / 20 / 7, within(1e-12));
      assertThat(lm.hasUnknownUnigram()).isTrue();
      assertThat(t.report().listedNgrams()[0]).isEqualTo(8);
    }
  }

  @Nested
  class MinimumCounts {
    @Test
    void bigramsSeenFewerTimesThanTheMinimumAreNotListedAndTheModelStillNormalises() {
      TrainedModel full = new Trainer(TrainingOptions.of(2, Smoothing.MKN)).train(SentenceSource.of(CORPUS));
      TrainedModel cut = new Trainer(TrainingOptions.of(2, Smoothing.MKN).withMinCount(2, 2))
          .train(SentenceSource.of(CORPUS));
      BackoffModel lm = cut.backoffModel();
      int[] ab = {lm.wordId("a"), lm.wordId("b")};
      int[] ae = {lm.wordId("a"), lm.wordId("e")};
      assertThat(lm.entryIndex(ab)).as("'a b' (count 3) is kept").isGreaterThanOrEqualTo(0);
      assertThat(lm.entryIndex(ae)).as("'a e' (count 1) is dropped").isLessThan(0);
      assertThat(cut.report().listedNgrams()[1]).isLessThan(full.report().listedNgrams()[1]);
      assertThat(TrainTestSupport.prob(lm, List.of("a"), "b"))
          .as("a kept n-gram keeps its interpolated probability")
          .isCloseTo(TrainTestSupport.prob(full.model(), List.of("a"), "b"), within(1e-12));
      for (String h : List.of("a", "b", "c", "d", "e", "<s>", "<unk>")) {
        assertThat(TrainTestSupport.sum(lm, List.of(h))).as("after %s", h).isCloseTo(1, within(1e-9));
      }
    }

    @Test
    void aContextOfAKeptLongerNgramStaysListed() {
      // a bigram minimum of 6 would drop every bigram; trigrams keep them all, so their contexts stay
      BackoffModel lm = new Trainer(TrainingOptions.of(3, Smoothing.WB).withMinCount(2, 6))
          .train(SentenceSource.of(CORPUS)).backoffModel();
      int[] ab = {lm.wordId("a"), lm.wordId("b")};
      assertThat(lm.entryIndex(ab)).isGreaterThanOrEqualTo(0);
      assertThat(lm.log10Prob(2, lm.entryIndex(ab))).isNotNaN();
      assertThat(TrainTestSupport.sum(lm, List.of("a", "b"))).isCloseTo(1, within(1e-9));
    }

    @Test
    void aUnigramMinimumCountIsRefused() {
      assertThatThrownBy(() -> TrainingOptions.of(2, Smoothing.MKN).withMinCount(1, 2))
          .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("order 1");
      assertThatThrownBy(() -> new TrainingOptions(2, steelyard.text.Unit.WORD, steelyard.text.NormalisationOptions.EXACT,
          Smoothing.MKN, 0, 0, new int[] {2, 2}, 1.0))
          .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("unigram minimum count");
    }

    @Test
    void ordersNotNamedKeepEveryNgram() {
      TrainingOptions o = TrainingOptions.of(4, Smoothing.MKN).withMinCount(3, 2);
      assertThat(new int[] {o.minCount(1), o.minCount(2), o.minCount(3), o.minCount(4)}).containsExactly(1, 1, 2, 1);
    }
  }

  @Test
  void sentenceMarkersInTheTextAreRefusedWithTheLine() {
    assertThatThrownBy(() -> new Trainer(TrainingOptions.of(2, Smoothing.MKN))
        .train(SentenceSource.of(TrainTestSupport.corpus("a b", "a </s> b"))))
        .isInstanceOf(InputException.class).hasMessageContaining(":2: the token '</s>' is reserved");
  }

  @Test
  void anEmptyCorpusIsRefused() {
    assertThatThrownBy(() -> new Trainer(TrainingOptions.of(2, Smoothing.MKN))
        .train(SentenceSource.of(TrainTestSupport.corpus("", " "))))
        .isInstanceOf(InputException.class).hasMessageContaining("no sentence to train on");
  }
}
