package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Runs that succeed but do something else than the command line suggests say so, on stderr and in the JSON
 * {@code warnings}: a model loaded but weighted 0, an option the method ignores, the scoring unit taken from
 * the model, picks that go nowhere, and a CSV file given where plain text is expected.
 */
class SurprisesWarnedTest {
  private static final String HYPS = Fixtures.valid("hyps.csv").toString();
  private static final String REFS = Fixtures.valid("refs.csv").toString();
  private static final String ARPA = Fixtures.valid("small.arpa").toString();
  private static final String CORPUS = Fixtures.valid("corpus.txt").toString();

  @TempDir Path dir;

  @Test
  void aModelWhoseWeightsAreAllZeroIsNamedAsUnused() throws IOException {
    Warned w = rescore("--lm", ARPA);
    w.contains("is loaded but scores nothing: every LM weight is 0");
  }

  @Test
  void optionsTheMethodIgnoresAreNamed() throws IOException {
    rescore("--method", "nbest", "--beam", "8", "--lattice-lm-weight", "0.5", "--lm", ARPA)
        .contains("--beam has no effect with --method nbest").contains("--lattice-lm-weight has no effect with --method nbest");
    rescore("--method", "lattice", "--mbr-max-hyps", "5").contains("--mbr-max-hyps has no effect with --method lattice");
    rescore("--method", "consensus", "--lattice-max-hyps", "5").doesNotContain("--lattice-max-hyps has no effect");
  }

  @Test
  void theUnitTakenFromTheModelIsNamedAndTheSummarySaysCer() throws IOException {
    Path charModel = dir.resolve("char.arpa");
    assertThat(Cli.runBuilt("lm", "train", "--corpus", CORPUS, "--order", "3", "--unit", "char", "--out", charModel.toString()).exit()).isZero();
    Warned w = rescore("--lm", charModel.toString(), "--lm-weight", "0.5", "--refs", REFS);
    w.contains("the scoring unit is char, taken from the model " + charModel + " because --unit was not given");
    assertThat(w.result.err()).contains("  CER ").doesNotContain("  WER ");
  }

  @Test
  void jsonWithoutOutSaysThePicksGoNowhere() throws IOException {
    Path json = dir.resolve("s.json");
    Cli.Result r = Cli.runBuilt("rescore", "--hyps", HYPS, "--features", "acoustic", "--json", json.toString());
    assertThat(r.exit()).isZero();
    assertThat(r.out()).as("no picks on stdout").isEmpty();
    new Warned(r, json).contains("the picks are not written anywhere: --json was given without --out");
  }

  @Test
  void aCsvFileGivenAsPlainTextIsNamed() throws IOException {
    Path json = dir.resolve("train.json");
    Cli.Result train = Cli.runBuilt("lm", "train", "--corpus", REFS, "--order", "2", "--out", dir.resolve("m.arpa").toString(), "--json", json.toString());
    assertThat(train.exit()).as("%s", train).isZero();
    new Warned(train, json).contains("the first line 'utt_id,text' looks like a CSV header");

    Path ppl = dir.resolve("ppl.json");
    Cli.Result perplexity = Cli.runBuilt("lm", "perplexity", "--lm", ARPA, "--text", REFS, "--json", ppl.toString());
    assertThat(perplexity.exit()).isZero();
    new Warned(perplexity, ppl).contains("looks like a CSV header");
  }

  @Test
  void anOrdinaryRunWarnsAboutNothing() throws IOException {
    Path json = dir.resolve("s.json");
    Cli.Result r = Cli.runBuilt("rescore", "--hyps", HYPS, "--refs", REFS, "--features", "acoustic", "--lm", ARPA, "--lm-weight", "0.5",
        "--out", dir.resolve("p.csv").toString(), "--json", json.toString());
    assertThat(r.exit()).isZero();
    assertThat(r.err()).doesNotContain("warning");
    assertThat(new ObjectMapper().readTree(json.toFile()).get("warnings")).isEmpty();
    Cli.Result train = Cli.runBuilt("lm", "train", "--corpus", CORPUS, "--order", "2", "--out", dir.resolve("m.arpa").toString());
    assertThat(train.err()).doesNotContain("CSV header");
  }

  private Warned rescore(String... more) throws IOException {
    Path json = dir.resolve("summary.json");
    List<String> args = new ArrayList<>(List.of("rescore", "--hyps", HYPS, "--features", "acoustic",
        "--out", dir.resolve("picks.csv").toString(), "--json", json.toString()));
    args.addAll(List.of(more));
    Cli.Result r = Cli.runBuilt(args.toArray(String[]::new));
    assertThat(r.exit()).as("%s", r).isZero();
    return new Warned(r, json);
  }

  /** A successful run's stderr and JSON warnings. */
  private static final class Warned {
    final Cli.Result result;
    final List<String> json = new ArrayList<>();

    Warned(Cli.Result result, Path jsonFile) throws IOException {
      this.result = result;
      new ObjectMapper().readTree(jsonFile.toFile()).get("warnings").forEach(w -> json.add(w.asText()));
    }

    Warned contains(String text) {
      assertThat(result.err()).as("stderr").contains("steelyard: warning: ").contains(text);
      assertThat(json).as("JSON warnings").anyMatch(w -> w.contains(text));
      return this;
    }

    Warned doesNotContain(String text) {
      assertThat(result.err()).doesNotContain(text);
      assertThat(json).noneMatch(w -> w.contains(text));
      return this;
    }
  }
}
