package steelyard.lm;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Seeded random back-off models for tests: random listed n-grams with random probabilities, back-off weights
 * made consistent by {@link BackoffRenormaliser}, so every context normalises.
 */
public final class RandomBackoffModels {
  private RandomBackoffModels() {}

  /** A model over {@code vocab} ordinary words w0…w(V−1) plus the three special tokens. */
  public static BackoffModel create(long seed, int vocab, int order, double density) {
    SplittableRandom rnd = new SplittableRandom(seed);
    BackoffModel.Builder b = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
    List<Integer> predictable = new ArrayList<>();
    predictable.add(b.tokenId(BackoffModel.SENTENCE_END));
    predictable.add(b.tokenId(BackoffModel.UNKNOWN));
    for (int i = 0; i < vocab; i++) predictable.add(b.tokenId("w" + i));
    int bos = b.tokenId(BackoffModel.SENTENCE_START);
    double[] raw = new double[predictable.size()];
    double total = 0;
    for (int i = 0; i < raw.length; i++) total += raw[i] = 0.05 + rnd.nextDouble();
    b.add(new int[] {bos}, -99, 0);
    for (int i = 0; i < raw.length; i++) b.add(new int[] {predictable.get(i)}, Math.log10(raw[i] / total), 0);
    List<int[]> contexts = new ArrayList<>();
    contexts.add(new int[] {bos});
    for (int w : predictable) if (w != b.tokenId(BackoffModel.SENTENCE_END)) contexts.add(new int[] {w});
    for (int k = 2; k <= order; k++) {
      List<int[]> next = new ArrayList<>();
      for (int[] ctx : contexts) {
        if (rnd.nextDouble() > density) continue;
        double mass = 0.3 + 0.6 * rnd.nextDouble();
        List<Integer> chosen = new ArrayList<>();
        for (int w : predictable) if (rnd.nextDouble() < 0.35) chosen.add(w);
        if (chosen.isEmpty() || chosen.size() == predictable.size()) continue;
        double[] weights = new double[chosen.size()];
        double sum = 0;
        for (int i = 0; i < weights.length; i++) sum += weights[i] = 0.05 + rnd.nextDouble();
        for (int i = 0; i < weights.length; i++) {
          int[] ng = java.util.Arrays.copyOf(ctx, k);
          ng[k - 1] = chosen.get(i);
          b.add(ng, Math.log10(mass * weights[i] / sum), 0);
          if (chosen.get(i) != b.tokenId(BackoffModel.SENTENCE_END)) next.add(ng);
        }
      }
      contexts = next;
    }
    return BackoffRenormaliser.renormalise(b.build());
  }

  /** Σ over every token but {@code <s>} of P(w | context), in linear probability. */
  public static double totalProbability(BackoffModel m, int[] context) {
    double sum = 0;
    for (int w = 0; w < m.vocabularySize(); w++) {
      if (w == m.sentenceStartId()) continue;
      sum += Math.pow(10, m.log10Prob(context, w));
    }
    return sum;
  }

  /** A random context of the given length: a listed history when one exists and {@code seen}, else random ids. */
  public static int[] randomContext(BackoffModel m, SplittableRandom rnd, int length, boolean seen) {
    if (seen && length > 0 && m.entryCount(length) > 0) {
      int[] ids = new int[length];
      m.ngram(length, rnd.nextInt(m.entryCount(length)), ids);
      return ids;
    }
    int[] ids = new int[length];
    for (int i = 0; i < length; i++) ids[i] = rnd.nextInt(m.vocabularySize());
    return ids;
  }
}
