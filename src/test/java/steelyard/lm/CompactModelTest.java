package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The compact engine against the exact double-precision {@link BackoffModel} (the reference here): same
 * log-probabilities up to float rounding and equal states, on seeded random models and random queries.
 */
class CompactModelTest {
  @ParameterizedTest(name = "[{index}] order {0}, closed {1}, unk {2}")
  @CsvSource({"1,true,true", "2,true,true", "3,true,true", "3,false,true", "4,true,false", "4,false,false", "5,false,true", "6,true,true", "6,false,true"})
  void scoresAndStatesMatchTheExactModel(int order, boolean closed, boolean unk) {
    long seed = 1000L * order + (closed ? 1 : 0) + (unk ? 2 : 0);
    SplittableRandom rnd = new SplittableRandom(seed);
    int v = 40;
    BackoffModel exact = RandomModels.model(rnd, order, v, 400, unk, closed);
    CompactModel compact = CompactModel.of(exact);
    // both query paths are exercised: the one-pass path for closed models, the two-pass path otherwise
    assertThat(compact.suffixClosed).as("seed %d", seed).isEqualTo(closed || order == 1);
    LmState es = exact.newState();
    LmState cs = compact.newState();
    for (int sentence = 0; sentence < 300; sentence++) {
      exact.beginSentence(es);
      compact.beginSentence(cs);
      String[] words = RandomModels.sentence(rnd, v, 1 + rnd.nextInt(15));
      for (String w : words) {
        int id = exact.wordId(w);
        assertThat(compact.wordId(w)).isEqualTo(id);
        double e = exact.score(es, id, es);
        double c = compact.score(cs, id, cs);
        // float storage: 24-bit mantissa, values below 100 in magnitude, a sum of at most 7 terms
        assertThat(c).as("seed %d, word %s", seed, w).isCloseTo(e, within(1e-4));
        assertThat(cs).as("seed %d", seed).isEqualTo(es);
      }
      assertThat(compact.score(cs, compact.sentenceEndId(), cs)).isCloseTo(exact.score(es, exact.sentenceEndId(), es), within(1e-4));
    }
  }

  @Test
  void separateInputAndOutputStatesGiveTheSameAsAliasedOnes() {
    SplittableRandom rnd = new SplittableRandom(77);
    CompactModel lm = CompactModel.of(RandomModels.model(rnd, 4, 30, 500, true, true));
    LmState a = lm.newState();
    LmState b = lm.newState();
    LmState t = lm.newState();
    lm.beginSentence(a);
    lm.beginSentence(b);
    for (int i = 0; i < 2000; i++) {
      int w = 3 + rnd.nextInt(30);
      double x = lm.score(a, w, a);
      double y = lm.score(b, w, t);
      b.copyFrom(t);
      assertThat(x).isEqualTo(y);
      assertThat(a).isEqualTo(b);
    }
  }

  @Test
  void reportsBytesPerNgramAndRebuildsTheExactModel() {
    BackoffModel exact = RandomModels.model(new SplittableRandom(5), 3, 200, 3000, true, true);
    CompactModel compact = CompactModel.of(exact);
    assertThat(compact.bytesPerNgram()).isBetween(4.0, 40.0);
    assertThat(compact.ramBytesUsed()).isGreaterThan(compact.ngramBytesUsed());
    BackoffModel back = compact.toBackoffModel();
    for (int k = 1; k <= 3; k++) assertThat(back.ngramCount(k)).isEqualTo(exact.ngramCount(k));
    SplittableRandom rnd = new SplittableRandom(6);
    for (int i = 0; i < 200; i++) {
      java.util.List<String> s = java.util.List.of(RandomModels.sentence(rnd, 200, 8));
      assertThat(back.sentenceLogProb(s)).isCloseTo(exact.sentenceLogProb(s), within(1e-4));
    }
  }
}
