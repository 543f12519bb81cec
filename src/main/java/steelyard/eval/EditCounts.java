package steelyard.eval;

/**
 * Counts of one alignment, or a sum of many.
 *
 * @param correct       reference tokens matched exactly (C)
 * @param substitutions S
 * @param deletions     reference tokens with no hypothesis token (D)
 * @param insertions    hypothesis tokens with no reference token (I)
 */
public record EditCounts(long correct, long substitutions, long deletions, long insertions) {
  public static final EditCounts ZERO = new EditCounts(0, 0, 0, 0);

  /** S + D + I. */
  public long errors() {
    return substitutions + deletions + insertions;
  }

  /** N = C + S + D, the number of reference tokens. */
  public long referenceTokens() {
    return correct + substitutions + deletions;
  }

  /** (S + D + I) / N, or NaN when N = 0 (the caller reports a null rate with a warning). */
  public double errorRate() {
    long n = referenceTokens();
    return n == 0 ? Double.NaN : (double) errors() / n;
  }

  public EditCounts plus(EditCounts o) {
    return new EditCounts(correct + o.correct, substitutions + o.substitutions, deletions + o.deletions, insertions + o.insertions);
  }
}
