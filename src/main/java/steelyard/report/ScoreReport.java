package steelyard.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.List;
import steelyard.eval.CorpusScore;
import steelyard.eval.EditCounts;
import steelyard.eval.GroupScore;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.TokenTally;
import steelyard.eval.UtteranceScores;
import steelyard.io.CsvWriter;
import steelyard.io.JsonOutput;
import steelyard.io.SkippedRow;
import steelyard.text.RuleUsage;

/**
 * Renders one {@link CorpusScore} as a plain-text report, a JSON summary and a per-utterance CSV table. Rates
 * in JSON and CSV are fractions with {@value #RATE_DIGITS} decimals; the text report shows percentages with two.
 */
public final class ScoreReport {
  /** Decimals of a rate (a fraction) in JSON and CSV. */
  public static final int RATE_DIGITS = 6;

  /** Header of the per-utterance CSV table. */
  public static final String[] CSV_HEADER = {
    "utt_id", "group", "status", "ref_tokens", "correct", "substitutions", "deletions", "insertions", "errors",
    "error_rate", "hyp_system", "hyp_rank", "hyp_text", "ref_text"
  };

  private ScoreReport() {}

  /** All warnings of the run in order: importer and normaliser first, then the scorer's. */
  public static List<String> warnings(CorpusScore s, ScoreContext c) {
    List<String> w = new ArrayList<>(c.importWarnings());
    w.addAll(s.warnings());
    return w;
  }

  /** The JSON summary; keys always in the same order. */
  public static ObjectNode json(CorpusScore s, ScoreContext c) {
    ObjectNode o = JsonOutput.object();
    o.put("hypotheses_file", c.hypothesesFile());
    o.put("references_file", c.referencesFile());
    o.put("unit", ReportText.unitLabel(c.unit()));
    o.put("normalisation", c.normalisation());
    o.put("pick", s.pick().label());
    o.put("missing_hypothesis_policy", s.missingPolicy().label());
    o.put("utterances", s.utterances());
    putCounts(o, s.totals());
    o.put("error_rate", Numbers.decimal(s.errorRate(), RATE_DIGITS));
    o.put("ci95_low", Numbers.decimal(c.ci95().low(), RATE_DIGITS));
    o.put("ci95_high", Numbers.decimal(c.ci95().high(), RATE_DIGITS));
    o.put("sentence_error_rate", Numbers.decimal(s.sentenceErrorRate(), RATE_DIGITS));
    o.put("sentences_with_errors", s.sentencesWithErrors());
    o.put("seed", c.seed());
    o.put("resamples", c.resamples());
    o.put("missing_hypotheses", s.missingHypotheses().size());
    o.put("missing_references", s.missingReferences().size());
    o.set("missing_hypothesis_ids", JsonOutput.strings(s.missingHypotheses()));
    o.set("missing_reference_ids", JsonOutput.strings(s.missingReferences()));
    o.set("groups", groups(s.groups()));
    o.set("top_substitutions", tallies(s.substitutions(), true, true));
    o.set("top_deletions", tallies(s.deletions(), true, false));
    o.set("top_insertions", tallies(s.insertions(), false, true));
    o.set("rule_usage", ruleUsage(c.ruleUsage()));
    o.set("skipped_rows", skipped(c.skippedRows()));
    o.set("warnings", JsonOutput.strings(warnings(s, c)));
    return o;
  }

  /** Rule usage as {@code [{line, kind, rule, tokens}]} in rules-file order. */
  public static ArrayNode ruleUsage(RuleUsage usage) {
    ArrayNode a = JsonOutput.array();
    for (RuleUsage.RuleCount r : usage.rules()) {
      ObjectNode o = a.addObject();
      o.put("line", r.line());
      o.put("kind", r.kind().keyword());
      o.put("rule", r.rule());
      o.put("tokens", r.tokens());
    }
    return a;
  }

  /** Puts {@code reference_tokens, correct, substitutions, deletions, insertions, errors} in that order. */
  public static void putCounts(ObjectNode o, EditCounts c) {
    o.put("reference_tokens", c.referenceTokens());
    o.put("correct", c.correct());
    o.put("substitutions", c.substitutions());
    o.put("deletions", c.deletions());
    o.put("insertions", c.insertions());
    o.put("errors", c.errors());
  }

  private static ArrayNode groups(List<GroupScore> groups) {
    ArrayNode a = JsonOutput.array();
    for (GroupScore g : groups) {
      ObjectNode o = a.addObject();
      o.put("group", g.group());
      o.put("utterances", g.utterances());
      putCounts(o, g.counts());
      o.put("error_rate", Numbers.decimal(g.errorRate(), RATE_DIGITS));
      o.put("sentence_error_rate", Numbers.decimal(g.sentenceErrorRate(), RATE_DIGITS));
    }
    return a;
  }

  private static ArrayNode tallies(List<TokenTally> list, boolean ref, boolean hyp) {
    ArrayNode a = JsonOutput.array();
    for (TokenTally t : list) {
      ObjectNode o = a.addObject();
      if (ref) o.put("ref", t.ref());
      if (hyp) o.put("hyp", t.hyp());
      o.put("count", t.count());
    }
    return a;
  }

  /** Skipped rows as {@code [{file, line, reason}]}. */
  public static ArrayNode skipped(List<SkippedRow> rows) {
    ArrayNode a = JsonOutput.array();
    for (SkippedRow r : rows) {
      ObjectNode o = a.addObject();
      o.put("file", r.file());
      o.put("line", r.line());
      o.put("reason", r.reason());
    }
    return a;
  }

  /** The per-utterance table, one row per reference utterance in reference-file order. */
  public static void csv(CorpusScore s, Writer out, boolean spreadsheetSafe) throws IOException {
    CsvWriter csv = new CsvWriter(out, spreadsheetSafe);
    csv.row(CSV_HEADER);
    UtteranceScores t = s.table();
    for (int r = 0; r < t.size(); r++) {
      byte st = t.status(r);
      boolean counted = t.included(r);
      String[] cells = {
        t.uttId(r), t.group(r), statusLabel(st),
        counted ? Numbers.integer(t.referenceTokens(r)) : "",
        counted ? Numbers.integer(t.correct(r)) : "",
        counted ? Numbers.integer(t.substitutions(r)) : "",
        counted ? Numbers.integer(t.deletions(r)) : "",
        counted ? Numbers.integer(t.insertions(r)) : "",
        counted ? Numbers.integer(t.errors(r)) : "",
        counted && t.referenceTokens(r) > 0 ? Numbers.fixed((double) t.errors(r) / t.referenceTokens(r), RATE_DIGITS) : "",
        t.hypSystem(r), st == UtteranceScores.SCORED ? Numbers.integer(t.hypRank(r)) : "",
        t.hypText(r), t.refText(r)
      };
      csv.row(cells);
    }
    csv.flush();
  }

  /** {@code scored}, {@code missing_hypothesis} (counted as all deletions) or {@code missing_excluded}. */
  public static String statusLabel(byte status) {
    switch (status) {
      case UtteranceScores.SCORED: return "scored";
      case UtteranceScores.MISSING_COUNTED: return "missing_hypothesis";
      case UtteranceScores.MISSING_EXCLUDED: return "missing_excluded";
      default: throw new IllegalArgumentException("status " + status);
    }
  }

  /** The plain-text report (see {@link ScoreText}). */
  public static String text(CorpusScore s, ScoreContext c) {
    return ScoreText.render(s, c);
  }

  static String policyWording(MissingHypothesisPolicy p) {
    return p == MissingHypothesisPolicy.ALL_DELETIONS ? "counted as all deletions" : "left out of the totals";
  }
}
