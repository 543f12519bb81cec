package steelyard.lm.mix;

import java.nio.file.Path;
import java.util.List;
import steelyard.io.InputException;
import steelyard.lm.BackoffModel;
import steelyard.lm.BackoffRenormaliser;
import steelyard.lm.LanguageModel;
import steelyard.lm.MixtureModel;
import steelyard.text.Unit;

/**
 * Writes a linear mixture as one back-off model by the standard static approximation: the union of the
 * components' n-grams, each given its exact mixture probability Σᵢ λᵢPᵢ(w | h), and back-off weights
 * recomputed so that every context normalises ({@link BackoffRenormaliser}). Probabilities of n-grams that
 * no component lists come from the back-off and differ from the exact mixture: that is the approximation,
 * and the mix command reports the held-out perplexity of both so the user sees its cost.
 */
public final class StaticMixture {
  private StaticMixture() {}

  /** The static approximation of {@code mixture}, whose components must all be {@link BackoffModel}s. */
  public static BackoffModel approximate(MixtureModel mixture) {
    List<LanguageModel> comps = mixture.components();
    BackoffModel first = asBackoff(comps.get(0));
    BackoffModel.Builder b = new BackoffModel.Builder(mixture.order(), first.unit(), first.normalisation());
    for (int id = 0; id < mixture.vocabularySize(); id++) b.tokenId(mixture.token(id));
    for (String line : first.metadata()) b.metadata(line);
    b.metadata("steelyard.mixture.weights=" + weightsText(mixture.weights()));
    double[] weights = mixture.weights();
    for (int k = 1; k <= mixture.order(); k++) {
      for (int c = 0; c < comps.size(); c++) {
        BackoffModel m = asBackoff(comps.get(c));
        if (k > m.order() || weights[c] == 0) continue;
        int[] ids = new int[k];
        for (int i = 0; i < m.entryCount(k); i++) {
          if (Double.isNaN(m.log10Prob(k, i))) continue;
          m.ngram(k, i, ids);
          int[] union = new int[k];
          for (int j = 0; j < k; j++) union[j] = mixture.wordId(m.token(ids[j]));
          if (b.contains(union)) continue;
          b.add(union, mixtureLog10(mixture, union), 0.0);
        }
      }
    }
    return BackoffRenormaliser.renormalise(b.build());
  }

  /**
   * log10 of Σᵢ λᵢPᵢ(w | h) for an n-gram given in the mixture's ids (context first, word last); a component
   * that does not know w adds nothing, as in {@link MixtureModel}.
   */
  static double mixtureLog10(MixtureModel mixture, int[] unionNgram) {
    List<LanguageModel> comps = mixture.components();
    double[] w = mixture.weights();
    double p = 0;
    int k = unionNgram.length;
    for (int c = 0; c < comps.size(); c++) {
      if (w[c] == 0) continue;
      BackoffModel m = asBackoff(comps.get(c));
      int start = Math.max(0, k - m.order());
      String word = mixture.token(unionNgram[k - 1]);
      int wid = m.wordId(word);
      if (!m.token(wid).equals(word)) continue; // outside this component's vocabulary: probability 0 there
      int[] ctx = new int[k - 1 - start];
      for (int j = start; j < k - 1; j++) ctx[j - start] = m.wordId(mixture.token(unionNgram[j]));
      p += w[c] * Math.pow(10, m.log10Prob(ctx, wid));
    }
    return Math.log10(p);
  }

  /**
   * Refuses components of different units (words mixed with characters would interpolate unrelated token
   * streams); returns a warning when their recorded normalisations differ, else null.
   */
  public static String checkCompatible(List<Path> files, List<? extends LanguageModel> models) {
    LanguageModel first = models.get(0);
    for (int i = 1; i < models.size(); i++) {
      LanguageModel m = models.get(i);
      if (m.unit() != first.unit()) {
        throw InputException.inFile(files.get(i), "is a " + label(m.unit()) + " model but " + files.get(0) + " is a "
            + label(first.unit()) + " model", "models of one unit (all word or all char) to mix");
      }
    }
    for (int i = 1; i < models.size(); i++) {
      if (!models.get(i).normalisation().equals(first.normalisation()))
        return files.get(i) + " was trained with other normalisation options than " + files.get(0)
            + "; the held-out text is normalised as the first model's";
    }
    return null;
  }

  private static String label(Unit u) {
    return u.name().toLowerCase(java.util.Locale.ROOT);
  }

  private static BackoffModel asBackoff(LanguageModel m) {
    if (m instanceof BackoffModel) return (BackoffModel) m;
    throw new IllegalArgumentException("static mixing needs exact back-off components, got " + m.getClass().getSimpleName());
  }

  private static String weightsText(double[] w) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < w.length; i++) {
      if (i > 0) sb.append(',');
      sb.append(String.format(java.util.Locale.ROOT, "%.6f", w[i]));
    }
    return sb.toString();
  }
}
