package steelyard.lm.arpa;

/**
 * Allocation-free helpers for the ARPA text format: whitespace splitting by hand and a decimal fast path for
 * the log10 numbers, because a regular-expression split and {@link Double#parseDouble} dominate the loading
 * time of million-line files.
 */
final class ArpaText {
  private static final double[] POW10 = new double[23];

  static {
    double p = 1;
    for (int i = 0; i < POW10.length; i++) {
      POW10[i] = p;
      p *= 10;
    }
  }

  private ArpaText() {}

  /** Whitespace for ARPA purposes: space, tab and other control characters. */
  static boolean isSpace(char c) {
    return c <= ' ';
  }

  /**
   * Splits {@code line} on runs of whitespace into {@code starts}/{@code ends} (char offsets) and returns the
   * number of fields, or {@code starts.length + 1} when there are more fields than room.
   */
  static int split(String line, int[] starts, int[] ends) {
    int n = 0;
    int len = line.length();
    int i = 0;
    while (true) {
      while (i < len && isSpace(line.charAt(i))) i++;
      if (i >= len) return n;
      if (n == starts.length) return n + 1;
      starts[n] = i;
      while (i < len && !isSpace(line.charAt(i))) i++;
      ends[n++] = i;
    }
  }

  /**
   * Parses a finite decimal number in {@code s[from, to)}; returns NaN when the text is not one. Plain
   * decimals of up to 18 digits with a power of ten up to 22 are converted with one correctly rounded
   * multiplication or division of exact doubles (Clinger's fast path); everything else goes through
   * {@link Double#parseDouble} after the characters were checked.
   */
  static double parseNumber(String s, int from, int to) {
    int i = from;
    boolean negative = false;
    if (i < to && (s.charAt(i) == '-' || s.charAt(i) == '+')) negative = s.charAt(i++) == '-';
    long mantissa = 0;
    int digits = 0;
    int fraction = 0;
    boolean point = false;
    int start = i;
    for (; i < to; i++) {
      char c = s.charAt(i);
      if (c >= '0' && c <= '9') {
        if (mantissa == 0 && c == '0') {
          if (point) fraction++;
          continue;
        }
        if (++digits > 18) return slowParse(s, from, to);
        mantissa = mantissa * 10 + (c - '0');
        if (point) fraction++;
      } else if (c == '.' && !point) {
        point = true;
      } else {
        break;
      }
    }
    int exponent = 0;
    if (i == start || (point && i == start + 1)) return Double.NaN;
    if (i < to) {
      char c = s.charAt(i);
      if (c != 'e' && c != 'E') return Double.NaN;
      i++;
      boolean expNegative = false;
      if (i < to && (s.charAt(i) == '-' || s.charAt(i) == '+')) expNegative = s.charAt(i++) == '-';
      if (i == to) return Double.NaN;
      for (; i < to; i++) {
        char d = s.charAt(i);
        if (d < '0' || d > '9') return Double.NaN;
        if (exponent < 10000) exponent = exponent * 10 + (d - '0');
      }
      if (expNegative) exponent = -exponent;
    }
    int power = exponent - fraction;
    double value;
    if (mantissa == 0) {
      value = 0;
    } else if (power >= 0 && power < POW10.length && mantissa < (1L << 53)) {
      value = mantissa * POW10[power];
    } else if (power < 0 && -power < POW10.length && mantissa < (1L << 53)) {
      value = mantissa / POW10[-power];
    } else {
      return slowParse(s, from, to);
    }
    if (Double.isInfinite(value)) return Double.NaN;
    return negative ? -value : value;
  }

  private static double slowParse(String s, int from, int to) {
    for (int i = from; i < to; i++) {
      char c = s.charAt(i);
      if (!(c >= '0' && c <= '9') && c != '.' && c != '-' && c != '+' && c != 'e' && c != 'E') return Double.NaN;
    }
    try {
      double v = Double.parseDouble(s.substring(from, to));
      return Double.isInfinite(v) ? Double.NaN : v;
    } catch (NumberFormatException e) {
      return Double.NaN;
    }
  }

  /**
   * Formats {@code v} with at most 7 significant digits, trailing zeros removed, {@code .} as decimal point;
   * plain notation for magnitudes in [1e-5, 1e7), otherwise {@code d.dddddde±x}. Deterministic.
   */
  static void appendNumber(StringBuilder sb, double v) {
    if (v == 0) {
      sb.append('0');
      return;
    }
    if (v < 0) {
      sb.append('-');
      v = -v;
    }
    int e = (int) Math.floor(Math.log10(v));
    long m = Math.round(scale(v, 6 - e));
    if (m >= 10_000_000L) {
      e++;
      m = Math.round(scale(v, 6 - e));
    } else if (m < 1_000_000L) {
      e--;
      m = Math.round(scale(v, 6 - e));
    }
    char[] d = Long.toString(m).toCharArray(); // 7 digits
    int last = d.length - 1;
    while (last > 0 && d[last] == '0') last--;
    if (e >= -5 && e < 7) {
      if (e < 0) {
        sb.append("0.");
        for (int z = -1; z > e; z--) sb.append('0');
        sb.append(d, 0, last + 1);
      } else {
        for (int i = 0; i <= Math.max(e, last); i++) {
          if (i == e + 1) sb.append('.');
          sb.append(i <= last ? d[i] : '0');
        }
      }
    } else {
      sb.append(d[0]);
      if (last > 0) sb.append('.').append(d, 1, last);
      sb.append('e').append(e);
    }
  }

  private static double scale(double v, int p) {
    if (p >= 0) return p < POW10.length ? v * POW10[p] : v * Math.pow(10, p);
    return -p < POW10.length ? v / POW10[-p] : v / Math.pow(10, -p);
  }
}
