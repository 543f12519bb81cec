package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

/**
 * Release 0.1's spellings of renamed commands and options: each still works exactly like its new spelling,
 * prints one notice line, and appears neither in the help nor in anything Steelyard writes.
 */
class OldSpellingsTest {
  static final Path WAREHOUSE = Path.of("src/test/resources/lm/warehouse.arpa");
  static final Path CLOSED = Path.of("src/test/resources/lm/closed.arpa");
  static final Path WEIGHTS_V1 = Path.of("src/test/resources/rescore/dockets-weights-version1.json");

  @TempDir Path dir;

  record Run(int exit, String out, String err) {
    long notices() {
      return err.lines().filter(l -> l.contains("is an old spelling, accepted for one more release")).count();
    }
  }

  static Run run(String... args) {
    ScoreCommandTest.Result r = ScoreCommandTest.run(args);
    return new Run(r.code(), r.out(), r.err());
  }

  @Nested
  class Commands {
    @Test
    void lmInfoDescribesLikeLmDescribeWithOneNotice() {
      Run old = run("lm", "info", "--lm", WAREHOUSE.toString());
      Run current = run("lm", "describe", "--lm", WAREHOUSE.toString());
      assertThat(old.exit()).as(old.err()).isZero();
      assertThat(old.out()).isEqualTo(current.out());
      assertThat(old.err()).contains("steelyard: warning: 'steelyard lm info' is an old spelling, accepted for one more release;"
          + " use 'steelyard lm describe'");
      assertThat(old.notices()).isEqualTo(1);
      assertThat(current.notices()).isZero();
    }

    @Test
    void lmConvertWritesTheSameFileAsLmCopyWithOneNotice() throws IOException {
      Path old = dir.resolve("old.bin"), current = dir.resolve("new.bin");
      Run r = run("lm", "convert", "--lm", WAREHOUSE.toString(), "--out", old.toString());
      assertThat(r.exit()).as(r.err()).isZero();
      assertThat(r.err()).contains("'steelyard lm convert' is an old spelling").contains("use 'steelyard lm copy'");
      assertThat(run("lm", "copy", "--lm", WAREHOUSE.toString(), "--out", current.toString()).exit()).isZero();
      assertThat(Files.readAllBytes(old)).isEqualTo(Files.readAllBytes(current));
    }
  }

  @Nested
  class Options {
    Path text;

    @BeforeEach
    void text() throws IOException {
      text = dir.resolve("t.txt");
      Files.writeString(text, "apples kumquats\n");
    }

    @Test
    void unkLog10SetsTheOutOfVocabularyProbability() throws IOException {
      Path old = dir.resolve("old.csv"), current = dir.resolve("new.csv");
      Run r = run("lm", "sentence-scores", "--lm", CLOSED.toString(), "--text", text.toString(), "--csv", old.toString(),
          "--unk-log10", "-5");
      assertThat(r.exit()).as(r.err()).isZero();
      assertThat(r.err()).contains("--unk-log10 is an old spelling").contains("use --oov-log10-prob");
      assertThat(r.notices()).isEqualTo(1);
      assertThat(run("lm", "sentence-scores", "--lm", CLOSED.toString(), "--text", text.toString(), "--csv", current.toString(),
          "--oov-log10-prob", "-5").exit()).isZero();
      assertThat(Files.readAllLines(old)).isEqualTo(Files.readAllLines(current));
      Path defaults = dir.resolve("default.csv");
      assertThat(run("lm", "sentence-scores", "--lm", CLOSED.toString(), "--text", text.toString(), "--csv", defaults.toString())
          .exit()).isZero();
      assertThat(Files.readAllLines(old)).as("the value reached the model").isNotEqualTo(Files.readAllLines(defaults));
    }

    @Test
    void theAttachedFormWorksToo() {
      Run r = run("lm", "describe", "--lm", CLOSED.toString(), "--unk-log10=-4");
      assertThat(r.exit()).as(r.err()).isZero();
      assertThat(r.out()).contains("log10 P = -4.0 (--oov-log10-prob)");
      assertThat(r.notices()).isEqualTo(1);
    }

    @Test
    void aValueTheNewSpellingRefusesIsRefusedUnderTheOldOne() {
      Run r = run("lm", "describe", "--lm", CLOSED.toString(), "--unk-log10", "3");
      assertThat(r.exit()).isEqualTo(Main.BAD_INPUT);
      assertThat(r.err()).contains("--oov-log10-prob: value 3.0 is not a finite log10 probability");
    }
  }

  @Nested
  class Rescoring {
    Path hyps;
    Path refs;

    @BeforeEach
    void files() throws IOException {
      hyps = dir.resolve("hyps.csv");
      refs = dir.resolve("refs.csv");
      RescoreFixtures.writeRandomSet(hyps, refs, 7L, 40);
    }

    private Run rescore(String sharpnessOption, String stem) {
      return run("rescore", "--hyps", hyps.toString(), "--refs", refs.toString(), "--features", "acoustic,conf:linear",
          "--method", "mbr", sharpnessOption, "0.05", "--out", dir.resolve(stem + ".csv").toString(),
          "--json", dir.resolve(stem + ".json").toString(), "--save-weights", dir.resolve(stem + ".weights.json").toString());
    }

    @Test
    void posteriorScaleSetsThePosteriorSharpness() throws IOException {
      Run old = rescore("--posterior-scale", "old");
      Run current = rescore("--posterior-sharpness", "new");
      assertThat(old.exit()).as(old.err()).isZero();
      assertThat(old.err()).contains("--posterior-scale is an old spelling").contains("use --posterior-sharpness");
      assertThat(old.notices()).isEqualTo(1);
      for (String suffix : List.of(".csv", ".json", ".weights.json"))
        assertThat(Files.readAllBytes(dir.resolve("old" + suffix))).as(suffix).isEqualTo(Files.readAllBytes(dir.resolve("new" + suffix)));
      assertThat(Files.readString(dir.resolve("old.weights.json"))).contains("\"posterior_sharpness\" : 0.05");
    }

    @Test
    void theNetworkCommandTakesTheOldSpellingToo() throws IOException {
      Path old = dir.resolve("old-arcs.csv"), current = dir.resolve("new-arcs.csv");
      Run r = run("network", "--hyps", hyps.toString(), "--utt", "dock-0001", "--features", "acoustic",
          "--posterior-scale", "0.01", "--arcs", old.toString());
      assertThat(r.exit()).as(r.err()).isZero();
      assertThat(r.notices()).isEqualTo(1);
      assertThat(run("network", "--hyps", hyps.toString(), "--utt", "dock-0001", "--features", "acoustic",
          "--posterior-sharpness", "0.01", "--arcs", current.toString()).exit()).isZero();
      assertThat(Files.readAllBytes(old)).isEqualTo(Files.readAllBytes(current));
    }

    @Test
    void aVersionOneWeightsFileIsReadAndEverythingWrittenUsesTheNewKey() throws IOException {
      Path saved = dir.resolve("saved.weights.json"), summary = dir.resolve("s.json");
      Files.writeString(hyps, Files.readString(hyps).replaceFirst(",conf\n", ",confidence\n"));
      Run r = run("rescore", "--hyps", hyps.toString(), "--features", "confidence:linear", "--weights", WEIGHTS_V1.toString(),
          "--unit", "word", "--out", dir.resolve("p.csv").toString(), "--json", summary.toString(),
          "--save-weights", saved.toString());
      assertThat(r.exit()).as(r.err()).isZero();
      for (Path written : List.of(saved, summary)) {
        assertThat(Files.readString(written)).as(written.toString())
            .contains("\"posterior_sharpness\"", "\"version\" : 2").doesNotContain("posterior_scale");
      }
    }
  }

  @Nested
  class Help {
    @Test
    void noHelpPageShowsAnOldSpelling() {
      Map<String, String> pages = new LinkedHashMap<>();
      collectHelp(Main.commandLine(), pages);
      assertThat(pages).hasSizeGreaterThan(10).containsKey("steelyard lm train");
      pages.forEach((command, page) -> {
        for (OldSpellings.Option o : OldSpellings.OPTIONS) {
          if (o.commands().isEmpty() || o.commands().contains(command))
            assertThat(page).as(command).doesNotContain(o.old() + "=").doesNotContain(o.old() + " ");
        }
        assertThat(page).as(command).doesNotContainPattern("\\n\\s+(convert|info)\\s");
      });
    }

    private void collectHelp(CommandLine cl, Map<String, String> pages) {
      if (cl.getCommandSpec().usageMessage().hidden()) return;
      pages.put(cl.getCommandSpec().qualifiedName(), cl.getUsageMessage(CommandLine.Help.Ansi.OFF));
      cl.getSubcommands().forEach((name, sub) -> {
        if (!name.equals("help")) collectHelp(sub, pages);
      });
    }

    @Test
    void everyNewSpellingIsARealOption() {
      CommandLine root = Main.commandLine();
      for (OldSpellings.Option o : OldSpellings.OPTIONS) {
        assertThat(hasOption(root, o.current())).as(o.current()).isTrue();
      }
    }

    private boolean hasOption(CommandLine cl, String name) {
      if (cl.getCommandSpec().findOption(name) != null) return true;
      for (CommandLine sub : cl.getSubcommands().values()) if (sub != cl && hasOption(sub, name)) return true;
      return false;
    }
  }
}
