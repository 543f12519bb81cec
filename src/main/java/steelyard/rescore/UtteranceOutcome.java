package steelyard.rescore;

/**
 * What a streaming run ({@link RescoreSession#run}) delivers per utterance, in input order.
 *
 * @param result the choice with its score breakdown
 * @param errors its errors against the reference; null when the run has no references or this utterance has none
 */
public record UtteranceOutcome(UtteranceResult result, UtteranceErrors errors) {
  public String uttId() {
    return result.uttId();
  }
}
