package steelyard.demo;

import java.util.Locale;

/** RFC 4180 CSV fields and fixed number formatting ({@link Locale#ROOT}) for the generated files. */
final class CsvText {
  private CsvText() {}

  /** The field, quoted when it contains a comma, a quote, a line break or leading/trailing whitespace. */
  static String field(String value) {
    boolean quote = value.indexOf(',') >= 0 || value.indexOf('"') >= 0 || value.indexOf('\n') >= 0
        || value.indexOf('\r') >= 0 || !value.equals(value.strip());
    return quote ? '"' + value.replace("\"", "\"\"") + '"' : value;
  }

  /** Joins fields into one record line terminated by LF. */
  static String row(String... fields) {
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < fields.length; i++) {
      if (i > 0) sb.append(',');
      sb.append(field(fields[i]));
    }
    return sb.append('\n').toString();
  }

  static String fixed(double value, int decimals) {
    return String.format(Locale.ROOT, "%." + decimals + "f", value);
  }
}
