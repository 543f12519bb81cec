package steelyard.audit;

import java.util.List;
import steelyard.eval.TokenTally;

/**
 * The overrules of the whole run or of one group, counted.
 *
 * @param group          the group ("" for a group column that was empty); null for the whole run
 * @param overrules      utterances whose pick differs from rank 1
 * @param helped         overrules with fewer errors than rank 1
 * @param hurt           overrules with more errors than rank 1
 * @param neutral        overrules with as many errors as rank 1
 * @param unverified     overrules without a reference
 * @param netErrorChange Σ over verified overrules of errors(rank 1) − errors(pick): positive means fewer errors
 * @param mostFixed      error pairs of rank 1 most often removed by an overrule (count = utterance-level pair count)
 * @param mostBroken     error pairs most often introduced by an overrule
 */
public record AuditCounts(
    String group, long overrules, long helped, long hurt, long neutral, long unverified, long netErrorChange,
    List<TokenTally> mostFixed, List<TokenTally> mostBroken) {
  public AuditCounts {
    mostFixed = List.copyOf(mostFixed);
    mostBroken = List.copyOf(mostBroken);
  }
}
