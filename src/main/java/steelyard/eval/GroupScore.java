package steelyard.eval;

/**
 * Totals of one breakdown group (speaker, channel, document …).
 *
 * @param group               the group name; empty for utterances without a group
 * @param utterances          utterances counted
 * @param sentencesWithErrors utterances with at least one error
 * @param counts              summed C/S/D/I
 */
public record GroupScore(String group, int utterances, int sentencesWithErrors, EditCounts counts) {
  /** (S + D + I) / N, NaN when N = 0. */
  public double errorRate() {
    return counts.errorRate();
  }

  /** Share of utterances with an error, NaN when there are none. */
  public double sentenceErrorRate() {
    return utterances == 0 ? Double.NaN : (double) sentencesWithErrors / utterances;
  }
}
