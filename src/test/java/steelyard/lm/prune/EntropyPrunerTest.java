package steelyard.lm.prune;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.lm.BackoffModel;
import steelyard.lm.BackoffRenormaliser;
import steelyard.lm.RandomBackoffModels;

class EntropyPrunerTest {

  @Nested
  class Thresholds {
    @Test
    void thresholdZeroKeepsEveryNgram() {
      BackoffModel m = RandomBackoffModels.create(21, 10, 3, 0.7);
      EntropyPruner.Result r = EntropyPruner.prune(m, 0);
      assertThat(r.after()).containsExactly(r.before());
    }

    @ParameterizedTest(name = "[{index}] seed {0}")
    @ValueSource(longs = {22, 23, 24})
    void largerThresholdsKeepANonIncreasingNumberOfNgrams(long seed) {
      BackoffModel m = RandomBackoffModels.create(seed, 10, 4, 0.7);
      int previous = Integer.MAX_VALUE;
      for (double theta : new double[] {0, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 1e-1}) {
        EntropyPruner.Result r = EntropyPruner.prune(m, theta);
        int kept = Arrays.stream(r.after()).sum();
        assertThat(kept).as("seed %d theta %s", seed, theta).isLessThanOrEqualTo(previous);
        previous = kept;
      }
      assertThat(previous).as("a large threshold prunes something").isLessThan(Arrays.stream(EntropyPruner.prune(m, 0).before()).sum());
    }

    @Test
    void unigramsAreNeverPruned() {
      BackoffModel m = RandomBackoffModels.create(25, 10, 3, 0.7);
      EntropyPruner.Result r = EntropyPruner.prune(m, 10);
      assertThat(r.after()[0]).isEqualTo(r.before()[0]);
      assertThat(r.after()[1] + r.after()[2]).isZero();
    }
  }

  /** Mathematical invariant: the pruned model is still a proper back-off model. */
  @ParameterizedTest(name = "[{index}] seed {0}")
  @ValueSource(longs = {31, 32, 33})
  void prunedModelStillNormalises(long seed) {
    BackoffModel pruned = EntropyPruner.prune(RandomBackoffModels.create(seed, 10, 4, 0.7), 1e-3).model();
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int t = 0; t < 30; t++) {
      int[] ctx = RandomBackoffModels.randomContext(pruned, rnd, rnd.nextInt(pruned.order()), rnd.nextBoolean());
      assertThat(RandomBackoffModels.totalProbability(pruned, ctx)).as("seed %d", seed).isCloseTo(1.0, within(1e-9));
    }
  }

  /**
   * Stolcke 1998 (eqs. 4–9) gives D in closed form; here it is checked against the definition
   * D = P(h)·Σ_w P(w|h)·ln(P(w|h)/P′(w|h)), computed by brute force over the whole vocabulary after
   * removing the one n-gram and renormalising.
   */
  @ParameterizedTest(name = "[{index}] seed {0}")
  @ValueSource(longs = {41, 42, 43, 44})
  void closedFormEntropyIncreaseMatchesTheDefinition(long seed) {
    BackoffModel m = RandomBackoffModels.create(seed, 8, 3, 0.8);
    SplittableRandom rnd = new SplittableRandom(seed);
    int k = 2 + rnd.nextInt(2);
    int[] ngram = new int[k];
    int i;
    do {
      i = rnd.nextInt(m.entryCount(k));
      m.ngram(k, i, ngram);
    } while (Double.isNaN(m.log10Prob(k, i)) || hasChildren(m, ngram));
    double closedForm = EntropyPruner.relativeEntropyIncrease(m, ngram);

    BackoffModel.Builder b = new BackoffModel.Builder(m.order(), m.unit(), m.normalisation());
    for (int id = 0; id < m.vocabularySize(); id++) b.tokenId(m.token(id));
    for (int kk = 1; kk <= m.order(); kk++) {
      int[] ids = new int[kk];
      for (int e = 0; e < m.entryCount(kk); e++) {
        m.ngram(kk, e, ids);
        if (Double.isNaN(m.log10Prob(kk, e)) || Arrays.equals(ids, ngram)) continue;
        b.add(ids.clone(), m.log10Prob(kk, e), 0);
      }
    }
    BackoffModel without = BackoffRenormaliser.renormalise(b.build());
    int[] h = Arrays.copyOf(ngram, k - 1);
    double klSum = 0;
    for (int w = 0; w < m.vocabularySize(); w++) {
      if (w == m.sentenceStartId()) continue;
      double p = Math.pow(10, m.log10Prob(h, w));
      double q = Math.pow(10, without.log10Prob(h, w));
      klSum += p * Math.log(p / q);
    }
    double ph = 1;
    int start = h[0] == m.sentenceStartId() ? 1 : 0;
    for (int j = start; j < h.length; j++) ph *= Math.pow(10, m.log10Prob(Arrays.copyOfRange(h, 0, j), h[j]));
    assertThat(closedForm).as("seed %d n-gram %s", seed, Arrays.toString(ngram)).isCloseTo(ph * klSum, within(1e-12));
  }

  private static boolean hasChildren(BackoffModel m, int[] ngram) {
    if (ngram.length == m.order()) return false;
    int[] ids = new int[ngram.length + 1];
    for (int e = 0; e < m.entryCount(ngram.length + 1); e++) {
      m.ngram(ngram.length + 1, e, ids);
      if (Arrays.equals(ids, 0, ngram.length, ngram, 0, ngram.length)) return true;
    }
    return false;
  }
}
