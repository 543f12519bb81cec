package steelyard.audit;

import java.util.List;
import java.util.Objects;
import steelyard.lattice.LatticeSettings;
import steelyard.lm.LanguageModel;
import steelyard.rescore.Tokenizer;
import steelyard.text.Unit;

/**
 * How the audit reads the rescoring results it is given: the same feature names, unit, model, model
 * tokenisation and network settings the rescoring ran with.
 *
 * @param featureNames the selected features, in the order of the weighting's feature terms
 * @param unit         the scoring unit (joins the tokens of a new transcript into text)
 * @param lm           the model; null when the run had none (no decisive n-grams, no flip weight for the network
 *                     methods)
 * @param lmTokens     the model's tokenisation of raw text (as rescoring scored ln P); required with a model
 * @param network      λ′, μ′, beam and cap of the confusion network; required for the consensus and lattice
 *                     methods, ignored otherwise
 * @param poolSize     k of the k-best path pool searched per network for the flip weights (≥ 1)
 * @param topPairs     how many most-often fixed and broken token pairs the summaries list (≥ 0)
 */
public record AuditSettings(
    List<String> featureNames, Unit unit, LanguageModel lm, Tokenizer lmTokens, LatticeSettings network,
    int poolSize, int topPairs) {
  /** Default k of the network path pool. */
  public static final int DEFAULT_POOL_SIZE = 20;
  /** Default length of the fixed/broken pair lists. */
  public static final int DEFAULT_TOP_PAIRS = 10;

  public AuditSettings {
    featureNames = List.copyOf(featureNames);
    Objects.requireNonNull(unit, "unit");
    if (lm != null && lmTokens == null) throw new IllegalArgumentException("a model needs its tokenisation (lmTokens)");
    if (poolSize < 1) throw new IllegalArgumentException("poolSize must be >= 1: " + poolSize);
    if (topPairs < 0) throw new IllegalArgumentException("topPairs must be >= 0: " + topPairs);
  }

  /** Settings with the default pool size and pair-list length. */
  public static AuditSettings of(
      List<String> featureNames, Unit unit, LanguageModel lm, Tokenizer lmTokens, LatticeSettings network) {
    return new AuditSettings(featureNames, unit, lm, lmTokens, network, DEFAULT_POOL_SIZE, DEFAULT_TOP_PAIRS);
  }
}
