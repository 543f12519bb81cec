package steelyard.gui.model;

/**
 * The corpus-level figures of one choice over every utterance, as the rescore summary counts them: errors
 * (S + D + I) summed over utterances with a reference, divided by their reference tokens; references without
 * hypotheses count every token deleted in all three rates.
 *
 * @param utterances      utterances with hypotheses
 * @param scored          utterances with a reference (including references without hypotheses)
 * @param referenceTokens N, the summed reference tokens of the scored utterances (optional tokens excluded)
 * @param errors          errors of the choice
 * @param firstErrors     errors of the recogniser's rank 1
 * @param oracleErrors    errors of the best hypothesis in each list (the N-best oracle)
 * @param changed         choices whose tokens differ from rank 1's
 * @param helped          choices with fewer errors than rank 1
 * @param hurt            choices with more errors than rank 1
 * @param newTranscripts  choices that no input hypothesis contains (network methods)
 */
public record CorpusFigures(
    int utterances, int scored, long referenceTokens, long errors, long firstErrors, long oracleErrors, int changed,
    int helped, int hurt, int newTranscripts) {

  /** Error rate of the choice, or NaN without references. */
  public double errorRate() {
    return rate(errors);
  }

  /** Error rate of rank 1, or NaN without references. */
  public double firstErrorRate() {
    return rate(firstErrors);
  }

  /** Error rate of the N-best oracle, or NaN without references. */
  public double oracleErrorRate() {
    return rate(oracleErrors);
  }

  private double rate(long e) {
    return referenceTokens == 0 ? Double.NaN : (double) e / referenceTokens;
  }
}
