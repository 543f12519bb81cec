package steelyard.rescore;

import java.util.Locale;

/** How the transcript of an utterance is chosen. */
public enum RescoreMethod {
  /** The hypothesis with the highest log-linear total. */
  NBEST,
  /** Minimum Bayes risk: the hypothesis with the fewest expected errors under the posteriors. */
  MBR,
  /** Consensus decoding over a confusion network of the hypotheses (highest-posterior arc per slot). */
  CONSENSUS,
  /** LM-rescored search over a confusion network of the hypotheses. */
  LATTICE;

  /** The lower-case name used on the command line, in picks.csv and in the weights file. */
  public String label() {
    return name().toLowerCase(Locale.ROOT);
  }

  /** Whether the method works on a confusion network (and may produce a new transcript). */
  public boolean usesNetwork() {
    return this == CONSENSUS || this == LATTICE;
  }
}
