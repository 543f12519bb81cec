package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The command with a model file and with the confusion-network methods. */
class RescoreModelAndNetworkTest {
  @TempDir Path dir;
  private Path hyps;
  private Path refs;

  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    refs = dir.resolve("refs.csv");
    RescoreFixtures.writeRandomSet(hyps, refs, 77L, 120);
  }

  /**
   * The hand-worked example of NbestRescorerTest through an ARPA file (same log10 values, worked by hand there):
   * totals −12.805170186, −11.272326584, −14.374911677 → "ten crates".
   */
  @Test
  void appliesTheModelFromAnArpaFile() throws IOException {
    Path arpa = dir.resolve("tiny.arpa");
    Files.writeString(arpa, String.join("\n", "\\data\\", "ngram 1=6", "ngram 2=2", "", "\\1-grams:",
        "-99\t<s>\t0", "-1.0\t</s>", "-2.0\t<unk>", "-1.0\tten\t0", "-1.5\tcrates\t0", "-2.5\tcranes\t0", "",
        "\\2-grams:", "-0.5\t<s> ten", "-0.3\tten crates", "", "\\end\\", ""));
    Files.writeString(hyps, "utt_id,rank,text,acoustic\ndock-7,1,ten cranes,-9.0\ndock-7,2,ten crates,-10.0\ndock-7,3,ten crates please,-10.2\n");
    Path out = dir.resolve("p.csv");
    RescoreCommandTest.Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--lm", arpa.toString(), "--lm-weight", "0.5",
        "--oov-weight", "-1", "--length-weight", "0.4", "--out", out.toString(), "--breakdown", dir.resolve("b.csv").toString());
    assertThat(r.code()).as(r.err()).isZero();
    List<String[]> rows = RescoreFixtures.readCsv(out);
    List<String> header = List.of(rows.get(0));
    String[] pick = rows.get(1);
    assertThat(pick[header.indexOf("text")]).isEqualTo("ten crates");
    assertThat(pick[header.indexOf("rank")]).isEqualTo("2");
    assertThat(Double.parseDouble(pick[header.indexOf("total")])).isCloseTo(-11.272326584, within(1e-5));
    assertThat(Double.parseDouble(pick[header.indexOf("lm_term")])).isCloseTo(-2.072326584, within(1e-5));
    List<String[]> all = RescoreFixtures.readCsv(dir.resolve("b.csv"));
    List<String> bh = List.of(all.get(0));
    assertThat(all).hasSize(4);
    assertThat(Double.parseDouble(all.get(3)[bh.indexOf("total")])).isCloseTo(-14.374911677, within(1e-5));
    assertThat(all.get(3)[bh.indexOf("oov_tokens")]).isEqualTo("1");
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @ValueSource(strings = {"consensus", "lattice"})
  void networkMethodsAreThreadCountIndependentAndReportTheLatticeOracle(String method) throws IOException {
    byte[] first = null;
    byte[] firstJson = null;
    for (String threads : new String[] {"1", "2", "8"}) {
      Path out = dir.resolve("p" + threads + ".csv");
      Path js = dir.resolve("s" + threads + ".json");
      RescoreCommandTest.Result r = run("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--refs", refs.toString(), "--method", method,
          "--posterior-sharpness", "0.2", "--lattice-length-weight", "0.1", "--threads", threads, "--out", out.toString(), "--json", js.toString());
      assertThat(r.code()).as(r.err()).isZero();
      if (first == null) {
        first = Files.readAllBytes(out);
        firstJson = Files.readAllBytes(js);
      } else {
        assertThat(Files.readAllBytes(out)).isEqualTo(first);
        assertThat(Files.readAllBytes(js)).isEqualTo(firstJson);
      }
    }
    JsonNode j = new ObjectMapper().readTree(firstJson);
    // a network contains every input hypothesis as a path, so its oracle is at most the N-best oracle
    assertThat(j.get("lattice_oracle_error_rate").asDouble()).isLessThanOrEqualTo(j.get("oracle_error_rate").asDouble());
    assertThat(j.get("oracle_error_rate").asDouble()).isLessThanOrEqualTo(j.get("first_error_rate").asDouble());
    List<String[]> rows = RescoreFixtures.readCsv(dir.resolve("p1.csv"));
    List<String> header = List.of(rows.get(0));
    for (String[] row : rows.subList(1, rows.size())) {
      boolean fresh = Boolean.parseBoolean(row[header.indexOf("new_transcript")]);
      assertThat(row[header.indexOf("rank")].isEmpty()).isEqualTo(fresh);
      assertThat(row[header.indexOf("method")]).isEqualTo(method);
    }
  }

  private static RescoreCommandTest.Result run(String... args) {
    return RescoreFixtures.run(args);
  }
}
