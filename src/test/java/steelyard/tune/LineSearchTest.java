package steelyard.tune;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.rescore.LogLinear;
import steelyard.rescore.ScoredUtterance;

/**
 * Exact line search (Och 2003, "Minimum error rate training in statistical machine translation", §5) against a
 * hand-worked example and against brute force on a fine grid.
 */
class LineSearchTest {
  static final List<String> FEATURES = List.of("acoustic", "lmf");

  /**
   * Worked by hand. Weights acoustic = 1, lmf = x; a hypothesis's total is acoustic + x·lmf, a line in x.
   *
   * <pre>
   * A, reference "a b c":  rank 1 "a b d" (1 error)  −10 − 6x
   *                        rank 2 "a x d" (2 errors) −11 − 4x
   *                        rank 3 "a b c" (0 errors) −12 − 3x
   *   "a b d" = "a x d" at x = 1/2, "a x d" = "a b c" at x = 1 ("a b d" = "a b c" at 2/3 lies below the envelope):
   *   x &lt; 1/2 → "a b d" (1), 1/2 &lt; x &lt; 1 → "a x d" (2), x &gt; 1 → "a b c" (0).
   * B, reference "p q":    rank 1 "p"   (1 error)    −4 − 2x
   *                        rank 2 "p q" (0 errors)   −5 − 5x
   *   equal at x = −1/3: x &lt; −1/3 → "p q" (0), x &gt; −1/3 → "p" (1).
   * Corpus (5 reference words): (−∞, −1/3) 1 error, (−1/3, 1/2) 2, (1/2, 1) 3, (1, ∞) 1.
   * Against rank 1 (1 + 1 errors): helped 1, 0, 0, 1; hurt 0, 0, 1, 0; changed 1, 0, 1, 1.
   * </pre>
   */
  static TuneInput handWorked() {
    return TuneInput.of(List.of(
        DevSets.utterance("A", "a b c", new String[] {"a b d", "a x d", "a b c"},
            new double[][] {{-10, -6}, {-11, -4}, {-12, -3}}, null),
        DevSets.utterance("B", "p q", new String[] {"p", "p q"}, new double[][] {{-4, -2}, {-5, -5}}, null)),
        FEATURES, null, DevSets.weights(FEATURES, 1, 0));
  }

  @Nested
  class HandWorkedExample {
    @Test
    void sweepHasTheBreakpointsErrorsAndCountsWorkedOutByHand() {
      TuneInput in = handWorked();
      Sweep s = WeightSweep.of(in, 1).nbest(in.start(), "lmf", -10, 10);
      assertThat(s.breakpoints()).containsExactly(new double[] {-1.0 / 3, 0.5, 1}, within(1e-12));
      assertThat(s.errors()).containsExactly(1, 2, 3, 1);
      assertThat(s.helped()).containsExactly(1, 0, 0, 1);
      assertThat(s.hurt()).containsExactly(0, 0, 1, 0);
      assertThat(s.changed()).containsExactly(1, 0, 1, 1);
      assertThat(s.referenceTokens()).isEqualTo(5);
      assertThat(s.firstErrors()).isEqualTo(2);
    }

    @Test
    void unboundedSearchTakesTheTiedBestIntervalNearestTheCurrentWeightsAndStepsPastItsEnd() {
      StepFunction.Choice c = search(handWorked(), Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY).best();
      // (−∞, −1/3) and (1, ∞) both give 1 error; −1/3 is nearer to 0; the point is −1/3 − max(1, 1/3) = −4/3
      assertThat(c.errors()).isEqualTo(1);
      assertThat(c.high()).isCloseTo(-1.0 / 3, within(1e-12));
      assertThat(c.x()).isCloseTo(-4.0 / 3, within(1e-12));
    }

    @Test
    void nonNegativeRangeTakesTheIntervalBeyondTheLastBreakpoint() {
      StepFunction f = search(handWorked(), 0, Double.POSITIVE_INFINITY);
      assertThat(f.errors).containsExactly(2, 3, 1);
      StepFunction.Choice c = f.best();
      assertThat(c.low()).isCloseTo(1, within(1e-12));
      assertThat(c.x()).isCloseTo(2, within(1e-12)); // 1 + max(1, 1)
    }

    @Test
    void boundedBestIntervalIsLeftAtItsMiddle() {
      StepFunction.Choice c = search(handWorked(), -1, 0.75).best();
      assertThat(c.errors()).isEqualTo(1);
      assertThat(c.x()).isCloseTo((-1 - 1.0 / 3) / 2, within(1e-12));
    }

    private StepFunction search(TuneInput in, double lo, double hi) {
      CandidateTable t = NbestTuning.table(in, Workers.single());
      double[] w = {1, 0, 0, 0, 0};
      double[] d = {0, 1, 0, 0, 0};
      return LineSearch.run(t, w, d, lo, hi, t.all(), false, Workers.single());
    }
  }

  @Nested
  class AgainstBruteForce {
    static final int GRID = 20_000;
    static final double LO = -4;
    static final double HI = 4;

    @ParameterizedTest(name = "seed {0}")
    @ValueSource(longs = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20})
    void stepFunctionEqualsBruteForceAtEveryGridPointAndFindsTheGridOptimum(long seed) {
      SplittableRandom rnd = new SplittableRandom(seed);
      List<DevUtterance> dev = DevSets.random(rnd, 25, 8, 3);
      TuneInput in = TuneInput.of(dev, List.of("f0", "f1", "f2"), null, DevSets.weights(List.of("f0", "f1", "f2"), 1, 1, 1));
      CandidateTable t = NbestTuning.table(in, Workers.single());
      double[] w = new double[6];
      double[] d = new double[6];
      for (int c : new int[] {0, 1, 2, 5}) {
        w[c] = LinearTuner.gaussian(rnd);
        d[c] = LinearTuner.gaussian(rnd);
      }
      StepFunction f = LineSearch.run(t, w, d, LO, HI, t.all(), false, Workers.single());
      StepFunction whole = LineSearch.run(t, w, d, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, t.all(), false, Workers.single());
      StepFunction right = LineSearch.run(t, w, d, 0, Double.POSITIVE_INFINITY, t.all(), false, Workers.single());
      StepFunction.Choice best = f.best();
      double step = (HI - LO) / GRID;
      long gridMin = Long.MAX_VALUE;
      boolean optimumInBest = false;
      long[] brute = new long[GRID];
      int[][] hypErrors = levenshteinPerHypothesis(dev);
      for (int i = 0; i < GRID; i++) {
        double x = LO + (i + 0.5) * step;
        brute[i] = bruteForceErrors(dev, hypErrors, w, d, x);
        if (!nearBreak(f, x)) assertThat(f.errors[f.intervalAt(x)]).as("seed %d, x = %s", seed, x).isEqualTo(brute[i]);
        if (!nearBreak(whole, x)) assertThat(whole.errors[whole.intervalAt(x)]).as("unbounded, x = %s", x).isEqualTo(brute[i]);
        if (x > 0 && !nearBreak(right, x)) assertThat(right.errors[right.intervalAt(x)]).as("x ≥ 0, x = %s", x).isEqualTo(brute[i]);
        gridMin = Math.min(gridMin, brute[i]);
      }
      for (int i = 0; i < GRID; i++) {
        double x = LO + (i + 0.5) * step;
        if (brute[i] == gridMin && best.low() < x && x < best.high()) optimumInBest = true;
      }
      assertThat(best.errors()).as("seed %d", seed).isLessThanOrEqualTo(gridMin);
      if (best.high() - best.low() > 2 * step) {
        assertThat(best.errors()).as("seed %d: best interval wide enough for the grid", seed).isEqualTo(gridMin);
        assertThat(optimumInBest).as("seed %d: a grid optimum inside the reported interval", seed).isTrue();
      }
    }

    private boolean nearBreak(StepFunction f, double x) {
      for (double b : f.breaks) if (Math.abs(b - x) < 1e-9) return true;
      return false;
    }
  }

  @Test
  void stepFunctionIsTheSameForAnyThreadCount() {
    SplittableRandom rnd = new SplittableRandom(99);
    TuneInput in = TuneInput.of(DevSets.random(rnd, 700, 10, 2), List.of("a", "b"), null, DevSets.weights(List.of("a", "b"), 1, 0));
    CandidateTable t = NbestTuning.table(in, Workers.single());
    double[] w = {1, 0, 0, 0, 0};
    double[] d = {0, 1, 0, 0, 0.3};
    StepFunction one = LineSearch.run(t, w, d, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, t.all(), true, Workers.single());
    try (Workers three = new Workers(3, () -> false)) {
      StepFunction many = LineSearch.run(t, w, d, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, t.all(), true, three);
      assertThat(many.breaks).containsExactly(one.breaks);
      assertThat(many.errors).containsExactly(one.errors);
      assertThat(many.changed).containsExactly(one.changed);
    }
  }

  /** Each hypothesis's plain edit distance to its reference. */
  static int[][] levenshteinPerHypothesis(List<DevUtterance> dev) {
    int[][] e = new int[dev.size()][];
    for (int u = 0; u < e.length; u++) {
      ScoredUtterance s = dev.get(u).scores();
      e[u] = new int[s.size()];
      for (int i = 0; i < s.size(); i++) e[u][i] = levenshtein(dev.get(u).reference().tokens(), s.tokens(i).tokens());
    }
    return e;
  }

  /** Corpus errors at w + x·d: the rescorer's own totals and pick, each hypothesis's plain edit distance. */
  static long bruteForceErrors(List<DevUtterance> dev, int[][] hypErrors, double[] w, double[] d, double x) {
    double[] v = new double[w.length];
    for (int c = 0; c < v.length; c++) v[c] = w[c] + x * d[c];
    int f = v.length - 3;
    LogLinear ll = new LogLinear(java.util.Arrays.copyOf(v, f), v[f], v[f + 1], v[f + 2]);
    long e = 0;
    for (int u = 0; u < dev.size(); u++) {
      ScoredUtterance s = dev.get(u).scores();
      e += hypErrors[u][LogLinear.best(s, ll.totals(s, new double[s.size()]))];
    }
    return e;
  }

  /** Textbook Levenshtein distance (Wagner &amp; Fischer 1974), full table. */
  static int levenshtein(List<String> a, List<String> b) {
    int[][] t = new int[a.size() + 1][b.size() + 1];
    for (int i = 0; i <= a.size(); i++) t[i][0] = i;
    for (int j = 0; j <= b.size(); j++) t[0][j] = j;
    for (int i = 1; i <= a.size(); i++)
      for (int j = 1; j <= b.size(); j++)
        t[i][j] = Math.min(Math.min(t[i - 1][j] + 1, t[i][j - 1] + 1), t[i - 1][j - 1] + (a.get(i - 1).equals(b.get(j - 1)) ? 0 : 1));
    return t[a.size()][b.size()];
  }
}
