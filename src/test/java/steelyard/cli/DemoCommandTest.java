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

class DemoCommandTest {
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
    assertThat(code).as(stderr.toString()).isZero();
    assertThat(out.resolve("voice-test.picks.csv")).exists();
    assertThat(out.resolve("dockets-test.picks.csv")).exists();
  }

  @Test
  void saysThatAnAutomaticPickIsNotAVerifiedTranscript() {
    assertThat(stdout.toString(StandardCharsets.UTF_8)).contains("An automatic pick is not a verified transcript");
  }

  @Test
  void printsEachPartsFiguresOnceAndNoRescoreSummary() {
    assertThat(stdout.toString(StandardCharsets.UTF_8)).containsOnlyOnce("WER chosen").containsOnlyOnce("CER chosen");
    assertThat(stderr.toString(StandardCharsets.UTF_8)).doesNotContain("steelyard rescore:");
  }

  @Test
  void everyTestUtteranceGetsOnePick() throws Exception {
    assertThat(Files.readAllLines(out.resolve("voice-test.picks.csv"))).hasSize(301);
    assertThat(summary("voice-test").get("utterances").asInt()).isEqualTo(300);
  }

  @Test
  void devTunedWeightsDoNotMakeTheTestSetsWorseThanRankOne() throws Exception {
    // Not a check value from invented data: only the direction (rescoring with an in-domain model should not
    // lose to the recogniser's own choice on held-out data), which is the demo's point.
    for (String stem : new String[] {"voice-test", "dockets-test"}) {
      JsonNode j = summary(stem);
      assertThat(j.get("error_rate").asDouble()).as(stem).isLessThanOrEqualTo(j.get("first_error_rate").asDouble());
    }
  }

  private static JsonNode summary(String stem) throws Exception {
    return new ObjectMapper().readTree(out.resolve(stem + ".summary.json").toFile());
  }

  @Test
  void aFolderWithoutTheDemoDataIsABadInput(@TempDir Path empty) {
    CommandLine cl = Main.commandLine();
    ByteArrayOutputStream err = new ByteArrayOutputStream();
    cl.setErr(new PrintWriter(err, true, StandardCharsets.UTF_8));
    assertThat(cl.execute("demo", "--data-dir", empty.toString(), "--out-dir", empty.resolve("o").toString())).isEqualTo(2);
    assertThat(err.toString(StandardCharsets.UTF_8)).contains("--data-dir: no sample-hypotheses/ and models/");
  }
}
