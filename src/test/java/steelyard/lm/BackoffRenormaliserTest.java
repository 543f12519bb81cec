package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class BackoffRenormaliserTest {

  /** Mathematical invariant: a back-off model's conditional distributions sum to 1 in every context. */
  @ParameterizedTest(name = "[{index}] seed {0}")
  @ValueSource(longs = {1, 2, 3, 4, 5, 6, 7, 8})
  void everyContextSumsToOneAfterRenormalising(long seed) {
    BackoffModel m = RandomBackoffModels.create(seed, 10, 4, 0.6);
    SplittableRandom rnd = new SplittableRandom(seed * 31);
    for (int trial = 0; trial < 40; trial++) {
      int len = rnd.nextInt(m.order());
      int[] ctx = RandomBackoffModels.randomContext(m, rnd, len, rnd.nextBoolean());
      assertThat(RandomBackoffModels.totalProbability(m, ctx))
          .as("seed %d context %s", seed, java.util.Arrays.toString(ctx))
          .isCloseTo(1.0, within(1e-9));
    }
  }

  @ParameterizedTest(name = "[{index}] seed {0}")
  @ValueSource(longs = {11, 12, 13})
  void renormalisingANormalisedModelChangesNothing(long seed) {
    BackoffModel m = RandomBackoffModels.create(seed, 8, 3, 0.7);
    BackoffModel again = BackoffRenormaliser.renormalise(m);
    for (int k = 1; k <= m.order(); k++) {
      assertThat(again.ngramCount(k)).isEqualTo(m.ngramCount(k));
      int[] ids = new int[k];
      for (int i = 0; i < m.entryCount(k); i++) {
        m.ngram(k, i, ids);
        int j = again.entryIndex(ids);
        assertThat(again.log10Prob(k, j)).as("seed %d", seed).isCloseTo(m.log10Prob(k, i), within(1e-9));
        assertThat(again.log10Backoff(k, j)).as("seed %d", seed).isCloseTo(m.log10Backoff(k, i), within(1e-9));
      }
    }
  }
}
