package steelyard.report;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.StringWriter;
import steelyard.io.JsonOutput;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import org.junit.jupiter.api.Test;
import steelyard.eval.Bootstrap;
import steelyard.eval.CorpusScore;
import steelyard.eval.CorpusScorer;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.Pick;
import steelyard.io.Hypothesis;
import steelyard.io.Reference;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.RuleUsage;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

class ScoreReportTest {
  private static CorpusScore sample() {
    LinkedHashMap<String, Reference> refs = new LinkedHashMap<>();
    refs.put("d1", new Reference("d1", "=crate 12 pears", "dock-a", 2));
    refs.put("d2", new Reference("d2", "bay four", "dock-b", 3));
    refs.put("d3", new Reference("d3", "van", "dock-b", 4));
    List<UtteranceHypotheses> hyps = List.of(
        new UtteranceHypotheses("d1", List.of(new Hypothesis("d1", "s1", 1, "=crate 12 bears", new double[0], "", 0, 2)), 0),
        new UtteranceHypotheses("d2", List.of(new Hypothesis("d2", "s1", 1, "bay for", new double[0], "", 0, 3)), 0),
        new UtteranceHypotheses("zz", List.of(new Hypothesis("zz", "s1", 1, "ghost", new double[0], "", 0, 4)), 0));
    CorpusScorer scorer = new CorpusScorer(
        raw -> {
          List<String> t = raw.isBlank() ? List.of() : Arrays.asList(raw.trim().split("\\s+"));
          return new TokenSequence(t, new boolean[t.size()]);
        },
        new CorpusScorer.Settings(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, 5, true));
    return scorer.score(refs, hyps.iterator());
  }

  private static ScoreContext context(CorpusScore s) {
    Bootstrap.Interval ci = Bootstrap.corpusRate(s.table().includedErrors(), s.table().includedReferenceTokens(), 100, 1L, 1);
    return new ScoreContext("h.csv", "r.csv", Unit.WORD, "nfkc", RuleUsage.NONE, 1L, 100, ci, List.of(), List.of("rank gap in d9"));
  }

  @Test
  void jsonHasTheDocumentedKeysInAFixedOrder() throws Exception {
    CorpusScore s = sample();
    String text = JsonOutput.render(ScoreReport.json(s, context(s)));
    JsonNode node = new ObjectMapper().readTree(text);
    List<String> keys = new ArrayList<>();
    node.fieldNames().forEachRemaining(keys::add);
    assertThat(keys).containsSubsequence(
        "utterances", "reference_tokens", "correct", "substitutions", "deletions", "insertions",
        "error_rate", "ci95_low", "ci95_high", "sentence_error_rate", "seed", "resamples",
        "missing_hypotheses", "missing_references", "groups", "skipped_rows", "warnings");
    assertThat(keys).contains("unit", "pick");
    // Worked by hand: d1 C2 S1, d2 C1 S1, d3 missing → D1; N = 6, errors 3.
    assertThat(node.get("reference_tokens").asLong()).isEqualTo(6);
    assertThat(node.get("error_rate").decimalValue()).isEqualByComparingTo("0.5");
    assertThat(node.get("missing_hypotheses").asInt()).isEqualTo(1);
    assertThat(node.get("missing_reference_ids").get(0).asText()).isEqualTo("zz");
    assertThat(node.get("warnings").get(0).asText()).isEqualTo("rank gap in d9");
    assertThat(text).isEqualTo(JsonOutput.render(ScoreReport.json(sample(), context(sample()))));
  }

  @Test
  void textReportCarriesTheHeadlineAndTheReviewNote() {
    CorpusScore s = sample();
    String text = ScoreReport.text(s, context(s));
    assertThat(text).contains("WER 50.00%").contains("dock-b").contains("pears → bears").contains("d3").contains("zz");
    assertThat(text).endsWith(ReportText.REVIEW_NOTE + "\n");
  }

  @Test
  void csvTableNeutralisesFormulaCellsByDefault() throws Exception {
    StringWriter out = new StringWriter();
    ScoreReport.csv(sample(), out, true);
    String[] lines = out.toString().split("\n");
    assertThat(lines[0]).isEqualTo(String.join(",", ScoreReport.CSV_HEADER));
    assertThat(lines[1]).isEqualTo("d1,dock-a,scored,3,2,1,0,0,1,0.333333,s1,1,'=crate 12 bears,'=crate 12 pears");
    assertThat(lines[3]).isEqualTo("d3,dock-b,missing_hypothesis,1,0,0,1,0,1,1.000000,,,,van");
    StringWriter raw = new StringWriter();
    ScoreReport.csv(sample(), raw, false);
    assertThat(raw.toString()).contains(",=crate 12 bears,");
  }
}
