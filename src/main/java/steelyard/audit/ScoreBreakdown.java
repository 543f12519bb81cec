package steelyard.audit;

import java.util.List;

/**
 * The log-linear terms of the pick and of rank 1 side by side (natural-log units, higher is better), as the
 * weighting of the run computed them: every weighted feature term, the weighted LM term λ·ln P, the OOV term
 * ω·OOV and the length term μ·tokens. The terms of each side add up to its total.
 *
 * @param terms      features first (in the order of the selected features), then LM, OOV, length
 * @param pickTotal  the pick's log-linear total
 * @param firstTotal rank 1's log-linear total
 */
public record ScoreBreakdown(List<Term> terms, double pickTotal, double firstTotal) {
  public ScoreBreakdown {
    terms = List.copyOf(terms);
  }

  /** The margin: pick total − rank 1 total (≥ 0 for the N-best method, which picks the highest total). */
  public double margin() {
    return pickTotal - firstTotal;
  }

  /** The term of {@code kind} (the first one for {@link Kind#FEATURE}); null when absent. */
  public Term term(Kind kind) {
    for (Term t : terms) if (t.kind() == kind) return t;
    return null;
  }

  /** What a term weighs. */
  public enum Kind {
    /** A feature column wᵢ·featureᵢ. */
    FEATURE,
    /** λ·ln P_LM of the sentence with {@code <s>}/{@code </s>}. */
    LM,
    /** ω·(out-of-vocabulary tokens in the model's tokenisation). */
    OOV,
    /** μ·(tokens in the scoring unit). */
    LENGTH
  }

  /**
   * One term of both sides.
   *
   * @param name          the feature name for {@link Kind#FEATURE}, else {@code lm}, {@code oov}, {@code length}
   * @param pickValue     the unweighted value of the pick (feature value, ln P, OOV count, token count)
   * @param firstValue    the unweighted value of rank 1
   * @param pickWeighted  the weighted term of the pick
   * @param firstWeighted the weighted term of rank 1
   */
  public record Term(
      Kind kind, String name, double pickValue, double firstValue, double pickWeighted, double firstWeighted) {
    /** Weighted pick − weighted rank 1. */
    public double delta() {
      return pickWeighted - firstWeighted;
    }

    /** {@code feature.NAME} for a feature, else the name ({@code lm}, {@code oov}, {@code length}). */
    public String label() {
      return kind == Kind.FEATURE ? "feature." + name : name;
    }
  }
}
