package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SignTestTest {

  @Test
  void tenUntiedWithOneWinMatchesHandWorkedBinomial() {
    // Worked by hand from the binomial formula: P(X <= 1) = (C(10,0) + C(10,1)) / 2^10 = 11/1024;
    // two-sided p = 2 * 11/1024 = 22/1024 = 0.021484375.
    assertThat(SignTest.twoSidedP(1, 9)).isCloseTo(22.0 / 1024, within(1e-15));
    assertThat(SignTest.twoSidedP(9, 1)).isCloseTo(22.0 / 1024, within(1e-15));
  }

  @Test
  void evenSplitAndNoUntiedUtterancesGiveOne() {
    // From the definition: an even split makes 2·P(X <= n/2) > 1, clamped to 1; n = 0 carries no evidence.
    assertThat(SignTest.twoSidedP(5, 5)).isEqualTo(1.0);
    assertThat(SignTest.twoSidedP(0, 0)).isEqualTo(1.0);
  }

  @Test
  void allWinsForOneSideIsTwoOverTwoToTheN() {
    // Worked by hand: k = 0 gives p = 2 · C(n,0) / 2^n = 2^(1-n); n = 20: 2^-19.
    assertThat(SignTest.twoSidedP(0, 20)).isCloseTo(Math.pow(2, -19), within(1e-18));
  }

  // Source: the exact binomial tail computed independently here in exact integer arithmetic (BigInteger),
  // p = min(1, 2 · Σ_{i<=k} C(n,i) / 2^n).
  @ParameterizedTest(name = "[{index}] {arguments}")
  @CsvSource({"7,2", "25,8", "100,40", "100,3", "1000,470", "3000,1400", "3000,1"})
  void matchesExactBinomialTail(int n, int k) {
    BigInteger sum = BigInteger.ZERO;
    BigInteger c = BigInteger.ONE;
    for (int i = 0; i <= k; i++) {
      sum = sum.add(c);
      c = c.multiply(BigInteger.valueOf(n - i)).divide(BigInteger.valueOf(i + 1));
    }
    BigDecimal p = new BigDecimal(sum.shiftLeft(1)).divide(new BigDecimal(BigInteger.ONE.shiftLeft(n)), MathContext.DECIMAL128);
    double expected = Math.min(1.0, p.doubleValue());
    double actual = SignTest.twoSidedP(k, n - k);
    assertThat(actual).as("n=%d k=%d", n, k).isCloseTo(expected, within(Math.max(1e-300, expected * 1e-9)));
  }

  @Test
  void staysFiniteAndInRangeForMillionsOfUtterances() {
    // Invariant: a probability; with 1% more wins for one side over 2 million it is small but positive.
    double p = SignTest.twoSidedP(990_000, 1_010_000);
    assertThat(p).isGreaterThan(0.0).isLessThan(1e-10);
    assertThat(SignTest.twoSidedP(1_000_000, 1_000_001)).isCloseTo(1.0, within(1e-3));
  }
}
