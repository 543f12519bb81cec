package steelyard.report.html;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;
import steelyard.report.html.ReportModel.Flip;
import steelyard.report.html.ReportModel.Rate;

/** Formatting of the page's numbers (hand-computed values; half-even rounding as in report.Numbers). */
class FmtTest {
  @ParameterizedTest(name = "[{index}] {0} -> {1}")
  @CsvSource({"0.14889, 14.89 %", "0, 0.00 %", "1, 100.00 %", "NaN, n/a"})
  void percentages(double fraction, String expected) {
    assertThat(Fmt.percent(fraction)).isEqualTo(expected);
  }

  @ParameterizedTest(name = "[{index}] {0} -> {1}")
  @CsvSource({"16, 16", "0.05, 0.05", "-2.5, −2.5", "-0.00001, 0", "12.34567, 12.3457", "Infinity, ∞"})
  void weights(double v, String expected) {
    assertThat(Fmt.number(v)).isEqualTo(expected);
  }

  @Test
  void changeIsInPointsAndRelative() {
    // 23.82 % -> 14.89 %: -8.93 points, -8.93 / 23.82 = -37.49 % relative.
    assertThat(Fmt.change(Rate.of(0.2382), Rate.of(0.1489))).isEqualTo("−8.93 points (−37.5 %)");
    assertThat(Fmt.change(Rate.of(0.1), Rate.of(0.1))).isEqualTo("±0.00 points (±0.0 %)");
    assertThat(Fmt.change(Rate.of(0), Rate.of(0.01))).isEqualTo("+1.00 points");
  }

  @Test
  void intervalsNeedBothEnds() {
    assertThat(Fmt.interval(new Rate(0.15, 0.1289, 0.1684))).isEqualTo("12.89 – 16.84 %");
    assertThat(Fmt.interval(Rate.of(0.15))).isEmpty();
  }

  @Test
  void smallPValuesAreBounded() {
    assertThat(Fmt.pValue(0.00002)).isEqualTo("< 0.0001");
    assertThat(Fmt.pValue(0.0312)).isEqualTo("0.0312");
  }

  @Test
  void flipIntervals() {
    assertThat(Fmt.flip(new Flip("λ", 7.25, 31, true))).isEqualTo("λ from 7.25 to 31");
    assertThat(Fmt.flip(new Flip("λ′", 0.12, Double.POSITIVE_INFINITY, false))).isEqualTo("λ′ ≥ 0.12");
    assertThat(Fmt.flip(new Flip("λ", Double.NaN, 3, true))).isEqualTo("λ < 3");
    assertThat(Fmt.flipBasis(new Flip("λ′", 0, 1, false))).isEqualTo("on the search-path pool");
  }

  @Test
  void countsAreGroupedWithThinSpaces() {
    assertThat(Fmt.count(12345)).isEqualTo("12\u2009345");
    assertThat(Fmt.count(-7)).isEqualTo("−7");
  }
}
