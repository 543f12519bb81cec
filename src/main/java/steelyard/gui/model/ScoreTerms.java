package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import steelyard.rescore.LogLinear;
import steelyard.rescore.ScoredUtterance;

/**
 * The score terms of a log-linear total as the window names and explains them: the feature columns, then
 * the model's ln P, the OOV count and the token count, in {@link LogLinear}'s order.
 */
public final class ScoreTerms {
  private ScoreTerms() {}

  /** Column titles of the terms for features {@code featureNames}. */
  public static List<String> names(List<String> featureNames) {
    List<String> out = new ArrayList<>(featureNames);
    out.add("model ln P");
    out.add("OOV");
    out.add("length");
    return out;
  }

  /** One sentence per term: what it is and how it is weighted. */
  public static List<String> tooltips(List<String> featureNames) {
    List<String> out = new ArrayList<>();
    for (String f : featureNames) {
      out.add("The recogniser's score column '" + f + "' as a natural log (higher is better), times its feature weight.");
    }
    out.add("The domain model's natural-log probability of the whole transcript with sentence markers, times λ.");
    out.add("The number of tokens the model does not know, times the OOV weight ω.");
    out.add("The number of tokens in the scoring unit, times μ (a positive μ favours longer transcripts).");
    return out;
  }

  /** The unweighted value of term {@code t} of hypothesis {@code i} (natural log, or a count). */
  public static double raw(ScoredUtterance s, int i, int t) {
    int f = s.featureCount();
    if (t < f) return s.feature(i, t);
    switch (t - f) {
      case LogLinear.LM_TERM: return s.lmLogProb(i);
      case LogLinear.OOV_TERM: return s.oovCount(i);
      case LogLinear.LENGTH_TERM: return s.tokenCount(i);
      default: throw new IndexOutOfBoundsException("term " + t);
    }
  }
}
