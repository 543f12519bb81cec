package steelyard.report;

import steelyard.report.SectionInput.ChartSeries;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.ErrorSurface;
import steelyard.tune.Sweep;
import steelyard.tune.TuneInput;
import steelyard.tune.WeightNames;
import steelyard.tune.WeightSweep;

/**
 * The chart series of a run, computed by the tuner's exact sweeps ({@link WeightSweep}) around the weights in effect,
 * for a run that was not tuned or for data other than the dev set: the same function the tuner reports with.
 *
 * <ul>
 *   <li>N-best: the error and helped/hurt counts along λ over [0, max(2λ, 1)] (one exact line search over every
 *       hypothesis), and the error over that λ range × μ ± max(|μ|, λ, 1) ({@value #COLUMNS} × {@value #ROWS} points,
 *       one line search per row);</li>
 *   <li>lattice: the same along λ′ and over λ′ × μ′, exact over each utterance's pooled k-best search paths
 *       ({@value #POOL} paths per search, searches at {@value #SAMPLES} values of λ′);</li>
 *   <li>MBR and consensus: none (their picks do not follow one weight's line search; the page leaves the charts
 *       out).</li>
 * </ul>
 * Cost: scoring every hypothesis against its reference once ({@link WeightSweep#of}), then the searches above.
 * The same input gives the same series for any thread count.
 */
public final class ReportSweeps {
  /** Points along the LM weight in the surface. */
  static final int COLUMNS = 41;
  /** Points along the length weight in the surface. */
  static final int ROWS = 21;
  /** k-best paths per network search for the lattice sweeps. */
  static final int POOL = 20;
  /** Values of λ′ searched to pool the paths of the lattice sweep. */
  static final int SAMPLES = 8;

  private ReportSweeps() {}

  /**
   * The series at {@code at} for {@code method} over the utterances of {@code input} (those with a reference).
   *
   * @param oracleErrors  errors of the N-best oracle over the same utterances (−1: unknown)
   * @param missingTokens reference tokens of references without hypotheses (all deleted)
   */
  public static ChartSeries series(TuneInput input, RescoreWeights at, RescoreMethod method, long oracleErrors,
      long missingTokens, int threads) {
    if (method == RescoreMethod.MBR || method == RescoreMethod.CONSENSUS)
      return new ChartSeries(null, null, oracleErrors, missingTokens);
    WeightSweep sweeps = WeightSweep.of(input, threads);
    Sweep sweep;
    ErrorSurface surface;
    if (method == RescoreMethod.NBEST) {
      double high = lmHigh(at.lmWeight());
      sweep = sweeps.nbest(at, WeightNames.LM, 0, high);
      surface = sweeps.nbestSurface(at, WeightNames.LENGTH, around(at.lengthWeight(), at.lmWeight()), WeightNames.LM,
          linear(0, high, COLUMNS));
    } else {
      if (input.model() == null) return new ChartSeries(null, null, oracleErrors, missingTokens);
      double high = lmHigh(at.latticeLmWeight());
      sweep = sweeps.lattice(at, 0, high, POOL, SAMPLES);
      surface = sweeps.latticeSurface(at, around(at.latticeLengthWeight(), at.latticeLmWeight()), linear(0, high, COLUMNS), POOL);
    }
    return new ChartSeries(sweep, surface, oracleErrors, missingTokens);
  }

  /** Upper end of the LM-weight range: twice the weight in effect, at least 1. */
  static double lmHigh(double lm) {
    return Math.max(2 * lm, 1);
  }

  /** {@value #ROWS} length weights centred on {@code length}, half-width max(|length|, lm, 1). */
  private static double[] around(double length, double lm) {
    double half = Math.max(Math.max(Math.abs(length), lm), 1);
    return linear(length - half, length + half, ROWS);
  }

  private static double[] linear(double a, double b, int n) {
    double[] v = new double[n];
    for (int i = 0; i < n; i++) v[i] = a + (b - a) * i / (n - 1);
    return v;
  }
}
