package steelyard.eval;

/**
 * The exact two-sided sign test (binomial test with p = 1/2) on per-utterance error counts of two systems;
 * utterances where both make the same number of errors (ties) are dropped.
 *
 * <p>With n = wins(A) + wins(B) and k = min(wins), p = min(1, 2 · Σ_{i=0..k} C(n, i) / 2ⁿ). The binomial terms are
 * summed in natural-log space (log-sum-exp), so the value stays accurate for n in the millions where 2ⁿ and
 * C(n, i) overflow a double.
 */
public final class SignTest {
  private SignTest() {}

  /** Two-sided p-value; 1 when there is no untied utterance. */
  public static double twoSidedP(long winsA, long winsB) {
    if (winsA < 0 || winsB < 0) throw new IllegalArgumentException("negative win count");
    long n = winsA + winsB;
    if (n == 0) return 1.0;
    long k = Math.min(winsA, winsB);
    // ln C(n, i) built up term by term, ln C(n, i+1) = ln C(n, i) + ln(n - i) - ln(i + 1), and summed by a
    // streaming log-sum-exp (sum is kept relative to the largest term so far).
    double logTerm = 0.0;
    double maxLog = 0.0;
    double sum = 1.0;
    for (long i = 0; i < k; i++) {
      logTerm += Math.log(n - i) - Math.log(i + 1.0);
      if (logTerm > maxLog) {
        sum = sum * Math.exp(maxLog - logTerm) + 1.0;
        maxLog = logTerm;
      } else {
        sum += Math.exp(logTerm - maxLog);
      }
    }
    double logTail = maxLog + Math.log(sum) - n * Math.log(2.0);
    double p = Math.exp(Math.log(2.0) + logTail);
    return Math.min(1.0, p);
  }
}
