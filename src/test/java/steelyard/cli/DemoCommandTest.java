package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import steelyard.report.html.ReportModel;

/**
 * {@code steelyard demo} end to end on the bundled data: tune on each dev set, choose and audit its test set, write
 * the files and the report. The checks are directions and agreements, never figures of the invented data: dev-tuned
 * weights beat the recogniser's rank 1 on held-out data; the demo's tuned weights are the bundled weights files (which
 * the README's {@code tune} commands rebuild, see {@link BundledModelsRebuildTest}); {@code rescore} with them writes
 * the demo's picks byte for byte.
 */
class DemoCommandTest {
  static {
    steelyard.report.HeadlessAwt.whenNoDisplay();
  }

  @TempDir static Path out;
  static final ByteArrayOutputStream stdout = new ByteArrayOutputStream();
  static final ByteArrayOutputStream stderr = new ByteArrayOutputStream();
  static int code;

  @BeforeAll
  static void runDemo() {
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(stdout, true, StandardCharsets.UTF_8));
    cl.setErr(new PrintWriter(stderr, true, StandardCharsets.UTF_8));
    code = cl.execute("demo", "--data-dir", Path.of("").toAbsolutePath().toString(), "--out-dir", out.toString());
  }

  @Test
  void runsBothPartsOnTheBundledDataAndSucceeds() {
    assertThat(code).as(stderr.toString(StandardCharsets.UTF_8)).isZero();
    for (String f : new String[] {"voice-test.picks.csv", "dockets-test.picks.csv", "voice.weights.json", "dockets.weights.json",
        "voice-dev.tune.json", "dockets-dev.tune.json", "voice-test.summary.json", "dockets-test.breakdown.csv", "report.html"})
      assertThat(out.resolve(f)).exists();
  }

  @Test
  void saysThatAnAutomaticPickIsNotAVerifiedTranscriptOnScreenAndInTheReport() throws Exception {
    assertThat(stdout.toString(StandardCharsets.UTF_8)).contains("An automatic pick is not a verified transcript");
    String html = Files.readString(out.resolve("report.html"));
    assertThat(html).contains(ReportModel.REVIEW_NOTICE.substring(0, 40), "Voice logs", "Delivery dockets");
  }

  @Test
  void printsEachPartsFiguresOnceAndWhereTheReportIs() {
    assertThat(stdout.toString(StandardCharsets.UTF_8)).containsOnlyOnce("WER test").containsOnlyOnce("CER test")
        .containsOnlyOnce("WER dev").contains("cross-validated", "helped", "Report: " + out.resolve("report.html"));
    assertThat(stderr.toString(StandardCharsets.UTF_8)).doesNotContain("steelyard rescore:", "steelyard tune:");
  }

  @Test
  void theReadmeShowsWhatTheDemoPrints() throws Exception {
    String readme = Files.readString(Path.of("README.md"));
    for (String line : stdout.toString(StandardCharsets.UTF_8).split("\n")) {
      if (line.startsWith("Report: ") || line.startsWith("Also in ")) continue; // name the output folder
      assertThat(readme).as("README.md shows the demo's line").contains(line);
    }
  }

  @Test
  void everyTestUtteranceGetsOnePick() throws Exception {
    assertThat(Files.readAllLines(out.resolve("voice-test.picks.csv"))).hasSize(301);
    assertThat(json("voice-test.summary.json").get("utterances").asInt()).isEqualTo(300);
    assertThat(json("dockets-test.summary.json").get("utterances").asInt()).isEqualTo(200);
  }

  @Test
  void devTunedWeightsBeatRankOneOnTheHeldOutTestSets() throws Exception {
    // Not a check value from invented data: only the direction (weights tuned on dev data with an in-domain model
    // should beat the recogniser's own choice on held-out data), which is the demo's point.
    for (String stem : new String[] {"voice", "dockets"}) {
      JsonNode test = json(stem + "-test.summary.json");
      assertThat(test.get("error_rate").asDouble()).as(stem).isLessThan(test.get("first_error_rate").asDouble());
      JsonNode dev = json(stem + "-dev.tune.json");
      assertThat(dev.get("dev_error_rate").asDouble()).as(stem).isLessThan(dev.get("dev_first_error_rate").asDouble());
    }
  }

  @Test
  void theTunedWeightsAreTheBundledWeightsFiles() throws Exception {
    assertThat(Files.readAllBytes(out.resolve("voice.weights.json"))).isEqualTo(Files.readAllBytes(Path.of("models/voice-demo.weights.json")));
    assertThat(Files.readAllBytes(out.resolve("dockets.weights.json")))
        .isEqualTo(Files.readAllBytes(Path.of("models/dockets-demo.weights.json")));
  }

  @Test
  void rescoringTheTestSetWithTheTunedWeightsWritesTheDemosPicks(@TempDir Path here) throws Exception {
    Path picks = here.resolve("picks.csv");
    ScoreCommandTest.Result r = ScoreCommandTest.run("rescore", "--hyps", "sample-hypotheses/voice-test.nbest.csv", "--refs",
        "sample-hypotheses/voice-test.refs.csv", "--rules", "sample-hypotheses/voice.rules", "--lm", "models/voice-3gram.arpa.gz",
        "--features", "acoustic,lm", "--weights", out.resolve("voice.weights.json").toString(), "--out", picks.toString(),
        "--json", here.resolve("s.json").toString());
    assertThat(r.code()).as(r.err()).isZero();
    assertThat(Files.readAllBytes(picks)).isEqualTo(Files.readAllBytes(out.resolve("voice-test.picks.csv")));
    assertThat(new ObjectMapper().readTree(here.resolve("s.json").toFile()).get("error_rate").decimalValue())
        .isEqualTo(json("voice-test.summary.json").get("error_rate").decimalValue());
  }

  private static JsonNode json(String name) throws Exception {
    return new ObjectMapper().readTree(out.resolve(name).toFile());
  }

  @Test
  void aFolderWithoutTheDemoDataIsABadInput(@TempDir Path empty) {
    CommandLine cl = Main.commandLine();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    cl.setErr(new PrintWriter(err, true, StandardCharsets.UTF_8));
    assertThat(cl.execute("demo", "--data-dir", empty.toString(), "--out-dir", empty.resolve("o").toString())).isEqualTo(2);
    assertThat(err.toString(StandardCharsets.UTF_8)).contains("--data-dir: no sample-hypotheses/ and models/");
    assertThat(empty.resolve("o")).doesNotExist();
  }
}
