package steelyard.eval;

import java.util.Arrays;

/**
 * The per-utterance table of one scoring run, one row per reference utterance in reference-file order.
 *
 * <p>Storage: parallel arrays indexed by row: a {@code byte} status, four {@code int} counts (C/S/D/I) and the
 * picked hypothesis's {@code int} rank, plus references to the id, group, reference text and, when texts are
 * kept, the picked hypothesis's text and system: about 25 bytes of primitives and five references per row
 * besides the strings, which are shared with the imported records. Rows are limited to
 * {@link Integer#MAX_VALUE}; counts per utterance to {@link Integer#MAX_VALUE}. Filled by
 * {@link CorpusScorer}; read-only afterwards.
 */
public final class UtteranceScores {
  /** The utterance was never seen among the hypotheses yet (only during scoring). */
  static final byte UNSEEN = 0;
  /** A hypothesis was picked and aligned. */
  public static final byte SCORED = 1;
  /** No hypothesis; counted as all deletions. */
  public static final byte MISSING_COUNTED = 2;
  /** No hypothesis; left out of the totals. */
  public static final byte MISSING_EXCLUDED = 3;

  private final String[] uttIds;
  private final String[] refTexts;
  final String[] groups;
  final byte[] status;
  final int[] correct;
  final int[] substitutions;
  final int[] deletions;
  final int[] insertions;
  final int[] hypRank;
  final String[] hypTexts;
  final String[] hypSystems;

  UtteranceScores(String[] uttIds, String[] refTexts) {
    int n = uttIds.length;
    this.uttIds = uttIds;
    this.refTexts = refTexts;
    groups = new String[n];
    Arrays.fill(groups, "");
    status = new byte[n];
    correct = new int[n];
    substitutions = new int[n];
    deletions = new int[n];
    insertions = new int[n];
    hypRank = new int[n];
    hypTexts = new String[n];
    hypSystems = new String[n];
  }

  void set(int row, byte st, int c, int s, int d, int i) {
    status[row] = st;
    correct[row] = c;
    substitutions[row] = s;
    deletions[row] = d;
    insertions[row] = i;
  }

  public int size() {
    return uttIds.length;
  }

  public String uttId(int row) {
    return uttIds[row];
  }

  /** Group from the reference, else from the picked hypothesis; empty when neither has one. */
  public String group(int row) {
    return groups[row];
  }

  /** {@link #SCORED}, {@link #MISSING_COUNTED} or {@link #MISSING_EXCLUDED}. */
  public byte status(int row) {
    return status[row];
  }

  /** Whether the row counts in the totals. */
  public boolean included(int row) {
    return status[row] == SCORED || status[row] == MISSING_COUNTED;
  }

  public int correct(int row) {
    return correct[row];
  }

  public int substitutions(int row) {
    return substitutions[row];
  }

  public int deletions(int row) {
    return deletions[row];
  }

  public int insertions(int row) {
    return insertions[row];
  }

  /** S + D + I of the row. */
  public int errors(int row) {
    return substitutions[row] + deletions[row] + insertions[row];
  }

  /** N = C + S + D of the row (optional tokens excluded). */
  public int referenceTokens(int row) {
    return correct[row] + substitutions[row] + deletions[row];
  }

  /** The row's counts as a record. */
  public EditCounts counts(int row) {
    return new EditCounts(correct[row], substitutions[row], deletions[row], insertions[row]);
  }

  /** Raw reference text as imported. */
  public String refText(int row) {
    return refTexts[row];
  }

  /** Raw text of the picked hypothesis; null when missing or when texts were not kept. */
  public String hypText(int row) {
    return hypTexts[row];
  }

  /** System of the picked hypothesis; null when missing or when texts were not kept. */
  public String hypSystem(int row) {
    return hypSystems[row];
  }

  /** Rank of the picked hypothesis; 0 when missing. */
  public int hypRank(int row) {
    return hypRank[row];
  }

  /** Per-row errors of the included rows, in row order (for resampling). */
  public int[] includedErrors() {
    return includedValues(true);
  }

  /** Per-row reference tokens of the included rows, in row order (for resampling). */
  public int[] includedReferenceTokens() {
    return includedValues(false);
  }

  private int[] includedValues(boolean errors) {
    int n = 0;
    for (int r = 0; r < size(); r++) if (included(r)) n++;
    int[] out = new int[n];
    int k = 0;
    for (int r = 0; r < size(); r++) if (included(r)) out[k++] = errors ? errors(r) : referenceTokens(r);
    return out;
  }
}
