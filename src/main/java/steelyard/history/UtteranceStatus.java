package steelyard.history;

/**
 * How one utterance of a stored run counted, with the labels of the {@code score} command's per-utterance table
 * (plus one for hypotheses without a reference).
 */
public enum UtteranceStatus {
  /** A hypothesis was picked and aligned; counts in the totals. */
  SCORED("scored"),
  /** No hypothesis; counted as all deletions (counts in the totals). */
  MISSING_HYPOTHESIS("missing_hypothesis"),
  /** No hypothesis; left out of the totals. */
  MISSING_EXCLUDED("missing_excluded"),
  /** A hypothesis utterance with no reference; never scored (errors and reference tokens 0). */
  NO_REFERENCE("no_reference");

  private final String label;

  UtteranceStatus(String label) {
    this.label = label;
  }

  /** The label stored in the history and shown in reports. */
  public String label() {
    return label;
  }

  /** Whether the utterance counts in the run's totals and in a paired comparison. */
  public boolean included() {
    return this == SCORED || this == MISSING_HYPOTHESIS;
  }

  /** The status with this label, or null when none has it. */
  public static UtteranceStatus fromLabel(String label) {
    for (UtteranceStatus s : values()) if (s.label.equals(label)) return s;
    return null;
  }
}
