package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * One utterance with 10 000 hypotheses: MBR and the lattice method still answer, capping their work, and the
 * output says the cap applied (the JSON's {@code capped_utterances}, the picks row's {@code capped}). A
 * second, small utterance shows the cap is per utterance.
 */
class LargeNbestTest {
  private static final int HYPOTHESES = 10_000;
  private static final String[] WORDS = {"load", "six", "crates", "of", "apples", "pears", "bay", "four", "is", "full", "cold", "store"};

  @TempDir static Path dir;
  static Path hyps;

  @BeforeAll
  static void writeTenThousandHypotheses() throws IOException {
    hyps = dir.resolve("hyps.csv");
    SplittableRandom random = new SplittableRandom(10_000);
    try (BufferedWriter w = Files.newBufferedWriter(hyps, StandardCharsets.UTF_8)) {
      w.write("utt_id,system,rank,text,acoustic\n");
      for (int k = 1; k <= HYPOTHESES; k++) {
        StringBuilder t = new StringBuilder();
        for (int i = 0, n = 4 + random.nextInt(8); i < n; i++) t.append(i == 0 ? "" : " ").append(WORDS[random.nextInt(WORDS.length)]);
        w.write("dock-big,asr," + k + "," + t + "," + (-100.0 - k * 0.01 - random.nextDouble()) + "\n");
      }
      w.write("dock-small,asr,1,load six crates,-10.0\ndock-small,asr,2,load sick crates,-11.0\n");
    }
  }

  @ParameterizedTest(name = "[{index}] --method {0}")
  @ValueSource(strings = {"mbr", "lattice"})
  void tenThousandHypothesesAreHandledWithACapThatIsReported(String method) throws IOException {
    Path picks = dir.resolve(method + "-picks.csv");
    Path json = dir.resolve(method + ".json");
    Cli.Result r = Cli.runBuilt("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--method", method,
        "--out", picks.toString(), "--json", json.toString());
    assertThat(r.exit()).as("%s", r).isZero();

    JsonNode summary = new ObjectMapper().readTree(json.toFile());
    assertThat(summary.path("capped_utterances").asInt(-1)).as("cap reported in %s", summary).isEqualTo(1);
    List<Map<String, String>> rows = HostileTextTest.readCsv(picks);
    assertThat(rows).extracting(m -> m.get("utt_id")).containsExactly("dock-big", "dock-small");
    assertThat(rows.get(0).get("capped")).as("picks row of the big utterance says capped").isIn("true", "1", "yes");
    assertThat(rows.get(1).get("capped")).as("small utterance not capped").isIn("false", "0", "no", "");
    assertThat(rows.get(0).get("text")).isNotBlank();
  }
}
