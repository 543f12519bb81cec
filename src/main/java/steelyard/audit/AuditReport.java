package steelyard.audit;

import java.util.List;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Unit;

/**
 * The audit of a rescoring run: every overrule in input order, the counts of the run and of each group, and the
 * run's error totals against the references, which tie the counts to the corpus:
 * {@code total().netErrorChange() == firstErrors() − chosenErrors()}.
 *
 * @param method            the rescoring method (null when no utterance was audited)
 * @param unit              the scoring unit
 * @param featureNames      the selected features, in the order of the breakdowns' feature terms
 * @param utterances        utterances audited
 * @param verifiedUtterances utterances with a reference
 * @param referenceTokens   reference tokens of those (optional tokens excluded)
 * @param firstErrors       errors of rank 1 over the utterances with a reference
 * @param chosenErrors      errors of the picks over the same utterances
 * @param total             the counts over all overrules
 * @param groups            the counts per group, groups sorted by name
 * @param overrules         every overrule, in input order
 */
public record AuditReport(
    RescoreMethod method, Unit unit, List<String> featureNames, long utterances, long verifiedUtterances,
    long referenceTokens, long firstErrors, long chosenErrors, AuditCounts total, List<AuditCounts> groups,
    List<Overrule> overrules) {
  /** Said with every audit: an automatic pick is a statistical choice. */
  public static final String NOTICE = steelyard.rescore.RescoreSummary.NOTICE;

  public AuditReport {
    featureNames = List.copyOf(featureNames);
    groups = List.copyOf(groups);
    overrules = List.copyOf(overrules);
  }
}
