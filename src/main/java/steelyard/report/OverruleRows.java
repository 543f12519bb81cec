package steelyard.report;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import steelyard.audit.AuditCounts;
import steelyard.audit.AuditInput;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.eval.TokenTally;
import steelyard.report.html.ReportModel;
import steelyard.report.html.TokenAlignment;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;

/**
 * The audit part of a report section: the summary by verdict and one row per overrule with both sides aligned
 * against the reference ({@link TokenAlignment}), the flip interval and the decisive n-grams.
 *
 * <p>Alignments leave out the tokens the rules file makes optional, on both sides, exactly as scoring counts them,
 * so a row's marks add up to its error count. In a character section the space token ({@link Normaliser#SPACE_TOKEN})
 * is shown as a space. Not thread-safe (one aligner per instance).
 */
final class OverruleRows {
  private final TokenAlignment align = new TokenAlignment();
  private final boolean characters;

  OverruleRows(boolean characters) {
    this.characters = characters;
  }

  /** The counts by verdict over the whole run, with the most often fixed and broken token pairs. */
  ReportModel.AuditSummary summary(AuditCounts t) {
    return new ReportModel.AuditSummary(Math.toIntExact(t.helped()), Math.toIntExact(t.hurt()), Math.toIntExact(t.neutral()),
        Math.toIntExact(t.unverified()), t.netErrorChange(), pairs(t.mostFixed()), pairs(t.mostBroken()));
  }

  /** Every overrule of {@code audit} in its order; {@code audited} supplies references and optional-token flags. */
  List<ReportModel.Overrule> rows(AuditReport audit, List<AuditInput> audited) {
    Map<String, AuditInput> byId = new HashMap<>(audited.size() * 2);
    for (AuditInput in : audited) byId.putIfAbsent(in.result().uttId(), in);
    List<ReportModel.Overrule> out = new ArrayList<>(audit.overrules().size());
    for (Overrule o : audit.overrules()) out.add(row(o, byId.get(o.uttId())));
    return out;
  }

  private ReportModel.Overrule row(Overrule o, AuditInput in) {
    TokenSequence ref = in == null ? null : in.reference();
    return new ReportModel.Overrule(o.uttId(), o.group(), ReportModel.Verdict.valueOf(o.verdict().name()), margin(o), flip(o),
        decisive(o.ngrams()), o.reference(), aligned(o.first(), ref, in), aligned(o.pick(), ref, in));
  }

  /** Total of the pick minus that of rank 1: the log-linear margin, or for a new transcript the search paths' margin. */
  private static double margin(Overrule o) {
    if (o.breakdown() != null) return o.breakdown().margin();
    return o.path() != null ? o.path().margin() : Double.NaN;
  }

  /**
   * The pick's interval along the LM weight (λ for N-best, λ′ for the network search): from its lower edge to its
   * upper edge, the other weights fixed; exact for N-best, on the search-path pool otherwise.
   */
  private static ReportModel.Flip flip(Overrule o) {
    FlipWeights f = o.flip();
    if (f == null) return null;
    String name = o.method() == RescoreMethod.NBEST ? "λ" : "λ′";
    return new ReportModel.Flip(name, f.lower(), f.upper(), f.basis() == FlipWeights.Basis.EXACT);
  }

  private ReportModel.AlignedText aligned(Overrule.Side side, TokenSequence ref, AuditInput in) {
    String text = side.text();
    if (ref == null || side.errors() < 0) return ReportModel.AlignedText.unaligned(text);
    boolean[] optional = side.isNewTranscript() ? new boolean[side.tokens().size()]
        : in.result().scores().tokens(side.index()).optional();
    return align.align(text, required(ref.tokens(), ref.optional()), required(side.tokens(), optional));
  }

  private List<String> required(List<String> tokens, boolean[] optional) {
    List<String> out = new ArrayList<>(tokens.size());
    for (int k = 0; k < tokens.size(); k++) if (!optional[k]) out.add(shown(tokens.get(k)));
    return out;
  }

  private String shown(String token) {
    return characters && Normaliser.SPACE_TOKEN.equals(token) ? " " : token;
  }

  /**
   * The decisive n-grams, largest difference first: the pick's n-gram where it has one, else rank 1's (its tokens
   * as written, oldest first; its length is the order the model matched, so a back-off shows as a shorter n-gram).
   */
  private List<ReportModel.DecisiveNgram> decisive(DecisiveNgrams n) {
    List<ReportModel.DecisiveNgram> out = new ArrayList<>();
    if (n == null) return out;
    for (DecisiveNgrams.Contribution c : n.contributions()) {
      DecisiveNgrams.NgramUse use = c.pick() != null ? c.pick() : c.first();
      List<String> shown = new ArrayList<>(use.ngram().size());
      for (String t : use.ngram()) shown.add(shown(t));
      out.add(new ReportModel.DecisiveNgram(String.join(characters ? "" : " ", shown), c.difference()));
    }
    return out;
  }

  private List<ReportModel.PairCount> pairs(List<TokenTally> tallies) {
    List<ReportModel.PairCount> out = new ArrayList<>(tallies.size());
    for (TokenTally t : tallies)
      out.add(new ReportModel.PairCount(t.ref() == null ? "" : shown(t.ref()), t.hyp() == null ? "" : shown(t.hyp()),
          Math.toIntExact(t.count())));
    return out;
  }
}
