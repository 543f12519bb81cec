package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringWriter;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/** The one CSV writer: RFC 4180 quoting, the spreadsheet-safe switch, fixed number formatting. */
class CsvWriterTest {
  // Source: OWASP "CSV Injection" guidance (from memory): cells starting with = + - @ tab or CR are
  // interpreted as formulas by spreadsheets; a leading apostrophe makes them text.
  @ParameterizedTest(name = "[{index}] {arguments}")
  @CsvSource(
      delimiter = '|',
      quoteCharacter = '"',
      value = {
        "=SUM(A1:A9)  | '=SUM(A1:A9)",
        "+cmd         | '+cmd",
        "-2+3         | '-2+3",
        "@lookup      | '@lookup",
        "pears        | pears",
        "-1.25        | -1.25",
        "42           | 42",
      })
  void neutralisesFormulaPrefixesButNotPlainNumbers(String cell, String expected) {
    assertThat(CsvWriter.neutralise(cell)).isEqualTo(expected);
  }

  @Test
  void neutralisesTabAndCarriageReturnPrefixes() {
    assertThat(CsvWriter.neutralise("\tx")).isEqualTo("'\tx");
    assertThat(CsvWriter.neutralise("\rx")).isEqualTo("'\rx");
  }

  @Test
  void quotesPerRfc4180AndCanBeTurnedOff() throws Exception {
    // Source: RFC 4180 section 2: fields with commas, quotes or line breaks are quoted; quotes are doubled.
    StringWriter safe = new StringWriter();
    CsvWriter csv = CsvWriter.spreadsheetSafe(safe);
    csv.row("a,b", "say \"hi\"", "=1+1", null);
    csv.flush();
    assertThat(safe.toString()).isEqualTo("\"a,b\",\"say \"\"hi\"\"\",'=1+1,\n");
    StringWriter raw = new StringWriter();
    CsvWriter off = CsvWriter.plain(raw);
    off.row("=1+1");
    off.flush();
    assertThat(raw.toString()).isEqualTo("=1+1\n");
  }

  /** RFC 4180 §2: fields with commas, quotes or line breaks (CR or LF) are quoted, quotes doubled; nothing else. */
  @Test
  void plainDataKeepsEveryCellExactlyAndQuotesOnlyWhatRfc4180Requires() throws Exception {
    StringWriter w = new StringWriter();
    CsvWriter csv = CsvWriter.plain(w);
    csv.row("plain", "a,b", "say \"hi\"", "two\nlines", "cr\rhere", "=SUM(A1)", "");
    csv.flush();
    assertThat(w.toString()).isEqualTo("plain,\"a,b\",\"say \"\"hi\"\"\",\"two\nlines\",\"cr\rhere\",=SUM(A1),\n");
  }

  /** Beyond RFC 4180: surrounding whitespace is quoted so trimming readers keep it. */
  @Test
  void quotesAFieldWithLeadingOrTrailingWhitespace() throws Exception {
    StringWriter w = new StringWriter();
    CsvWriter csv = CsvWriter.plain(w);
    csv.row(" bay four", "bay four ", "bay four");
    csv.flush();
    assertThat(w.toString()).isEqualTo("\" bay four\",\"bay four \",bay four\n");
  }

  /** Worked by hand: six decimals at most, trailing zeros dropped, scientific outside [1e-4, 1e12). */
  @ParameterizedTest(name = "[{index}] {arguments}")
  @CsvSource({
    "-12.805170186, -12.80517",
    "3.0, 3",
    "0.0, 0",
    "-0.5, -0.5",
    "0.0000004, 4.000000e-07",
    "123456789012345.0, 1.234568e+14",
    "0.9999996, 1",
  })
  void formatsNumbersTheSameWayEverywhere(double value, String expected) {
    assertThat(CsvWriter.number(value)).isEqualTo(expected);
  }

  @Test
  void notANumberIsAnEmptyCell() {
    assertThat(CsvWriter.number(Double.NaN)).isEmpty();
  }
}
