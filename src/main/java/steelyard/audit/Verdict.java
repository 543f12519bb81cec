package steelyard.audit;

import java.util.Locale;

/** What an overrule did to the error count against the reference. */
public enum Verdict {
  /** The pick has fewer errors than rank 1. */
  HELPED,
  /** The pick has more errors than rank 1. */
  HURT,
  /** Both have the same number of errors. */
  NEUTRAL,
  /** The utterance has no reference. */
  UNVERIFIED;

  /** The lower-case name written in the JSON and CSV outputs. */
  public String label() {
    return name().toLowerCase(Locale.ROOT);
  }

  /** The verdict for {@code firstErrors} of rank 1 against {@code pickErrors} of the pick (negative: no reference). */
  static Verdict of(long firstErrors, long pickErrors) {
    if (firstErrors < 0 || pickErrors < 0) return UNVERIFIED;
    return pickErrors < firstErrors ? HELPED : pickErrors > firstErrors ? HURT : NEUTRAL;
  }
}
