package steelyard.eval;

import java.util.List;

/**
 * The result of scoring one pick of hypotheses against references.
 *
 * @param pick                which hypothesis was scored per utterance
 * @param missingPolicy       how utterances without a hypothesis were counted
 * @param totals              summed C/S/D/I over the included utterances
 * @param utterances          included utterances (scored, plus missing ones counted as all deletions)
 * @param sentencesWithErrors included utterances with at least one error
 * @param groups              per-group totals sorted by group name; empty when no utterance has a group
 * @param substitutions       most frequent substitution pairs (count descending, then reference, then hypothesis text)
 * @param deletions           most frequent deleted reference tokens (same order)
 * @param insertions          most frequent inserted hypothesis tokens (same order)
 * @param table               one row per reference utterance, in reference-file order
 * @param missingHypotheses   ids of references with no hypothesis, in reference-file order
 * @param missingReferences   ids of hypothesis utterances with no reference (never scored), in hypothesis-file order
 * @param warnings            human-readable warnings, in the order they arose
 */
public record CorpusScore(
    Pick pick,
    MissingHypothesisPolicy missingPolicy,
    EditCounts totals,
    int utterances,
    int sentencesWithErrors,
    List<GroupScore> groups,
    List<TokenTally> substitutions,
    List<TokenTally> deletions,
    List<TokenTally> insertions,
    UtteranceScores table,
    List<String> missingHypotheses,
    List<String> missingReferences,
    List<String> warnings) {

  public CorpusScore {
    groups = List.copyOf(groups);
    substitutions = List.copyOf(substitutions);
    deletions = List.copyOf(deletions);
    insertions = List.copyOf(insertions);
    missingHypotheses = List.copyOf(missingHypotheses);
    missingReferences = List.copyOf(missingReferences);
    warnings = List.copyOf(warnings);
  }

  /** Corpus error rate (S + D + I) / N; NaN when N = 0 (reported as null, with a warning). */
  public double errorRate() {
    return totals.errorRate();
  }

  /** Share of included utterances with at least one error; NaN when none is included. */
  public double sentenceErrorRate() {
    return utterances == 0 ? Double.NaN : (double) sentencesWithErrors / utterances;
  }
}
