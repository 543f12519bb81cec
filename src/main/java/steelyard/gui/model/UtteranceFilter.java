package steelyard.gui.model;

import java.util.Locale;

/** Which utterances the list shows. */
public enum UtteranceFilter {
  ALL("All utterances"),
  CHANGED("Changed from rank 1"),
  HELPED("Helped"),
  HURT("Hurt"),
  STILL_WRONG("Still wrong"),
  NEW_TRANSCRIPT("New transcripts");

  private final String label;

  UtteranceFilter(String label) {
    this.label = label;
  }

  /** Whether {@code row} passes this filter. */
  public boolean accepts(UtteranceRow row) {
    switch (this) {
      case ALL: return true;
      case CHANGED: return row.verdict() != Choices.Verdict.SAME;
      case HELPED: return row.verdict() == Choices.Verdict.HELPED;
      case HURT: return row.verdict() == Choices.Verdict.HURT;
      case STILL_WRONG: return row.pickErrors() > 0;
      case NEW_TRANSCRIPT: return row.newTranscript();
      default: throw new AssertionError(this);
    }
  }

  /** Whether {@code row} matches the search text (case-insensitive, in the id, the pick, rank 1 or the reference). */
  public static boolean matches(UtteranceRow row, String query) {
    if (query == null || query.isBlank()) return true;
    String q = query.strip().toLowerCase(Locale.ROOT);
    return contains(row.uttId(), q) || contains(row.pickText(), q) || contains(row.firstText(), q) || contains(row.referenceText(), q);
  }

  private static boolean contains(String s, String q) {
    return s != null && s.toLowerCase(Locale.ROOT).contains(q);
  }

  @Override
  public String toString() {
    return label;
  }
}
