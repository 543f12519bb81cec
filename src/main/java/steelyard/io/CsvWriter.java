package steelyard.io;

import com.opencsv.CSVWriter;
import com.opencsv.ICSVWriter;
import java.io.IOException;
import java.io.Writer;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * The one CSV writer of every output: RFC 4180 through opencsv (comma, a field quoted only when it contains a
 * comma, a quote, CR or LF, quotes doubled, LF line ends), with a spreadsheet-safe switch. A field with leading
 * or trailing whitespace is quoted too, so that readers which trim unquoted fields (opencsv's own default) read
 * it back exactly.
 * <ul>
 *   <li>{@link #plain}: data meant for re-import (picks, breakdowns, arc lists): text exactly as given.</li>
 *   <li>{@link #spreadsheetSafe}: tables meant to be opened in a spreadsheet: a cell that starts with {@code =},
 *       {@code +}, {@code -}, {@code @}, a tab or a carriage return gets a leading apostrophe so it is shown as
 *       text and never evaluated as a formula (CSV injection); plain decimal numbers such as {@code -1.25} are
 *       left as they are.</li>
 * </ul>
 * Numbers should go through {@link #number} (fixed, locale-independent) so the same values give the same bytes.
 *
 * <pre>{@code
 * CsvWriter csv = CsvWriter.spreadsheetSafe(out);
 * csv.row("utt_id", "text", "total");
 * csv.row(id, text, CsvWriter.number(total));
 * csv.flush();
 * }</pre>
 *
 * <p>Not thread-safe. The caller owns (and closes) the underlying writer; call {@link #flush()} at the end.
 */
public final class CsvWriter {
  private static final Pattern PLAIN_NUMBER = Pattern.compile("-?\\d+(\\.\\d+)?");
  private static final double SCIENTIFIC_BELOW = 1e-4;
  private static final double SCIENTIFIC_FROM = 1e12;
  private static final long MICROS = 1_000_000;

  private final CSVWriter csv;
  private final boolean spreadsheetSafe;

  public CsvWriter(Writer out, boolean spreadsheetSafe) {
    this.csv = new QuotingWriter(out);
    this.spreadsheetSafe = spreadsheetSafe;
  }

  /** A writer for data meant for re-import: every cell exactly as given. */
  public static CsvWriter plain(Writer out) {
    return new CsvWriter(out, false);
  }

  /** A writer for tables meant for a spreadsheet: formula-like cells neutralised (see the class comment). */
  public static CsvWriter spreadsheetSafe(Writer out) {
    return new CsvWriter(out, true);
  }

  /** Writes one row; null cells are written empty. */
  public void row(String... cells) throws IOException {
    String[] out = new String[cells.length];
    for (int i = 0; i < cells.length; i++) {
      String c = cells[i] == null ? "" : cells[i];
      out[i] = spreadsheetSafe ? neutralise(c) : c;
    }
    csv.writeNext(out, false);
    if (csv.checkError()) throw new IOException("CSV write failed", csv.getException());
  }

  /** Writes one row from a list. */
  public void row(List<String> cells) throws IOException {
    row(cells.toArray(new String[0]));
  }

  public void flush() throws IOException {
    csv.flush();
  }

  /** opencsv's writer, also quoting a field that starts or ends with whitespace. */
  private static final class QuotingWriter extends CSVWriter {
    QuotingWriter(Writer out) {
      super(out, ICSVWriter.DEFAULT_SEPARATOR, ICSVWriter.DEFAULT_QUOTE_CHARACTER, ICSVWriter.DEFAULT_QUOTE_CHARACTER, "\n");
    }

    @Override
    protected boolean stringContainsSpecialCharacters(String field) {
      return super.stringContainsSpecialCharacters(field) || !field.isEmpty()
          && (Character.isWhitespace(field.charAt(0)) || Character.isWhitespace(field.charAt(field.length() - 1)));
    }
  }

  /** The cell with a leading apostrophe when it starts with a formula prefix and is not a plain number. */
  public static String neutralise(String cell) {
    if (cell.isEmpty()) return cell;
    char c = cell.charAt(0);
    boolean risky = c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r';
    if (!risky || PLAIN_NUMBER.matcher(cell).matches()) return cell;
    return "'" + cell;
  }

  /**
   * A number with at most six decimals and no trailing zeros ({@code -12.80517}, {@code 3}); magnitudes below
   * 1e-4 or from 1e12 in scientific notation ({@code 1.234568e-07}); NaN as an empty field.
   */
  public static String number(double v) {
    if (Double.isNaN(v)) return "";
    if (v == 0) return "0";
    double a = Math.abs(v);
    if (a < SCIENTIFIC_BELOW || a >= SCIENTIFIC_FROM || Double.isInfinite(v)) return String.format(Locale.ROOT, "%.6e", v);
    long scaled = Math.round(a * MICROS);
    long whole = scaled / MICROS;
    long frac = scaled % MICROS;
    StringBuilder sb = new StringBuilder(24);
    if (v < 0) sb.append('-');
    sb.append(whole);
    if (frac != 0) {
      String f = Long.toString(frac + MICROS).substring(1);
      int end = f.length();
      while (f.charAt(end - 1) == '0') end--;
      sb.append('.').append(f, 0, end);
    }
    return sb.toString();
  }
}
