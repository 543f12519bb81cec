package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Same inputs → byte-identical outputs: two reruns and {@code --threads 1}, {@code 2} and {@code 8} give the
 * same bytes in every output file (JSON and CSV), on inputs full of ties (equal scores, equal texts, equal
 * error counts), with bootstrap intervals; the seed in effect is recorded in the JSON.
 */
class DeterminismTest {
  private static final String SEED = "4242";
  private static final String[] WORDS = {"load", "six", "crates", "of", "apples", "pears", "bay", "four", "for", "is", "full", "cold", "store"};

  @TempDir static Path inputs;
  static Path hyps;
  static Path otherHyps;
  static Path refs;

  /** 80 utterances × up to 6 hypotheses; scores drawn from a few values so that many totals tie. */
  @BeforeAll
  static void writeInputsWithTies() throws IOException {
    SplittableRandom random = new SplittableRandom(17);
    StringBuilder h = new StringBuilder("utt_id,system,rank,text,acoustic,lm\n");
    StringBuilder r = new StringBuilder("utt_id,text\n");
    for (int u = 0; u < 80; u++) {
      String id = String.format("dock-%03d", u);
      String ref = sentence(random);
      r.append(id).append(',').append(ref).append('\n');
      int n = 1 + random.nextInt(6);
      for (int k = 1; k <= n; k++) {
        String text = random.nextInt(3) == 0 ? ref : sentence(random);
        h.append(id).append(",asr,").append(k).append(',').append(text).append(',')
            .append(-10 - random.nextInt(3)).append(".5,").append(-4 - random.nextInt(2)).append(".25\n");
      }
    }
    hyps = inputs.resolve("hyps.csv");
    refs = inputs.resolve("refs.csv");
    Files.writeString(hyps, h, StandardCharsets.UTF_8);
    Files.writeString(refs, r, StandardCharsets.UTF_8);
    otherHyps = inputs.resolve("other-hyps.csv");
    StringBuilder o = new StringBuilder("utt_id,text\n");
    for (int u = 0; u < 80; u++) o.append(String.format("dock-%03d", u)).append(',').append(sentence(random)).append('\n');
    Files.writeString(otherHyps, o, StandardCharsets.UTF_8);
  }

  private static String sentence(SplittableRandom random) {
    List<String> w = new ArrayList<>();
    for (int i = 0, n = 2 + random.nextInt(5); i < n; i++) w.add(WORDS[random.nextInt(WORDS.length)]);
    return String.join(" ", w);
  }

  /** A command with its output files (by name); placeholders {@code {dir}} and {@code {threads}}. */
  record Case(String name, List<String> args, List<String> outputs) {
    @Override
    public String toString() {
      return name;
    }
  }

  static Stream<Arguments> commands() {
    String lm = Fixtures.valid("small.arpa").toString();
    return Stream.of(
        Arguments.of(new Case("score --pick first", List.of("score", "--hyps", "{hyps}", "--refs", "{refs}", "--features", "acoustic,lm",
            "--json", "{dir}/summary.json", "--csv", "{dir}/table.csv"), List.of("summary.json", "table.csv"))),
        Arguments.of(new Case("score --pick oracle", List.of("score", "--hyps", "{hyps}", "--refs", "{refs}", "--pick", "oracle",
            "--json", "{dir}/summary.json", "--csv", "{dir}/table.csv"), List.of("summary.json", "table.csv"))),
        Arguments.of(new Case("compare (paired bootstrap, sign test)", List.of("compare", "--refs", "{refs}", "--hyps", "{hyps}",
            "--hyps", "{other}", "--json", "{dir}/summary.json"), List.of("summary.json"))),
        Arguments.of(new Case("rescore --method nbest", List.of("rescore", "--hyps", "{hyps}", "--refs", "{refs}", "--lm", lm,
            "--features", "acoustic,lm", "--lm-weight", "0.5", "--method", "nbest", "--out", "{dir}/picks.csv", "--json", "{dir}/summary.json"),
            List.of("picks.csv", "summary.json"))),
        Arguments.of(new Case("rescore --method mbr", List.of("rescore", "--hyps", "{hyps}", "--refs", "{refs}",
            "--features", "acoustic", "--method", "mbr", "--out", "{dir}/picks.csv", "--json", "{dir}/summary.json"),
            List.of("picks.csv", "summary.json"))),
        Arguments.of(new Case("rescore --method lattice", List.of("rescore", "--hyps", "{hyps}", "--refs", "{refs}", "--lm", lm,
            "--features", "acoustic", "--method", "lattice", "--lattice-lm-weight", "0.3", "--out", "{dir}/picks.csv",
            "--breakdown", "{dir}/breakdown.csv", "--json", "{dir}/summary.json"),
            List.of("picks.csv", "breakdown.csv", "summary.json"))));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("commands")
  void sameBytesAcrossRerunsAndThreadCounts(Case c, @TempDir Path out) throws IOException {
    Map<String, Map<String, byte[]>> runs = new LinkedHashMap<>();
    for (String threads : List.of("1", "2", "8", "1", "8")) {
      String label = "threads " + threads + " run " + (runs.size() + 1);
      runs.put(label, run(c, out, threads));
    }
    Map<String, byte[]> first = runs.values().iterator().next();
    for (Map.Entry<String, Map<String, byte[]>> e : runs.entrySet()) {
      for (String name : c.outputs()) {
        assertThat(new String(e.getValue().get(name), StandardCharsets.UTF_8)).as("%s of %s", name, e.getKey())
            .isEqualTo(new String(first.get(name), StandardCharsets.UTF_8));
      }
    }
    JsonNode json = new ObjectMapper().readTree(first.get("summary.json"));
    assertThat(json.findValue("seed")).as("seed recorded in %s", json).isNotNull();
    assertThat(json.findValue("seed").asText()).isEqualTo(SEED);
    assertThat(fieldNames(json, new java.util.TreeSet<>())).as("a bootstrap interval in %s", json).anyMatch(n -> n.contains("ci95_low"));
  }

  private static java.util.Set<String> fieldNames(JsonNode n, java.util.Set<String> out) {
    n.fieldNames().forEachRemaining(out::add);
    n.forEach(child -> fieldNames(child, out));
    return out;
  }

  private static Map<String, byte[]> run(Case c, Path out, String threads) throws IOException {
    List<String> args = new ArrayList<>();
    for (String a : c.args()) {
      args.add(a.replace("{hyps}", hyps.toString()).replace("{other}", otherHyps.toString()).replace("{refs}", refs.toString())
          .replace("{dir}", out.toString()));
    }
    args.addAll(List.of("--threads", threads, "--seed", SEED));
    Cli.Result r = Cli.runBuilt(args.toArray(String[]::new));
    assertThat(r.exit()).as("%s", r).isZero();
    Map<String, byte[]> files = new LinkedHashMap<>();
    for (String name : c.outputs()) files.put(name, Files.readAllBytes(out.resolve(name)));
    return files;
  }
}
