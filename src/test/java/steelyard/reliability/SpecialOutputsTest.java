package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.FileInputStream;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * An output that is not a regular file is written in place, never replaced: a FIFO's reader gets the whole
 * output and the FIFO stays a FIFO, a character device stays a device, {@code /dev/stdout} redirected to a
 * file keeps that file (same inode), and {@code -} is standard output for every output option. The FIFO and
 * the device are made here ({@code mkfifo}, {@code mknod} as root), never the machine's own {@code /dev/null}.
 */
class SpecialOutputsTest {
  private static final String HYPS = Fixtures.valid("hyps.csv").toString();
  private static final String REFS = Fixtures.valid("refs.csv").toString();
  private static final String ARPA = Fixtures.valid("small.arpa").toString();
  private static final String CORPUS = Fixtures.valid("corpus.txt").toString();

  @Test
  void aFifoGetsTheWholeOutputAndStaysAFifo(@TempDir Path dir) throws Exception {
    Path regular = dir.resolve("picks.csv");
    assertThat(Cli.runBuilt(rescore("--out", regular.toString())).exit()).isZero();
    Path fifo = make(dir.resolve("picks.fifo"), "mkfifo", "picks.fifo");
    CompletableFuture<byte[]> reader = CompletableFuture.supplyAsync(() -> readAll(fifo));

    Cli.Result r = Cli.runBuilt(rescore("--out", fifo.toString(), "--json", dir.resolve("summary.json").toString()));
    if (!reader.isDone()) unblock(fifo);

    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(reader.get(60, TimeUnit.SECONDS)).as("the reader got exactly the picks").isEqualTo(Files.readAllBytes(regular));
    assertThat(fileType(fifo)).isEqualTo("fifo");
    assertThat(Fixtures.listing(dir).keySet()).containsExactlyInAnyOrder("picks.csv", "picks.fifo", "summary.json");
  }

  @Test
  void aCharacterDeviceStaysADeviceAndMayTakeSeveralOutputs(@TempDir Path dir) throws Exception {
    assumeTrue("root".equals(System.getProperty("user.name")), "making a character device (mknod) needs root; skipped");
    Path device = make(dir.resolve("sink"), "mknod", "sink", "c", "1", "3"); // Linux's null device numbers

    Cli.Result r = Cli.runBuilt(rescore("--out", device.toString(), "--json", device.toString(), "--breakdown", device.toString()));

    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(fileType(device)).isEqualTo("character device");
    assertThat(Fixtures.listing(dir).keySet()).as("no temporary file beside the device").containsExactly("sink");
  }

  @Test
  void devStdoutRedirectedToAFileWritesIntoThatFileWithoutReplacingIt(@TempDir Path dir) throws Exception {
    Path regular = dir.resolve("picks.csv");
    assertThat(Cli.runBuilt(rescore("--out", regular.toString())).exit()).isZero();
    Path redirected = Files.createFile(dir.resolve("redirected.csv"));
    Object inode = Files.getAttribute(redirected, "unix:ino");

    Process p = Cli.start(List.of("-Xmx256m", "-XX:TieredStopAtLevel=1"), redirected, dir.resolve("err.txt"), rescore("--out", "/dev/stdout"));
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();

    assertThat(p.exitValue()).as(Files.readString(dir.resolve("err.txt"))).isZero();
    assertThat(Files.getAttribute(redirected, "unix:ino")).as("same file, not a replacement").isEqualTo(inode);
    assertThat(Files.readAllBytes(redirected)).isEqualTo(Files.readAllBytes(regular));
  }

  static Stream<Arguments> dashOutputs() {
    return Stream.of(
        Arguments.of("score --json -", List.of("score", "--hyps", HYPS, "--refs", REFS, "--json", "-"), "\"error_rate\""),
        Arguments.of("score --csv -", List.of("score", "--hyps", HYPS, "--refs", REFS, "--csv", "-"), "utt_id,group,status"),
        Arguments.of("compare --json -", List.of("compare", "--refs", REFS, "--hyps", HYPS, "--hyps", HYPS, "--json", "-"), "\"sign_test_p\""),
        Arguments.of("rescore --out -", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--out", "-"), "utt_id,system,rank,method"),
        Arguments.of("rescore --json -", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--out", "/dev/null", "--json", "-"), "\"rescored_utterances\""),
        Arguments.of("rescore --breakdown -", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--out", "/dev/null", "--breakdown", "-"), "utt_id,system,rank,text,chosen"),
        Arguments.of("rescore --save-weights -", List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--out", "/dev/null", "--save-weights", "-"), "\"steelyard-weights\""),
        Arguments.of("network --dot -", List.of("network", "--hyps", HYPS, "--utt", "bay-001", "--dot", "-"), "digraph"),
        Arguments.of("lm train --out -", List.of("lm", "train", "--corpus", CORPUS, "--order", "2", "--out", "-"), "\\data\\"),
        Arguments.of("lm train --json -", List.of("lm", "train", "--corpus", CORPUS, "--order", "2", "--out", "/dev/null", "--json", "-"), "\"sentences\""),
        Arguments.of("lm copy --out -", List.of("lm", "copy", "--lm", ARPA, "--out", "-"), "\\2-grams:"),
        Arguments.of("lm describe --json -", List.of("lm", "describe", "--lm", ARPA, "--json", "-"), "\"ngrams_total\""),
        Arguments.of("lm perplexity --json -", List.of("lm", "perplexity", "--lm", ARPA, "--text", CORPUS, "--json", "-"), "\"perplexity\""),
        Arguments.of("lm sentence-scores --csv -", List.of("lm", "sentence-scores", "--lm", ARPA, "--text", CORPUS, "--csv", "-"), "line,tokens,oov,log10_prob"),
        Arguments.of("lm prune --out -", List.of("lm", "prune", "--lm", ARPA, "--threshold", "0", "--out", "-"), "\\data\\"),
        Arguments.of("lm mix --out -", List.of("lm", "mix", "--lm", ARPA, "--lm", ARPA, "--text", CORPUS, "--out", "-"), "\\data\\"));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("dashOutputs")
  void dashIsStandardOutputForEveryOutputOption(String name, List<String> args, String marker) {
    assumeTrue(Files.exists(Path.of("/dev/null")) || !args.contains("/dev/null"), "no /dev/null on this system");
    Cli.Result r = Cli.runBuilt(args.toArray(String[]::new));
    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(r.out()).as("%s", r).contains(marker);
  }

  private static String[] rescore(String... outputs) {
    List<String> a = new ArrayList<>(List.of("rescore", "--hyps", HYPS, "--features", "acoustic", "--threads", "1"));
    a.addAll(List.of(outputs));
    return a.toArray(String[]::new);
  }

  /** Runs {@code command} in {@code path}'s directory to make a special file there; skips when the tool is missing. */
  private static Path make(Path path, String... command) throws Exception {
    Process p;
    try {
      p = new ProcessBuilder(command).directory(path.getParent().toFile()).redirectErrorStream(true).start();
    } catch (IOException e) {
      assumeTrue(false, command[0] + " is not available: " + e.getMessage());
      return null;
    }
    String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assumeTrue(p.waitFor() == 0, command[0] + " failed (" + out.strip() + "); skipped");
    return path;
  }

  /** Plain reads: Java 17's bulk {@code FileInputStream.readAllBytes} asks a FIFO for its position and fails. */
  private static byte[] readAll(Path fifo) {
    try (InputStream in = new FileInputStream(fifo.toFile())) {
      java.io.ByteArrayOutputStream all = new java.io.ByteArrayOutputStream();
      byte[] buf = new byte[8192];
      for (int n; (n = in.read(buf)) >= 0; ) all.write(buf, 0, n);
      return all.toByteArray();
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }

  /** Opens the FIFO for writing once, so a reader still waiting (the command failed early) sees its end. */
  private static void unblock(Path fifo) throws IOException {
    new FileOutputStream(fifo.toFile()).close();
  }

  private static String fileType(Path p) throws IOException {
    int mode = (Integer) Files.getAttribute(p, "unix:mode");
    switch (mode & 0170000) {
      case 0010000: return "fifo";
      case 0020000: return "character device";
      case 0100000: return "regular file";
      default: return "other " + Integer.toOctalString(mode);
    }
  }
}
