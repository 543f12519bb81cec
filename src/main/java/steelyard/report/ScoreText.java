package steelyard.report;

import java.util.List;
import steelyard.eval.CorpusScore;
import steelyard.eval.EditCounts;
import steelyard.eval.GroupScore;
import steelyard.eval.Pick;
import steelyard.eval.TokenTally;
import steelyard.io.SkippedRow;
import steelyard.text.RuleUsage;
import steelyard.text.Unit;

/** The plain-text score report: a headline, the counts, groups, frequent errors, what is missing, warnings. */
final class ScoreText {
  private ScoreText() {}

  static String render(CorpusScore s, ScoreContext c) {
    StringBuilder sb = new StringBuilder();
    Unit unit = c.unit();
    String rate = ReportText.rateName(unit);
    String noun = ReportText.tokenNoun(unit);
    EditCounts t = s.totals();
    line(sb, "Steelyard score: " + rate + " of " + pickWording(s.pick()));
    line(sb, "  hypotheses  " + c.hypothesesFile());
    line(sb, "  references  " + c.referencesFile());
    line(sb, "  normalised  " + c.normalisation());
    line(sb, "");
    line(sb, "  " + rate + " " + Numbers.percent(s.errorRate(), 2) + "   95% interval "
        + Numbers.percent(c.ci95().low(), 2) + " to " + Numbers.percent(c.ci95().high(), 2)
        + "   (bootstrap over utterances, " + c.resamples() + " resamples, seed " + c.seed() + ")");
    line(sb, "  " + t.errors() + " errors in " + t.referenceTokens() + " reference " + noun + ": "
        + t.substitutions() + " substituted, " + t.deletions() + " deleted, " + t.insertions() + " inserted; "
        + t.correct() + " correct");
    line(sb, "  sentence error rate " + Numbers.percent(s.sentenceErrorRate(), 2) + "   ("
        + s.sentencesWithErrors() + " of " + s.utterances() + " utterances have at least one error)");
    rules(sb, c.ruleUsage());
    groups(sb, s.groups(), rate, noun);
    frequent(sb, s);
    missing(sb, s, c.skippedRows());
    List<String> warnings = ScoreReport.warnings(s, c);
    if (!warnings.isEmpty()) {
      line(sb, "");
      line(sb, "Warnings");
      for (String w : warnings) line(sb, "  - " + w);
    }
    line(sb, "");
    line(sb, ReportText.REVIEW_NOTE);
    return sb.toString();
  }

  static String pickWording(Pick pick) {
    switch (pick) {
      case FIRST: return "the recogniser's own choice (rank 1)";
      case ORACLE: return "the oracle pick (fewest errors per utterance: the N-best lower bound)";
      default: return "the given choice per utterance";
    }
  }

  private static void rules(StringBuilder sb, RuleUsage usage) {
    if (usage.rules().isEmpty()) return;
    line(sb, "");
    line(sb, "Rules file: " + usage.total() + " words touched (hypotheses and references, every pass)");
    for (RuleUsage.RuleCount r : usage.rules()) line(sb, "  " + r.tokens() + " × " + r.description());
  }

  private static void groups(StringBuilder sb, List<GroupScore> groups, String rate, String noun) {
    if (groups.isEmpty()) return;
    line(sb, "");
    line(sb, "By group");
    for (GroupScore g : groups) {
      String name = g.group().isEmpty() ? "(no group)" : g.group();
      line(sb, "  " + name + ": " + rate + " " + Numbers.percent(g.errorRate(), 2) + " over " + g.counts().referenceTokens()
          + " " + noun + " in " + g.utterances() + " utterances; sentence error rate " + Numbers.percent(g.sentenceErrorRate(), 2));
    }
  }

  private static void frequent(StringBuilder sb, CorpusScore s) {
    if (s.substitutions().isEmpty() && s.deletions().isEmpty() && s.insertions().isEmpty()) return;
    line(sb, "");
    line(sb, "Most frequent errors");
    tallies(sb, "substituted (reference → hypothesis)", s.substitutions(), true);
    tallies(sb, "deleted", s.deletions(), false);
    tallies(sb, "inserted", s.insertions(), false);
  }

  private static void tallies(StringBuilder sb, String title, List<TokenTally> list, boolean pairs) {
    if (list.isEmpty()) return;
    line(sb, "  " + title + ":");
    for (TokenTally t : list) {
      String what = pairs ? ReportText.token(t.ref()) + " → " + ReportText.token(t.hyp())
          : ReportText.token(t.ref().isEmpty() ? t.hyp() : t.ref());
      line(sb, "    " + t.count() + " × " + what);
    }
  }

  private static void missing(StringBuilder sb, CorpusScore s, List<SkippedRow> skipped) {
    line(sb, "");
    line(sb, "Coverage");
    if (s.missingHypotheses().isEmpty() && s.missingReferences().isEmpty()) {
      line(sb, "  every reference has a hypothesis and every hypothesis utterance has a reference");
    }
    if (!s.missingHypotheses().isEmpty())
      line(sb, "  " + s.missingHypotheses().size() + " reference utterance(s) without a hypothesis ("
          + ScoreReport.policyWording(s.missingPolicy()) + "): " + ReportText.ids(s.missingHypotheses()));
    if (!s.missingReferences().isEmpty())
      line(sb, "  " + s.missingReferences().size() + " hypothesis utterance(s) without a reference (not scored): "
          + ReportText.ids(s.missingReferences()));
    if (!skipped.isEmpty()) {
      line(sb, "  " + skipped.size() + " malformed row(s) skipped:");
      for (int i = 0; i < skipped.size() && i < ReportText.MAX_IDS; i++) {
        SkippedRow r = skipped.get(i);
        line(sb, "    " + r.file() + ":" + r.line() + ": " + r.reason());
      }
      if (skipped.size() > ReportText.MAX_IDS) line(sb, "    … and " + (skipped.size() - ReportText.MAX_IDS) + " more");
    }
  }

  static void line(StringBuilder sb, String s) {
    sb.append(s).append('\n');
  }
}
