package steelyard.eval;

/**
 * Unit-cost edit-distance alignment (Levenshtein; Wagner &amp; Fischer 1974) of a hypothesis token-id sequence
 * against a reference, with backtrace for C/S/D/I counts.
 *
 * <h2>Costs</h2>
 * A match costs 0; a substitution, a deletion (a reference token with no hypothesis token) and an insertion (a
 * hypothesis token with no reference token) cost 1 each. Token ids are compared with {@code ==}; what an id
 * means (a word or a grapheme cluster) is the caller's business.
 *
 * <h2>Tie-breaking (fixed, so counts are reproducible)</h2>
 * Among all minimum-cost alignments the one chosen is the one a backtrace finds when it walks back from the
 * end, cell {@code (i, j)} = (reference prefix length, hypothesis prefix length), and at every cell takes the
 * first move that lies on a minimum-cost path in this order of preference:
 * <ol>
 *   <li>diagonal: match or substitution of {@code ref[i-1]} with {@code hyp[j-1]};</li>
 *   <li>up: deletion of {@code ref[i-1]};</li>
 *   <li>left: insertion of {@code hyp[j-1]}.</li>
 * </ol>
 * The counts path ({@link #count}, {@link #measure}) does not store an {@code int} table. For references of
 * at most 64 tokens it runs the bit-parallel recurrence (Myers 1999, global form as in Hyyrö 2001), keeping two
 * 64-bit difference words per hypothesis token from which any cell's cost is recomputed, and walks that
 * back with the preference above ({@code BitParallelCounts}). For longer references it carries, in a two-row
 * forward pass, the deletion count of the path the backtrace would take from each cell (each cell's choice
 * depends only on its three neighbours' costs, so the forward and the backward choice coincide); from the
 * cost, the deletion count and the two lengths the other counts follow: {@code I = D + |hyp| − |ref|},
 * {@code S = cost − D − I}, {@code C = |ref| − S − D}. {@link #alignment} fills a full cost table and walks it
 * back with the same preference. All three give identical counts (tested).
 *
 * <h2>Optional tokens</h2>
 * Tokens flagged optional (hesitations, noise markers from the rules file) cost nothing whether present or
 * absent on either side, are never part of a substitution, and are not counted in N nor as an error. They are
 * removed from both sequences before alignment, which gives the same minimum cost as zero-cost deletion and
 * insertion of them; the tie-breaking above then applies to the remaining tokens.
 *
 * <h2>Memory</h2>
 * Work storage is grown on demand and reused: the counts path keeps two {@code long} words per hypothesis
 * token (16 bytes) for references up to 64 tokens, and two {@code int} rows of {@code |hyp| + 1} entries
 * (8 bytes per hypothesis token) beyond; {@link #alignment} keeps a full
 * {@code (|ref| + 1) × (|hyp| + 1)} {@code int} table (4 bytes per cell; a 1000 × 1000 pair needs about 4 MB),
 * so it is meant for per-utterance reports, not for hot loops. Sequence length products above
 * {@link Integer#MAX_VALUE} cells are rejected by {@link #alignment}. In steady state {@link #distance} and
 * {@link #measure} allocate nothing.
 *
 * <p>An instance is therefore <b>not thread-safe</b>: use one per thread.
 */
public final class Aligner {
  private int[] costRow = new int[32];
  private int[] delRow = new int[32];
  private int[] table = new int[0];
  private int[] refBuf = new int[32];
  private int[] hypBuf = new int[32];
  private int[] refMap = new int[32];
  private int[] hypMap = new int[32];

  private final BitParallelCounts bits = new BitParallelCounts();

  private int lastCorrect;
  private int lastSubstitutions;
  private int lastDeletions;
  private int lastInsertions;

  public Aligner() {}

  /** Edit distance (S + D + I, unit costs) between {@code ref} and {@code hyp}. */
  public int distance(int[] ref, int[] hyp) {
    return distance(ref, ref.length, hyp, hyp.length);
  }

  /** Edit distance between the first {@code refLen} tokens of {@code ref} and the first {@code hypLen} of {@code hyp}. */
  public int distance(int[] ref, int refLen, int[] hyp, int hypLen) {
    if (refLen == 0) return hypLen;
    if (hypLen == 0) return refLen;
    if (refLen <= BitParallelCounts.MAX_REF) return bits.distance(ref, refLen, hyp, hypLen);
    // The distance is symmetric: a short hypothesis can play the bit-parallel pattern.
    if (hypLen <= BitParallelCounts.MAX_REF) return bits.distance(hyp, hypLen, ref, refLen);
    return distanceScalar(ref, refLen, hyp, hypLen);
  }

  // Two-row Wagner-Fischer for references longer than one machine word.
  int distanceScalar(int[] ref, int refLen, int[] hyp, int hypLen) {
    if (refLen == 0) return hypLen;
    if (hypLen == 0) return refLen;
    int[] row = costRow = grow(costRow, hypLen + 1);
    for (int j = 0; j <= hypLen; j++) row[j] = j;
    for (int i = 1; i <= refLen; i++) {
      int r = ref[i - 1];
      int diag = row[0];
      int left = i;
      row[0] = i;
      for (int j = 1; j <= hypLen; j++) {
        int up = row[j];
        int v = r == hyp[j - 1] ? diag : diag + 1;
        if (up + 1 < v) v = up + 1;
        if (left + 1 < v) v = left + 1;
        diag = up;
        row[j] = v;
        left = v;
      }
    }
    return row[hypLen];
  }

  /** C/S/D/I of the minimum-cost alignment of {@code hyp} against {@code ref} (tie-breaking: see class doc). */
  public EditCounts count(int[] ref, int[] hyp) {
    measure(ref, ref.length, hyp, hyp.length);
    return lastCounts();
  }

  /**
   * C/S/D/I where tokens flagged optional (hesitations, noise markers) cost nothing whether matched,
   * deleted or inserted, and are not counted in N. A null flag array means no token of that side is optional.
   */
  public EditCounts count(int[] ref, boolean[] refOptional, int[] hyp, boolean[] hypOptional) {
    measure(ref, refOptional, hyp, hypOptional);
    return lastCounts();
  }

  /**
   * Allocation-free counts: aligns, keeps C/S/D/I for {@link #lastCorrect()} and friends, and returns the
   * number of errors S + D + I.
   */
  public int measure(int[] ref, int[] hyp) {
    return measure(ref, ref.length, hyp, hyp.length);
  }

  /** As {@link #measure(int[], int[])}, with optional-token flags (null: none optional). */
  public int measure(int[] ref, boolean[] refOptional, int[] hyp, boolean[] hypOptional) {
    int n = strip(ref, refOptional, true);
    int m = strip(hyp, hypOptional, false);
    int[] r = refOptional == null ? ref : refBuf;
    int[] h = hypOptional == null ? hyp : hypBuf;
    return measure(r, n, h, m);
  }

  /** As {@link #measure(int[], int[])} on the first {@code refLen} and {@code hypLen} tokens. */
  public int measure(int[] ref, int refLen, int[] hyp, int hypLen) {
    if (refLen > 0 && hypLen > 0 && refLen <= BitParallelCounts.MAX_REF) {
      int cost = bits.measure(ref, refLen, hyp, hypLen);
      lastCorrect = bits.correct;
      lastSubstitutions = bits.substitutions;
      lastDeletions = bits.deletions;
      lastInsertions = bits.insertions;
      return cost;
    }
    return measureScalar(ref, refLen, hyp, hypLen);
  }

  // Forward pass over two rows (cost and deletions of the preferred path); any length.
  int measureScalar(int[] ref, int refLen, int[] hyp, int hypLen) {
    int cost;
    int del;
    if (refLen == 0 || hypLen == 0) {
      cost = refLen + hypLen;
      del = refLen;
    } else {
      int[] c = costRow = grow(costRow, hypLen + 1);
      int[] d = delRow = grow(delRow, hypLen + 1);
      for (int j = 0; j <= hypLen; j++) {
        c[j] = j;
        d[j] = 0;
      }
      for (int i = 1; i <= refLen; i++) forwardRow(ref[i - 1], i, hyp, hypLen, c, d);
      cost = c[hypLen];
      del = d[hypLen];
    }
    int ins = del + hypLen - refLen;
    int sub = cost - del - ins;
    lastDeletions = del;
    lastInsertions = ins;
    lastSubstitutions = sub;
    lastCorrect = refLen - sub - del;
    return cost;
  }

  // One row of the forward pass; keeps, per cell, the deletion count of the preferred backtrace path.
  private static void forwardRow(int r, int i, int[] hyp, int hypLen, int[] c, int[] d) {
    int diagC = c[0];
    int diagD = d[0];
    int leftC = i;
    int leftD = i;
    c[0] = i;
    d[0] = i;
    for (int j = 1; j <= hypLen; j++) {
      int upC = c[j];
      int upD = d[j];
      int v = r == hyp[j - 1] ? diagC : diagC + 1;
      int vd = diagD;
      if (upC + 1 < v) {
        v = upC + 1;
        vd = upD + 1;
      }
      if (leftC + 1 < v) {
        v = leftC + 1;
        vd = leftD;
      }
      diagC = upC;
      diagD = upD;
      c[j] = v;
      d[j] = vd;
      leftC = v;
      leftD = vd;
    }
  }

  /** C of the last {@link #measure} or {@link #count} call. */
  public int lastCorrect() {
    return lastCorrect;
  }

  /** S of the last {@link #measure} or {@link #count} call. */
  public int lastSubstitutions() {
    return lastSubstitutions;
  }

  /** D of the last {@link #measure} or {@link #count} call. */
  public int lastDeletions() {
    return lastDeletions;
  }

  /** I of the last {@link #measure} or {@link #count} call. */
  public int lastInsertions() {
    return lastInsertions;
  }

  /** Reference tokens N = C + S + D of the last {@link #measure} or {@link #count} call. */
  public int lastReferenceTokens() {
    return lastCorrect + lastSubstitutions + lastDeletions;
  }

  private EditCounts lastCounts() {
    return new EditCounts(lastCorrect, lastSubstitutions, lastDeletions, lastInsertions);
  }

  /** The aligned pairs of the minimum-cost alignment, in order (same tie-breaking and counts as {@link #count}). */
  public Alignment alignment(int[] ref, int[] hyp) {
    return alignment(ref, null, hyp, null);
  }

  /**
   * The aligned pairs with optional tokens removed first (see class doc); indices in the result refer to the
   * original arrays, and optional tokens appear in no step.
   */
  public Alignment alignment(int[] ref, boolean[] refOptional, int[] hyp, boolean[] hypOptional) {
    int n = strip(ref, refOptional, true);
    int m = strip(hyp, hypOptional, false);
    int[] r = refOptional == null ? ref : refBuf;
    int[] h = hypOptional == null ? hyp : hypBuf;
    fillTable(r, n, h, m);
    return backtrace(r, n, h, m, refOptional == null ? null : refMap, hypOptional == null ? null : hypMap);
  }

  private void fillTable(int[] ref, int n, int[] hyp, int m) {
    long cells = (long) (n + 1) * (m + 1);
    if (cells > Integer.MAX_VALUE) throw new IllegalArgumentException("alignment too large: " + n + " x " + m);
    int w = m + 1;
    int[] t = table = grow(table, (int) cells);
    for (int j = 0; j <= m; j++) t[j] = j;
    for (int i = 1; i <= n; i++) {
      int base = i * w;
      int prev = base - w;
      int r = ref[i - 1];
      t[base] = i;
      for (int j = 1; j <= m; j++) {
        int v = r == hyp[j - 1] ? t[prev + j - 1] : t[prev + j - 1] + 1;
        if (t[prev + j] + 1 < v) v = t[prev + j] + 1;
        if (t[base + j - 1] + 1 < v) v = t[base + j - 1] + 1;
        t[base + j] = v;
      }
    }
  }

  private Alignment backtrace(int[] ref, int n, int[] hyp, int m, int[] rMap, int[] hMap) {
    int w = m + 1;
    int[] t = table;
    int steps = 0;
    byte[] ops = new byte[n + m];
    int[] ri = new int[n + m];
    int[] hi = new int[n + m];
    int i = n;
    int j = m;
    while (i > 0 || j > 0) {
      int here = t[i * w + j];
      byte op;
      if (i > 0 && j > 0 && here == t[(i - 1) * w + j - 1] + (ref[i - 1] == hyp[j - 1] ? 0 : 1)) {
        op = ref[i - 1] == hyp[j - 1] ? Alignment.CORRECT : Alignment.SUBSTITUTION;
        i--;
        j--;
        ri[steps] = rMap == null ? i : rMap[i];
        hi[steps] = hMap == null ? j : hMap[j];
      } else if (i > 0 && here == t[(i - 1) * w + j] + 1) {
        op = Alignment.DELETION;
        i--;
        ri[steps] = rMap == null ? i : rMap[i];
        hi[steps] = -1;
      } else {
        op = Alignment.INSERTION;
        j--;
        ri[steps] = -1;
        hi[steps] = hMap == null ? j : hMap[j];
      }
      ops[steps++] = op;
    }
    return Alignment.reversed(ops, ri, hi, steps);
  }

  // Copies the non-optional tokens of seq into refBuf/hypBuf (with their original indices); returns the count.
  private int strip(int[] seq, boolean[] optional, boolean isRef) {
    if (optional == null) return seq.length;
    if (optional.length != seq.length)
      throw new IllegalArgumentException("optional flags " + optional.length + " != tokens " + seq.length);
    int[] buf = isRef ? (refBuf = grow(refBuf, seq.length)) : (hypBuf = grow(hypBuf, seq.length));
    int[] map = isRef ? (refMap = grow(refMap, seq.length)) : (hypMap = grow(hypMap, seq.length));
    int k = 0;
    for (int i = 0; i < seq.length; i++) {
      if (!optional[i]) {
        buf[k] = seq[i];
        map[k++] = i;
      }
    }
    return k;
  }

  private static int[] grow(int[] a, int size) {
    if (a.length >= size) return a;
    long grown = Math.min(Integer.MAX_VALUE - 8L, a.length + (long) (a.length >> 1));
    return new int[(int) Math.max(size, grown)];
  }
}
