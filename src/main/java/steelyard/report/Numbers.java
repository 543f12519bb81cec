package steelyard.report;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Locale;
import steelyard.io.JsonOutput;

/**
 * Fixed-digit number formatting for every report, independent of the platform locale ({@link Locale#ROOT}), so
 * the same values always print the same bytes. Rounding is half-even throughout.
 */
public final class Numbers {
  /** What a text report prints for an undefined value (NaN). */
  public static final String UNDEFINED = "n/a";

  private Numbers() {}

  /** {@code v} with exactly {@code digits} decimals; {@value #UNDEFINED} for NaN, {@code inf}/{@code -inf} for infinities. */
  public static String fixed(double v, int digits) {
    if (Double.isNaN(v)) return UNDEFINED;
    if (Double.isInfinite(v)) return v > 0 ? "inf" : "-inf";
    return round(v, digits).toPlainString();
  }

  /** A rate (a fraction, 0.25) as a percentage with {@code digits} decimals and a % sign: {@code 25.00%}. */
  public static String percent(double rate, int digits) {
    String s = fixed(rate * 100.0, digits);
    return Double.isFinite(rate) ? s + "%" : s;
  }

  /** A difference of rates in percentage points with an explicit sign: {@code +1.25} or {@code -0.50}. */
  public static String signedPoints(double rateDifference, int digits) {
    String s = fixed(rateDifference * 100.0, digits);
    return Double.isFinite(rateDifference) && !s.startsWith("-") ? "+" + s : s;
  }

  /** An integer with no grouping: {@code 1234}. */
  public static String integer(long v) {
    return Long.toString(v);
  }

  /** {@code v} rounded to {@code digits} decimals for JSON (written plain, never in exponent form); null when not finite. */
  public static BigDecimal decimal(double v, int digits) {
    return JsonOutput.fixed(v, digits);
  }

  /** {@code v} to {@code significant} significant digits for JSON (plain form, e.g. a small p-value); null when not finite. */
  public static BigDecimal significant(double v, int significant) {
    return JsonOutput.significant(v, significant);
  }

  /** A p-value for text: four decimals, or {@code < 0.0001} below that. */
  public static String pValue(double p) {
    if (Double.isFinite(p) && p < 0.0001) return "< 0.0001";
    return "= " + fixed(p, 4);
  }

  private static BigDecimal round(double v, int digits) {
    BigDecimal d = new BigDecimal(v).setScale(digits, RoundingMode.HALF_EVEN);
    // -0.000 prints as 0.000.
    return d.signum() == 0 ? BigDecimal.ZERO.setScale(digits) : d;
  }
}
