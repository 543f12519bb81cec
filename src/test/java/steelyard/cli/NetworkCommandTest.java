package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.opencsv.CSVReader;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code steelyard network} end to end, in-process through {@link Main#run}. */
class NetworkCommandTest {
  @TempDir Path dir;
  private Path hyps;
  private Path dot;
  private Path arcs;
  private Path json;

  @BeforeEach
  void files() throws IOException {
    hyps = dir.resolve("hyps.csv");
    Files.writeString(hyps, String.join("\n",
        "utt_id,rank,text,acoustic",
        "u1,1,ten crates of pears,-1.0",
        "u2,1,load the leeks to bay nine,-2.0",
        "u2,2,load leeks to bay nine,-2.5",
        "u2,3,load the leek to bay nine please,-3.0",
        "u2,4,lode the leeks to bay nine,-3.2",
        "u3,1,cold store,-1.0",
        ""), StandardCharsets.UTF_8);
    dot = dir.resolve("n.dot");
    arcs = dir.resolve("n.csv");
    json = dir.resolve("n.json");
  }

  private RescoreCommandTest.Result network(String utt, String... extra) {
    String[] base = {"network", "--hyps", hyps.toString(), "--features", "acoustic", "--utt", utt,
        "--dot", dot.toString(), "--arcs", arcs.toString(), "--json", json.toString()};
    String[] args = new String[base.length + extra.length];
    System.arraycopy(base, 0, args, 0, base.length);
    System.arraycopy(extra, 0, args, base.length, extra.length);
    return RescoreFixtures.run(args);
  }

  @Test
  void writesOneCsvRowPerArcWithSlotPosteriorsSummingToOne() throws Exception {
    RescoreCommandTest.Result r = network("u2");
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode summary = new ObjectMapper().readTree(json.toFile());
    List<String[]> rows;
    try (Reader in = Files.newBufferedReader(arcs); CSVReader csv = new CSVReader(in)) {
      rows = csv.readAll();
    }
    List<String> header = List.of(rows.get(0));
    int slotCol = header.indexOf("slot");
    int postCol = header.indexOf("posterior");
    assertThat(rows).hasSize(1 + summary.get("arcs").asInt());
    TreeMap<Integer, Double> mass = new TreeMap<>();
    for (String[] row : rows.subList(1, rows.size()))
      mass.merge(Integer.parseInt(row[slotCol]), Double.parseDouble(row[postCol]), Double::sum);
    assertThat(mass).hasSize(summary.get("slots").asInt());
    // Each slot of a confusion network is a probability distribution over its arcs, the empty arc included
    // (Mangu, Brill & Stolcke 2000); the CSV rounds to 10 decimals.
    mass.forEach((slot, sum) -> assertThat(sum).as("slot %d", slot).isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-8)));

    String text = Files.readString(dot);
    assertThat(text).startsWith("digraph").endsWith("}\n");
    long edges = text.lines().filter(l -> l.contains("->")).count();
    assertThat(edges).isEqualTo(summary.get("arcs").asLong());
    assertThat(text.chars().filter(c -> c == '{').count()).isEqualTo(text.chars().filter(c -> c == '}').count());
  }

  @Test
  void kbestListsDistinctPathsInNonIncreasingScoreOrder() throws Exception {
    RescoreCommandTest.Result r = network("u2", "--kbest", "3", "--length-weight", "-0.2");
    assertThat(r.code()).as(r.err()).isZero();
    JsonNode paths = new ObjectMapper().readTree(json.toFile()).get("paths");
    assertThat(paths).hasSize(3);
    Set<String> texts = new HashSet<>();
    double previous = Double.POSITIVE_INFINITY;
    for (JsonNode p : paths) {
      texts.add(p.get("text").asText());
      double score = p.get("score").asDouble();
      assertThat(score).isLessThanOrEqualTo(previous);
      previous = score;
      // λ′ = μ′ = 0: the score is the log posterior alone (definition of the search objective).
      assertThat(score).isEqualTo(p.get("log_posterior").asDouble());
    }
    assertThat(texts).hasSize(3);
    assertThat(r.out().lines().filter(l -> !l.startsWith("rank")).count()).isEqualTo(3);
  }

  @Test
  void unknownUtteranceIsExitTwoNamingIt() {
    RescoreCommandTest.Result r = network("no-such-utt");
    assertThat(r.code()).isEqualTo(2);
    assertThat(r.err()).contains("--utt").contains("no-such-utt").doesNotContain("Exception");
    assertThat(dot).doesNotExist();
  }

  @Test
  void refusesAnOutputThatIsAnInput() {
    RescoreCommandTest.Result r = RescoreFixtures.run("network", "--hyps", hyps.toString(), "--features", "acoustic",
        "--utt", "u2", "--arcs", hyps.toString());
    assertThat(r.code()).isEqualTo(2);
    assertThat(r.err()).contains("--arcs");
  }

  @Test
  void rerunGivesByteIdenticalOutputs() throws IOException {
    assertThat(network("u2", "--kbest", "2").code()).isZero();
    byte[][] first = {Files.readAllBytes(dot), Files.readAllBytes(arcs), Files.readAllBytes(json)};
    assertThat(network("u2", "--kbest", "2").code()).isZero();
    assertThat(Files.readAllBytes(dot)).isEqualTo(first[0]);
    assertThat(Files.readAllBytes(arcs)).isEqualTo(first[1]);
    assertThat(Files.readAllBytes(json)).isEqualTo(first[2]);
  }

  @Test
  void networkOfOneHypothesisIsThatHypothesis() throws IOException {
    assertThat(network("u1", "--kbest", "1").code()).isZero();
    JsonNode s = new ObjectMapper().readTree(json.toFile());
    assertThat(s.get("slots").asInt()).isEqualTo(4);
    assertThat(s.get("paths").get(0).get("text").asText()).isEqualTo("ten crates of pears");
    assertThat(s.get("paths").get(0).get("new").asBoolean()).isFalse();
  }
}
