package steelyard.eval;

/**
 * Bit-parallel edit distance for references of at most 64 tokens (Myers 1999; global form as in Hyyrö 2001),
 * with the per-column vertical difference vectors kept so that any cell of the cost table can be read back and
 * the minimum-cost path walked back with {@link Aligner}'s tie-breaking.
 *
 * <p>Bit {@code k} of a column vector stands for reference row {@code k + 1}. Column {@code j} (hypothesis
 * prefix length) keeps {@code VP} (vertical +1) and {@code VN} (vertical −1) words, so
 * {@code cost(i, j) = j + popcount(VP_j & low(i)) − popcount(VN_j & low(i))} with {@code low(i)} the lowest
 * {@code i} bits. The match masks {@code Peq} come from a small open-addressing table from reference token to
 * bit mask (128 slots, generation-stamped so it is never cleared between pairs).
 *
 * <p>Storage, grown on demand and reused: two {@code long} per hypothesis token (16 bytes) plus a fixed
 * 128 × (4 + 8 + 4) bytes for the token table. Not thread-safe.
 */
final class BitParallelCounts {
  static final int MAX_REF = 64;
  private static final int SLOTS = 128;

  private final int[] keys = new int[SLOTS];
  private final long[] masks = new long[SLOTS];
  private final int[] stamps = new int[SLOTS];
  private int generation;
  private long[] vp = new long[33];
  private long[] vn = new long[33];

  int deletions;
  int insertions;
  int substitutions;
  int correct;

  /** Edit distance of ref (length n ≤ 64) and hyp. */
  int distance(int[] ref, int n, int[] hyp, int m) {
    buildPeq(ref, n);
    long top = 1L << (n - 1);
    long pv = n == 64 ? -1L : (1L << n) - 1;
    long nv = 0;
    int score = n;
    for (int j = 0; j < m; j++) {
      long eq = peq(hyp[j]);
      long xv = eq | nv;
      long xh = (((eq & pv) + pv) ^ pv) | eq;
      long ph = nv | ~(xh | pv);
      long mh = pv & xh;
      if ((ph & top) != 0) score++;
      else if ((mh & top) != 0) score--;
      ph = (ph << 1) | 1L;
      mh <<= 1;
      pv = mh | ~(xv | ph);
      nv = ph & xv;
    }
    return score;
  }

  /** Aligns ref (length n, 1 ≤ n ≤ 64) and hyp (m ≥ 1), fills the four counts and returns the cost. */
  int measure(int[] ref, int n, int[] hyp, int m) {
    if (vp.length < m + 1) {
      vp = new long[Math.max(m + 1, vp.length * 2)];
      vn = new long[vp.length];
    }
    buildPeq(ref, n);
    long pv = n == 64 ? -1L : (1L << n) - 1;
    long nv = 0;
    vp[0] = pv;
    vn[0] = 0;
    for (int j = 0; j < m; j++) {
      long eq = peq(hyp[j]);
      long xv = eq | nv;
      long xh = (((eq & pv) + pv) ^ pv) | eq;
      long ph = nv | ~(xh | pv);
      long mh = pv & xh;
      ph = (ph << 1) | 1L;
      mh <<= 1;
      pv = mh | ~(xv | ph);
      nv = ph & xv;
      vp[j + 1] = pv;
      vn[j + 1] = nv;
    }
    return backtrace(ref, n, hyp, m);
  }

  // Walks back from (n, m) preferring diagonal, then up (deletion), then left (insertion). Branch-free steps:
  // the move depends on data that a branch predictor cannot learn, so it is computed arithmetically.
  private int backtrace(int[] ref, int n, int[] hyp, int m) {
    int i = n;
    int j = m;
    int here = cost(i, j);
    int total = here;
    int diagSteps = 0;
    int s = 0;
    int d = 0;
    while (i > 0 && j > 0) {
      int same = ref[i - 1] == hyp[j - 1] ? 1 : 0;
      int diag = cost(i - 1, j - 1);
      int up = cost(i - 1, j);
      int takeDiag = same | (diag + 1 == here ? 1 : 0);
      int takeUp = (1 - takeDiag) & (up + 1 == here ? 1 : 0);
      int takeLeft = 1 - takeDiag - takeUp;
      diagSteps += takeDiag;
      s += takeDiag & (1 - same);
      d += takeUp;
      here -= (takeDiag & (1 - same)) + takeUp + takeLeft;
      i -= takeDiag + takeUp;
      j -= takeDiag + takeLeft;
    }
    d += i;
    substitutions = s;
    correct = diagSteps - s;
    deletions = d;
    insertions = d + m - n;
    return total;
  }

  private int cost(int i, int j) {
    long low = i == 64 ? -1L : (1L << i) - 1;
    return j + Long.bitCount(vp[j] & low) - Long.bitCount(vn[j] & low);
  }

  private void buildPeq(int[] ref, int n) {
    if (++generation == 0) {
      java.util.Arrays.fill(stamps, 0);
      generation = 1;
    }
    for (int i = 0; i < n; i++) {
      int t = ref[i];
      int slot = slot(t);
      while (stamps[slot] == generation && keys[slot] != t) slot = (slot + 1) & (SLOTS - 1);
      if (stamps[slot] != generation) {
        stamps[slot] = generation;
        keys[slot] = t;
        masks[slot] = 0;
      }
      masks[slot] |= 1L << i;
    }
  }

  private long peq(int t) {
    int slot = slot(t);
    while (stamps[slot] == generation) {
      if (keys[slot] == t) return masks[slot];
      slot = (slot + 1) & (SLOTS - 1);
    }
    return 0L;
  }

  private static int slot(int t) {
    return (t * 0x9E3779B9) >>> 25;
  }
}
