package steelyard.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.audit.ScoreBreakdown;
import steelyard.eval.TokenTally;
import steelyard.io.AtomicOutput;
import steelyard.io.CsvWriter;

/**
 * The overrule audit as CSV, one row per overrule, through the project's {@link CsvWriter}: safe to open
 * in a spreadsheet (a text cell starting with {@code =}, {@code +}, {@code -} or {@code @} gets a leading
 * apostrophe). Scores are natural log with {@value AuditJson#DIGITS} decimals; an empty cell is an unbounded
 * interval edge, a value that does not apply, or an undefined one. Columns are listed in the README's audit
 * section; {@code feature.NAME_delta} columns follow the run's features.
 */
public final class AuditCsv {
  private AuditCsv() {}

  /** Writes the table atomically to {@code target} ({@code -}: stdout), spreadsheet-safe. */
  public static void write(Path target, AuditReport r) {
    AtomicOutput.writeText(target, w -> write(w, r, true));
  }

  /** Writes the header and one row per overrule to {@code out} (not closed). */
  public static void write(Writer out, AuditReport r, boolean spreadsheetSafe) throws IOException {
    CsvWriter csv = new CsvWriter(out, spreadsheetSafe);
    csv.row(header(r.featureNames()));
    for (Overrule o : r.overrules()) csv.row(row(o, r.featureNames().size()));
    csv.flush();
  }

  static String[] header(List<String> features) {
    List<String> h = new ArrayList<>(List.of("utt_id", "group", "method", "verdict", "error_change", "rank1_errors",
        "pick_errors", "rank1_text", "pick_text", "new_transcript", "reference", "margin"));
    for (String f : features) h.add("feature." + f + "_delta");
    h.addAll(List.of("lm_term_delta", "oov_term_delta", "length_term_delta", "path_margin", "flip_basis", "flip_lower",
        "weight_now", "flip_upper", "flip_distance", "rank1_return_weight", "lm_ln_prob_delta", "top_ngram_pick",
        "top_ngram_rank1", "top_ngram_difference", "fixed", "broken"));
    return h.toArray(new String[0]);
  }

  private static String[] row(Overrule o, int features) {
    List<String> c = new ArrayList<>(30 + features);
    c.addAll(List.of(o.uttId(), o.group(), o.method().label(), o.verdict().label(), Long.toString(o.errorChange()),
        errors(o.first()), errors(o.pick()), o.first().text(), o.pick().text(),
        Boolean.toString(o.pick().isNewTranscript()), o.reference() == null ? "" : o.reference()));
    ScoreBreakdown b = o.breakdown();
    c.add(b == null ? "" : num(b.margin()));
    for (int t = 0; t < features + 3; t++) c.add(b == null ? "" : num(b.terms().get(t).delta()));
    c.add(o.path() == null ? "" : num(o.path().margin()));
    flip(c, o.flip());
    ngrams(c, o.ngrams());
    c.add(pairs(o.fixed()));
    c.add(pairs(o.broken()));
    return c.toArray(new String[0]);
  }

  private static void flip(List<String> c, FlipWeights f) {
    if (f == null) {
      for (int k = 0; k < 6; k++) c.add("");
      return;
    }
    c.addAll(List.of(f.basis().label(), num(f.lower()), num(f.weight()), num(f.upper()), num(f.distance()),
        num(f.returnWeight())));
  }

  private static void ngrams(List<String> c, DecisiveNgrams d) {
    if (d == null) {
      for (int k = 0; k < 4; k++) c.add("");
      return;
    }
    c.add(num(d.delta()));
    DecisiveNgrams.Contribution top = d.contributions().isEmpty() ? null : d.contributions().get(0);
    c.add(top == null ? "" : ngram(top.pick()));
    c.add(top == null ? "" : ngram(top.first()));
    c.add(top == null ? "" : num(top.difference()));
  }

  /** {@code w1 w2 w3 [3]}: the n-gram and the order matched; empty when that side has no token here. */
  private static String ngram(DecisiveNgrams.NgramUse u) {
    return u == null ? "" : String.join(" ", u.ngram()) + " [" + u.order() + "]";
  }

  /** {@code ref>hyp×n} pairs joined by {@code "; "}; an empty side is written {@code ∅}. */
  private static String pairs(List<TokenTally> pairs) {
    StringBuilder sb = new StringBuilder();
    for (TokenTally t : pairs) {
      if (sb.length() > 0) sb.append("; ");
      sb.append(t.ref().isEmpty() ? "∅" : t.ref()).append('>').append(t.hyp().isEmpty() ? "∅" : t.hyp());
      if (t.count() > 1) sb.append('×').append(t.count());
    }
    return sb.toString();
  }

  private static String errors(Overrule.Side s) {
    return s.errors() < 0 ? "" : Long.toString(s.errors());
  }

  /** Fixed decimals; empty for ±∞ and NaN. */
  private static String num(double v) {
    return Double.isFinite(v) ? Numbers.fixed(v, AuditJson.DIGITS) : "";
  }
}
