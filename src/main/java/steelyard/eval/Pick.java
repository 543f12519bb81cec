package steelyard.eval;

import java.util.Locale;

/** Which hypothesis of an utterance is scored. */
public enum Pick {
  /** The recogniser's own choice, rank 1 ({@code UtteranceHypotheses.first()}): the baseline. */
  FIRST,
  /**
   * The hypothesis with the fewest errors against the reference (the N-best lower bound); ties go to the
   * smaller rank, then to the recogniser's choice, then to the earlier row in the file.
   */
  ORACLE,
  /** Chosen by the caller per utterance (for instance a rescoring); see {@code CorpusScorer.score(…, chooser)}. */
  GIVEN;

  /** The lower-case name used on the command line and in reports. */
  public String label() {
    return name().toLowerCase(Locale.ROOT);
  }
}
