package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/** The lm describe, copy, perplexity and sentence-scores commands through the real command line. */
class LmStoreCommandsTest {
  static final Path WAREHOUSE = Path.of("src/test/resources/lm/warehouse.arpa");

  @TempDir Path dir;
  StringWriter out;
  StringWriter err;

  @BeforeEach
  void streams() {
    out = new StringWriter();
    err = new StringWriter();
  }

  int run(String... args) {
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    return cl.execute(args);
  }

  JsonNode json(Path file) throws Exception {
    return new ObjectMapper().readTree(Files.readString(file));
  }

  /** Uniform over V = 10 outcomes (9 words and </s>), with <unk> listed at log10 −3 so OOV words are visible. */
  Path uniformModel() {
    BackoffModel.Builder b = new BackoffModel.Builder(2, Unit.WORD, new NormalisationOptions(true, false, false, false, null));
    b.add(new int[] {b.tokenId("<s>")}, -99, 0);
    b.add(new int[] {b.tokenId("</s>")}, -1, 0);
    b.add(new int[] {b.tokenId("<unk>")}, -3, 0);
    for (String w : List.of("crate", "pallet", "apples", "pears", "plums", "bay", "dock", "two", "ten")) b.add(new int[] {b.tokenId(w)}, -1, 0);
    Path file = dir.resolve("uniform.arpa");
    ModelFiles.save(b.build(), file);
    return file;
  }

  @Nested
  class Perplexity {
    @Test
    void uniformModelGivesPerplexityVAndCountsOovSeparately() throws Exception {
      Path text = dir.resolve("held-out.txt");
      Files.writeString(text, "Ten crates\ntwo PEARS to bay\n\n");
      Path report = dir.resolve("ppl.json");
      assertThat(run("lm", "perplexity", "--lm", uniformModel().toString(), "--text", text.toString(), "--json", report.toString())).isEqualTo(0);
      JsonNode j = json(report);
      // words after the model's case folding: ten crates | two pears to bay | (empty line)
      assertThat(j.get("sentences").asLong()).isEqualTo(3);
      assertThat(j.get("words").asLong()).isEqualTo(6);
      assertThat(j.get("tokens").asLong()).isEqualTo(9);
      assertThat(j.get("oov").asLong()).isEqualTo(2); // crates, to
      assertThat(j.get("oov_rate").asDouble()).isCloseTo(2.0 / 6, within(1e-12));
      // uniform over V = 10 (definition of perplexity: 2^H, H = log2 V)
      assertThat(j.get("perplexity").asDouble()).isCloseTo(10, within(1e-4));
      assertThat(j.get("log10_prob").asDouble()).isCloseTo(-7, within(1e-5));
      assertThat(j.get("ln_prob").asDouble()).isCloseTo(-7 * Math.log(10), within(1e-4));
      assertThat(j.get("log10_prob_with_oov").asDouble()).isCloseTo(-7 - 6, within(1e-5));
      assertThat(j.get("convention").asText()).contains("out-of-vocabulary");
    }

    @Test
    void differentNormalisationOptionsGiveAWarningAndTheModelsAreUsed() throws Exception {
      Path text = dir.resolve("t.txt");
      Files.writeString(text, "TEN crate\n");
      assertThat(run("lm", "perplexity", "--lm", uniformModel().toString(), "--text", text.toString(), "--strip-punct")).isEqualTo(0);
      assertThat(err.toString()).contains("warning").contains("differ from the model's");
      assertThat(out.toString()).contains("oov         0");
    }

    @Test
    void sameInputsGiveByteIdenticalJson() throws Exception {
      Path text = dir.resolve("t.txt");
      Files.writeString(text, "ten crate\nplums\n");
      Path model = uniformModel();
      run("lm", "perplexity", "--lm", model.toString(), "--text", text.toString(), "--json", dir.resolve("a.json").toString());
      run("lm", "perplexity", "--lm", model.toString(), "--text", text.toString(), "--json", dir.resolve("b.json").toString());
      assertThat(Files.readAllBytes(dir.resolve("a.json"))).isEqualTo(Files.readAllBytes(dir.resolve("b.json")));
    }
  }

  @Test
  void sentenceScoresIncludeUnkScoresAndEndOfSentence() throws Exception {
    Path text = dir.resolve("t.txt");
    Files.writeString(text, "ten crate\nten kumquats\n");
    Path csv = dir.resolve("scores.csv");
    assertThat(run("lm", "sentence-scores", "--lm", uniformModel().toString(), "--text", text.toString(), "--csv", csv.toString())).isEqualTo(0);
    // line 1: 2 words + </s> at -1 each; line 2: ten -1, kumquats as <unk> -3, </s> -1
    assertThat(Files.readAllLines(csv)).containsExactly("line,tokens,oov,log10_prob", "1,2,0,-3.000000", "2,2,1,-5.000000");
  }

  @Test
  void copyRoundTripsThroughBinaryAndDescribeDescribesIt() throws Exception {
    Path bin = dir.resolve("w.bin");
    Path back = dir.resolve("w.arpa");
    assertThat(run("lm", "copy", "--lm", WAREHOUSE.toString(), "--out", bin.toString())).isEqualTo(0);
    assertThat(run("lm", "copy", "--lm", bin.toString(), "--out", back.toString())).isEqualTo(0);
    assertThat(ModelFiles.loadExact(back).ngramCount(3)).isEqualTo(2);
    Path description = dir.resolve("describe.json");
    assertThat(run("lm", "describe", "--lm", bin.toString(), "--json", description.toString())).isEqualTo(0);
    JsonNode j = json(description);
    assertThat(j.get("file_format").asText()).isEqualTo("binary");
    assertThat(j.get("order").asInt()).isEqualTo(3);
    assertThat(j.get("orders").findValuesAsText("ngrams")).containsExactly("6", "2", "2");
    assertThat(j.get("ngrams_total").asLong()).isEqualTo(10);
    assertThat(j.get("vocabulary_size").asInt()).isEqualTo(6);
    assertThat(j.get("unk_listed").asBoolean()).isTrue();
    assertThat(j.get("oov_log10_prob").isNull()).as("only a closed vocabulary uses the fixed value").isTrue();
    assertThat(j.get("unit").asText()).isEqualTo("word");
    assertThat(j.get("normalisation").get("fold_case").asBoolean()).isTrue();
    assertThat(j.get("memory").get("bytes_per_ngram").asDouble()).isPositive();
    run("lm", "describe", "--lm", bin.toString());
    assertThat(out.toString()).contains("w.bin  (Steelyard packed binary)", "kept when seen at least", "bytes of n-gram tables");
  }

  @Test
  void describeReadsTheMinimumCountsAModelRecordsInBothSpellings() throws Exception {
    Path text = dir.resolve("corpus.txt");
    Files.writeString(text, "ten crates to bay two\nten crates to bay nine\nten pears\n");
    Path model = dir.resolve("m.arpa");
    assertThat(run("lm", "train", "--corpus", text.toString(), "--order", "3", "--min-count", "3=2", "--out", model.toString())).isZero();
    Path current = dir.resolve("current.json");
    assertThat(run("lm", "describe", "--lm", model.toString(), "--json", current.toString())).isZero();
    assertThat(json(current).get("orders").findValuesAsText("min_count")).containsExactly("1", "1", "2");
    // the same model with release 0.1's single cut-off line instead (cut-offs 0,0,1: trigrams seen once dropped)
    String old = Files.readString(model).replaceAll("# steelyard\\.min_count\\.\\d=\\d\n", "")
        .replace("# steelyard.max_vocab=0\n", "# steelyard.max_vocab=0\n# steelyard.cutoffs=0,0,1\n");
    Path oldModel = dir.resolve("old.arpa");
    Files.writeString(oldModel, old);
    Path legacy = dir.resolve("legacy.json");
    assertThat(run("lm", "describe", "--lm", oldModel.toString(), "--json", legacy.toString())).isZero();
    assertThat(json(legacy).get("orders").findValuesAsText("min_count")).containsExactly("1", "1", "2");
    Path none = dir.resolve("none.json");
    assertThat(run("lm", "describe", "--lm", WAREHOUSE.toString(), "--json", none.toString())).isZero();
    assertThat(json(none).get("orders").get(0).get("min_count").isNull()).as("a model that records none").isTrue();
  }

  @Test
  void copyRefusesToOverwriteItsInput() {
    assertThat(run("lm", "copy", "--lm", WAREHOUSE.toString(), "--out", WAREHOUSE.toString())).isEqualTo(Main.BAD_INPUT);
    assertThat(err.toString()).contains("output path is the input");
  }

  @Test
  void closedVocabularyModelWarnsAndUsesTheGivenFloor() throws Exception {
    Path text = dir.resolve("t.txt");
    Files.writeString(text, "apples kumquats\n");
    Path csv = dir.resolve("s.csv");
    assertThat(run("lm", "sentence-scores", "--lm", "src/test/resources/lm/closed.arpa", "--text", text.toString(), "--csv", csv.toString(), "--oov-log10-prob", "-5")).isEqualTo(0);
    assertThat(err.toString()).contains("warning").contains("closed-vocabulary").contains("-5");
    // P(apples | <s>) = bow(<s>) -0.30 + P(apples) -1.00; P(kumquats | apples) = bow(apples) -0.20 + floor -5;
    // P(</s> | <s> apples ...) history after an unknown word is empty: P(</s>) = -0.70
    assertThat(Files.readAllLines(csv).get(1)).isEqualTo("1,2,1," + String.format(java.util.Locale.ROOT, "%.6f", -0.30 - 1.00 - 0.20 - 5 - 0.70));
  }
}
