package steelyard.eval;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import steelyard.io.InputException;

/**
 * Checks that a hypotheses file and a references file are about the same utterances. Files that share no
 * utterance id (a test set scored against dev references, ids renamed by one tool) would otherwise score
 * every reference as all deletions — a 100 % error rate with exit code 0 — so that is refused; a small
 * overlap, less than {@value #SMALL_PERCENT} % of either side, is allowed with a warning that gives the counts.
 */
public final class UtteranceOverlap {
  /** Below this share of either side, in per cent, the overlap gets a warning. */
  public static final int SMALL_PERCENT = 50;

  private UtteranceOverlap() {}

  /**
   * @param hypotheses           the hypotheses file as named in messages (with its system when one is picked)
   * @param references           the references file (for messages)
   * @param referenceIds         every reference id, in file order
   * @param missingHypotheses    reference ids with no hypothesis
   * @param missingReferences    hypothesis utterance ids with no reference, in file order
   * @return a warning with the counts when the overlap is small, else null
   * @throws InputException when the files share no utterance id although at least one of them has some
   */
  public static String check(String hypotheses, Path references, List<String> referenceIds,
      List<String> missingHypotheses, List<String> missingReferences) {
    long refs = referenceIds.size();
    long shared = refs - missingHypotheses.size();
    long hyps = shared + missingReferences.size();
    if (shared == 0 && (refs > 0 || hyps > 0)) {
      throw InputException.inFile(references, "shares no utterance id with " + hypotheses + " (references: "
          + sample(referenceIds) + "; hypotheses: " + sample(missingReferences) + ")",
          "references of the same utterances as the hypotheses (are both files from the same set?)");
    }
    if (shared * 100 >= SMALL_PERCENT * refs && shared * 100 >= SMALL_PERCENT * hyps) return null;
    return String.format(Locale.ROOT, "%s and %s have few utterances in common: %d of %d references (%d %%) have hypotheses, "
        + "%d of %d hypothesis utterances (%d %%) have references", hypotheses, references, shared, refs,
        percent(shared, refs), shared, hyps, percent(shared, hyps));
  }

  private static long percent(long part, long whole) {
    return whole == 0 ? 0 : Math.round(100.0 * part / whole);
  }

  /** The first two ids, quoted, or {@code none}. */
  private static String sample(List<String> ids) {
    if (ids.isEmpty()) return "none";
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < Math.min(2, ids.size()); i++) {
      if (i > 0) sb.append(", ");
      sb.append('\'').append(shown(ids.get(i))).append('\'');
    }
    if (ids.size() > 2) sb.append(", …");
    return sb.toString();
  }

  private static String shown(String id) {
    return steelyard.io.Messages.shown(id, 40);
  }
}
