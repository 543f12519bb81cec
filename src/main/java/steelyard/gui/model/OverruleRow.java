package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.audit.Verdict;

/**
 * One row of the overrule table: an utterance whose pick differs from rank 1, as the audit explains it.
 *
 * @param uttId        utterance id
 * @param group        group
 * @param verdict      helped, hurt, neutral or unverified
 * @param firstErrors  errors of rank 1 (−1 without a reference)
 * @param pickErrors   errors of the pick (−1 without a reference)
 * @param margin       pick total − rank 1 total (natural log; NaN for a new transcript, which has no total)
 * @param flipLow      lower edge of the LM weight interval in which the pick holds (−∞: none; NaN: not computed)
 * @param flipHigh     upper edge (+∞: none; NaN: not computed)
 * @param returnWeight the nearest LM weight at which rank 1 is picked again (NaN: never, or not computed)
 * @param flipExact    whether the flip weights are exact (N-best) rather than over a path pool
 * @param topNgram     the largest decisive n-gram difference as text, e.g. {@code "bay four" +2.31}; empty without a model
 * @param overrule     the audit's record
 */
public record OverruleRow(
    String uttId, String group, Verdict verdict, long firstErrors, long pickErrors, double margin, double flipLow, double flipHigh,
    double returnWeight, boolean flipExact, String topNgram, Overrule overrule) {

  /** The rows of {@code report}, in its order. */
  public static List<OverruleRow> of(AuditReport report) {
    List<OverruleRow> out = new ArrayList<>(report.overrules().size());
    for (Overrule o : report.overrules()) {
      FlipWeights f = o.flip();
      double margin = o.breakdown() != null ? o.breakdown().margin() : o.path() != null ? o.path().margin() : Double.NaN;
      out.add(new OverruleRow(o.uttId(), o.group(), o.verdict(), o.first().errors(), o.pick().errors(), margin,
          f == null ? Double.NaN : f.lower(), f == null ? Double.NaN : f.upper(), f == null ? Double.NaN : f.returnWeight(),
          f != null && f.basis() == FlipWeights.Basis.EXACT, top(o.ngrams()), o));
    }
    return out;
  }

  /** The listed n-gram contributions of {@code o} as lines: pick n-gram, rank 1 n-gram, difference. */
  public static List<String> ngramLines(Overrule o) {
    List<String> out = new ArrayList<>();
    if (o.ngrams() == null) return out;
    for (DecisiveNgrams.Contribution c : o.ngrams().contributions()) {
      out.add(String.format(Locale.ROOT, "%-28s %-28s %+8.3f", use(c.pick()), use(c.first()), c.difference()));
    }
    return out;
  }

  private static String top(DecisiveNgrams n) {
    if (n == null || n.contributions().isEmpty()) return "";
    DecisiveNgrams.Contribution c = n.contributions().get(0);
    DecisiveNgrams.NgramUse u = c.pick() != null ? c.pick() : c.first();
    return String.format(Locale.ROOT, "\"%s\" %+.2f", String.join(" ", u.ngram()), c.difference());
  }

  private static String use(DecisiveNgrams.NgramUse u) {
    if (u == null) return "—";
    return String.format(Locale.ROOT, "%s (%d-gram %.2f)", String.join(" ", u.ngram()), u.order(), u.logProb());
  }
}
