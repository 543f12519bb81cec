package steelyard.gui.model;

import java.util.List;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * One choice per utterance under one set of weights and a method, with its errors and the corpus figures.
 * Built by {@link Workspace}; immutable.
 *
 * @param weights   the weights the choice was made with
 * @param method    the method
 * @param chosen    per utterance: kept index of the chosen hypothesis, or −1 for a new transcript
 * @param newTokens per utterance: the chosen tokens when {@code chosen} is −1, else null (array may be null
 *                  for N-best, which never makes one)
 * @param errors    per utterance: errors of the choice, or {@link Corpus#NO_REFERENCE}
 * @param changed   per utterance: whether the chosen tokens differ from rank 1's
 * @param figures   the corpus figures
 */
public record Choices(
    RescoreWeights weights, RescoreMethod method, int[] chosen, List<List<String>> newTokens, int[] errors, boolean[] changed,
    CorpusFigures figures) {

  /** The choices with their corpus figures (as the rescore summary counts them; see {@link CorpusFigures}). */
  static Choices of(Corpus corpus, RescoreWeights w, RescoreMethod method, int[] chosen, List<List<String>> fresh, int[] errors,
      boolean[] changed) {
    int n = corpus.size();
    int scored = 0;
    int nChanged = 0;
    int helped = 0;
    int hurt = 0;
    int news = 0;
    long tokens = 0;
    long e = 0;
    long first = 0;
    long oracle = 0;
    for (int u = 0; u < n; u++) {
      if (changed[u]) nChanged++;
      if (chosen[u] < 0) news++;
      if (!corpus.hasReference(u)) continue;
      scored++;
      tokens += corpus.referenceLength(u);
      e += errors[u];
      int f = corpus.firstErrors(u);
      first += f;
      oracle += corpus.oracleErrors(u);
      if (errors[u] < f) helped++;
      else if (errors[u] > f) hurt++;
    }
    int orphans = corpus.orphanReferences().size();
    long lost = corpus.orphanTokens();
    CorpusFigures figures = new CorpusFigures(n, scored + orphans, tokens + lost, e + lost, first + lost, oracle + lost,
        nChanged, helped, hurt, news);
    return new Choices(w, method, chosen, fresh, errors, changed, figures);
  }

  /** The verdict of utterance {@code u} against rank 1. */
  public Verdict verdict(Corpus corpus, int u) {
    if (!changed[u]) return Verdict.SAME;
    int first = corpus.firstErrors(u);
    if (first == Corpus.NO_REFERENCE) return Verdict.UNVERIFIED;
    int e = errors[u];
    return e < first ? Verdict.HELPED : e > first ? Verdict.HURT : Verdict.NEUTRAL;
  }

  /** Whether utterance {@code u}'s choice is a new transcript. */
  public boolean isNew(int u) {
    return chosen[u] < 0;
  }

  /** The chosen tokens of utterance {@code u} when new, else null. */
  public List<String> newTokens(int u) {
    return newTokens == null ? null : newTokens.get(u);
  }

  /** How a choice compares with the recogniser's rank 1. */
  public enum Verdict {
    /** The same tokens as rank 1. */
    SAME,
    /** Different tokens, fewer errors. */
    HELPED,
    /** Different tokens, more errors. */
    HURT,
    /** Different tokens, as many errors. */
    NEUTRAL,
    /** Different tokens, no reference to tell. */
    UNVERIFIED
  }
}
