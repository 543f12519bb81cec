package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import com.opencsv.CSVReader;
import com.opencsv.CSVReaderBuilder;
import com.opencsv.RFC4180ParserBuilder;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every broken file of the corpus {@code src/test/resources/bad/} runs through the real command line, driven by
 * the manifest {@code bad/cases.csv}: exit code 2, exactly one {@code file[:line[:column]]: problem; expected …}
 * message naming the file, the manifest's problem words, no stack trace, and the output directory untouched
 * (half of the cases start with existing output files of known content, which must survive byte for byte).
 * Rows with exit 0 are valid inputs that look odd (rank gaps, empty transcripts) and must succeed.
 *
 * <p>Manifest columns: {@code file} (a {@code @kind/name} entry is generated at run time, see
 * {@code bad/generated.txt}), {@code exit}, {@code line} (a number, {@code none} for a whole-file problem,
 * {@code yes} for "some line", {@code any}), {@code problem} ({@code ;} separates words that must all appear,
 * {@code |} alternatives), {@code command} (placeholders {@code {file}}, {@code {valid}}, {@code {out}}) and
 * {@code known_problem} (when not empty the case is skipped with that text: a known bug awaiting its owner).
 */
class BadInputCorpusTest {
  private static final Pattern MESSAGE = Pattern.compile("^steelyard: (.+?)((?::\\d+){0,2}): (.+)$");
  private static final Pattern OUTPUT_TOKEN = Pattern.compile("\\{out}/[^ ]+");

  record Case(int index, String file, int exit, String line, String problem, String command, String knownProblem) {
    @Override
    public String toString() {
      return file + " → " + Cli.commandName(command.split(" "));
    }
  }

  static Stream<Arguments> cases() throws IOException {
    List<Arguments> out = new ArrayList<>();
    try (Reader r = Files.newBufferedReader(Fixtures.badDir().resolve("cases.csv"), StandardCharsets.UTF_8);
        CSVReader csv = new CSVReaderBuilder(r).withCSVParser(new RFC4180ParserBuilder().build()).build()) {
      String[] row;
      int index = 0;
      try {
        csv.readNext();
        while ((row = csv.readNext()) != null) {
          out.add(Arguments.of(new Case(index++, row[0], Integer.parseInt(row[1]), row[2], row[3], row[4], row.length > 5 ? row[5] : "")));
        }
      } catch (com.opencsv.exceptions.CsvValidationException e) {
        throw new IOException(e);
      }
    }
    return out.stream();
  }

  @Test
  void corpusHasAtLeastFortyBrokenFilesOfEveryKind() throws IOException {
    List<Case> all = cases().map(a -> (Case) a.get()[0]).toList();
    assertThat(all.stream().filter(c -> c.exit() == 2).map(Case::file).distinct().count()).isGreaterThanOrEqualTo(40);
    for (String kind : List.of("hyps/", "refs/", "arpa/", "bin/", "weights/", "corpus/", "rules/")) {
      assertThat(all).as(kind).anyMatch(c -> c.exit() == 2 && c.file().replace("@", "").startsWith(kind));
    }
    assertThat(all.stream().filter(c -> c.exit() == 0 && c.file().startsWith("hyps/ok-")).count()).isEqualTo(2);
    List<String> listed = Files.readAllLines(Fixtures.badDir().resolve("generated.txt")).stream()
        .filter(l -> !l.isBlank() && !l.startsWith("#")).toList();
    assertThat(listed).containsExactlyInAnyOrderElementsOf(
        all.stream().filter(c -> c.file().startsWith("@")).map(c -> c.file().substring(1)).distinct().toList());
    for (Case c : all) {
      if (!c.file().startsWith("@")) assertThat(Fixtures.badDir().resolve(c.file())).as(c.file()).exists();
    }
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("cases")
  void brokenInputExitsTwoWithOneMessageAndWritesNothing(Case c, @TempDir Path tmp) throws IOException {
    assumeTrue(c.knownProblem().isEmpty(), () -> "known problem: " + c.knownProblem());
    Path input = c.file().startsWith("@") ? generate(c.file().substring(1), tmp.resolve("input")) : Fixtures.badDir().resolve(c.file());
    Path outDir = Files.createDirectories(tmp.resolve("out"));
    List<Path> outputs = new ArrayList<>();
    Matcher m = OUTPUT_TOKEN.matcher(c.command());
    while (m.find()) outputs.add(outDir.resolve(m.group().substring("{out}/".length())));
    boolean preExisting = c.index() % 2 == 1;
    if (preExisting) {
      for (Path p : outputs) Files.writeString(p, "earlier output of " + p.getFileName() + "\n");
    }
    Map<String, String> before = Fixtures.snapshot(outDir);

    String[] args = Arrays.stream(c.command().split(" "))
        .map(a -> a.replace("{file}", input.toString()).replace("{valid}", Fixtures.validDir().toString()).replace("{out}", outDir.toString()))
        .toArray(String[]::new);
    Cli.Result r = Cli.runBuilt(args);

    assertThat(r.err()).as("no stack trace\n%s", r).doesNotContain("at steelyard.").doesNotContain("Exception").doesNotContain("\tat ");
    if (c.exit() == 0) {
      assertThat(r.exit()).as("valid input must succeed\n%s", r).isZero();
      assertThat(r.messageLines()).as("at most warnings: no error message\n%s", r)
          .noneMatch(l -> l.startsWith("steelyard: ") || l.contains("; expected "));
      for (Path p : outputs) assertThat(p).as("output written").isRegularFile();
      return;
    }
    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    List<String> lines = r.messageLines();
    assertThat(lines).as("exactly one message line\n%s", r).hasSize(1);
    checkMessage(c, input, lines.get(0));
    assertThat(Fixtures.snapshot(outDir)).as("output directory unchanged (pre-existing outputs: %s)", preExisting).isEqualTo(before);
  }

  private static void checkMessage(Case c, Path input, String line) {
    Matcher m = MESSAGE.matcher(line);
    assertThat(m.matches()).as("message form 'steelyard: file[:line[:col]]: problem': %s", line).isTrue();
    String file = m.group(1);
    String location = m.group(2);
    String rest = m.group(3);
    assertThat(file).as("message names the file: %s", line).endsWith(input.getFileName().toString());
    assertThat(rest).as("message says what was expected: %s", line).contains("; expected ");
    assertThat(rest).as("no parser internals in: %s", line)
        .doesNotContain("Source:").doesNotContain("REDACTED").doesNotContain("(code ").doesNotContain("`").doesNotContainIgnoringCase("jackson");
    switch (c.line()) {
      case "none" -> assertThat(location).as("no line for a whole-file problem: %s", line).isEmpty();
      case "yes" -> assertThat(location).as("a line number: %s", line).isNotEmpty();
      case "any" -> { }
      default -> assertThat(location).as("line: %s", line).matches(":" + c.line() + "(:\\d+)?");
    }
    if (!c.problem().isEmpty()) {
      for (String all : c.problem().split(";")) {
        assertThat(Arrays.stream(all.split("\\|")).anyMatch(w -> rest.toLowerCase().contains(w.toLowerCase())))
            .as("problem words '%s' in: %s", all, line).isTrue();
      }
    }
  }

  /** Writes the generated broken input {@code name} (e.g. {@code bin/bad-checksum.bin}) under {@code dir}. */
  static Path generate(String name, Path dir) throws IOException {
    Path target = dir.resolve(name);
    Files.createDirectories(target.getParent());
    SplittableRandom random = new SplittableRandom(name.hashCode());
    byte[] bytes = switch (name) {
      case "hyps/ten-megabyte-field.csv" -> tenMegabyteField();
      case "hyps/truncated.csv.gz" -> truncatedGzip(Files.readAllBytes(Fixtures.valid("hyps.csv")));
      case "refs/truncated.csv.gz" -> truncatedGzip(Files.readAllBytes(Fixtures.valid("refs.csv")));
      case "arpa/truncated.arpa.gz" -> truncatedGzip(Files.readAllBytes(Fixtures.valid("small.arpa")));
      case "hyps/binary-garbage.csv", "arpa/binary-garbage.arpa", "corpus/binary-file.txt" -> garbage(random, 4096);
      case "bin/wrong-magic.bin" -> patch(goodBinary(dir), 0, new byte[] {'N', 'O', 'T', 'M', 'O', 'D', 'E', 'L'});
      case "bin/wrong-version.bin" -> patch(goodBinary(dir), 8, ByteBuffer.allocate(4).order(ByteOrder.LITTLE_ENDIAN).putInt(99).array());
      case "bin/bad-checksum.bin" -> flipLastQuarter(goodBinary(dir));
      case "bin/truncated.bin" -> {
        byte[] b = goodBinary(dir);
        yield Arrays.copyOf(b, b.length * 2 / 3);
      }
      case "hyps/cr-only-line-ends.csv" -> crOnly(Files.readAllBytes(Fixtures.valid("hyps.csv")));
      case "refs/cr-only-line-ends.csv" -> crOnly(Files.readAllBytes(Fixtures.valid("refs.csv")));
      case "hyps/gzip-trailing-garbage.csv.gz" -> concat(gzip(Files.readAllBytes(Fixtures.valid("hyps.csv"))), "not gzip\n".getBytes(StandardCharsets.UTF_8));
      case "refs/gzip-trailing-garbage.csv.gz" -> concat(gzip(Files.readAllBytes(Fixtures.valid("refs.csv"))), new byte[] {0, 0, 0, 0});
      case "corpus/gzip-trailing-garbage.txt.gz" -> concat(gzip(Files.readAllBytes(Fixtures.valid("corpus.txt"))), "extra text".getBytes(StandardCharsets.UTF_8));
      case "hyps/gzip-truncated-second-member.csv.gz" -> truncatedSecondMember(Files.readAllBytes(Fixtures.valid("hyps.csv")));
      case "arpa/gzip-truncated-second-member.arpa.gz" -> truncatedSecondMember(Files.readAllBytes(Fixtures.valid("small.arpa")));
      case "bin/positive-log-prob.bin" -> BinaryModelPatch.of(goodBinary(dir)).setUnigramLog10("load", 0.5f).bytes();
      case "bin/nan-log-prob.bin" -> BinaryModelPatch.of(goodBinary(dir)).setFirstTopOrderLog10(Float.NaN).bytes();
      case "bin/counts-disagree.bin" -> BinaryModelPatch.of(goodBinary(dir)).addToCount(2, 1).bytes();
      case "bin/invalid-utf8-token.bin" -> BinaryModelPatch.of(goodBinary(dir)).breakTokenUtf8("crates").bytes();
      case "arpa/char-unit.arpa" -> charModel(dir);
      default -> throw new IllegalArgumentException("no generator for " + name);
    };
    Files.write(target, bytes);
    return target;
  }

  private static byte[] tenMegabyteField() {
    StringBuilder sb = new StringBuilder(10_600_000);
    sb.append("utt_id,system,rank,text,acoustic,lm\nbay-001,asr,1,");
    for (int i = 0; i < 10 * 1024 * 1024 / 8; i++) sb.append("apples; ");
    sb.append(",-120.5,-20.1\n");
    return sb.toString().getBytes(StandardCharsets.UTF_8);
  }

  static byte[] gzip(byte[] plain) throws IOException {
    ByteArrayOutputStream bos = new ByteArrayOutputStream();
    try (GZIPOutputStream gz = new GZIPOutputStream(bos)) {
      gz.write(plain);
    }
    return bos.toByteArray();
  }

  private static byte[] truncatedGzip(byte[] plain) throws IOException {
    byte[] gz = gzip(plain);
    return Arrays.copyOf(gz, gz.length / 2);
  }

  /** The file with every LF turned into a lone CR (classic Mac OS line ends). */
  private static byte[] crOnly(byte[] lf) {
    byte[] b = lf.clone();
    for (int i = 0; i < b.length; i++) if (b[i] == '\n') b[i] = '\r';
    return b;
  }

  private static byte[] concat(byte[] a, byte[] b) {
    byte[] out = Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }

  /** Two gzip members (RFC 1952 allows several): the first half of the text whole, the second cut after 6 bytes. */
  private static byte[] truncatedSecondMember(byte[] plain) throws IOException {
    int half = plain.length / 2;
    byte[] second = gzip(Arrays.copyOfRange(plain, half, plain.length));
    return concat(gzip(Arrays.copyOf(plain, half)), Arrays.copyOf(second, 6));
  }

  /** A character-level model trained by the real {@code lm train --unit char} on the valid corpus. */
  private static byte[] charModel(Path dir) throws IOException {
    Path model = dir.resolve("char-trained.arpa");
    Cli.Result r = Cli.runBuilt("lm", "train", "--corpus", Fixtures.valid("corpus.txt").toString(), "--order", "3", "--unit", "char",
        "--out", model.toString());
    assertThat(r.exit()).as("lm train --unit char\n%s", r).isZero();
    return Files.readAllBytes(model);
  }

  private static byte[] garbage(SplittableRandom random, int n) {
    byte[] b = new byte[n];
    for (int i = 0; i < n; i++) b[i] = (byte) random.nextInt(256);
    b[0] = (byte) 0xC3; // never a BOM or text start, so every reader sees binary data at once
    b[1] = 0x00;
    return b;
  }

  private static byte[] patch(byte[] b, int offset, byte[] with) {
    System.arraycopy(with, 0, b, offset, with.length);
    return b;
  }

  private static byte[] flipLastQuarter(byte[] b) {
    int i = b.length - Math.max(1, b.length / 4);
    b[i] ^= 0x5A;
    return b;
  }

  /** A valid binary model converted from the committed ARPA by the real {@code lm copy}. */
  static byte[] goodBinary(Path dir) throws IOException {
    Path bin = dir.resolve("good.bin");
    if (!Files.exists(bin)) {
      Files.createDirectories(dir);
      Cli.Result r = Cli.runBuilt("lm", "copy", "--lm", Fixtures.valid("small.arpa").toString(), "--out", bin.toString());
      assertThat(r.exit()).as("lm copy of the valid model\n%s", r).isZero();
    }
    return Files.readAllBytes(bin);
  }
}
