package steelyard.rescore;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;

/**
 * CSV output for data meant for re-import (RFC 4180): a field is quoted when it contains a comma, a quote,
 * CR or LF, with quotes doubled; text is written exactly as given, with no spreadsheet neutralisation. Numbers
 * use a fixed, locale-independent format so the same values always give the same bytes.
 */
public final class Csv {
  private Csv() {}

  public static void field(Writer out, String s) throws IOException {
    boolean quote = false;
    for (int i = 0; i < s.length() && !quote; i++) {
      char c = s.charAt(i);
      quote = c == ',' || c == '"' || c == '\n' || c == '\r';
    }
    if (!quote) {
      out.write(s);
      return;
    }
    out.write('"');
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c == '"') out.write('"');
      out.write(c);
    }
    out.write('"');
  }

  /** Writes the fields separated by commas and ends the row with LF. */
  public static void row(Writer out, String... fields) throws IOException {
    for (int i = 0; i < fields.length; i++) {
      if (i > 0) out.write(',');
      field(out, fields[i]);
    }
    out.write('\n');
  }

  /**
   * A number with at most six decimals and no trailing zeros ({@code -12.80517}, {@code 3}); values below
   * 1e-4 or from 1e12 in magnitude in scientific notation ({@code 1.234568e-07}); NaN as an empty field.
   */
  public static String number(double v) {
    if (Double.isNaN(v)) return "";
    if (v == 0) return "0";
    double a = Math.abs(v);
    if (a < 1e-4 || a >= 1e12 || Double.isInfinite(v)) return String.format(Locale.ROOT, "%.6e", v);
    long scaled = Math.round(a * 1e6);
    long whole = scaled / 1_000_000;
    long frac = scaled % 1_000_000;
    StringBuilder sb = new StringBuilder(24);
    if (v < 0) sb.append('-');
    sb.append(whole);
    if (frac != 0) {
      String f = Long.toString(frac + 1_000_000).substring(1);
      int end = f.length();
      while (f.charAt(end - 1) == '0') end--;
      sb.append('.').append(f, 0, end);
    }
    return sb.toString();
  }
}
