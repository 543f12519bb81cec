package steelyard.eval;

import java.util.Locale;

/** How a reference utterance with no hypothesis at all is counted. */
public enum MissingHypothesisPolicy {
  /** As an empty hypothesis: every reference token is a deletion (the default: nothing is hidden). */
  ALL_DELETIONS,
  /** Left out of every total; still listed by id as missing. */
  EXCLUDE;

  /** The command-line spelling: {@code all-deletions} or {@code exclude}. */
  public String label() {
    return name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  /** Parses {@link #label()} (case-insensitive; '_' accepted for '-'); null when unknown. */
  public static MissingHypothesisPolicy fromLabel(String s) {
    String norm = s.trim().toLowerCase(Locale.ROOT).replace('_', '-');
    for (MissingHypothesisPolicy p : values()) if (p.label().equals(norm)) return p;
    return null;
  }
}
