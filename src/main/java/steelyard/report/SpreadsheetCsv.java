package steelyard.report;

import com.opencsv.CSVWriter;
import com.opencsv.ICSVWriter;
import java.io.IOException;
import java.io.Writer;
import java.util.regex.Pattern;

/**
 * Writes RFC 4180 CSV (comma, double-quote quoting only where needed, LF line ends) through opencsv, by default
 * safe to open in a spreadsheet: a cell that starts with {@code =}, {@code +}, {@code -}, {@code @}, a tab or a
 * carriage return gets a leading apostrophe so it is shown as text and never evaluated as a formula
 * (CSV injection). Cells that are plain decimal numbers (such as {@code -1.25}) are left as they are.
 *
 * <p>Not thread-safe. The caller owns (and closes) the underlying writer; call {@link #flush()} at the end.
 */
public final class SpreadsheetCsv {
  private static final Pattern PLAIN_NUMBER = Pattern.compile("-?\\d+(\\.\\d+)?");

  private final CSVWriter csv;
  private final boolean spreadsheetSafe;

  public SpreadsheetCsv(Writer out, boolean spreadsheetSafe) {
    this.csv = new CSVWriter(out, ICSVWriter.DEFAULT_SEPARATOR, ICSVWriter.DEFAULT_QUOTE_CHARACTER, ICSVWriter.DEFAULT_QUOTE_CHARACTER, "\n");
    this.spreadsheetSafe = spreadsheetSafe;
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

  public void flush() throws IOException {
    csv.flush();
  }

  /** The cell with a leading apostrophe when it starts with a formula prefix and is not a plain number. */
  public static String neutralise(String cell) {
    if (cell.isEmpty()) return cell;
    char c = cell.charAt(0);
    boolean risky = c == '=' || c == '+' || c == '-' || c == '@' || c == '\t' || c == '\r';
    if (!risky || PLAIN_NUMBER.matcher(cell).matches()) return cell;
    return "'" + cell;
  }
}
