package steelyard.gui.model;

import java.util.List;
import steelyard.io.Reference;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * Everything the window holds in memory after opening a set of files: every utterance's scored hypotheses
 * (unweighted terms, computed once), its reference and the errors of each hypothesis against it. Re-weighting
 * reads these arrays and never scores or aligns again.
 *
 * <p>Storage, U utterances, H kept hypotheses in all: the {@link ScoredUtterance}s (about 8·F + 28 bytes per
 * hypothesis plus token lists), {@code hypErrors} {@code int[H]} and {@code sameAsFirst} {@code boolean[H]}
 * (flat, utterance u's hypotheses at {@code [start[u], start[u+1])}), and per utterance the reference
 * tokens, N and the rank-1 and oracle errors ({@code int[U]} each). Immutable.
 */
public final class Corpus {
  /** Errors of a hypothesis or utterance that has no reference. */
  public static final int NO_REFERENCE = -1;

  private final List<String> featureNames;
  private final Unit unit;
  private final ScoredUtterance[] scored;
  private final String[] groups;
  private final Reference[] references;
  private final TokenSequence[] referenceTokens;
  private final int[] referenceLength;
  private final int[] start;
  private final int[] hypErrors;
  private final boolean[] sameAsFirst;
  private final List<Reference> orphans;
  private final long orphanTokens;
  private final int[] firstErrors;
  private final int[] oracleErrors;

  Corpus(List<String> featureNames, Unit unit, ScoredUtterance[] scored, String[] groups, Reference[] references,
      TokenSequence[] referenceTokens, int[] referenceLength, int[] start, int[] hypErrors, boolean[] sameAsFirst,
      List<Reference> orphans, long orphanTokens) {
    this.featureNames = List.copyOf(featureNames);
    this.unit = unit;
    this.scored = scored;
    this.groups = groups;
    this.references = references;
    this.referenceTokens = referenceTokens;
    this.referenceLength = referenceLength;
    this.start = start;
    this.hypErrors = hypErrors;
    this.sameAsFirst = sameAsFirst;
    this.orphans = List.copyOf(orphans);
    this.orphanTokens = orphanTokens;
    this.firstErrors = new int[scored.length];
    this.oracleErrors = new int[scored.length];
    for (int u = 0; u < scored.length; u++) {
      firstErrors[u] = hypErrors[start[u] + scored[u].firstIndex()];
      int best = Integer.MAX_VALUE;
      for (int k = start[u]; k < start[u + 1]; k++) best = Math.min(best, hypErrors[k]);
      oracleErrors[u] = best;
    }
  }

  public List<String> featureNames() { return featureNames; }
  public Unit unit() { return unit; }
  /** Number of utterances with hypotheses. */
  public int size() { return scored.length; }
  public ScoredUtterance scored(int u) { return scored[u]; }
  public String uttId(int u) { return scored[u].uttId(); }
  /** The group of rank 1's row, else the reference's; empty when neither has one. */
  public String group(int u) { return groups[u]; }
  public boolean hasReference(int u) { return referenceTokens[u] != null; }
  /** The reference row, or null. */
  public Reference reference(int u) { return references[u]; }
  /** Normalised reference tokens in the scoring unit, or null. */
  public TokenSequence referenceTokens(int u) { return referenceTokens[u]; }
  /** N of utterance u: its non-optional reference tokens (0 without a reference). */
  public int referenceLength(int u) { return referenceLength[u]; }
  /** Whether any utterance has a reference. */
  public boolean hasReferences() { return orphans.size() > 0 || anyReference(); }
  /** References whose utterance has no hypotheses (every token counts as deleted). */
  public List<Reference> orphanReferences() { return orphans; }
  /** Summed N of the orphan references. */
  public long orphanTokens() { return orphanTokens; }

  /** Errors (S + D + I) of kept hypothesis {@code i} of utterance {@code u}, or {@link #NO_REFERENCE}. */
  public int errors(int u, int i) {
    return hypErrors[start[u] + i];
  }

  /** Whether hypothesis {@code i}'s tokens equal those of rank 1 (choosing it changes nothing). */
  public boolean sameAsFirst(int u, int i) {
    return sameAsFirst[start[u] + i];
  }

  /** Errors of rank 1, or {@link #NO_REFERENCE}. */
  public int firstErrors(int u) {
    return firstErrors[u];
  }

  /** Fewest errors of any kept hypothesis, or {@link #NO_REFERENCE}. */
  public int oracleErrors(int u) {
    return oracleErrors[u];
  }

  /** Total kept hypotheses. */
  public int hypothesisCount() {
    return hypErrors.length;
  }

  private boolean anyReference() {
    for (TokenSequence r : referenceTokens) if (r != null) return true;
    return false;
  }
}
