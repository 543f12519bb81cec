package steelyard.rescore;

import steelyard.eval.EditCounts;

/**
 * Errors of one utterance against its reference.
 *
 * @param chosen        counts of the chosen transcript
 * @param first         counts of the recogniser's rank 1
 * @param oracle        counts of the kept hypothesis with the fewest errors (the N-best oracle)
 * @param latticeOracle fewest errors of any path through the confusion network, or −1 when not computed
 */
public record UtteranceErrors(EditCounts chosen, EditCounts first, EditCounts oracle, long latticeOracle) {}
