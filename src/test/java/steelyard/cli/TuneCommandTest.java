package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * {@code steelyard tune} through the real command line on the bundled voice dev set (word N-best lists, the voice
 * 3-gram, the hesitation rules). The checks are invariants and agreements between two paths of the program, never
 * figures of the invented data: tuning never ends worse than its start; {@code rescore} with the tuned weights counts
 * exactly the error the tuner reported; outputs do not depend on the thread count; the recorded SHA-256 is the one
 * the JDK's own {@link MessageDigest} computes.
 */
class TuneCommandTest {
  static final String HYPS = "sample-hypotheses/voice-dev.nbest.csv";
  static final String REFS = "sample-hypotheses/voice-dev.refs.csv";
  static final String[] DATA = {"--lm", "models/voice-3gram.arpa.gz", "--features", "acoustic,lm", "--rules",
      "sample-hypotheses/voice.rules"};

  @TempDir static Path dir;
  static ScoreCommandTest.Result one;

  /** N-best tuning with 3 folds on one thread: the run most tests read. */
  @BeforeAll
  static void tuneOnce() {
    one = tune(HYPS, "1", "one");
    assertThat(one.code()).as(one.err()).isZero();
  }

  static ScoreCommandTest.Result tune(String hyps, String threads, String stem, String... more) {
    List<String> args = new ArrayList<>(List.of("tune", "--hyps", hyps, "--refs", REFS));
    args.addAll(List.of(DATA));
    args.addAll(List.of("--method", "nbest", "--folds", "3", "--threads", threads, "--out", dir.resolve(stem + ".weights.json").toString(),
        "--json", dir.resolve(stem + ".json").toString(), "--surface", dir.resolve(stem + ".surface.csv").toString()));
    args.addAll(List.of(more));
    return ScoreCommandTest.run(args.toArray(String[]::new));
  }

  static JsonNode json(String stem) throws IOException {
    return new ObjectMapper().readTree(dir.resolve(stem + ".json").toFile());
  }

  @Test
  void writesTheSummaryKeys() throws IOException {
    JsonNode j = json("one");
    assertThat(j.fieldNames()).toIterable().contains("method", "dev_first_error_rate", "dev_error_rate", "cv_error_rate", "weights",
        "best_interval", "per_method", "warnings", "notice");
    assertThat(j.get("method").asText()).isEqualTo("nbest");
    assertThat(j.get("folds").asInt()).isEqualTo(3);
    assertThat(j.get("per_method")).hasSize(1);
    assertThat(j.get("best_interval").get("lm_weight").get("exact").asBoolean()).as("N-best intervals are exact").isTrue();
    JsonNode lm = j.get("best_interval").get("lm_weight");
    assertThat(lm.get("low").asDouble()).isLessThan(lm.get("chosen").asDouble());
    assertThat(lm.get("high").asDouble()).isGreaterThan(lm.get("chosen").asDouble());
  }

  @Test
  void printsTheMeasureTheMethodTheCrossValidatedErrorAndTheNotice() {
    assertThat(one.err()).contains("WER", "kept nbest", "cross-validated", "lm_weight", "An automatic pick is not a verified transcript");
    assertThat(one.out()).isEmpty();
  }

  @Test
  void tunedDevErrorIsNoWorseThanTheStartingWeightsByRescoringWithThem() throws IOException {
    // Invariant (Tuner: weights that do not beat the start are not kept); the start is rescored independently.
    ScoreCommandTest.Result start = rescore("start", "--threads", "1");
    assertThat(start.code()).as(start.err()).isZero();
    double startRate = json("start").get("error_rate").asDouble();
    assertThat(json("one").get("dev_error_rate").asDouble()).isLessThanOrEqualTo(startRate);
    JsonNode nbest = json("one").get("per_method").get(0);
    assertThat(nbest.get("dev_errors").asLong()).isLessThanOrEqualTo(nbest.get("start_errors").asLong());
  }

  @Test
  void rescoringTheDevSetWithTheTunedWeightsGivesExactlyTheReportedError() throws IOException {
    ScoreCommandTest.Result r = rescore("check", "--weights", dir.resolve("one.weights.json").toString());
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode check = json("check");
    assertThat(check.get("method").asText()).as("the method comes from the weights file").isEqualTo("nbest");
    assertThat(check.get("error_rate").decimalValue()).isEqualTo(json("one").get("dev_error_rate").decimalValue());
    assertThat(check.get("first_error_rate").decimalValue()).isEqualTo(json("one").get("dev_first_error_rate").decimalValue());
  }

  static ScoreCommandTest.Result rescore(String stem, String... more) {
    List<String> args = new ArrayList<>(List.of("rescore", "--hyps", HYPS, "--refs", REFS));
    args.addAll(List.of(DATA));
    args.addAll(List.of("--json", dir.resolve(stem + ".json").toString()));
    args.addAll(List.of(more));
    return ScoreCommandTest.run(args.toArray(String[]::new));
  }

  @Test
  void theWeightsFileRecordsTheDevDataTheModelAndTheMethod() throws Exception {
    JsonNode w = new ObjectMapper().readTree(dir.resolve("one.weights.json").toFile());
    assertThat(w.get("version").asInt()).isEqualTo(3);
    assertThat(w.get("method").asText()).isEqualTo("nbest");
    JsonNode dev = w.get("tuning").get("dev");
    assertThat(dev.get("utterances").asInt()).isEqualTo(300);
    assertThat(dev.get("hypotheses").get("sha256").asText()).isEqualTo(sha256(Path.of(HYPS)));
    assertThat(dev.get("references").get("sha256").asText()).isEqualTo(sha256(Path.of(REFS)));
    assertThat(w.get("model").get("sha256").asText()).isEqualTo(sha256(Path.of("models/voice-3gram.arpa.gz")));
    assertThat(w.get("tuning").get("changed")).isNotEmpty();
    assertThat(w.get("methods").get("nbest").get("lm_weight").asDouble()).isEqualTo(json("one").get("weights").get("methods")
        .get("nbest").get("lm_weight").asDouble());
  }

  /** Independent digest: the JDK's SHA-256 (FIPS 180-4) over the file's bytes. */
  static String sha256(Path file) throws Exception {
    return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
  }

  @Test
  void theSurfacePassesThroughTheTunedWeightsWithTheirDevErrors() throws IOException {
    List<String> lines = Files.readAllLines(dir.resolve("one.surface.csv"));
    assertThat(lines.get(0)).isEqualTo("length_weight,lm_weight,errors,error_rate");
    assertThat(lines).hasSize(1 + 21 * 41);
    // The grid is centred on the tuned (μ, λ): row 10, column 20. The tuned value lies inside its best interval,
    // so the centre point has exactly the tuned dev errors.
    String[] centre = lines.get(1 + 10 * 41 + 20).split(",");
    JsonNode nbest = json("one").get("per_method").get(0);
    assertThat(Long.parseLong(centre[2])).isEqualTo(nbest.get("dev_errors").asLong());
  }

  @Nested
  class Determinism {
    @Test
    void twoThreadsAndAReRunWriteTheSameBytes() throws IOException {
      assertThat(tune(HYPS, "2", "two").code()).isZero();
      assertThat(tune(HYPS, "2", "again").code()).isZero();
      for (String suffix : new String[] {".weights.json", ".json", ".surface.csv"}) {
        byte[] a = Files.readAllBytes(dir.resolve("one" + suffix));
        assertThat(Files.readAllBytes(dir.resolve("two" + suffix))).as("threads 1 vs 2: " + suffix).isEqualTo(a);
        assertThat(Files.readAllBytes(dir.resolve("again" + suffix))).as("rerun: " + suffix).isEqualTo(a);
      }
    }
  }

  @Nested
  class BadInput {
    @ParameterizedTest(name = "[{index}] {0} {1}")
    @CsvSource(delimiter = '|', value = {
        "--tune|lm_weight,beam_width|--tune: names 'beam_width'",
        "--folds|1|--folds: is 1; expected 0 (no cross-validation) or 2 or more folds",
        "--refs|sample-hypotheses/voice-test.refs.csv|--refs: no reference has the utt_id of an utterance with hypotheses",
        "--json|no-such-folder/tune.json|no-such-folder/tune.json: directory"})
    void exitsTwoWithOneLine(String option, String value, String message, @TempDir Path out) {
      List<String> args = new ArrayList<>(List.of("tune", "--hyps", HYPS));
      args.addAll(List.of(DATA));
      args.addAll(List.of("--method", "nbest", "--out", out.resolve("w.json").toString(), option, value));
      if (!option.equals("--refs")) args.addAll(List.of("--refs", REFS));
      ScoreCommandTest.Result r = ScoreCommandTest.run(args.toArray(String[]::new));
      assertThat(r.code()).as(r.err()).isEqualTo(2);
      assertThat(r.err().strip().lines().filter(l -> !l.startsWith("steelyard: warning:"))).singleElement().asString()
          .startsWith("steelyard: " + message);
      assertThat(out.resolve("w.json")).doesNotExist();
    }
  }

  @Nested
  class NetworkMethod {
    /**
     * The lattice method on the first 60 dev utterances (kept small so the test stays fast): its picks include new
     * transcripts from the confusion networks, which rescore aligns on its own path.
     */
    @Test
    void rescoringWithLatticeWeightsGivesExactlyTheReportedError() throws IOException {
      Path hyps = firstUtterances(Path.of(HYPS), dir.resolve("small.nbest.csv"));
      Path refs = firstUtterances(Path.of(REFS), dir.resolve("small.refs.csv"));
      List<String> args = new ArrayList<>(List.of("tune", "--hyps", hyps.toString(), "--refs", refs.toString()));
      args.addAll(List.of(DATA));
      args.addAll(List.of("--method", "lattice", "--tune", "posterior_sharpness,lattice_lm_weight,lattice_length_weight", "--folds", "0",
          "--out", dir.resolve("small.weights.json").toString(), "--json", dir.resolve("small.json").toString()));
      ScoreCommandTest.Result t = ScoreCommandTest.run(args.toArray(String[]::new));
      assertThat(t.code()).as(t.err()).isZero();
      assertThat(t.err()).contains("cross-validation is off").doesNotContain("nbest: no tuned weights");
      List<String> check = new ArrayList<>(List.of("rescore", "--hyps", hyps.toString(), "--refs", refs.toString()));
      check.addAll(List.of(DATA));
      check.addAll(List.of("--weights", dir.resolve("small.weights.json").toString(), "--json", dir.resolve("small-check.json").toString()));
      ScoreCommandTest.Result r = ScoreCommandTest.run(check.toArray(String[]::new));
      assertThat(r.code()).as(r.err()).isZero();
      assertThat(json("small-check").get("method").asText()).isEqualTo("lattice");
      assertThat(json("small-check").get("error_rate").decimalValue()).isEqualTo(json("small").get("dev_error_rate").decimalValue());
      assertThat(json("small").get("dev_error_rate").asDouble()).isLessThanOrEqualTo(json("small").get("dev_first_error_rate").asDouble());
    }

    /** The header and the rows of the first 60 utterances (ids vdev-0001 … vdev-0060). */
    private Path firstUtterances(Path from, Path to) throws IOException {
      List<String> keep = new ArrayList<>();
      for (String line : Files.readAllLines(from)) {
        if (keep.isEmpty() || line.compareTo("vdev-0061") < 0) keep.add(line);
      }
      Files.write(to, keep);
      return to;
    }
  }

  @Nested
  class History {
    @Test
    void aRecordedTuneIsListedAndGivesBackTheTunedWeightsFile(@TempDir Path here) throws IOException {
      String db = here.resolve("runs.db").toString();
      ScoreCommandTest.Result t = tune(HYPS, "2", "recorded", "--history", db);
      assertThat(t.code()).as(t.err()).isZero();
      ScoreCommandTest.Result list = ScoreCommandTest.run("runs", "list", "--history", db);
      assertThat(list.out()).contains("tune", "nbest");
      Path back = here.resolve("back.json");
      assertThat(ScoreCommandTest.run("runs", "weights", "1", "--history", db, "--out", back.toString()).code()).isZero();
      assertThat(Files.readAllBytes(back)).isEqualTo(Files.readAllBytes(dir.resolve("recorded.weights.json")));
      ScoreCommandTest.Result show = ScoreCommandTest.run("runs", "show", "1", "--history", db);
      assertThat(show.out()).as("the recorded dev error is the tuned one")
          .contains(steelyard.report.Numbers.percent(json("recorded").get("dev_error_rate").asDouble(), 2));
    }
  }
}
