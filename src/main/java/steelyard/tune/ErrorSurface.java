package steelyard.tune;

import steelyard.rescore.RescoreMethod;

/**
 * Dev errors over a grid of two weights, the others at their tuned values: {@code errors[r][c]} at
 * {@code rowWeight = rows[r]} and {@code columnWeight = columns[c]}. Computed with one exact line search per
 * row, read off at the column values (a value exactly on a breakpoint takes the error on the breakpoint's right).
 *
 * @param method          the method whose weights these are ({@link RescoreMethod#NBEST} for λ × μ,
 *                        {@link RescoreMethod#LATTICE} for λ′ × μ′)
 * @param referenceTokens N of the error rate
 * @param exact           true over all N-best hypotheses; false over the lattice method's path pools
 */
public record ErrorSurface(
    RescoreMethod method, String rowWeight, double[] rows, String columnWeight, double[] columns, long[][] errors,
    long referenceTokens, boolean exact) {

  /** The error rate at grid point (r, c). */
  public double rate(int r, int c) {
    return referenceTokens == 0 ? Double.NaN : (double) errors[r][c] / referenceTokens;
  }
}
