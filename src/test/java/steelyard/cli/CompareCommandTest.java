package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.junit.jupiter.api.Assumptions.assumeTrue;
import static steelyard.cli.ScoreCommandTest.json;
import static steelyard.cli.ScoreCommandTest.run;
import static steelyard.cli.ScoreCommandTest.write;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.report.ReportText;

class CompareCommandTest {
  @TempDir Path dir;

  private static final String REFS = "utt_id,text\n"
      + "u1,load six crates\nu2,bay four\nu3,two bins of pears\nu4,cold store\nu5,van at dock\n";
  // A: errors 1,1,1,0,0. B: errors 0,0,0,1,0 (better on u1..u3, worse on u4, tied on u5).
  private static final String HYPS_A = "utt_id,text\n"
      + "u1,load sick crates\nu2,bay for\nu3,two bins of bears\nu4,cold store\nu5,van at dock\n";
  private static final String HYPS_B = "utt_id,text\n"
      + "u1,load six crates\nu2,bay four\nu3,two bins of pears\nu4,gold store\nu5,van at dock\n";

  @Test
  void reportsBothRatesThePairedDifferenceAndTheSignTest() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    Path a = write(dir, "a.csv", HYPS_A);
    Path b = write(dir, "b.csv", HYPS_B);
    Path out = dir.resolve("cmp.json");
    ScoreCommandTest.Result r = run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", b.toString(),
        "--names", "baseline,tuned", "--json", out.toString());
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode j = json(out);
    for (String key : List.of("systems", "common_utterances", "error_rate_a", "error_rate_b", "ci95_low_a", "ci95_high_b",
        "difference_b_minus_a", "difference_ci95_low", "difference_ci95_high", "prob_b_better", "sign_test_p",
        "utterances_a_better", "utterances_b_better", "utterances_tied", "seed", "resamples", "warnings"))
      assertThat(j.has(key)).as(key).isTrue();
    // Worked by hand: N = 3 + 2 + 4 + 2 + 3 = 14; A 3 errors, B 1 error; difference (1 - 3)/14.
    assertThat(j.get("common_reference_tokens").asLong()).isEqualTo(14);
    assertThat(j.get("difference_b_minus_a").asDouble()).isCloseTo(-2.0 / 14, within(1e-6));
    assertThat(j.get("utterances_b_better").asInt()).isEqualTo(3);
    assertThat(j.get("utterances_a_better").asInt()).isEqualTo(1);
    assertThat(j.get("utterances_tied").asInt()).isEqualTo(1);
    // Worked by hand from the binomial formula: n = 4, k = 1: 2 · (1 + 4) / 16 = 0.625.
    assertThat(j.get("sign_test_p").asDouble()).isCloseTo(0.625, within(1e-9));
    assertThat(j.get("systems").get(1).get("name").asText()).isEqualTo("tuned");
    assertThat(j.get("prob_b_better").asDouble()).isBetween(0.5, 1.0);
    assertThat(r.out()).contains("tuned minus baseline").contains(ReportText.REVIEW_NOTE);
  }

  @Test
  void sameSeedGivesByteIdenticalJsonWhateverTheThreads() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    Path a = write(dir, "a.csv", HYPS_A);
    Path b = write(dir, "b.csv", HYPS_B);
    Path one = dir.resolve("one.json");
    Path four = dir.resolve("four.json");
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", b.toString(), "--threads", "1", "--json", one.toString()).code()).isZero();
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", b.toString(), "--threads", "4", "--json", four.toString()).code()).isZero();
    assertThat(Files.readString(four)).isEqualTo(Files.readString(one));
  }

  @Test
  void comparesTwoSystemsOfOneFile() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    StringBuilder both = new StringBuilder("utt_id,system,text\n");
    String[] a = HYPS_A.split("\n");
    String[] b = HYPS_B.split("\n");
    for (int i = 1; i < a.length; i++) {
      both.append(a[i].replaceFirst(",", ",alpha,")).append('\n');
      both.append(b[i].replaceFirst(",", ",beta,")).append('\n');
    }
    Path h = write(dir, "both.csv", both.toString());
    Path out = dir.resolve("sys.json");
    ScoreCommandTest.Result r = run("compare", "--refs", refs.toString(), "--hyps", h.toString(), "--systems", "alpha,beta", "--json", out.toString());
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode j = json(out);
    assertThat(j.get("systems").get(0).get("name").asText()).isEqualTo("alpha");
    assertThat(j.get("utterances_b_better").asInt()).isEqualTo(3);
    assertThat(j.get("utterances_a_better").asInt()).isEqualTo(1);
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", h.toString(), "--systems", "alpha").code()).isEqualTo(2);
    Path noSystem = write(dir, "nosys.csv", HYPS_A);
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", noSystem.toString(), "--systems", "alpha,beta").code()).isEqualTo(2);
  }

  @Test
  void needsExactlyTwoSystemsAndTwoDistinctNames() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    Path a = write(dir, "a.csv", HYPS_A);
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", a.toString()).code()).isEqualTo(2);
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", a.toString(), "--names", "x,x").code()).isEqualTo(2);
    assertThat(run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", a.toString(), "--names", "x").code()).isEqualTo(2);
  }

  @Test
  void refusesToWriteOverAnInput() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    Path a = write(dir, "a.csv", HYPS_A);
    Path b = write(dir, "b.csv", HYPS_B);
    ScoreCommandTest.Result r = run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", b.toString(), "--json", b.toString());
    assertThat(r.code()).isEqualTo(2);
    assertThat(Files.readString(b)).isEqualTo(HYPS_B);
  }

  @Test
  void badInputInTheSecondFileWritesNothing() throws IOException {
    Path refs = write(dir, "refs.csv", REFS);
    Path a = write(dir, "a.csv", HYPS_A);
    Path b = write(dir, "b.csv", "utt_id,text\nu1,\"open quote\n");
    Path out = dir.resolve("cmp.json");
    ScoreCommandTest.Result r = run("compare", "--refs", refs.toString(), "--hyps", a.toString(), "--hyps", b.toString(), "--json", out.toString());
    assertThat(r.code()).isEqualTo(2);
    assertThat(r.err()).contains(b.toString());
    assertThat(out).doesNotExist();
  }

  @Test
  void comparesRankOneWithOracleOnTheRealisticOcrSet() throws IOException {
    Path base = ScoreCommandTest.realistic();
    assumeTrue(base != null, "realistic fixtures not found (../shared/realistic): skipped");
    // The same file twice: identical systems must show no difference (invariant of the paired bootstrap).
    Path h = base.resolve("ocr/dev.nbest.csv");
    Path out = dir.resolve("same.json");
    ScoreCommandTest.Result r = run("compare", "--refs", base.resolve("ocr/dev.refs.csv").toString(), "--hyps", h.toString(),
        "--hyps", h.toString(), "--unit", "char", "--json", out.toString());
    assertThat(r.code()).as(r.err()).isZero();
    assertThat(json(out).get("difference_b_minus_a").asDouble()).isZero();
    assertThat(json(out).get("sign_test_p").asDouble()).isEqualTo(1.0);
  }
}
