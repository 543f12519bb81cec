package steelyard.io;

/**
 * One competing transcript for an utterance, as imported.
 *
 * @param uttId     utterance id, never empty
 * @param system    recogniser or configuration name; empty string when the file has no {@code system} column
 * @param rank      that system's own rank, 1 = its best; when the file has no rank column, the 1-based
 *                  position within (utterance, system) in file order
 * @param text      the raw text exactly as in the file (an empty string is a valid, empty transcript)
 * @param features  the selected feature columns (in the order of {@link ImportOptions#features()}),
 *                  converted by each column's {@link FeatureSpec} to a natural-log score, higher is better
 * @param group     value of an optional {@code group} column, empty when absent
 * @param fileOrder 0-based position of the row among all rows of its utterance (the last tie-breaker)
 * @param line      1-based line of the row in its file, for messages
 */
public record Hypothesis(
    String uttId, String system, int rank, String text, double[] features, String group, int fileOrder, long line) {

  /** Natural-log score of the {@code index}-th selected feature, higher is better. */
  public double feature(int index) {
    return features[index];
  }
}
