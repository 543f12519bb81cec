package steelyard.rescore;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

class LineEnvelopeTest {

  /** Brute force: the highest line at x, ties to the smaller tie order (the rule of LogLinear.best). */
  private static int argmax(double[] a, double[] b, int[] tie, double x) {
    int best = 0;
    for (int i = 1; i < a.length; i++) {
      double y = a[i] + b[i] * x;
      double yb = a[best] + b[best] * x;
      if (y > yb || (y == yb && tie[i] < tie[best])) best = i;
    }
    return best;
  }

  @Nested
  class WorkedExamples {
    // Hand-worked: y0 = 0, y1 = 1 - x, y2 = -2 + 2x. y1 wins for x < 1/2... check: y1 = y0 at x = 1, y2 = y0 at x = 1,
    // y2 = y1 at x = 1 (all three meet at (1, 0)). So the envelope is y1 on (-inf, 1), y2 on (1, +inf); y0 only
    // touches it at x = 1, where the tie order decides.
    final double[] a = {0, 1, -2};
    final double[] b = {0, -1, 2};
    final int[] tie = {0, 1, 2};

    @Test
    void threeLinesMeetingInOnePointGiveTwoSegments() {
      LineEnvelope e = LineEnvelope.of(a, b, tie);
      assertThat(e.segments()).isEqualTo(2);
      assertThat(e.winner(0)).isEqualTo(1);
      assertThat(e.winner(1)).isEqualTo(2);
      assertThat(e.start(1)).isEqualTo(1.0);
      assertThat(e.start(0)).isEqualTo(Double.NEGATIVE_INFINITY);
      assertThat(e.end(1)).isEqualTo(Double.POSITIVE_INFINITY);
    }

    @Test
    void atTheBreakpointTheSmallestTieOrderWinsEvenOffTheSegments() {
      LineEnvelope e = LineEnvelope.of(a, b, tie);
      assertThat(e.winnerAt(1.0)).isEqualTo(0);
      assertThat(e.winnerAt(0.999)).isEqualTo(1);
      assertThat(e.winnerAt(1.001)).isEqualTo(2);
    }

    @Test
    void parallelLinesKeepTheHigherOne() {
      LineEnvelope e = LineEnvelope.of(new double[] {0, 3, 3}, new double[] {1, 1, 1}, new int[] {0, 2, 1});
      assertThat(e.segments()).isEqualTo(1);
      assertThat(e.winner(0)).isEqualTo(2); // equal lines: tie order 1 beats 2
    }

    @Test
    void oneLineIsOneSegment() {
      LineEnvelope e = LineEnvelope.of(new double[] {-4}, new double[] {0.5}, new int[] {0});
      assertThat(e.segments()).isEqualTo(1);
      assertThat(e.segmentAt(-1e300)).isZero();
      assertThat(e.segmentAt(1e300)).isZero();
    }
  }

  @Test
  void refusesNonFiniteOrMismatchedInput() {
    assertThatThrownBy(() -> LineEnvelope.of(new double[] {Double.NaN}, new double[] {0}, new int[] {0}))
        .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not finite");
    assertThatThrownBy(() -> LineEnvelope.of(new double[] {0, 1}, new double[] {0}, new int[] {0, 1}))
        .isInstanceOf(IllegalArgumentException.class);
  }

  /** Invariant (definition of the upper envelope): inside every segment its winner is the brute-force argmax. */
  @Test
  void matchesBruteForceArgmaxOnRandomLines() {
    long seed = 20261202L;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int round = 0; round < 2000; round++) {
      int n = 1 + rnd.nextInt(30);
      double[] a = new double[n];
      double[] b = new double[n];
      int[] tie = new int[n];
      boolean coarse = round % 2 == 0; // small integers: many ties, parallel and concurrent lines
      for (int i = 0; i < n; i++) {
        a[i] = coarse ? rnd.nextInt(-3, 4) : rnd.nextDouble(-50, 50);
        b[i] = coarse ? rnd.nextInt(-3, 4) : rnd.nextDouble(-5, 5);
        tie[i] = i;
      }
      shuffle(tie, rnd);
      LineEnvelope e = LineEnvelope.of(a, b, tie);
      for (int k = 0; k < e.segments(); k++) {
        double lo = e.start(k), hi = e.end(k);
        assertThat(lo).as("seed %d round %d: segments ascend", seed, round).isLessThan(hi);
        double mid = Double.isInfinite(lo) ? (Double.isInfinite(hi) ? 0 : hi - 1) : (Double.isInfinite(hi) ? lo + 1 : (lo + hi) / 2);
        assertThat(e.winner(k)).as("seed %d round %d segment %d", seed, round, k).isEqualTo(argmax(a, b, tie, mid));
        if (k > 0) assertThat(e.winner(k)).isNotEqualTo(e.winner(k - 1));
      }
      for (int q = 0; q < 20; q++) {
        double x = coarse ? rnd.nextInt(-6, 7) / 2.0 : rnd.nextDouble(-40, 40);
        assertThat(e.winnerAt(x)).isEqualTo(argmax(a, b, tie, x));
        int k = e.segmentAt(x);
        assertThat(e.start(k)).isLessThanOrEqualTo(x);
        assertThat(x).isLessThan(e.end(k));
      }
    }
  }

  private static void shuffle(int[] v, SplittableRandom rnd) {
    for (int i = v.length - 1; i > 0; i--) {
      int j = rnd.nextInt(i + 1);
      int t = v[i];
      v[i] = v[j];
      v[j] = t;
    }
  }
}
