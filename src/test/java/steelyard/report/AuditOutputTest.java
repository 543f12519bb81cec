package steelyard.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.opencsv.CSVReader;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.List;
import org.junit.jupiter.api.Test;
import steelyard.audit.AuditCounts;
import steelyard.audit.AuditReport;
import steelyard.audit.DecisiveNgrams;
import steelyard.audit.FlipWeights;
import steelyard.audit.Overrule;
import steelyard.audit.ScoreBreakdown;
import steelyard.audit.ScoreBreakdown.Kind;
import steelyard.audit.Verdict;
import steelyard.eval.TokenTally;
import steelyard.io.JsonOutput;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Unit;

/** The audit's JSON and CSV outputs: hostile transcripts stay raw in JSON and are neutralised in CSV. */
class AuditOutputTest {
  static final String SCRIPT = "<script>alert(\"bay 4\")</script> & 'crates'";

  /** One overrule per hostile text: the pick's text is {@code text}, rank 1's is "pears to dock". */
  static Overrule overrule(String uttId, String text) {
    Overrule.Side pick = new Overrule.Side(1, "fast", 2, text, List.of(text.split(" ")), 0);
    Overrule.Side first = new Overrule.Side(0, "fast", 1, "pears to dock", List.of("pears", "to", "dock"), 2);
    ScoreBreakdown b = new ScoreBreakdown(List.of(
        new ScoreBreakdown.Term(Kind.FEATURE, "acoustic", -12.5, -10, -12.5, -10),
        new ScoreBreakdown.Term(Kind.LM, "lm", -5, -9, -10, -18),
        new ScoreBreakdown.Term(Kind.OOV, "oov", 0, 0, 0, 0),
        new ScoreBreakdown.Term(Kind.LENGTH, "length", 3, 3, 0, 0)), -22.5, -28);
    FlipWeights f = new FlipWeights(FlipWeights.Basis.EXACT, 2, 0.5, Double.POSITIVE_INFINITY, List.of("pears", "to", "dock"),
        null, Double.NEGATIVE_INFINITY, 0.5, 3);
    DecisiveNgrams.NgramUse p = new DecisiveNgrams.NgramUse(0, List.of("<s>", text), 2, -1.5, false);
    DecisiveNgrams.NgramUse q = new DecisiveNgrams.NgramUse(0, List.of("pears"), 1, -4.5, true);
    DecisiveNgrams d = new DecisiveNgrams("model", -5, -9, 1, List.of(new DecisiveNgrams.Contribution(0, p, q)));
    return new Overrule(uttId, "=sheet", RescoreMethod.NBEST, Verdict.HELPED, pick, first, "-pears to dock",
        List.of(new TokenTally("pears", "=pairs", 1)), List.of(), b, null, f, d);
  }

  static AuditReport report() {
    List<Overrule> list = List.of(overrule("=u1", "=SUM(A1:A9)"), overrule("+u2", "+cmd bay"), overrule("-u3", "-2+3 crates"),
        overrule("@u4", "@lookup dock"), overrule("u5", SCRIPT));
    AuditCounts total = new AuditCounts(null, 5, 5, 0, 0, 0, 10, List.of(new TokenTally("pears", "=pairs", 5)), List.of());
    AuditCounts group = new AuditCounts("=sheet", 5, 5, 0, 0, 0, 10, List.of(new TokenTally("pears", "=pairs", 5)), List.of());
    return new AuditReport(RescoreMethod.NBEST, Unit.WORD, List.of("acoustic"), 5, 5, 15, 10, 0, total, List.of(group), list);
  }

  @Test
  void jsonKeepsTranscriptsExactlyAsImported() throws Exception {
    JsonNode root = new ObjectMapper().readTree(JsonOutput.render(AuditJson.json(report())));
    assertThat(root.path("per_overrule").get(0).path("pick").path("text").asText()).isEqualTo("=SUM(A1:A9)");
    assertThat(root.path("per_overrule").get(4).path("pick").path("text").asText()).isEqualTo(SCRIPT);
    assertThat(root.path("per_overrule").get(4).path("ngrams").path("contributions").get(0).path("pick").path("ngram").get(1).asText())
        .isEqualTo(SCRIPT);
    assertThat(root.path("per_overrule").get(0).path("group").asText()).isEqualTo("=sheet");
  }

  @Test
  void jsonHasTheSummaryKeysAndUnboundedEdgesAsNull() throws Exception {
    JsonNode root = new ObjectMapper().readTree(JsonOutput.render(AuditJson.json(report())));
    for (String key : List.of("overrules", "helped", "hurt", "neutral", "unverified", "net_error_change", "per_overrule", "groups"))
      assertThat(root.has(key)).as(key).isTrue();
    assertThat(root.path("overrules").asLong()).isEqualTo(5);
    assertThat(root.path("net_error_change").asLong()).isEqualTo(10);
    JsonNode flip = root.path("per_overrule").get(0).path("flip");
    assertThat(flip.path("lower").decimalValue()).isEqualByComparingTo("0.5");
    assertThat(flip.path("upper").isNull()).isTrue();
    assertThat(flip.path("rank1_low").isNull()).isTrue();
    assertThat(flip.path("return_weight").decimalValue()).isEqualByComparingTo("0.5");
    assertThat(root.path("per_overrule").get(0).path("path").isNull()).isTrue();
  }

  /** Source: OWASP "CSV Injection" guidance (from memory): = + - @ at the start of a cell make a formula. */
  @Test
  void csvNeutralisesFormulaCellsAndKeepsPlainNumbers() throws Exception {
    StringWriter out = new StringWriter();
    AuditCsv.write(out, report(), true);
    List<String[]> rows = new CSVReader(new StringReader(out.toString())).readAll();
    assertThat(rows).hasSize(6);
    List<String> header = List.of(rows.get(0));
    int pickText = header.indexOf("pick_text");
    assertThat(rows.get(1)[pickText]).isEqualTo("'=SUM(A1:A9)");
    assertThat(rows.get(2)[pickText]).isEqualTo("'+cmd bay");
    assertThat(rows.get(3)[pickText]).isEqualTo("'-2+3 crates");
    assertThat(rows.get(4)[pickText]).isEqualTo("'@lookup dock");
    assertThat(rows.get(5)[pickText]).isEqualTo(SCRIPT);
    assertThat(rows.get(1)[header.indexOf("utt_id")]).isEqualTo("'=u1");
    assertThat(rows.get(1)[header.indexOf("reference")]).isEqualTo("'-pears to dock");
    assertThat(rows.get(1)[header.indexOf("fixed")]).isEqualTo("pears>=pairs");
    assertThat(rows.get(1)[header.indexOf("feature.acoustic_delta")]).isEqualTo("-2.500000");
    assertThat(rows.get(1)[header.indexOf("flip_upper")]).isEmpty();
    for (String[] row : rows)
      for (String cell : row)
        assertThat(cell).as("every cell is safe").doesNotStartWith("=").doesNotStartWith("+").doesNotStartWith("@");
  }

  @Test
  void theSameReportGivesTheSameBytes() throws Exception {
    StringWriter a = new StringWriter();
    StringWriter b = new StringWriter();
    AuditCsv.write(a, report(), true);
    AuditCsv.write(b, report(), true);
    assertThat(a.toString()).isEqualTo(b.toString());
    assertThat(JsonOutput.render(AuditJson.json(report()))).isEqualTo(JsonOutput.render(AuditJson.json(report())));
  }
}
