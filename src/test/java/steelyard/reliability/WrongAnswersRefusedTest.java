package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Command lines that used to end with exit code 0 and a wrong answer (every utterance missing, a weight that
 * changes nothing, a column counted twice, an infinite total) now end with exit code 2 and one line that
 * names the rule, writing nothing; a small overlap of utterance ids is allowed with a warning that gives the
 * counts, on stderr and in the JSON {@code warnings}. Broken files of the same kinds are in the bad-input
 * corpus ({@code bad/cases.csv}); these cases are about options.
 */
class WrongAnswersRefusedTest {
  private static final String HYPS = Fixtures.valid("hyps.csv").toString();
  private static final String REFS = Fixtures.valid("refs.csv").toString();
  private static final String ARPA = Fixtures.valid("small.arpa").toString();
  private static final ObjectMapper JSON = new ObjectMapper();

  /** A case: the arguments ({@code {out}} = output directory, {@code {dir}} = scratch) and words the message must hold. */
  record Case(String name, List<String> args, List<String> words) {
    @Override
    public String toString() {
      return name;
    }
  }

  static Stream<Arguments> refused() {
    return Stream.of(
        // 5. a system that does not occur
        c("score --system absent", List.of("score", "--hyps", "{multi}", "--refs", "{multirefs}", "--system", "scan-x", "--json", "{out}/s.json"),
            "--system", "'scan-x' does not occur", "fast, slow"),
        c("compare --systems absent", List.of("compare", "--refs", "{multirefs}", "--hyps", "{multi}", "--systems", "fast,slw", "--json", "{out}/c.json"),
            "--systems", "'slw' does not occur", "fast, slow"),
        c("rescore --system-weight absent", List.of("rescore", "--hyps", "{multi}", "--features", "acoustic", "--method", "consensus",
            "--system-weight", "slw=2", "--out", "{out}/picks.csv", "--json", "{out}/s.json"), "--system-weight", "'slw' does not occur", "fast, slow"),
        // 8. feature specs
        c("--features acoustic,acoustic", rescore("acoustic,acoustic"), "--features", "listed twice"),
        c("--features empty", rescore(""), "--features", "empty"),
        c("--features ,", rescore(","), "--features", "empty entry"),
        c("--features acoustic,", rescore("acoustic,"), "--features", "empty entry"),
        c("--features scale twice", rescore("acoustic:scale=1:scale=2"), "--features", "more than one scale"),
        c("--features convention twice", rescore("acoustic:ln:log10"), "--features", "more than one convention"),
        c("--features linear with a negative scale", rescore("acoustic:linear:scale=-1"), "--features", "negative scale"),
        c("score --features twice", List.of("score", "--hyps", HYPS, "--refs", REFS, "--features", "lm,lm", "--json", "{out}/s.json"),
            "--features", "listed twice"),
        // 9. totals that overflow although every input is finite
        c("--length-weight 1e308", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--length-weight", "1e308",
            "--out", "{out}/picks.csv", "--breakdown", "{out}/b.csv"), "bay-001", "length_term", "Infinity"),
        c("weights file lm_weight 1e308", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--lm", ARPA,
            "--weights", "{bigweights}", "--out", "{out}/picks.csv"), "bay-001", "lm_term", "Infinity"),
        c("--posterior-scale 1e306 with mbr", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--method", "mbr",
            "--posterior-scale", "1e306", "--out", "{out}/picks.csv"), "bay-001", "posterior scale", "told apart"),
        c("scores of ±1e308 with weight 2", List.of("rescore", "--hyps", "{huge}", "--features", "s", "--weight", "s=2",
            "--out", "{out}/picks.csv", "--json", "{out}/s.json"), "'u1'", "feature.s 2.0 × 1.0E308 = Infinity"),
        c("--lattice-lm-weight 1e308", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--lm", ARPA, "--method", "lattice",
            "--lattice-lm-weight", "1e308", "--out", "{out}/picks.csv"), "bay-001", "lattice LM weight", "-Infinity"),
        // 13. a negative lenient-mode budget
        c("score --max-bad-rows -1", List.of("score", "--hyps", HYPS, "--refs", REFS, "--max-bad-rows", "-1", "--json", "{out}/s.json"),
            "--max-bad-rows", "is -1"),
        c("rescore --max-bad-rows -1", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--max-bad-rows", "-1", "--out", "{out}/p.csv"),
            "--max-bad-rows", "is -1"),
        c("compare --max-bad-rows -1", List.of("compare", "--refs", REFS, "--hyps", HYPS, "--hyps", HYPS, "--max-bad-rows", "-1"),
            "--max-bad-rows", "is -1"));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("refused")
  void exitsTwoWithOneLineNamingTheRuleAndWritesNothing(Case c, @TempDir Path tmp) throws IOException {
    Path out = Files.createDirectories(tmp.resolve("out"));
    Files.writeString(out.resolve("picks.csv"), "an earlier output\n");
    Map<String, String> before = Fixtures.snapshot(out);

    Cli.Result r = Cli.runBuilt(args(c.args(), tmp, out));

    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    assertThat(r.messageLines()).as("one message line\n%s", r).hasSize(1);
    assertThat(r.err()).doesNotContain("Exception").doesNotContain("\tat ");
    for (String w : c.words()) assertThat(r.messageLines().get(0)).as("%s", r).contains(w);
    assertThat(Fixtures.snapshot(out)).as("outputs untouched\n%s", r).isEqualTo(before);
  }

  @Nested
  class SmallOverlapOfUtteranceIds {
    @Test
    void scoreWarnsWithTheCountsOnStderrAndInTheJson(@TempDir Path tmp) throws IOException {
      Path refs = Files.writeString(tmp.resolve("few.refs.csv"),
          "utt_id,text\nbay-001,load six crates of apples\ndock-1,a\ndock-2,b\ndock-3,c\n");
      Path json = tmp.resolve("s.json");
      Cli.Result r = Cli.runBuilt("score", "--hyps", HYPS, "--refs", refs.toString(), "--json", json.toString());
      assertThat(r.exit()).as("%s", r).isZero();
      String expected = "1 of 4 references (25 %) have hypotheses, 1 of 3 hypothesis utterances (33 %) have references";
      assertThat(r.err()).contains("steelyard: warning: ").contains(expected);
      assertThat(warnings(json)).anyMatch(w -> w.contains(expected));
    }

    @Test
    void rescoreWarnsWithTheCountsOnStderrAndInTheJson(@TempDir Path tmp) throws IOException {
      Path refs = Files.writeString(tmp.resolve("few.refs.csv"), "utt_id,text\nbay-002,bay four is full\ndock-1,a\ndock-2,b\n");
      Path json = tmp.resolve("s.json");
      Cli.Result r = Cli.runBuilt("rescore", "--hyps", HYPS, "--refs", refs.toString(), "--features", "acoustic",
          "--out", tmp.resolve("p.csv").toString(), "--json", json.toString());
      assertThat(r.exit()).as("%s", r).isZero();
      String expected = "1 of 3 references (33 %) have hypotheses, 1 of 3 hypothesis utterances (33 %) have references";
      assertThat(r.err()).contains(expected);
      assertThat(warnings(json)).anyMatch(w -> w.contains(expected));
    }

    @Test
    void aLargeOverlapGivesNoSuchWarning(@TempDir Path tmp) {
      Cli.Result r = Cli.runBuilt("score", "--hyps", HYPS, "--refs", REFS, "--json", tmp.resolve("s.json").toString());
      assertThat(r.exit()).isZero();
      assertThat(r.err()).doesNotContain("few utterances in common");
    }
  }

  private static List<String> warnings(Path json) throws IOException {
    List<String> out = new ArrayList<>();
    JSON.readTree(json.toFile()).get("warnings").forEach(w -> out.add(w.asText()));
    return out;
  }

  private static Arguments c(String name, List<String> args, String... words) {
    return Arguments.of(new Case(name, args, List.of(words)));
  }

  private static List<String> rescore(String features) {
    return List.of("rescore", "--hyps", HYPS, "--features", features, "--out", "{out}/picks.csv", "--json", "{out}/s.json");
  }

  /** Fills the placeholders, writing the small inputs some cases need into {@code tmp}. */
  private static String[] args(List<String> template, Path tmp, Path out) throws IOException {
    Path multi = Files.writeString(tmp.resolve("multi.csv"), "utt_id,system,rank,text,acoustic\n"
        + "d1,fast,1,load six crates,-10\nd1,slow,1,load sick crates,-11\nd2,fast,1,bay four,-8\nd2,slow,1,bay for,-9\n");
    Path multiRefs = Files.writeString(tmp.resolve("multi.refs.csv"), "utt_id,text\nd1,load six crates\nd2,bay four\n");
    Path huge = Files.writeString(tmp.resolve("huge.csv"), "utt_id,text,s\nu1,apples,1e308\nu1,pears,-1e308\n");
    Path big = Files.writeString(tmp.resolve("big.weights.json"),
        "{\"format\": \"steelyard-weights\", \"version\": 1, \"methods\": {\"nbest\": {\"lm_weight\": 1e308}}}\n");
    List<String> filled = new ArrayList<>();
    for (String a : template) {
      filled.add(a.replace("{out}", out.toString()).replace("{multi}", multi.toString()).replace("{multirefs}", multiRefs.toString())
          .replace("{huge}", huge.toString()).replace("{bigweights}", big.toString()));
    }
    return filled.toArray(String[]::new);
  }
}
