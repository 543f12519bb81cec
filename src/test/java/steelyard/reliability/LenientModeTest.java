package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * {@code --max-bad-rows N}: a file with two bad rows passes with N = 2, each skipped row named by line and
 * reason on stderr and in the JSON summary's {@code skipped_rows}; with N = 1 it fails with exit code 2 and
 * writes nothing; with the default (0) it fails at the first bad row.
 */
class LenientModeTest {
  private static final Path LENIENT = Fixtures.badDir().resolve("lenient");

  /** A command over a file with bad rows at the given lines. */
  record Case(String name, Path badFile, List<Long> badLines, List<String> args) {
    @Override
    public String toString() {
      return name;
    }
  }

  static Stream<Arguments> cases() {
    Path hyps = LENIENT.resolve("hyps-two-bad-rows.csv");
    Path refs = LENIENT.resolve("refs-two-bad-rows.csv");
    String validHyps = Fixtures.valid("hyps.csv").toString();
    String validRefs = Fixtures.valid("refs.csv").toString();
    return Stream.of(
        Arguments.of(new Case("score, hypotheses file", hyps, List.of(3L, 6L),
            List.of("score", "--hyps", hyps.toString(), "--refs", validRefs, "--features", "acoustic"))),
        Arguments.of(new Case("score, references file", refs, List.of(3L, 5L),
            List.of("score", "--hyps", validHyps, "--refs", refs.toString(), "--features", "acoustic"))),
        Arguments.of(new Case("compare, second hypotheses file", hyps, List.of(3L, 6L),
            List.of("compare", "--refs", validRefs, "--hyps", validHyps, "--hyps", hyps.toString(), "--features", "acoustic"))),
        Arguments.of(new Case("rescore, hypotheses file", hyps, List.of(3L, 6L),
            List.of("rescore", "--hyps", hyps.toString(), "--features", "acoustic", "--method", "nbest"))));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("cases")
  void skipsAndListsEachBadRowWhenWithinTheLimit(Case c, @TempDir Path tmp) throws IOException {
    Path json = tmp.resolve("summary.json");
    Cli.Result r = Cli.runBuilt(args(c, "2", json, tmp));
    assertThat(r.exit()).as("%s", r).isZero();

    for (long line : c.badLines()) {
      assertThat(r.err()).as("stderr names skipped line %d\n%s", line, r).contains(c.badFile().getFileName() + ":" + line + ":");
    }
    JsonNode skipped = new ObjectMapper().readTree(json.toFile()).path("skipped_rows");
    assertThat(skipped.isArray()).as("skipped_rows in %s", Files.readString(json)).isTrue();
    List<Long> lines = new ArrayList<>();
    for (JsonNode row : skipped) {
      lines.add(row.path("line").asLong());
      assertThat(row.path("file").asText()).endsWith(c.badFile().getFileName().toString());
      assertThat(row.path("reason").asText()).as("reason of line %s", row.path("line")).isNotBlank();
    }
    assertThat(lines).containsExactlyElementsOf(c.badLines());
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("cases")
  void failsWithExitTwoWhenMoreRowsAreBadThanAllowed(Case c, @TempDir Path tmp) {
    for (String max : List.of("1", "0")) {
      Path json = tmp.resolve("summary-" + max + ".json");
      Cli.Result r = Cli.runBuilt(args(c, max, json, tmp));
      assertThat(r.exit()).as("--max-bad-rows %s\n%s", max, r).isEqualTo(2);
      long failingLine = c.badLines().get(Integer.parseInt(max));
      assertThat(r.messageLines()).as("%s", r).hasSize(1);
      assertThat(r.messageLines().get(0)).contains(c.badFile().getFileName() + ":" + failingLine);
      assertThat(json).as("no summary written").doesNotExist();
    }
  }

  private static String[] args(Case c, String maxBadRows, Path json, Path tmp) {
    List<String> a = new ArrayList<>(c.args());
    a.addAll(List.of("--max-bad-rows", maxBadRows, "--json", json.toString()));
    if (a.get(0).equals("rescore")) a.addAll(List.of("--out", tmp.resolve("picks-" + maxBadRows + ".csv").toString()));
    return a.toArray(String[]::new);
  }
}
