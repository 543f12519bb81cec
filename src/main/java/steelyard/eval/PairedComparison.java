package steelyard.eval;

import it.unimi.dsi.fastutil.ints.IntArrayList;

/**
 * Two systems scored on the same references, compared on the utterances both count (the common set).
 *
 * @param utterances      utterances in the common set
 * @param referenceTokens N over the common set
 * @param errorsA         S + D + I of system A over the common set
 * @param errorsB         S + D + I of system B over the common set
 * @param intervalA       95 % bootstrap interval of A's rate on the common set
 * @param intervalB       95 % bootstrap interval of B's rate on the common set
 * @param paired          paired bootstrap of rate(B) − rate(A)
 * @param aBetter         utterances where A makes fewer errors than B
 * @param bBetter         utterances where B makes fewer errors than A
 * @param ties            utterances where both make the same number of errors
 * @param signTestP       exact two-sided sign-test p-value over the untied utterances
 */
public record PairedComparison(
    int utterances,
    long referenceTokens,
    long errorsA,
    long errorsB,
    Bootstrap.Interval intervalA,
    Bootstrap.Interval intervalB,
    Bootstrap.Paired paired,
    int aBetter,
    int bBetter,
    int ties,
    double signTestP) {

  /** Rate of A on the common set; NaN when N = 0. */
  public double rateA() {
    return referenceTokens == 0 ? Double.NaN : (double) errorsA / referenceTokens;
  }

  /** Rate of B on the common set; NaN when N = 0. */
  public double rateB() {
    return referenceTokens == 0 ? Double.NaN : (double) errorsB / referenceTokens;
  }

  /** rate(B) − rate(A) on the common set. */
  public double difference() {
    return rateB() - rateA();
  }

  /**
   * Compares two scores made from the same reference map (so their table rows line up). The common set is the
   * utterances included in both (under {@link MissingHypothesisPolicy#EXCLUDE} an utterance missing from either
   * system drops out of the comparison), in reference-file order.
   */
  public static PairedComparison of(CorpusScore a, CorpusScore b, int resamples, long seed, int threads) {
    UtteranceScores ta = a.table();
    UtteranceScores tb = b.table();
    if (ta.size() != tb.size()) throw new IllegalArgumentException("scores were made from different references");
    IntArrayList ea = new IntArrayList();
    IntArrayList eb = new IntArrayList();
    IntArrayList refs = new IntArrayList();
    for (int row = 0; row < ta.size(); row++) {
      if (!ta.uttId(row).equals(tb.uttId(row))) throw new IllegalArgumentException("rows differ at " + row);
      if (!ta.included(row) || !tb.included(row)) continue;
      ea.add(ta.errors(row));
      eb.add(tb.errors(row));
      refs.add(ta.referenceTokens(row));
    }
    return of(ea.toIntArray(), eb.toIntArray(), refs.toIntArray(), resamples, seed, threads);
  }

  /**
   * Compares two systems on a common set given as parallel per-utterance arrays (errors S + D + I of A and of B,
   * reference tokens N), in the order the resampling draws from: the statistics {@code compare} reports. Same
   * arrays, resamples and seed give the same result whatever the thread count.
   */
  public static PairedComparison of(int[] errA, int[] errB, int[] ref, int resamples, long seed, int threads) {
    if (errA.length != ref.length || errB.length != ref.length)
      throw new IllegalArgumentException("array lengths differ: " + errA.length + ", " + errB.length + ", " + ref.length);
    long sumA = 0;
    long sumB = 0;
    long n = 0;
    int aBetter = 0;
    int bBetter = 0;
    for (int u = 0; u < ref.length; u++) {
      sumA += errA[u];
      sumB += errB[u];
      n += ref[u];
      if (errA[u] < errB[u]) aBetter++;
      if (errB[u] < errA[u]) bBetter++;
    }
    // One seed for all three analyses: each sees the same resampled utterance sets.
    Bootstrap.Interval ia = Bootstrap.corpusRate(errA, ref, resamples, seed, threads);
    Bootstrap.Interval ib = Bootstrap.corpusRate(errB, ref, resamples, seed, threads);
    Bootstrap.Paired p = Bootstrap.paired(errA, errB, ref, resamples, seed, threads);
    int ties = ref.length - aBetter - bBetter;
    return new PairedComparison(ref.length, n, sumA, sumB, ia, ib, p, aBetter, bBetter, ties, SignTest.twoSidedP(aBetter, bBetter));
  }
}
