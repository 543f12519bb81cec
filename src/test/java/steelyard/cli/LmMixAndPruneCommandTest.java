package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;
import steelyard.lm.RandomBackoffModels;

class LmMixAndPruneCommandTest {
  @TempDir Path dir;
  Path a, b, text;
  final ByteArrayOutputStream err = new ByteArrayOutputStream();

  @BeforeEach
  void models() throws Exception {
    a = dir.resolve("a.arpa");
    b = dir.resolve("b.arpa.gz");
    ModelFiles.save(RandomBackoffModels.create(1, 8, 3, 0.6), a);
    ModelFiles.save(RandomBackoffModels.create(2, 8, 3, 0.6), b);
    StringBuilder sb = new StringBuilder();
    SplittableRandom rnd = new SplittableRandom(3);
    for (int i = 0; i < 50; i++) {
      for (int j = 1 + rnd.nextInt(6); j > 0; j--) sb.append('w').append(rnd.nextInt(8)).append(' ');
      sb.append('\n');
    }
    text = dir.resolve("held-out.txt");
    Files.writeString(text, sb.toString());
  }

  /**
   * Through the command line, with a second model that knows words the first does not: a static mix with
   * weights 1, 0 scores held-out text like the first model alone (same perplexity to ARPA precision, same OOV
   * count), and the report's exact and written perplexities agree.
   */
  @Test
  void staticMixWithWeightsOneAndZeroScoresLikeTheFirstModel() throws Exception {
    Path wide = dir.resolve("wide.arpa");
    ModelFiles.save(RandomBackoffModels.create(4, 12, 3, 0.6), wide);
    Files.writeString(text, Files.readString(text) + "w9 w1 w10\nw11\n");
    Path mixed = dir.resolve("mixed.arpa");
    Path report = dir.resolve("mix.json");
    assertThat(run("lm", "mix", "--lm", a.toString(), "--lm", wide.toString(), "--text", text.toString(), "--mix-weights", "1,0",
        "--out", mixed.toString(), "--json", report.toString())).isZero();
    Path alone = dir.resolve("alone.json");
    Path written = dir.resolve("written.json");
    assertThat(run("lm", "perplexity", "--lm", a.toString(), "--text", text.toString(), "--json", alone.toString())).isZero();
    assertThat(run("lm", "perplexity", "--lm", mixed.toString(), "--text", text.toString(), "--json", written.toString())).isZero();
    ObjectMapper m = new ObjectMapper();
    JsonNode x = m.readTree(alone.toFile());
    JsonNode y = m.readTree(written.toFile());
    JsonNode r = m.readTree(report.toFile());
    assertThat(y.get("oov").asLong()).isEqualTo(x.get("oov").asLong()).isEqualTo(3);
    assertThat(y.get("perplexity").asDouble()).isCloseTo(x.get("perplexity").asDouble(), within(1e-4 * x.get("perplexity").asDouble()));
    // Equal up to the 7-digit rounding of the ARPA components (renormalising them moves the values by ~1e-7).
    assertThat(r.get("perplexity_written_model").asDouble()).isCloseTo(r.get("perplexity_exact_mixture").asDouble(), within(1e-5));
  }

  int run(String... args) {
    CommandLine cl = Main.commandLine();
    cl.setErr(new PrintWriter(err, true, StandardCharsets.UTF_8));
    cl.setOut(new PrintWriter(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8));
    return cl.execute(args);
  }

  JsonNode json(Path p) throws Exception {
    return new ObjectMapper().readTree(p.toFile());
  }

  @Nested
  class Mix {
    @Test
    void writesOneModelAndReportsBothPerplexities() throws Exception {
      Path out = dir.resolve("mixed.arpa");
      Path report = dir.resolve("mix.json");
      assertThat(run("lm", "mix", "--lm", a.toString(), "--lm", b.toString(), "--text", text.toString(), "--out", out.toString(), "--json", report.toString()))
          .as(err.toString()).isZero();
      JsonNode j = json(report);
      double sum = 0;
      for (JsonNode c : j.get("components")) sum += c.get("weight").asDouble();
      assertThat(sum).isCloseTo(1.0, within(1e-9));
      assertThat(j.get("perplexity_exact_mixture").asDouble()).isPositive();
      assertThat(j.get("perplexity_written_model").asDouble()).isPositive();
      BackoffModel mixed = ModelFiles.loadExact(out);
      assertThat(RandomBackoffModels.totalProbability(mixed, new int[] {mixed.wordId("w1")})).isCloseTo(1.0, within(1e-5));
    }

    @Test
    void emNeverEndsAbovePerplexityOfUniformWeights() throws Exception {
      Path report = dir.resolve("mix.json");
      run("lm", "mix", "--lm", a.toString(), "--lm", b.toString(), "--text", text.toString(), "--out", dir.resolve("m.arpa").toString(), "--json", report.toString());
      JsonNode h = json(report).get("em_perplexity_history");
      assertThat(h.get(h.size() - 1).asDouble()).isLessThanOrEqualTo(h.get(0).asDouble());
    }

    @Test
    void oneModelIsABadInput() {
      assertThat(run("lm", "mix", "--lm", a.toString(), "--text", text.toString(), "--out", dir.resolve("m.arpa").toString())).isEqualTo(2);
      assertThat(err.toString()).contains("--lm: only 1 model given; expected at least two --lm files");
    }

    @Test
    void refusesToOverwriteAnInput() {
      assertThat(run("lm", "mix", "--lm", a.toString(), "--lm", b.toString(), "--text", text.toString(), "--out", a.toString())).isEqualTo(2);
    }
  }

  @Nested
  class Prune {
    @Test
    void thresholdZeroKeepsEveryNgram() throws Exception {
      Path report = dir.resolve("prune.json");
      assertThat(run("lm", "prune", "--lm", a.toString(), "--threshold", "0", "--out", dir.resolve("p.arpa").toString(), "--json", report.toString()))
          .as(err.toString()).isZero();
      for (JsonNode o : json(report).get("orders")) assertThat(o.get("ngrams_kept").asInt()).isEqualTo(o.get("ngrams_before").asInt());
    }

    @Test
    void reportsPerplexityBeforeAndAfterOnHeldOutText() throws Exception {
      Path report = dir.resolve("prune.json");
      Path out = dir.resolve("p.bin");
      assertThat(run("lm", "prune", "--lm", a.toString(), "--threshold", "1e-2", "--text", text.toString(), "--out", out.toString(), "--json", report.toString()))
          .as(err.toString()).isZero();
      JsonNode j = json(report);
      assertThat(j.get("perplexity_before").asDouble()).isPositive();
      assertThat(j.get("perplexity_after").asDouble()).isPositive();
      assertThat(j.get("orders").get(2).get("ngrams_kept").asInt()).isLessThan(j.get("orders").get(2).get("ngrams_before").asInt());
      assertThat(Files.exists(out)).isTrue();
    }

    @Test
    void negativeThresholdIsABadInput() {
      assertThat(run("lm", "prune", "--lm", a.toString(), "--threshold", "-1", "--out", dir.resolve("p.arpa").toString())).isEqualTo(2);
      assertThat(err.toString()).contains("--threshold:");
    }
  }
}
