package steelyard.tune;

/**
 * The closed range a tuned weight may take; an infinite end means unbounded on that side.
 *
 * @param low  smallest allowed value (may be −∞)
 * @param high largest allowed value (may be +∞)
 */
public record WeightRange(double low, double high) {
  public static final WeightRange ANY = new WeightRange(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
  public static final WeightRange NON_NEGATIVE = new WeightRange(0, Double.POSITIVE_INFINITY);

  public WeightRange {
    if (Double.isNaN(low) || Double.isNaN(high) || low > high)
      throw new IllegalArgumentException("not a range: " + low + " .. " + high);
  }

  public boolean contains(double x) {
    return low <= x && x <= high;
  }

  public double clip(double x) {
    return Math.min(high, Math.max(low, x));
  }
}
