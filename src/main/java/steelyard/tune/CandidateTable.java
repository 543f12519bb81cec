package steelyard.tune;

/**
 * The candidates of many utterances (N-best hypotheses, or confusion-network paths) with everything exact line
 * search needs, in flat primitive arrays: each candidate's score is linear in a weight vector w,
 * {@code total(h) = Σ_c w[c]·column[c][h]} (summed in column order, natural-log units, higher is better).
 *
 * <p>Layout, U utterances, H candidates, D columns: utterance u owns candidates {@code [start[u], start[u+1])};
 * {@code column[c]} is a {@code double[H]} (column-major, so a weighted sum streams through memory);
 * {@code errors[H]} are S+D+I against the utterance's reference, computed once; {@code tie[H]} is the tie order
 * within the utterance (smaller wins an exact tie, as {@link steelyard.rescore.LogLinear#best}); {@code
 * unchanged[H]} says whether the candidate's tokens equal those of the recogniser's rank 1;
 * {@code firstErrors[U]} and {@code refTokens[U]} are rank 1's errors and the reference's scored tokens.
 * Cost: 8·D + 9 bytes per candidate and 13 bytes per utterance (1 M hypotheses with 5 columns: about 49 MB).
 * Immutable once built; safe to read from several threads.
 */
final class CandidateTable {
  final int[] start;
  final double[][] column;
  final int[] errors;
  final int[] tie;
  final boolean[] unchanged;
  final int[] firstErrors;
  final int[] refTokens;
  /** Per utterance: every candidate has the same error count, so no weight can change its error. */
  final boolean[] constant;

  CandidateTable(int[] start, double[][] column, int[] errors, int[] tie, boolean[] unchanged, int[] firstErrors, int[] refTokens) {
    int u = start.length - 1;
    int h = start[u];
    if (errors.length != h || tie.length != h || unchanged.length != h || firstErrors.length != u || refTokens.length != u)
      throw new IllegalArgumentException("array sizes disagree with " + u + " utterances and " + h + " candidates");
    for (double[] c : column) if (c.length != h) throw new IllegalArgumentException("column of " + c.length + " values, expected " + h);
    this.start = start;
    this.column = column;
    this.errors = errors;
    this.tie = tie;
    this.unchanged = unchanged;
    this.firstErrors = firstErrors;
    this.refTokens = refTokens;
    this.constant = new boolean[u];
    for (int k = 0; k < u; k++) {
      boolean same = true;
      for (int x = start[k] + 1; x < start[k + 1] && same; x++) same = errors[x] == errors[start[k]];
      constant[k] = same;
    }
  }

  int utterances() {
    return start.length - 1;
  }

  int dimensions() {
    return column.length;
  }

  /** Σ_c w[c]·column[c][h] in column order; zero weights are skipped (adding 0 would not change the sum). */
  double total(int h, double[] w) {
    double t = 0;
    for (int c = 0; c < w.length; c++) if (w[c] != 0) t += w[c] * column[c][h];
    return t;
  }

  /**
   * Totals of candidates [from, from + n) into {@code out} (returned): the same sums as {@link #total}, in the same
   * column order, accumulated column by column so that each column is read sequentially.
   */
  double[] totals(int from, int n, double[] w, double[] out) {
    for (int c = 0; c < w.length; c++) {
      double wc = w[c];
      if (wc == 0) continue;
      double[] col = column[c];
      for (int i = 0; i < n; i++) out[i] += wc * col[from + i];
    }
    return out;
  }

  /** The candidate of utterance {@code u} with the highest total under {@code w}; ties to the smaller tie order. */
  int best(int u, double[] w) {
    int best = start[u];
    double top = total(best, w);
    for (int h = start[u] + 1; h < start[u + 1]; h++) {
      double t = total(h, w);
      if (t > top || (t == top && tie[h] < tie[best])) {
        best = h;
        top = t;
      }
    }
    return best;
  }

  /** Totals under {@code w} of every candidate of {@code utts} (other slots 0), {@code double[H]}, as {@link #total} sums them. */
  double[] totalsAt(int[] utts, double[] w, Workers workers) {
    double[] out = new double[errors.length];
    workers.blocks(utts.length, (b, from, to) -> {
      double[] buf = new double[0];
      for (int i = from; i < to; i++) {
        int u = utts[i];
        int n = start[u + 1] - start[u];
        if (buf.length < n) buf = new double[n];
        java.util.Arrays.fill(buf, 0, n, 0);
        System.arraycopy(totals(start[u], n, w, buf), 0, out, start[u], n);
      }
    });
    return out;
  }

  /** Σ errors over {@code utts} of the candidate with the highest of {@code totals} (ties to the smaller tie order). */
  long errorsFrom(int[] utts, double[] totals, Workers workers) {
    long[] sums = new long[Workers.blockCount(utts.length)];
    workers.blocks(utts.length, (b, from, to) -> {
      for (int i = from; i < to; i++) {
        int u = utts[i];
        int best = start[u];
        for (int h = start[u] + 1; h < start[u + 1]; h++)
          if (totals[h] > totals[best] || (totals[h] == totals[best] && tie[h] < tie[best])) best = h;
        sums[b] += errors[best];
      }
    });
    long sum = 0;
    for (long x : sums) sum += x;
    return sum;
  }

  /** Errors of the pick under {@code w} for each of {@code utts}, aligned with it. */
  int[] errorsOf(int[] utts, double[] w, Workers workers) {
    int[] out = new int[utts.length];
    workers.blocks(utts.length, (b, from, to) -> {
      for (int i = from; i < to; i++) out[i] = errors[best(utts[i], w)];
    });
    return out;
  }

  /** Σ errors of the picks under {@code w} over {@code utts}. */
  long errors(int[] utts, double[] w, Workers workers) {
    long sum = 0;
    for (int e : errorsOf(utts, w, workers)) sum += e;
    return sum;
  }

  /** Σ reference tokens over {@code utts}. */
  long referenceTokens(int[] utts) {
    long n = 0;
    for (int u : utts) n += refTokens[u];
    return n;
  }

  /** Σ errors of rank 1 over {@code utts}. */
  long firstErrors(int[] utts) {
    long n = 0;
    for (int u : utts) n += firstErrors[u];
    return n;
  }

  /** 0, 1, …, U−1. */
  int[] all() {
    int[] a = new int[utterances()];
    for (int i = 0; i < a.length; i++) a[i] = i;
    return a;
  }
}
