package steelyard.report.html;

import java.util.Locale;
import steelyard.report.Numbers;
import steelyard.report.html.ReportModel.Flip;
import steelyard.report.html.ReportModel.Rate;

/**
 * Number and text formatting for the HTML templates: locale-independent ({@link Numbers}), so the same model
 * always gives the same page. Returns plain text; the templates escape it.
 */
public final class Fmt {
  /** Shown where a value is not known. */
  public static final String UNKNOWN = "n/a";
  private static final String MINUS = "\u2212";

  private Fmt() {}

  /** A fraction as a percentage with two decimals: {@code 0.14889 → "14.89 %"}. */
  public static String percent(double fraction) {
    return Double.isFinite(fraction) ? Numbers.fixed(fraction * 100, 2) + " %" : UNKNOWN;
  }

  /** The 95 % interval of a rate: {@code "12.89 – 16.84 %"}, or empty when there is none. */
  public static String interval(Rate r) {
    if (r == null || !r.hasInterval()) return "";
    return Numbers.fixed(r.low() * 100, 2) + " \u2013 " + Numbers.fixed(r.high() * 100, 2) + " %";
  }

  /** Change from {@code before} to {@code after} in percentage points and relative: {@code "−8.93 points (−37.5 %)"}. */
  public static String change(Rate before, Rate after) {
    double d = after.value() - before.value();
    if (!Double.isFinite(d)) return UNKNOWN;
    String points = signed(d * 100, 2) + " points";
    if (!(before.value() > 0)) return points;
    return points + " (" + signed(d / before.value() * 100, 1) + " %)";
  }

  /** A number with a sign always shown and a true minus sign: {@code "+2.31"}, {@code "−0.50"}. */
  public static String signed(double v, int digits) {
    if (!Double.isFinite(v)) return UNKNOWN;
    String s = Numbers.fixed(v, digits);
    if (s.startsWith("-")) return MINUS + s.substring(1);
    return (isZero(s) ? "\u00b1" : "+") + s;
  }

  /** A weight or score with up to four decimals and no trailing zeros: {@code 16}, {@code 0.05}, {@code −2.5}. */
  public static String number(double v) {
    if (Double.isNaN(v)) return UNKNOWN;
    if (Double.isInfinite(v)) return v > 0 ? "\u221e" : MINUS + "\u221e";
    String s = Numbers.fixed(v, 4);
    if (s.contains(".")) s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
    if (s.equals("-0")) s = "0";
    return s.startsWith("-") ? MINUS + s.substring(1) : s;
  }

  /** A p-value: four decimals, or {@code "< 0.0001"} below that. */
  public static String pValue(double p) {
    if (Double.isNaN(p)) return UNKNOWN;
    return p < 0.0001 ? "< 0.0001" : Numbers.fixed(p, 4);
  }

  /** An integer count, grouped by thin spaces when long: {@code 12 345}. */
  public static String count(long n) {
    String s = String.format(Locale.ROOT, "%,d", n).replace(',', '\u2009');
    return s.startsWith("-") ? MINUS + s.substring(1) : s;
  }

  /** Where the pick holds along the LM weight, e.g. {@code "λ from 7.25 to 31"} or {@code "λ ≥ 7.25"}. */
  public static String flip(Flip f) {
    if (f == null) return UNKNOWN;
    boolean hasFrom = Double.isFinite(f.from());
    boolean hasTo = Double.isFinite(f.to());
    String w = f.weightName();
    if (hasFrom && hasTo) return w + " from " + number(f.from()) + " to " + number(f.to());
    if (hasFrom) return w + " \u2265 " + number(f.from());
    if (hasTo) return w + " < " + number(f.to());
    return "every " + w;
  }

  /** How a flip was computed. */
  public static String flipBasis(Flip f) {
    return f == null ? "" : f.exact() ? "exact" : "on the search-path pool";
  }

  /** A character token made visible: a space shows as {@code ␣}, other tokens unchanged. */
  public static String visible(String token, boolean characters) {
    if (token == null) return "";
    return characters && token.isBlank() ? "\u2423" : token;
  }

  private static boolean isZero(String s) {
    return s.replaceAll("[0.]", "").isEmpty();
  }
}
