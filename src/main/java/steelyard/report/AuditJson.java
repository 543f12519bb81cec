package steelyard.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.file.Path;
import java.util.List;
import steelyard.audit.AuditCounts;
import steelyard.io.JsonOutput;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.audit.PathComparison;
import steelyard.audit.ScoreBreakdown;
import steelyard.eval.TokenTally;
import steelyard.io.JsonOutput;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * The overrule audit as JSON, through the project's one JSON set-up ({@link JsonOutput}): keys in a fixed order,
 * scores (natural log) with {@value #DIGITS} decimals, transcripts exactly as imported (JSON escaping only). A
 * value that is unbounded (an interval edge at ±∞) or undefined is {@code null}. The keys are listed in the
 * README's audit section.
 */
public final class AuditJson {
  /** Decimals of every score and weight. */
  public static final int DIGITS = 6;

  private AuditJson() {}

  /** Writes the audit atomically to {@code target} ({@code -}: stdout). */
  public static void write(Path target, AuditReport r) {
    JsonOutput.write(target, json(r));
  }

  /** The JSON document. */
  public static ObjectNode json(AuditReport r) {
    ObjectNode o = JsonOutput.object();
    o.put("notice", AuditReport.NOTICE);
    o.put("method", r.method() == null ? null : r.method().label());
    o.put("unit", ReportText.unitLabel(r.unit()));
    o.put("utterances", r.utterances());
    counts(o, r.total());
    o.put("verified_utterances", r.verifiedUtterances());
    o.put("reference_tokens", r.referenceTokens());
    o.put("rank1_errors", r.firstErrors());
    o.put("chosen_errors", r.chosenErrors());
    ArrayNode groups = o.putArray("groups");
    for (AuditCounts g : r.groups()) counts(groups.addObject().put("group", g.group()), g);
    ArrayNode per = o.putArray("per_overrule");
    for (Overrule x : r.overrules()) per.add(overrule(x, r.unit()));
    return o;
  }

  private static void counts(ObjectNode o, AuditCounts c) {
    o.put("overrules", c.overrules());
    o.put("helped", c.helped());
    o.put("hurt", c.hurt());
    o.put("neutral", c.neutral());
    o.put("unverified", c.unverified());
    o.put("net_error_change", c.netErrorChange());
    o.set("most_fixed", pairs(c.mostFixed()));
    o.set("most_broken", pairs(c.mostBroken()));
  }

  private static ArrayNode pairs(List<TokenTally> pairs) {
    ArrayNode a = JsonOutput.array();
    for (TokenTally t : pairs) a.addObject().put("ref", t.ref()).put("hyp", t.hyp()).put("count", t.count());
    return a;
  }

  private static ObjectNode overrule(Overrule x, Unit unit) {
    ObjectNode o = JsonOutput.object();
    o.put("utt_id", x.uttId());
    o.put("group", x.group());
    o.put("method", x.method().label());
    o.put("verdict", x.verdict().label());
    o.put("error_change", x.errorChange());
    o.put("reference", x.reference());
    o.set("pick", side(x.pick()));
    o.set("rank1", side(x.first()));
    o.set("fixed", pairs(x.fixed()));
    o.set("broken", pairs(x.broken()));
    o.set("breakdown", x.breakdown() == null ? null : breakdown(x.breakdown()));
    o.set("path", x.path() == null ? null : path(x.path()));
    o.set("flip", x.flip() == null ? null : flip(x.flip(), x.method(), unit));
    o.set("ngrams", x.ngrams() == null ? null : ngrams(x.ngrams()));
    return o;
  }

  private static ObjectNode side(Overrule.Side s) {
    ObjectNode o = JsonOutput.object();
    o.put("system", s.system());
    o.put("rank", s.rank());
    o.put("new_transcript", s.isNewTranscript());
    o.put("text", s.text());
    o.set("tokens", JsonOutput.strings(s.tokens()));
    if (s.errors() < 0) o.putNull("errors"); else o.put("errors", s.errors());
    return o;
  }

  private static ObjectNode breakdown(ScoreBreakdown b) {
    ObjectNode o = JsonOutput.object();
    o.put("margin", num(b.margin()));
    o.put("pick_total", num(b.pickTotal()));
    o.put("rank1_total", num(b.firstTotal()));
    ArrayNode terms = o.putArray("terms");
    for (ScoreBreakdown.Term t : b.terms()) {
      terms.addObject().put("term", t.label())
          .put("pick_value", num(t.pickValue())).put("rank1_value", num(t.firstValue()))
          .put("pick", num(t.pickWeighted())).put("rank1", num(t.firstWeighted())).put("delta", num(t.delta()));
    }
    return o;
  }

  private static ObjectNode path(PathComparison p) {
    ObjectNode o = JsonOutput.object();
    o.put("lattice_lm_weight", num(p.lmWeight()));
    o.put("lattice_length_weight", num(p.lengthWeight()));
    o.put("margin", num(p.margin()));
    o.set("pick", pathTerms(p, p.pick()));
    o.set("rank1", p.first() == null ? null : pathTerms(p, p.first()));
    return o;
  }

  private static ObjectNode pathTerms(PathComparison c, PathComparison.PathTerms t) {
    return JsonOutput.object().put("ln_posterior", num(t.logPosterior())).put("lm_ln_prob", num(t.lmLogProb()))
        .put("tokens", t.tokens()).put("lm_term", num(c.lmWeight() * t.lmLogProb()))
        .put("length_term", num(c.lengthWeight() * t.tokens())).put("score", num(c.score(t)));
  }

  private static ObjectNode flip(FlipWeights f, RescoreMethod method, Unit unit) {
    ObjectNode o = JsonOutput.object();
    o.put("basis", f.basis().label());
    o.put("weight_name", method == RescoreMethod.NBEST ? "lm_weight" : "lattice_lm_weight");
    o.put("weight", num(f.weight()));
    o.put("lower", num(f.lower()));
    o.put("upper", num(f.upper()));
    o.put("distance", num(f.distance()));
    o.put("below_text", f.belowTokens() == null ? null : Normaliser.join(f.belowTokens(), unit));
    o.put("above_text", f.aboveTokens() == null ? null : Normaliser.join(f.aboveTokens(), unit));
    o.put("returns_to_rank1", f.returnsToFirst());
    o.put("rank1_low", num(f.firstLow()));
    o.put("rank1_high", num(f.firstHigh()));
    o.put("return_weight", num(f.returnWeight()));
    o.put("candidates", f.lines());
    return o;
  }

  private static ObjectNode ngrams(DecisiveNgrams d) {
    ObjectNode o = JsonOutput.object();
    o.put("tokens", d.tokenisation());
    o.put("pick_ln_prob", num(d.pickLogProb()));
    o.put("rank1_ln_prob", num(d.firstLogProb()));
    o.put("delta", num(d.delta()));
    o.put("regions", d.regions());
    ArrayNode a = o.putArray("contributions");
    for (DecisiveNgrams.Contribution c : d.contributions()) {
      ObjectNode x = a.addObject().put("region", c.region()).put("difference", num(c.difference()));
      x.set("pick", use(c.pick()));
      x.set("rank1", use(c.first()));
    }
    return o;
  }

  private static ObjectNode use(DecisiveNgrams.NgramUse u) {
    if (u == null) return null;
    ObjectNode o = JsonOutput.object().put("position", u.position());
    o.set("ngram", JsonOutput.strings(u.ngram()));
    return o.put("order", u.order()).put("ln_prob", num(u.logProb())).put("oov", u.unknown());
  }

  private static java.math.BigDecimal num(double v) {
    return Numbers.decimal(v, DIGITS);
  }
}
