package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.rescore.Fixtures.row;
import static steelyard.rescore.Fixtures.utterance;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** {@link Posteriors#weighByConfidence}: mass ∝ posterior × exp(confidence), renormalised. */
class ConfidenceVoteTest {
  /** One feature per row, read as the natural-log confidence. */
  private static ScoredUtterance scores(Object[]... rows) {
    return new HypothesisScorer(null, Fixtures.WHITESPACE, Fixtures.WHITESPACE, 1, 0).score(utterance("u", rows));
  }

  @Test
  void threeEqualSystemsAreWeighedByTheirConfidences() {
    // Hand-worked: posteriors 1/3 each; confidences 0.2, 0.5, 0.3 (as natural logs) →
    // (1/3·0.2, 1/3·0.5, 1/3·0.3) / (1/3) = (0.2, 0.5, 0.3).
    ScoredUtterance s = scores(row("a", 1, "x", Math.log(0.2)), row("b", 1, "y", Math.log(0.5)), row("c", 1, "z", Math.log(0.3)));
    double[] third = {1.0 / 3, 1.0 / 3, 1.0 / 3};
    double[] p = Posteriors.weighByConfidence(s, third, 0, new double[3]);
    assertThat(p).containsExactly(new double[] {0.2, 0.5, 0.3}, within(1e-12));
  }

  @Test
  void equalConfidencesLeaveThePosteriorsUnchanged() {
    // exp(c) is a common factor, which renormalising removes (invariant).
    ScoredUtterance s = scores(row("a", 1, "x", -4.0), row("b", 1, "y", -4.0), row("c", 1, "z", -4.0));
    double[] post = {0.5, 0.3, 0.2};
    assertThat(Posteriors.weighByConfidence(s, post, 0, new double[3])).containsExactly(post, within(1e-12));
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @ValueSource(doubles = {1e6, -1e6, 1e300})
  void hugeConfidencesStayFiniteAndSumToOne(double big) {
    ScoredUtterance s = scores(row("a", 1, "x", big), row("b", 1, "y", big - 1), row("c", 1, "z", -big));
    double[] p = Posteriors.weighByConfidence(s, new double[] {0.25, 0.25, 0.5}, 0, new double[3]);
    assertThat(p).doesNotContain(Double.NaN);
    // 1e-9: a double near 1e6 carries about 1e-10 absolute precision
    assertThat(p[0] + p[1] + p[2]).isCloseTo(1.0, within(1e-9));
    // equal posteriors, confidences c and c−1: ratio e (property of exp), while the third is negligible;
    // at 1e300 c and c−1 are the same double, so a and b tie exactly
    if (big > 0 && big < 1e15) assertThat(p[0] / p[1]).isCloseTo(Math.E, within(1e-6));
    if (big >= 1e15) assertThat(p).containsExactly(new double[] {0.5, 0.5, 0.0}, within(1e-12));
  }

  @Test
  void zeroPosteriorStaysZero() {
    ScoredUtterance s = scores(row("a", 1, "x", 5.0), row("b", 1, "y", 0.0));
    assertThat(Posteriors.weighByConfidence(s, new double[] {0.0, 1.0}, 0, new double[2])).containsExactly(0.0, 1.0);
  }
}
