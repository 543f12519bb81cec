package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class BootstrapTest {
  private static final long SEED = 424242L;

  /** Per-utterance errors and lengths drawn with seed {@code seed}: lengths 1..20, about 30 % errors. */
  private static int[][] corpus(long seed, int utterances) {
    SplittableRandom rnd = new SplittableRandom(seed);
    int[] err = new int[utterances];
    int[] len = new int[utterances];
    for (int u = 0; u < utterances; u++) {
      len[u] = 1 + rnd.nextInt(20);
      for (int t = 0; t < len[u]; t++) if (rnd.nextDouble() < 0.3) err[u]++;
      if (rnd.nextInt(10) == 0) err[u]++;
    }
    return new int[][] {err, len};
  }

  private static double rate(int[] err, int[] len) {
    long e = 0;
    long n = 0;
    for (int i = 0; i < err.length; i++) {
      e += err[i];
      n += len[i];
    }
    return (double) e / n;
  }

  @Test
  void intervalContainsPointEstimate() {
    // Property: the percentile interval of a resampled ratio brackets the full-sample ratio (for these sizes).
    for (int trial = 0; trial < 20; trial++) {
      int[][] c = corpus(SEED + trial, 50 + trial * 20);
      Bootstrap.Interval ci = Bootstrap.corpusRate(c[0], c[1], 1000, SEED, 1);
      assertThat(ci.contains(rate(c[0], c[1]))).as("seed %d: %s vs %f", SEED + trial, ci, rate(c[0], c[1])).isTrue();
    }
  }

  @Test
  void sameSeedGivesSameIntervalWhateverTheThreadCount() {
    int[][] c = corpus(SEED, 300);
    Bootstrap.Interval one = Bootstrap.corpusRate(c[0], c[1], 1000, 7, 1);
    assertThat(Bootstrap.corpusRate(c[0], c[1], 1000, 7, 1)).isEqualTo(one);
    assertThat(Bootstrap.corpusRate(c[0], c[1], 1000, 7, 4)).isEqualTo(one);
    assertThat(Bootstrap.corpusRate(c[0], c[1], 1000, 8, 1)).isNotEqualTo(one);
    Bootstrap.Paired p = Bootstrap.paired(c[0], corpus(SEED + 1, 300)[0], c[1], 1000, 7, 1);
    assertThat(Bootstrap.paired(c[0], corpus(SEED + 1, 300)[0], c[1], 1000, 7, 3)).isEqualTo(p);
  }

  @Test
  void intervalNarrowsWithMoreUtterances() {
    // Property (standard error shrinks like 1/sqrt(n)): sixteen copies of a corpus give a much narrower interval.
    int[][] c = corpus(SEED, 100);
    int[] err16 = new int[1600];
    int[] len16 = new int[1600];
    for (int i = 0; i < 1600; i++) {
      err16[i] = c[0][i % 100];
      len16[i] = c[1][i % 100];
    }
    Bootstrap.Interval small = Bootstrap.corpusRate(c[0], c[1], 1000, SEED, 1);
    Bootstrap.Interval large = Bootstrap.corpusRate(err16, len16, 1000, SEED, 1);
    assertThat(large.high() - large.low()).as("seed %d", SEED).isLessThan(0.5 * (small.high() - small.low()));
  }

  @Test
  void identicalUtterancesGiveAPointInterval() {
    // Invariant: every resample of identical utterances has the same ratio, 2/10.
    int[] err = {2, 2, 2, 2};
    int[] len = {10, 10, 10, 10};
    assertThat(Bootstrap.corpusRate(err, len, 200, SEED, 1)).isEqualTo(new Bootstrap.Interval(0.2, 0.2));
  }

  @Test
  void percentileUsesNearestRank() {
    // Worked by hand from the nearest-rank definition: B = 1000 sorted values 1..1000 → r(25) = 25, r(975) = 975.
    double[] v = new double[1000];
    for (int i = 0; i < 1000; i++) v[999 - i] = i + 1;
    assertThat(Bootstrap.percentile(v)).isEqualTo(new Bootstrap.Interval(25, 975));
  }

  @Test
  void pairedBootstrapOfIdenticalSystemsShowsNoDifference() {
    int[][] c = corpus(SEED, 200);
    Bootstrap.Paired p = Bootstrap.paired(c[0], c[0], c[1], 1000, SEED, 2);
    assertThat(p.difference()).isEqualTo(new Bootstrap.Interval(0, 0));
    assertThat(p.probBBetter()).isZero();
    assertThat(p.probABetter()).isZero();
  }

  @Test
  void pairedBootstrapFavoursTheSystemThatIsBetterEverywhere() {
    // Invariant: if B has fewer errors on every utterance, B wins every resample and the difference is negative.
    int[][] c = corpus(SEED, 200);
    int[] worse = c[0].clone();
    for (int i = 0; i < worse.length; i++) worse[i]++;
    Bootstrap.Paired p = Bootstrap.paired(worse, c[0], c[1], 1000, SEED, 1);
    assertThat(p.probBBetter()).isEqualTo(1.0);
    assertThat(p.difference().high()).isLessThan(0);
  }

  @Test
  void emptyCorpusHasNoInterval() {
    Bootstrap.Interval ci = Bootstrap.corpusRate(new int[0], new int[0], 1000, SEED, 1);
    assertThat(ci.low()).isNaN();
  }
}
