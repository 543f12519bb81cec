package steelyard.history;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Objects;
import steelyard.eval.CorpusScore;
import steelyard.eval.UtteranceScores;
import steelyard.rescore.RescoreSummary;

/**
 * The per-utterance error counts of one run, in reference-file order (the order {@code compare} resamples in),
 * followed by the hypothesis utterances that had no reference: what a paired comparison of two stored runs needs.
 *
 * <p>Storage: four parallel arrays indexed by row: the id ({@code String}), a {@code byte} status and two
 * {@code int}s (errors S + D + I, reference tokens N): 9 bytes of primitives and one reference per row besides the
 * id strings, shared with the caller. Immutable; {@link Builder} grows by doubling.
 */
public final class UtteranceCounts {
  private static final UtteranceStatus[] STATUSES = UtteranceStatus.values();
  /** No rows. */
  public static final UtteranceCounts EMPTY = new Builder(0).build();

  private final String[] ids;
  private final byte[] status;
  private final int[] errors;
  private final int[] referenceTokens;

  private UtteranceCounts(String[] ids, byte[] status, int[] errors, int[] referenceTokens) {
    this.ids = ids;
    this.status = status;
    this.errors = errors;
    this.referenceTokens = referenceTokens;
  }

  /**
   * The rows of a score: every reference utterance in reference-file order with its status, then the hypothesis
   * utterances without a reference.
   */
  public static UtteranceCounts of(CorpusScore score) {
    UtteranceScores t = score.table();
    Builder b = new Builder(t.size() + score.missingReferences().size());
    for (int r = 0; r < t.size(); r++) b.add(t.uttId(r), status(t.status(r)), t.errors(r), t.referenceTokens(r));
    for (String id : score.missingReferences()) b.add(id, UtteranceStatus.NO_REFERENCE, 0, 0);
    return b.build();
  }

  /**
   * The rows of a rescoring run with references, in reference-file order when the summary knows it
   * ({@link RescoreSummary#referenceOrder}): each scored utterance (a reference without hypotheses counted as all
   * deletions), then the hypothesis utterances without a reference.
   */
  public static UtteranceCounts of(RescoreSummary s) {
    List<String> ids = s.scoredIds();
    int[] errors = s.errorsPerUtterance();
    int[] tokens = s.referenceTokensPerUtterance();
    java.util.Set<String> missing = new java.util.HashSet<>(s.missingHypothesisIds());
    Builder b = new Builder(ids.size() + s.missingReferenceIds().size());
    for (int k = 0; k < ids.size(); k++)
      b.add(ids.get(k), missing.contains(ids.get(k)) ? UtteranceStatus.MISSING_HYPOTHESIS : UtteranceStatus.SCORED, errors[k], tokens[k]);
    for (String id : s.missingReferenceIds()) b.add(id, UtteranceStatus.NO_REFERENCE, 0, 0);
    UtteranceCounts rows = b.build();
    return s.referenceOrder().isEmpty() ? rows : rows.inOrderOf(s.referenceOrder());
  }

  private static UtteranceStatus status(byte s) {
    switch (s) {
      case UtteranceScores.SCORED: return UtteranceStatus.SCORED;
      case UtteranceScores.MISSING_COUNTED: return UtteranceStatus.MISSING_HYPOTHESIS;
      case UtteranceScores.MISSING_EXCLUDED: return UtteranceStatus.MISSING_EXCLUDED;
      default: throw new AssertionError("unscored row status " + s);
    }
  }

  /**
   * The same rows with those whose id is in {@code referenceOrder} first, in that order, then the others in their
   * own order: for a command that meets utterances in hypotheses-file order (rescoring) and must store them in
   * reference-file order. An id listed but without a row is skipped.
   */
  public UtteranceCounts inOrderOf(Collection<String> referenceOrder) {
    Object2IntOpenHashMap<String> rowOf = new Object2IntOpenHashMap<>(size());
    rowOf.defaultReturnValue(-1);
    for (int r = 0; r < size(); r++) rowOf.putIfAbsent(ids[r], r);
    boolean[] taken = new boolean[size()];
    Builder b = new Builder(size());
    for (String id : referenceOrder) {
      int r = rowOf.getInt(id);
      if (r < 0 || taken[r]) continue;
      taken[r] = true;
      b.add(ids[r], status(r), errors[r], referenceTokens[r]);
    }
    for (int r = 0; r < size(); r++) if (!taken[r]) b.add(ids[r], status(r), errors[r], referenceTokens[r]);
    return b.build();
  }

  public int size() {
    return ids.length;
  }

  public String uttId(int row) {
    return ids[row];
  }

  public UtteranceStatus status(int row) {
    return STATUSES[status[row]];
  }

  /** S + D + I of the row's pick. */
  public int errors(int row) {
    return errors[row];
  }

  /** N = C + S + D of the row (optional tokens excluded). */
  public int referenceTokens(int row) {
    return referenceTokens[row];
  }

  /** Rows that count in the totals ({@link UtteranceStatus#included()}). */
  public int includedCount() {
    int n = 0;
    for (int r = 0; r < size(); r++) if (status(r).included()) n++;
    return n;
  }

  /** Included rows with at least one error. */
  public int includedWithErrors() {
    int n = 0;
    for (int r = 0; r < size(); r++) if (status(r).included() && errors[r] > 0) n++;
    return n;
  }

  /** Errors of the included rows in row order: what a bootstrap of the run's rate resamples. */
  public int[] includedErrors() {
    return included(errors);
  }

  /** Reference tokens of the included rows in row order. */
  public int[] includedReferenceTokens() {
    return included(referenceTokens);
  }

  private int[] included(int[] values) {
    int[] out = new int[includedCount()];
    int k = 0;
    for (int r = 0; r < size(); r++) if (status(r).included()) out[k++] = values[r];
    return out;
  }

  /** Ids of the rows with {@code wanted} status, in row order. */
  public List<String> idsWith(UtteranceStatus wanted) {
    List<String> out = new ArrayList<>();
    for (int r = 0; r < size(); r++) if (status(r) == wanted) out.add(ids[r]);
    return out;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof UtteranceCounts u && Arrays.equals(ids, u.ids) && Arrays.equals(status, u.status)
        && Arrays.equals(errors, u.errors) && Arrays.equals(referenceTokens, u.referenceTokens);
  }

  @Override
  public int hashCode() {
    return Objects.hash(Arrays.hashCode(ids), Arrays.hashCode(errors), Arrays.hashCode(referenceTokens));
  }

  @Override
  public String toString() {
    return "UtteranceCounts[" + size() + " rows]";
  }

  /** Appends rows in order. Not thread-safe. */
  public static final class Builder {
    private String[] ids;
    private byte[] status;
    private int[] errors;
    private int[] referenceTokens;
    private int size;

    public Builder(int expectedRows) {
      int n = Math.max(expectedRows, 0);
      ids = new String[n];
      status = new byte[n];
      errors = new int[n];
      referenceTokens = new int[n];
    }

    /** Appends one row; counts must not be negative. */
    public Builder add(String uttId, UtteranceStatus st, int errorCount, int refTokens) {
      Objects.requireNonNull(uttId, "uttId");
      Objects.requireNonNull(st, "status");
      if (errorCount < 0 || refTokens < 0)
        throw new IllegalArgumentException("negative count for " + uttId + ": errors " + errorCount + ", reference tokens " + refTokens);
      if (size == ids.length) grow();
      ids[size] = uttId;
      status[size] = (byte) st.ordinal();
      errors[size] = errorCount;
      referenceTokens[size] = refTokens;
      size++;
      return this;
    }

    private void grow() {
      int n = Math.max(16, ids.length * 2);
      ids = Arrays.copyOf(ids, n);
      status = Arrays.copyOf(status, n);
      errors = Arrays.copyOf(errors, n);
      referenceTokens = Arrays.copyOf(referenceTokens, n);
    }

    public UtteranceCounts build() {
      return new UtteranceCounts(Arrays.copyOf(ids, size), Arrays.copyOf(status, size), Arrays.copyOf(errors, size),
          Arrays.copyOf(referenceTokens, size));
    }
  }
}
