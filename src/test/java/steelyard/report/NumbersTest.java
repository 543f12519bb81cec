package steelyard.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import steelyard.io.JsonOutput;
import org.junit.jupiter.api.Test;

class NumbersTest {
  @Test
  void formatsWithFixedDigitsWhateverTheDefaultLocale() {
    Locale before = Locale.getDefault();
    try {
      Locale.setDefault(Locale.GERMANY);
      assertThat(Numbers.fixed(0.6052631, 4)).isEqualTo("0.6053");
      assertThat(Numbers.percent(0.605263, 2)).isEqualTo("60.53%");
      assertThat(Numbers.fixed(2.0, 3)).isEqualTo("2.000");
    } finally {
      Locale.setDefault(before);
    }
  }

  @Test
  void undefinedAndNegativeZeroPrintPredictably() {
    assertThat(Numbers.fixed(Double.NaN, 2)).isEqualTo(Numbers.UNDEFINED);
    assertThat(Numbers.percent(Double.NaN, 2)).isEqualTo(Numbers.UNDEFINED);
    assertThat(Numbers.fixed(-0.0001, 2)).isEqualTo("0.00");
    assertThat(Numbers.decimal(Double.POSITIVE_INFINITY, 3)).isNull();
  }

  @Test
  void signedPointsShowTheSign() {
    assertThat(Numbers.signedPoints(-0.0123, 2)).isEqualTo("-1.23");
    assertThat(Numbers.signedPoints(0.0123, 2)).isEqualTo("+1.23");
  }

  @Test
  void smallPValuesKeepTheirSignificantDigits() {
    assertThat(Numbers.significant(2.0 / 1024 / 1024 / 1024, 4).toPlainString()).isEqualTo("0.000000001863");
    assertThat(Numbers.significant(1.0, 10).toPlainString()).isEqualTo("1");
    assertThat(Numbers.pValue(1e-9)).isEqualTo("< 0.0001");
    assertThat(Numbers.pValue(0.021484375)).isEqualTo("= 0.0215");
  }

  @Test
  void jsonDecimalsAreNeverInExponentForm() {
    assertThat(JsonOutput.render(JsonOutput.object().put("x", Numbers.decimal(1e-9, 6)))).contains("\"x\" : 0.000000");
  }
}
