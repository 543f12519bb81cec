package steelyard.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringWriter;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class SpreadsheetCsvTest {
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
    assertThat(SpreadsheetCsv.neutralise(cell)).isEqualTo(expected);
  }

  @Test
  void neutralisesTabAndCarriageReturnPrefixes() {
    assertThat(SpreadsheetCsv.neutralise("\tx")).isEqualTo("'\tx");
    assertThat(SpreadsheetCsv.neutralise("\rx")).isEqualTo("'\rx");
  }

  @Test
  void quotesPerRfc4180AndCanBeTurnedOff() throws Exception {
    // Source: RFC 4180 section 2: fields with commas, quotes or line breaks are quoted; quotes are doubled.
    StringWriter safe = new StringWriter();
    SpreadsheetCsv csv = new SpreadsheetCsv(safe, true);
    csv.row("a,b", "say \"hi\"", "=1+1", null);
    csv.flush();
    assertThat(safe.toString()).isEqualTo("\"a,b\",\"say \"\"hi\"\"\",'=1+1,\n");
    StringWriter raw = new StringWriter();
    SpreadsheetCsv off = new SpreadsheetCsv(raw, false);
    off.row("=1+1");
    off.flush();
    assertThat(raw.toString()).isEqualTo("=1+1\n");
  }
}
