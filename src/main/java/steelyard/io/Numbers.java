package steelyard.io;

/**
 * Strict number syntax for score and rank columns. Decimal only: an optional sign, digits with an optional
 * fraction, an optional exponent ({@code -12.5}, {@code 3e-4}, {@code .5}); surrounding spaces allowed.
 * Java-only forms that {@link Double#parseDouble} would accept ({@code NaN}, {@code Infinity}, hex floats,
 * a trailing {@code d} or {@code f}) are rejected, so a file means the same thing to every reader.
 */
final class Numbers {
  private Numbers() {}

  /** The value, or NaN when {@code s} is not a decimal number; the result may be infinite on overflow. */
  static double parseDecimal(String s) {
    String t = s.strip();
    if (!isDecimal(t)) return Double.NaN;
    return Double.parseDouble(t);
  }

  /** Returned by {@link #parseInt} for anything but a whole number in int range. */
  static final long NOT_AN_INT = Long.MIN_VALUE;

  /** A whole number in int range (as a long, to avoid boxing), or {@link #NOT_AN_INT}. */
  static long parseInt(String s) {
    String t = s.strip();
    if (t.isEmpty() || t.length() > 11) return NOT_AN_INT;
    int i = (t.charAt(0) == '+' || t.charAt(0) == '-') ? 1 : 0;
    if (i == t.length()) return NOT_AN_INT;
    for (int k = i; k < t.length(); k++) if (t.charAt(k) < '0' || t.charAt(k) > '9') return NOT_AN_INT;
    long v = Long.parseLong(t);
    return v < Integer.MIN_VALUE || v > Integer.MAX_VALUE ? NOT_AN_INT : v;
  }

  private static boolean isDecimal(String t) {
    int n = t.length();
    int i = 0;
    if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) i++;
    int digits = 0;
    while (i < n && isDigit(t.charAt(i))) {
      i++;
      digits++;
    }
    if (i < n && t.charAt(i) == '.') {
      i++;
      while (i < n && isDigit(t.charAt(i))) {
        i++;
        digits++;
      }
    }
    if (digits == 0) return false;
    if (i < n && (t.charAt(i) == 'e' || t.charAt(i) == 'E')) {
      i++;
      if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) i++;
      int exp = 0;
      while (i < n && isDigit(t.charAt(i))) {
        i++;
        exp++;
      }
      if (exp == 0) return false;
    }
    return i == n;
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }
}
