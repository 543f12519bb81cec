package steelyard.lm;

import java.util.SplittableRandom;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Seeded random back-off models for property-style tests: a vocabulary of {@code v} words, random listed
 * n-grams of every order (some with unlisted prefixes, like pruned files), random log10 values. They need
 * not normalise: the tests compare engines and files, not probabilities with a formula.
 */
public final class RandomModels {
  private RandomModels() {}

  public static BackoffModel model(SplittableRandom rnd, int order, int v, int ngramsPerOrder, boolean withUnk) {
    return model(rnd, order, v, ngramsPerOrder, withUnk, false);
  }

  /**
   * As {@link #model(SplittableRandom, int, int, int, boolean)}; when {@code closed}, every contiguous part of a
   * listed n-gram is listed too (as in files from the usual estimators), otherwise prefixes and suffixes may
   * be missing (as in pruned files).
   */
  public static BackoffModel model(SplittableRandom rnd, int order, int v, int ngramsPerOrder, boolean withUnk, boolean closed) {
    BackoffModel.Builder b = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
    b.metadata("steelyard.test.seed-model=random");
    int[] words = new int[v + 3];
    words[0] = b.tokenId(BackoffModel.SENTENCE_START);
    words[1] = b.tokenId(BackoffModel.SENTENCE_END);
    words[2] = b.tokenId(BackoffModel.UNKNOWN);
    for (int i = 0; i < v; i++) words[i + 3] = b.tokenId("w" + i);
    b.add(new int[] {words[0]}, -99, rnd.nextDouble(-1, 0.5));
    b.add(new int[] {words[1]}, rnd.nextDouble(-3, 0), 0);
    if (withUnk) b.add(new int[] {words[2]}, rnd.nextDouble(-5, -1), 0);
    for (int i = 3; i < words.length; i++) {
      if (rnd.nextInt(10) > 0) b.add(new int[] {words[i]}, rnd.nextDouble(-5, 0), rnd.nextDouble(-1.5, 0.5));
    }
    for (int k = 2; k <= order; k++) {
      for (int n = 0; n < ngramsPerOrder; n++) {
        int[] g = new int[k];
        g[0] = rnd.nextInt(8) == 0 ? words[0] : words[1 + rnd.nextInt(words.length - 1)];
        for (int j = 1; j < k; j++) g[j] = words[1 + rnd.nextInt(words.length - 1)];
        if (closed) {
          for (int len = 1; len <= k; len++) {
            for (int i = 0; i + len <= k; i++) {
              int[] part = java.util.Arrays.copyOfRange(g, i, i + len);
              if (len == 1 && part[0] == words[2] && !withUnk) continue;
              if (!b.contains(part)) b.add(part, part.length == 1 && part[0] == words[0] ? -99 : rnd.nextDouble(-4, 0), len < order ? rnd.nextDouble(-1.5, 0.5) : 0);
            }
          }
        } else if (g[0] == words[0] || rnd.nextInt(4) > 0) {
          b.add(g, rnd.nextDouble(-4, 0), k < order ? rnd.nextDouble(-1.5, 0.5) : 0);
        } else {
          b.add(g, rnd.nextDouble(-4, 0), 0);
        }
      }
    }
    return b.build();
  }

  /** A random token sequence over the model's vocabulary plus some out-of-vocabulary words. */
  public static String[] sentence(SplittableRandom rnd, int v, int length) {
    String[] out = new String[length];
    for (int i = 0; i < length; i++) out[i] = rnd.nextInt(15) == 0 ? "oov" + rnd.nextInt(5) : "w" + rnd.nextInt(v);
    return out;
  }
}
