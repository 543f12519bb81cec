package steelyard.tune;

import java.util.SplittableRandom;

/**
 * Seeded k-fold assignment of utterances for cross-validation: a Fisher–Yates shuffle of 0 … U−1 drawn from
 * {@code new SplittableRandom(seed)}, then the utterance at shuffled position p goes to fold p mod k, so fold
 * sizes differ by at most one. The same (U, k, seed) always gives the same folds.
 */
final class Folds {
  private final int[] fold;
  private final int count;

  Folds(int utterances, int k, long seed) {
    if (k < 2 || k > utterances) throw new IllegalArgumentException("need 2 <= folds <= utterances: " + k + ", " + utterances);
    int[] order = new int[utterances];
    for (int i = 0; i < utterances; i++) order[i] = i;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int i = utterances - 1; i > 0; i--) {
      int j = rnd.nextInt(i + 1);
      int t = order[i];
      order[i] = order[j];
      order[j] = t;
    }
    fold = new int[utterances];
    for (int p = 0; p < utterances; p++) fold[order[p]] = p % k;
    count = k;
  }

  int count() {
    return count;
  }

  /** The fold of utterance {@code u}. */
  int of(int u) {
    return fold[u];
  }

  /** Utterances outside fold f (ascending): what fold f is tuned on. */
  int[] train(int f) {
    return select(f, false);
  }

  /** Utterances of fold f (ascending): what fold f is evaluated on. */
  int[] test(int f) {
    return select(f, true);
  }

  private int[] select(int f, boolean inside) {
    int n = 0;
    for (int x : fold) if ((x == f) == inside) n++;
    int[] out = new int[n];
    int at = 0;
    for (int u = 0; u < fold.length; u++) if ((fold[u] == f) == inside) out[at++] = u;
    return out;
  }
}
