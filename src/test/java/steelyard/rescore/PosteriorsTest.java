package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static steelyard.rescore.Fixtures.row;
import static steelyard.rescore.Fixtures.utterance;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.RepetitionInfo;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Mathematical invariants of the softmax (posteriors are non-negative and sum to 1) and its stability. */
class PosteriorsTest {
  private static ScoredUtterance scores(Object[]... rows) {
    return new HypothesisScorer(null, Fixtures.WHITESPACE, Fixtures.WHITESPACE, 1, 0).score(utterance("u", rows));
  }

  private static double[] posteriors(ScoredUtterance s, double scale, double... systemWeights) {
    double[] totals = new double[s.size()];
    for (int i = 0; i < totals.length; i++) totals[i] = s.feature(i, 0);
    return Posteriors.compute(s, totals, scale, systemWeights, new double[s.size()]);
  }

  @RepeatedTest(value = 40, name = "[{currentRepetition}]")
  void sumToOneAndStayFinite(RepetitionInfo info) {
    long seed = 700 + info.getCurrentRepetition();
    SplittableRandom rnd = new SplittableRandom(seed);
    int n = 1 + rnd.nextInt(50);
    double magnitude = Math.pow(10, rnd.nextInt(8));
    List<Object[]> rows = new ArrayList<>();
    for (int i = 0; i < n; i++) rows.add(row("s" + rnd.nextInt(3), i + 1, "t" + i, (rnd.nextDouble() * 2 - 1) * magnitude));
    ScoredUtterance s = scores(rows.toArray(new Object[0][]));
    double[] w = new double[s.systems().size()];
    for (int k = 0; k < w.length; k++) w[k] = 0.1 + rnd.nextDouble();
    double[] p = posteriors(s, 0.01 + rnd.nextDouble() * 3, w);
    double sum = 0;
    for (double v : p) {
      assertThat(v).as("seed %d", seed).isFinite().isBetween(0.0, 1.0);
      sum += v;
    }
    assertThat(sum).as("seed %d", seed).isCloseTo(1.0, within(1e-9));
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @ValueSource(doubles = {1e6, -1e6, 1e300, -1e300})
  void surviveHugeTotals(double big) {
    ScoredUtterance s = scores(row("", 1, "a", big), row("", 2, "b", big - 1), row("", 3, "c", -big));
    double[] p = posteriors(s, 1.0, 1.0);
    assertThat(p).doesNotContain(Double.NaN);
    assertThat(p[0] + p[1] + p[2]).isCloseTo(1.0, within(1e-12));
    // softmax of (x, x−1, ·): p0/p1 = e (exact property of the softmax), whenever the third is negligible
    if (big > 0 && big < 1e15) assertThat(p[0] / p[1]).isCloseTo(Math.E, within(1e-9));
  }

  @Test
  void mixSystemsByTheirNormalisedWeights() {
    // within each system a softmax; systems weigh 3 : 1 → 0.75 and 0.25 of the mass (definition of the mixture)
    ScoredUtterance s = scores(row("a", 1, "x", -1e6), row("a", 2, "y", -1e6), row("b", 1, "x", 5.0));
    double[] p = posteriors(s, 1.0, 3.0, 1.0);
    assertThat(p).containsExactly(new double[] {0.375, 0.375, 0.25}, within(1e-12));
  }

  @Test
  void logSumExpMatchesTheDirectSumOnSmallValues() {
    double[] x = {-1.0, -2.0, -0.5};
    double direct = Math.log(Math.exp(-1.0) + Math.exp(-2.0) + Math.exp(-0.5));
    assertThat(Posteriors.logSumExp(x, 3)).isCloseTo(direct, within(1e-12));
    assertThat(Posteriors.logSumExp(new double[] {1e6, 1e6}, 2)).isCloseTo(1e6 + Math.log(2), within(1e-6));
  }
}
