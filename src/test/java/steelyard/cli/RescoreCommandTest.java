package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import steelyard.rescore.RescoreSummary;

/** The rescore command end to end, run in-process through {@link Main#run}. */
class RescoreCommandTest {
  @TempDir Path dir;
  private Path hyps;
  private Path refs;

  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    refs = dir.resolve("refs.csv");
    RescoreFixtures.writeRandomSet(hyps, refs, 20261202L, 300);
  }

  private Result run(String... args) {
    return RescoreFixtures.run(args);
  }

  @Nested
  class ThreadCountIndependence {
    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {"nbest", "mbr"})
    void picksAndJsonAreByteIdenticalFor1And2And8Threads(String method) throws IOException {
      byte[][] picks = new byte[3][];
      byte[][] json = new byte[3][];
      int[] threads = {1, 2, 8};
      for (int k = 0; k < 3; k++) {
        Path out = dir.resolve("picks-" + k + ".csv");
        Path js = dir.resolve("summary-" + k + ".json");
        Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf:linear", "--refs", refs.toString(),
            "--method", method, "--length-weight", "-0.3", "--posterior-sharpness", "0.5", "--system-weight", "b=2",
            "--threads", Integer.toString(threads[k]), "--out", out.toString(), "--json", js.toString(),
            "--breakdown", dir.resolve("bd-" + k + ".csv").toString());
        assertThat(r.code).as(r.err).isZero();
        picks[k] = Files.readAllBytes(out);
        json[k] = Files.readAllBytes(js);
      }
      assertThat(picks[1]).isEqualTo(picks[0]);
      assertThat(picks[2]).isEqualTo(picks[0]);
      assertThat(json[1]).isEqualTo(json[0]);
      assertThat(json[2]).isEqualTo(json[0]);
      assertThat(Files.readAllBytes(dir.resolve("bd-2.csv"))).isEqualTo(Files.readAllBytes(dir.resolve("bd-0.csv")));
    }
  }

  @Test
  void summaryHasTheScoreKeysTheExtraRatesAndTheNotice() throws IOException {
    Path js = dir.resolve("s.json");
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--refs", refs.toString(),
        "--out", dir.resolve("p.csv").toString(), "--json", js.toString());
    assertThat(r.code).as(r.err).isZero();
    JsonNode j = new ObjectMapper().readTree(js.toFile());
    for (String key : List.of("utterances", "reference_tokens", "correct", "substitutions", "deletions", "insertions",
        "error_rate", "sentence_error_rate", "ci95_low", "ci95_high", "missing_hypotheses", "missing_references",
        "first_error_rate", "oracle_error_rate", "changed", "notice"))
      assertThat(j.has(key)).as(key).isTrue();
    assertThat(j.get("notice").asText()).isEqualTo(RescoreSummary.NOTICE);
    assertThat(r.err).contains("not a verified transcript");
    // with only the recogniser's feature at weight 1, the choice is rank 1 whenever ranks follow it (they do here)
    assertThat(j.get("error_rate").asDouble()).isEqualTo(j.get("first_error_rate").asDouble());
    assertThat(j.get("oracle_error_rate").asDouble()).isLessThanOrEqualTo(j.get("first_error_rate").asDouble());
    assertThat(j.get("changed").asLong()).isZero();
  }

  @Test
  void theSummaryCarriesThePairedTestAgainstRankOne() throws IOException {
    Path js = dir.resolve("paired.json");
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf", "--refs", refs.toString(),
        "--weight", "conf=40", "--json", js.toString());
    assertThat(r.code).as(r.err).isZero();
    JsonNode j = new ObjectMapper().readTree(js.toFile());
    JsonNode v = j.get("versus_first");
    // every scored utterance is better, worse or tied; the difference is the difference of the two rates
    assertThat(v.get("better").asLong() + v.get("worse").asLong() + v.get("tied").asLong()).isEqualTo(j.get("utterances").asLong());
    assertThat(v.get("error_rate_difference").asDouble())
        .isCloseTo(j.get("error_rate").asDouble() - j.get("first_error_rate").asDouble(), org.assertj.core.data.Offset.offset(2e-6));
    assertThat(v.get("difference_ci95_low").asDouble()).isLessThanOrEqualTo(v.get("difference_ci95_high").asDouble());
    assertThat(v.get("sign_test_p").asDouble()).isBetween(0.0, 1.0);
    assertThat(r.err).contains("versus rank 1: better on " + v.get("better").asLong() + ", worse on " + v.get("worse").asLong());
  }

  @Test
  void warnsWhenPosteriorsCollapseUnderAPosteriorMethodOnly() throws IOException {
    // totals 10 nats apart: at α = 1 the best holds 1/(1 + e^−10 + e^−20) > 0.999 of the mass; at α = 0.01 about 0.37
    StringBuilder h = new StringBuilder("utt_id,rank,text,acoustic\n");
    for (int u = 0; u < 40; u++)
      for (int k = 0; k < 3; k++) h.append("u").append(u).append(',').append(k + 1).append(",crates ").append(k).append(',').append(-10 * k).append('\n');
    Path hyps = java.nio.file.Files.writeString(dir.resolve("gaps.csv"), h.toString());
    Path js = dir.resolve("collapse.json");
    Result sharp = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--method", "mbr",
        "--json", js.toString());
    assertThat(sharp.code).as(sharp.err).isZero();
    assertThat(sharp.err).contains("steelyard: warning: posteriors are nearly all 0 or 1");
    assertThat(new ObjectMapper().readTree(js.toFile()).get("warnings").toString()).contains("--posterior-sharpness");
    Result soft = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--method", "mbr",
        "--posterior-sharpness", "0.01", "--json", js.toString());
    assertThat(soft.err).doesNotContain("posteriors are nearly all");
    Result nbest = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--json", js.toString());
    assertThat(nbest.err).doesNotContain("posteriors are nearly all");
  }

  @Test
  void picksKeepHostileTextExactly() throws IOException {
    String nasty = "=SUM(A1),\"crates\"\n+7 <script>x</script>\u200f e\u0301";
    Files.writeString(hyps, "utt_id,rank,text,acoustic\nu1,1,\"" + nasty.replace("\"", "\"\"") + "\",-1\nu1,2,plain,-2\n");
    Path out = dir.resolve("p.csv");
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--out", out.toString());
    assertThat(r.code).as(r.err).isZero();
    List<String[]> rows = RescoreFixtures.readCsv(out);
    assertThat(rows.get(0)[0]).isEqualTo("utt_id");
    assertThat(rows.get(1)[4]).isEqualTo(nasty);
  }

  @Test
  void refusesAnOutputPathEqualToAnInput() throws IOException {
    byte[] before = Files.readAllBytes(hyps);
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--out", hyps.toString());
    assertThat(r.code).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err).contains("--out").contains("also an input");
    assertThat(Files.readAllBytes(hyps)).isEqualTo(before);
  }

  @Test
  void needsAModelWhenTheLmWeightIsNotZero() {
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--lm-weight", "2", "--json", dir.resolve("j").toString());
    assertThat(r.code).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err).contains("--lm");
    assertThat(Files.exists(dir.resolve("j"))).isFalse();
  }

  @Test
  void rejectsAWeightForAColumnThatIsNotAFeature() {
    Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--weight", "acustic=2");
    assertThat(r.code).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err).contains("unknown weight name 'acustic'");
  }

  @Nested
  class WeightsFiles {
    @Test
    void savedWeightsReproduceTheRunAndOptionsOverrideThem() throws IOException {
      Path saved = dir.resolve("w.json");
      Path p1 = dir.resolve("p1.csv");
      assertThat(run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf:linear", "--weight", "conf=3",
          "--length-weight", "-0.7", "--method", "mbr", "--out", p1.toString(), "--save-weights", saved.toString()).code).isZero();
      Path p2 = dir.resolve("p2.csv");
      assertThat(run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf:linear", "--weights", saved.toString(),
          "--method", "mbr", "--out", p2.toString()).code).isZero();
      assertThat(Files.readAllBytes(p2)).isEqualTo(Files.readAllBytes(p1));

      // options override the file: back to the plain weights gives the plain run
      Path p3 = dir.resolve("p3.csv");
      Path p4 = dir.resolve("p4.csv");
      assertThat(run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf:linear", "--weights", saved.toString(),
          "--weight", "conf=1", "--length-weight", "0", "--method", "mbr", "--out", p3.toString()).code).isZero();
      assertThat(run("rescore", "--hyps", hyps.toString(), "--features", "acoustic,conf:linear", "--method", "mbr",
          "--out", p4.toString()).code).isZero();
      assertThat(Files.readAllBytes(p3)).isEqualTo(Files.readAllBytes(p4));
      assertThat(Files.readAllBytes(p3)).isNotEqualTo(Files.readAllBytes(p1));
    }

    @ParameterizedTest(name = "[{index}] {arguments}")
    @ValueSource(strings = {
      "{\"format\":\"steelyard-weights\",\"version\":1,\n\"methods\":{\"nbest\":{\"features\":{\"acustic\":1}}}}|:2:33: unknown weight name",
      "{\"format\":\"steelyard-weights\",\"version\":1,\n\"methods\":{\"nbest\":{\"lm_weight\":true}}}|:2:33: 'lm_weight' is a boolean",
      "weights:\n  lm: 3\n|:1:1: not valid JSON",
    })
    void badWeightsFilesExitWithCode2AndTheirLine(String spec) throws IOException {
      String[] parts = spec.split("\\|");
      Path w = dir.resolve("bad.json");
      Files.writeString(w, parts[0]);
      Path out = dir.resolve("never.csv");
      Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--weights", w.toString(), "--out", out.toString());
      assertThat(r.code).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err).contains(w + parts[1]).doesNotContain("\tat ");
      assertThat(Files.exists(out)).isFalse();
    }
  }

  /** Exit code and captured streams of one in-process run. */
  record Result(int code, String out, String err) {}
}
