package steelyard.demo;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.Locale;
import steelyard.io.CsvWriter;

/** CSV records and fixed number formatting ({@link Locale#ROOT}) for the generated files. */
final class CsvText {
  private CsvText() {}

  /** Fields as one CSV record line terminated by LF, through the project's CSV writer (plain data, RFC 4180). */
  static String row(String... fields) {
    StringWriter w = new StringWriter();
    try {
      CsvWriter csv = CsvWriter.plain(w);
      csv.row(fields);
      csv.flush();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return w.toString();
  }

  static String fixed(double value, int decimals) {
    return String.format(Locale.ROOT, "%." + decimals + "f", value);
  }
}
