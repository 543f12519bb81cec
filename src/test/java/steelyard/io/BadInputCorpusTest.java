package steelyard.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Drives the broken-file corpus in {@code src/test/resources/io/bad/}: {@code EXPECTED.tsv} lists each file,
 * whether lenient mode may skip the problem ({@code row}) or not ({@code fatal}), the line the message must
 * name (0 = none) and words the problem must contain. Files named {@code hyps-*} are read as hypotheses with
 * {@code --features acoustic,lm}, {@code refs-*} as references.
 */
class BadInputCorpusTest {

  record Case(String name, boolean rowLevel, long line, String words) {
    Path path() {
      return corpusDir().resolve(name);
    }

    @Override
    public String toString() {
      return name;
    }
  }

  static Path corpusDir() {
    try {
      return Path.of(BadInputCorpusTest.class.getResource("/io/bad/EXPECTED.tsv").toURI()).getParent();
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  static Stream<Case> cases() {
    try {
      List<Case> out = new ArrayList<>();
      for (String l : Files.readAllLines(corpusDir().resolve("EXPECTED.tsv"))) {
        if (l.startsWith("#") || l.isBlank()) continue;
        String[] f = l.split("\t", -1);
        out.add(new Case(f[0], f[1].equals("row"), Long.parseLong(f[2]), f[3]));
      }
      return out.stream();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static List<SkippedRow> importFile(Path file, int maxBadRows) {
    List<SkippedRow> skipped = new ArrayList<>();
    ImportOptions options = new ImportOptions(FeatureSpec.parseList("acoustic,lm"), null, maxBadRows, w -> {}, skipped::add);
    if (file.getFileName().toString().startsWith("refs-")) {
      ReferencesReader.readAll(file, options);
    } else {
      try (HypothesesReader r = HypothesesReader.open(file, options)) {
        while (r.hasNext()) r.next();
      }
    }
    return skipped;
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("cases")
  void strictImportFailsWithFileLineProblemAndExpectation(Case c) {
    InputException e = catchThrowableOfType(InputException.class, () -> importFile(c.path(), 0));
    assertThat(e).as("an InputException for %s", c.name).isNotNull();
    assertThat(e.file()).isEqualTo(c.path().toString());
    assertThat(e.line()).isEqualTo(c.line);
    assertThat(e.problem()).contains(c.words);
    String where = Pattern.quote(c.path().toString()) + (c.line > 0 ? ":" + c.line + "(:\\d+)?" : "");
    assertThat(e.getMessage()).matches(where + ": [^\\n]+; expected [^\\n]+");
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("cases")
  void lenientImportSkipsRowProblemsAndStillFailsOnStructuralOnes(Case c) {
    if (c.rowLevel) {
      List<SkippedRow> skipped = importFile(c.path(), 1);
      assertThat(skipped).hasSize(1);
      assertThat(skipped.get(0).line()).isEqualTo(c.line);
      assertThat(skipped.get(0).reason()).contains(c.words);
      assertThat(skipped.get(0).file()).isEqualTo(c.path().toString());
    } else {
      InputException e = catchThrowableOfType(InputException.class, () -> importFile(c.path(), 100));
      assertThat(e).as("structural problem in %s is never skipped", c.name).isNotNull();
      assertThat(e.problem()).contains(c.words);
    }
  }
}
