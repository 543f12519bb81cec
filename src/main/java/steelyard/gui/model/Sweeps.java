package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.ErrorSurface;
import steelyard.tune.Sweep;
import steelyard.tune.WeightNames;

/**
 * The series behind the window's charts: the exact corpus error and helped/hurt counts along λ and the error
 * over a λ × μ grid, both from the tuner's exact line search ({@code tune.WeightSweep}, N-best), and the error per
 * group under the current choices.
 */
public final class Sweeps {
  private Sweeps() {}

  /**
   * Error and helped/hurt counts along λ (other weights as in {@code base}).
   *
   * @param lambdas   where each step starts, ascending (the last point closes the range)
   * @param errorRate corpus error rate of the choice from each λ to the next
   * @param helped    utterances helped from each λ to the next
   * @param hurt      utterances hurt from each λ to the next
   * @param firstRate rank 1's error rate (a level)
   * @param oracleRate the N-best oracle's error rate (a level)
   * @param current   the λ in effect
   */
  public record LambdaSweep(double[] lambdas, double[] errorRate, int[] helped, int[] hurt, double firstRate, double oracleRate,
      double current) {}

  /**
   * Error rate over a grid: {@code errorRate[i][j]} at λ = {@code lambdas[i]}, μ = {@code mus[j]}.
   *
   * @param best the grid cell with the lowest error {i, j} (first in λ-then-μ order on ties)
   */
  public record Surface(double[] lambdas, double[] mus, double[][] errorRate, int[] best) {}

  /** Error rates of one group: rank 1, the choice, the N-best oracle; N its reference tokens. */
  public record GroupErrors(String group, long referenceTokens, double firstRate, double choiceRate, double oracleRate) {}

  /** {@code n} evenly spaced values from {@code from} to {@code to} inclusive. */
  public static double[] grid(double from, double to, int n) {
    double[] g = new double[n];
    for (int i = 0; i < n; i++) g[i] = n == 1 ? from : from + (to - from) * i / (n - 1);
    return g;
  }

  /**
   * The exact error and helped/hurt counts along λ over [low, high] (other weights as in {@code at}), from the
   * tuner's sweep ({@code tune.WeightSweep}: one exact line search). Series points are the interval starts
   * plus a closing point at {@code high}; references without hypotheses count as all deletions, as in the
   * corpus figures.
   */
  public static LambdaSweep lambda(Workspace w, RescoreWeights at, double low, double high) {
    Corpus c = w.corpus();
    Sweep s = w.weightSweep().nbest(at, WeightNames.LM, low, high);
    long lost = c.orphanTokens();
    long n = s.referenceTokens() + lost;
    int m = s.intervals();
    double[] x = new double[m + 1];
    double[] rate = new double[m + 1];
    int[] helped = new int[m + 1];
    int[] hurt = new int[m + 1];
    int k = 0;
    for (int j = 0; j <= m; j++) {
      double xj = j < m ? s.intervalLow(j) : high;
      int src = Math.min(j, m - 1);
      if (k > 0 && !(xj > x[k - 1])) k--;
      x[k] = xj;
      rate[k] = rate(s.errors()[src] + lost, n);
      helped[k] = s.helped()[src];
      hurt[k] = s.hurt()[src];
      k++;
    }
    long oracle = lost;
    for (int u = 0; u < c.size(); u++) if (c.hasReference(u)) oracle += c.oracleErrors(u);
    return new LambdaSweep(java.util.Arrays.copyOf(x, k), java.util.Arrays.copyOf(rate, k), java.util.Arrays.copyOf(helped, k),
        java.util.Arrays.copyOf(hurt, k), rate(s.firstErrors() + lost, n), rate(oracle, n), at.lmWeight());
  }

  /** The error over λ × μ (other weights as in {@code at}), one exact line search along λ per μ ({@code tune.WeightSweep}). */
  public static Surface surface(Workspace w, RescoreWeights at, double[] lambdas, double[] mus) {
    ErrorSurface e = w.weightSweep().nbestSurface(at, WeightNames.LENGTH, mus, WeightNames.LM, lambdas);
    long lost = w.corpus().orphanTokens();
    double[][] err = new double[lambdas.length][mus.length];
    int[] best = {0, 0};
    for (int i = 0; i < lambdas.length; i++) {
      for (int j = 0; j < mus.length; j++) {
        err[i][j] = rate(e.errors()[j][i] + lost, e.referenceTokens() + lost);
        if (err[i][j] < err[best[0]][best[1]]) best = new int[] {i, j};
      }
    }
    return new Surface(lambdas.clone(), mus.clone(), err, best);
  }

  /** Error per group under {@code choices}, groups in sorted order; utterances without a reference left out. */
  public static List<GroupErrors> perGroup(Corpus corpus, Choices choices) {
    Map<String, long[]> sums = new TreeMap<>();
    for (int u = 0; u < corpus.size(); u++) {
      if (!corpus.hasReference(u)) continue;
      long[] s = sums.computeIfAbsent(corpus.group(u), g -> new long[4]);
      s[0] += corpus.referenceLength(u);
      s[1] += corpus.firstErrors(u);
      s[2] += choices.errors()[u];
      s[3] += corpus.oracleErrors(u);
    }
    List<GroupErrors> out = new ArrayList<>();
    for (Map.Entry<String, long[]> e : sums.entrySet()) {
      long[] s = e.getValue();
      out.add(new GroupErrors(e.getKey(), s[0], rate(s[1], s[0]), rate(s[2], s[0]), rate(s[3], s[0])));
    }
    return out;
  }

  private static double rate(long errors, long n) {
    return n == 0 ? Double.NaN : (double) errors / n;
  }

}
