package steelyard.lm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;
import steelyard.cli.Main;
import steelyard.io.InputException;

/**
 * Every broken model file in {@code lm/bad/} is an {@link InputException} with file, line (for text files)
 * and an expectation, and exit code 2 with one message and no stack trace through the real command line.
 */
class BadModelFilesTest {
  static Stream<Arguments> badFiles() {
    return Stream.of(
        Arguments.of("counts-disagree.arpa", 23L, "section \\2-grams: has 2 n-grams but \\data\\ announced 3"),
        Arguments.of("too-many-ngrams.arpa", 25L, "more 3-grams than the 1 announced"),
        Arguments.of("missing-data.arpa", 26L, "no \\data\\ line found"),
        Arguments.of("bad-float.arpa", 16L, "bad log10 probability '-0.9x0'"),
        Arguments.of("bad-backoff.arpa", 15L, "bad log10 back-off weight '-0.2.0'"),
        Arguments.of("bad-count.arpa", 2L, "bad count line 'ngram 1=x'"),
        Arguments.of("positive-logprob.arpa", 13L, "positive log10 probability 0.70"),
        Arguments.of("wrong-order.arpa", 21L, "n-gram of the wrong order in section \\2-grams:"),
        Arguments.of("duplicate-ngram.arpa", 22L, "duplicate 2-gram 'crates apples'"),
        Arguments.of("missing-section.arpa", 23L, "missing section \\3-grams:"),
        Arguments.of("truncated-no-end.arpa", 26L, "file ends without \\end\\"),
        Arguments.of("truncated-entries.arpa", 24L, "file ends in section \\3-grams: after 1 of 2 announced n-grams"),
        Arguments.of("binary-garbage.arpa", 1L, "NUL character"),
        Arguments.of("truncated.arpa.gz", 0L, "gzip data is truncated"),
        Arguments.of("not-gzip.arpa.gz", 0L, "not gzip data"),
        Arguments.of("empty.arpa", 0L, "empty file"),
        Arguments.of("wrong-magic.bin", 0L, "wrong magic bytes"),
        Arguments.of("text-named.bin", 0L, "wrong magic bytes"),
        Arguments.of("wrong-version.bin", 0L, "format version 9 is not supported"),
        Arguments.of("bad-checksum.bin", 0L, "checksum mismatch"),
        Arguments.of("truncated.bin", 0L, "payload is 588 bytes but the header announces 600 (truncated?)"),
        Arguments.of("truncated-header.bin", 0L, "file too short for the header"),
        Arguments.of("empty.bin", 0L, "empty file"));
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("badFiles")
  void readerNamesFileLineAndProblem(String name, long line, String problem) {
    Path file = TestFiles.resource("lm/bad/" + name);
    assertThatThrownBy(() -> ModelFiles.loadExact(file))
        .isInstanceOfSatisfying(InputException.class, e -> {
          assertThat(e.file()).isEqualTo(file.toString());
          assertThat(e.line()).isEqualTo(line);
          assertThat(e.problem()).contains(problem);
          assertThat(e.expected()).isNotBlank();
        });
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("badFiles")
  void commandLineExitsWithTwoAndOneMessage(String name, long line, String problem) {
    Path file = TestFiles.resource("lm/bad/" + name);
    StringWriter err = new StringWriter();
    StringWriter out = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setErr(new PrintWriter(err));
    cl.setOut(new PrintWriter(out));
    int code = cl.execute("lm", "describe", "--lm", file.toString());
    assertThat(code).isEqualTo(Main.BAD_INPUT);
    String prefix = line > 0 ? file + ":" + line + ":" : file + ": ";
    assertThat(err.toString()).startsWith("steelyard: " + prefix).contains(problem).contains("; expected ");
    assertThat(err.toString().strip().lines()).hasSize(1);
    assertThat(out.toString()).isEmpty();
  }

  @Test
  void unknownFileTypeIsAnInputError() {
    assertThatThrownBy(() -> ModelFiles.load(Path.of("model.txt")))
        .isInstanceOf(InputException.class).hasMessageContaining("model.txt: unknown model file type; expected a name ending in .arpa, .arpa.gz or .bin");
  }

  @Test
  void failedConversionLeavesNoOutput(@TempDir Path dir) {
    Path out = dir.resolve("m.bin");
    int code = Main.commandLine().setErr(new PrintWriter(new StringWriter()))
        .execute("lm", "copy", "--lm", TestFiles.resource("lm/bad/truncated-entries.arpa").toString(), "--out", out.toString());
    assertThat(code).isEqualTo(Main.BAD_INPUT);
    assertThat(dir.toFile().list()).isEmpty();
    assertThat(Files.exists(out)).isFalse();
  }
}
