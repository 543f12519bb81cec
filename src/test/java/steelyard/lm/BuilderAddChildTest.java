package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.longs.LongOpenHashSet;
import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * {@link BackoffModel.Builder#addChild} against {@link BackoffModel.Builder#add}. Invariant (mathematical,
 * from the contract): for any sequence of new n-grams in which every n-gram's prefix was added before it,
 * calling {@code addChild(k, entry of the prefix, w, p, b)} instead of {@code add(prefix + w, p, b)} gives the
 * same model: the same entries at the same indices with the same n-grams, probabilities and back-off
 * weights, and therefore the same score for every query.
 */
class BuilderAddChildTest {
  private static final int VOCABULARY = 40;

  @Test
  void addChildBuildsTheSameModelAsAddOnSeededRandomModels() {
    for (long seed = 1; seed <= 30; seed++) {
      SplittableRandom random = new SplittableRandom(seed);
      int order = 1 + random.nextInt(5);
      BackoffModel.Builder slow = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
      BackoffModel.Builder fast = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
      for (int w = 3; w < VOCABULARY; w++) {
        slow.tokenId("w" + w);
        fast.tokenId("w" + w);
      }
      addRandomNgrams(random, order, slow, fast, seed);
      BackoffModel expected = slow.build();
      BackoffModel actual = fast.build();
      assertSameEntries(expected, actual, seed);
      assertSameScores(expected, actual, new SplittableRandom(seed * 31 + 7), seed);
    }
  }

  @Test
  void addChildRejectsAnNgramThatIsAlreadyStoredWhenAssertionsAreOn() {
    assumeTrue(BackoffModel.class.desiredAssertionStatus(), "the contract is checked by assertions only");
    BackoffModel.Builder b = new BackoffModel.Builder(2, Unit.WORD, NormalisationOptions.EXACT);
    int a = b.tokenId("apples");
    int e = b.addChild(1, -1, a, -1.0, -0.5);
    b.addChild(2, e, a, -0.3, 0);
    assertThatThrownBy(() -> b.addChild(2, e, a, -0.3, 0)).isInstanceOf(AssertionError.class);
    assertThatThrownBy(() -> b.addChild(2, 5, a, -0.3, 0)).isInstanceOf(AssertionError.class);
  }

  /** Random n-grams, interleaved across orders, each added only after its prefix; both builders get each one. */
  private static void addRandomNgrams(SplittableRandom random, int order, BackoffModel.Builder slow,
      BackoffModel.Builder fast, long seed) {
    IntArrayList[] entries = new IntArrayList[order + 1];
    for (int k = 1; k <= order; k++) entries[k] = new IntArrayList();
    LongOpenHashSet[] stored = new LongOpenHashSet[order + 1];
    for (int k = 1; k <= order; k++) stored[k] = new LongOpenHashSet();
    java.util.List<int[]>[] ngrams = new java.util.List[order + 1];
    for (int k = 1; k <= order; k++) ngrams[k] = new java.util.ArrayList<>();
    int steps = 50 + random.nextInt(400);
    for (int s = 0; s < steps; s++) {
      int k = 1 + random.nextInt(order);
      if (k > 1 && entries[k - 1].isEmpty()) k = 1;
      int parentIndex = k == 1 ? -1 : random.nextInt(entries[k - 1].size());
      int parentEntry = k == 1 ? -1 : entries[k - 1].getInt(parentIndex);
      int w = random.nextInt(VOCABULARY);
      if (!stored[k].add(((long) (parentEntry + 1) << 32) | w)) continue;
      int[] ngram = new int[k];
      if (k > 1) System.arraycopy(ngrams[k - 1].get(parentIndex), 0, ngram, 0, k - 1);
      ngram[k - 1] = w;
      double p = -5 * random.nextDouble();
      double bow = k < order ? -random.nextDouble() : 0;
      assertThat(slow.add(ngram, p, bow)).as("seed %d: add of a new n-gram", seed).isTrue();
      int e = fast.addChild(k, parentEntry, w, p, bow);
      assertThat(e).as("seed %d: entry index", seed).isEqualTo(entries[k].size());
      entries[k].add(e);
      ngrams[k].add(ngram);
    }
  }

  private static void assertSameEntries(BackoffModel expected, BackoffModel actual, long seed) {
    for (int k = 1; k <= expected.order(); k++) {
      assertThat(actual.entryCount(k)).as("seed %d: entries of order %d", seed, k).isEqualTo(expected.entryCount(k));
      int[] a = new int[k];
      int[] b = new int[k];
      for (int i = 0; i < expected.entryCount(k); i++) {
        expected.ngram(k, i, a);
        actual.ngram(k, i, b);
        assertThat(b).as("seed %d: n-gram of entry %d order %d", seed, i, k).containsExactly(a);
        assertThat(actual.log10Prob(k, i)).as("seed %d: log10 P", seed).isEqualTo(expected.log10Prob(k, i));
        assertThat(actual.log10Backoff(k, i)).as("seed %d: log10 bow", seed).isEqualTo(expected.log10Backoff(k, i));
        assertThat(actual.entryIndex(a)).as("seed %d: look-up of %s", seed, Arrays.toString(a)).isEqualTo(i);
      }
    }
  }

  private static void assertSameScores(BackoffModel expected, BackoffModel actual, SplittableRandom random,
      long seed) {
    for (int q = 0; q < 300; q++) {
      int[] context = new int[random.nextInt(expected.order() + 1)];
      for (int j = 0; j < context.length; j++) context[j] = random.nextInt(VOCABULARY);
      int w = random.nextInt(VOCABULARY);
      assertThat(actual.log10Prob(context, w))
          .as("seed %d: log10 P(%d | %s)", seed, w, Arrays.toString(context))
          .isEqualTo(expected.log10Prob(context, w));
    }
  }
}
