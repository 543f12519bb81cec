package steelyard.eval;

import java.util.Arrays;

/**
 * One alignment of a hypothesis against a reference, as a sequence of steps in reading order.
 *
 * <p>Storage: three parallel arrays of the same length (the number of steps, at most |ref| + |hyp|): a
 * {@code byte} operation code, the {@code int} reference index and the {@code int} hypothesis index of each
 * step (−1 where the step has no token on that side): 9 bytes per step. Indices refer to the arrays that were
 * aligned. Immutable.
 */
public final class Alignment {
  /** The reference token equals the hypothesis token (C). */
  public static final byte CORRECT = 0;
  /** Different tokens aligned with each other (S). */
  public static final byte SUBSTITUTION = 1;
  /** A reference token with no hypothesis token (D): hypothesis index −1. */
  public static final byte DELETION = 2;
  /** A hypothesis token with no reference token (I): reference index −1. */
  public static final byte INSERTION = 3;

  private final byte[] ops;
  private final int[] refIndex;
  private final int[] hypIndex;

  private Alignment(byte[] ops, int[] refIndex, int[] hypIndex) {
    this.ops = ops;
    this.refIndex = refIndex;
    this.hypIndex = hypIndex;
  }

  // Builds from the first `steps` entries of arrays filled back to front.
  static Alignment reversed(byte[] ops, int[] ri, int[] hi, int steps) {
    byte[] o = new byte[steps];
    int[] r = new int[steps];
    int[] h = new int[steps];
    for (int k = 0; k < steps; k++) {
      o[k] = ops[steps - 1 - k];
      r[k] = ri[steps - 1 - k];
      h[k] = hi[steps - 1 - k];
    }
    return new Alignment(o, r, h);
  }

  /** Number of steps. */
  public int size() {
    return ops.length;
  }

  /** Operation of step {@code k}: {@link #CORRECT}, {@link #SUBSTITUTION}, {@link #DELETION} or {@link #INSERTION}. */
  public byte op(int k) {
    return ops[k];
  }

  /** Reference index of step {@code k}, or −1 for an insertion. */
  public int refIndex(int k) {
    return refIndex[k];
  }

  /** Hypothesis index of step {@code k}, or −1 for a deletion. */
  public int hypIndex(int k) {
    return hypIndex[k];
  }

  /** C/S/D/I of this alignment. */
  public EditCounts counts() {
    long[] c = new long[4];
    for (byte op : ops) c[op]++;
    return new EditCounts(c[CORRECT], c[SUBSTITUTION], c[DELETION], c[INSERTION]);
  }

  /** A compact rendering such as {@code C S D I} for messages and tests. */
  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder();
    for (byte op : ops) {
      if (sb.length() > 0) sb.append(' ');
      sb.append("CSDI".charAt(op));
    }
    return sb.toString();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof Alignment a
        && Arrays.equals(ops, a.ops)
        && Arrays.equals(refIndex, a.refIndex)
        && Arrays.equals(hypIndex, a.hypIndex);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * Arrays.hashCode(ops) + Arrays.hashCode(refIndex)) + Arrays.hashCode(hypIndex);
  }
}
