package steelyard.report;

import java.io.IOException;
import java.io.Writer;
import steelyard.io.CsvWriter;
import steelyard.tune.ErrorSurface;

/**
 * The error surface of a tuning run as CSV ({@code tune --surface}), one row per grid point for plotting: the two
 * weights under their own names ({@link steelyard.tune.WeightNames}, e.g. {@code length_weight,lm_weight}), the
 * dev errors there and the error rate (errors / reference tokens). Rows go row weight by row weight, each along the
 * column weight, both ascending as the grid lists them. Numbers as {@link CsvWriter#number}.
 */
public final class SurfaceCsv {
  private SurfaceCsv() {}

  public static void write(Writer out, ErrorSurface s) throws IOException {
    CsvWriter csv = CsvWriter.plain(out);
    csv.row(s.rowWeight(), s.columnWeight(), "errors", "error_rate");
    for (int r = 0; r < s.rows().length; r++) {
      for (int c = 0; c < s.columns().length; c++)
        csv.row(CsvWriter.number(s.rows()[r]), CsvWriter.number(s.columns()[c]), Long.toString(s.errors()[r][c]), CsvWriter.number(s.rate(r, c)));
    }
    csv.flush();
  }
}
