package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import steelyard.rescore.RescoreWeights;

/**
 * The series behind the window's charts, computed by re-choosing (N-best) over the cached terms at a grid
 * of weights: corpus error and helped/hurt counts along λ, the error over a λ × μ grid, and the error per
 * group under the current weights. Every point is one {@link Workspace#rerank}.
 */
public final class Sweeps {
  private Sweeps() {}

  /**
   * Error and helped/hurt counts along λ (other weights as in {@code base}).
   *
   * @param lambdas   the λ values, ascending
   * @param errorRate corpus error rate of the choice at each λ
   * @param helped    utterances helped at each λ
   * @param hurt      utterances hurt at each λ
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

  public static LambdaSweep lambda(Workspace w, RescoreWeights base, double[] lambdas, TaskProgress progress) {
    double[] err = new double[lambdas.length];
    int[] helped = new int[lambdas.length];
    int[] hurt = new int[lambdas.length];
    CorpusFigures f = null;
    for (int i = 0; i < lambdas.length; i++) {
      progress.checkCancelled();
      f = w.rerank(with(base, lambdas[i], base.lengthWeight())).figures();
      err[i] = f.errorRate();
      helped[i] = f.helped();
      hurt[i] = f.hurt();
      progress.report((i + 1.0) / lambdas.length, "error along λ");
    }
    double first = f == null ? Double.NaN : f.firstErrorRate();
    double oracle = f == null ? Double.NaN : f.oracleErrorRate();
    return new LambdaSweep(lambdas.clone(), err, helped, hurt, first, oracle, base.lmWeight());
  }

  public static Surface surface(Workspace w, RescoreWeights base, double[] lambdas, double[] mus, TaskProgress progress) {
    double[][] err = new double[lambdas.length][mus.length];
    int[] best = {0, 0};
    for (int i = 0; i < lambdas.length; i++) {
      for (int j = 0; j < mus.length; j++) {
        progress.checkCancelled();
        err[i][j] = w.rerank(with(base, lambdas[i], mus[j])).figures().errorRate();
        if (err[i][j] < err[best[0]][best[1]]) best = new int[] {i, j};
      }
      progress.report((i + 1.0) / lambdas.length, "error over λ × μ");
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

  private static RescoreWeights with(RescoreWeights b, double lambda, double mu) {
    return new RescoreWeights(b.features(), lambda, b.oovWeight(), mu, b.posteriorScale(), b.systemWeights(), b.mbrMaxHypotheses(),
        b.latticeLmWeight(), b.latticeLengthWeight(), b.beam(), b.latticeMaxHypotheses(), b.voteConfidence());
  }
}
