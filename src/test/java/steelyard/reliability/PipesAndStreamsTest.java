package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.ByteArrayInputStream;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Inputs that are streams — a FIFO (as process substitution and {@code /dev/stdin} give), or {@code -} for
 * standard input — are read in one pass, with the same result as the file; a command that must read an input
 * twice refuses a stream with a message saying so. Never "no such file" for a FIFO, never "Illegal seek".
 */
class PipesAndStreamsTest {
  private static final Path HYPS = Fixtures.valid("hyps.csv");
  private static final Path REFS = Fixtures.valid("refs.csv");
  private static final Path ARPA = Fixtures.valid("small.arpa");
  private static final Path CORPUS = Fixtures.valid("corpus.txt");

  @TempDir Path dir;

  @Test
  void referencesAndHypothesesThroughFifosScoreLikeTheFiles() throws Exception {
    Path expected = dir.resolve("expected.json");
    assertThat(Cli.runBuilt("score", "--hyps", HYPS.toString(), "--refs", REFS.toString(), "--json", expected.toString()).exit()).isZero();
    Path hypsFifo = fifo("hyps.fifo");
    Path refsFifo = fifo("refs.fifo");
    CompletableFuture<Void> h = feed(hypsFifo, Files.readAllBytes(HYPS));
    CompletableFuture<Void> r = feed(refsFifo, Files.readAllBytes(REFS));
    Path actual = dir.resolve("actual.json");

    Cli.Result res = Cli.runBuilt("score", "--hyps", hypsFifo.toString(), "--refs", refsFifo.toString(), "--json", actual.toString());
    drain(hypsFifo, h);
    drain(refsFifo, r);

    assertThat(res.exit()).as("%s", res).isZero();
    assertThat(Files.readString(actual).replace(hypsFifo.toString(), "H").replace(refsFifo.toString(), "R"))
        .isEqualTo(Files.readString(expected).replace(HYPS.toString(), "H").replace(REFS.toString(), "R"));
  }

  @Test
  void dashReadsHypothesesFromStandardInput() throws Exception {
    Cli.Result r = withStdin(Files.readAllBytes(HYPS), "rescore", "--hyps", "-", "--features", "acoustic", "--out", "-");
    Cli.Result file = Cli.runBuilt("rescore", "--hyps", HYPS.toString(), "--features", "acoustic", "--out", "-");
    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(r.out()).isEqualTo(file.out());
  }

  /** {@code --hyps /dev/stdin} with standard input a pipe, in a child JVM: once "Illegal seek". */
  @Test
  void devStdinThatIsAPipeIsReadLikeAFile() throws Exception {
    Path expected = dir.resolve("expected.json");
    assertThat(Cli.runBuilt("score", "--hyps", HYPS.toString(), "--refs", REFS.toString(), "--json", expected.toString()).exit()).isZero();
    Path actual = dir.resolve("actual.json");
    Process p = Cli.start(java.util.List.of("-Xmx256m", "-XX:TieredStopAtLevel=1"), dir.resolve("out.txt"), dir.resolve("err.txt"),
        "score", "--hyps", "/dev/stdin", "--refs", REFS.toString(), "--json", actual.toString());
    try (OutputStream stdin = p.getOutputStream()) {
      stdin.write(Files.readAllBytes(HYPS));
    }
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(p.exitValue()).as(Files.readString(dir.resolve("err.txt"))).isZero();
    assertThat(Files.readString(actual).replace("/dev/stdin", "H")).isEqualTo(Files.readString(expected).replace(HYPS.toString(), "H"));
  }

  @Test
  void lmTrainReadsItsCorpusFromStandardInputInOnePass() throws Exception {
    Path fromFile = dir.resolve("file.arpa");
    Path fromStdin = dir.resolve("stdin.arpa");
    assertThat(Cli.runBuilt("lm", "train", "--corpus", CORPUS.toString(), "--order", "2", "--out", fromFile.toString()).exit()).isZero();
    Cli.Result r = withStdin(Files.readAllBytes(CORPUS), "lm", "train", "--corpus", "-", "--order", "2", "--out", fromStdin.toString());
    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(Files.readString(fromStdin)).isEqualTo(Files.readString(fromFile));
  }

  @Test
  void aBinaryModelThroughAFifoNamedBinLoads() throws Exception {
    Path bin = dir.resolve("model.bin");
    assertThat(Cli.runBuilt("lm", "copy", "--lm", ARPA.toString(), "--out", bin.toString()).exit()).isZero();
    Path fifo = fifo("piped.bin");
    CompletableFuture<Void> w = feed(fifo, Files.readAllBytes(bin));
    Cli.Result r = Cli.runBuilt("lm", "describe", "--lm", fifo.toString(), "--json", "-");
    drain(fifo, w);
    assertThat(r.exit()).as("%s", r).isZero();
    assertThat(r.out()).contains("\"ngrams_total\" : 22");
  }

  @Test
  void commandsThatReadAnInputTwiceRefuseAStreamSayingWhy() throws Exception {
    refused(CORPUS, "corpus.fifo", "can be read only once", "--vocab-min-count reads the corpus twice",
        "lm", "train", "--corpus", "{fifo}", "--order", "2", "--vocab-min-count", "2", "--out", dir.resolve("m.arpa").toString());
    Path dockets = Files.writeString(dir.resolve("two.csv"), "utt_id,system,text\nd1,a,x y\nd1,b,x z\n");
    refused(dockets, "two.fifo", "can be read only once", "--systems scores it once per system",
        "compare", "--refs", REFS.toString(), "--hyps", "{fifo}", "--systems", "a,b");
    refused(ARPA, "model.arpa", "can be read only once", "SHA-256",
        "rescore", "--hyps", HYPS.toString(), "--features", "acoustic", "--lm", "{fifo}", "--lm-weight", "1",
        "--out", dir.resolve("p.csv").toString(), "--save-weights", dir.resolve("w.json").toString());
    refused(ARPA, "model", "no file name to tell the format by", "",
        "lm", "perplexity", "--lm", "{fifo}", "--text", CORPUS.toString());
  }

  private void refused(Path content, String fifoName, String words, String why, String... template) throws Exception {
    Path fifo = fifo(fifoName);
    CompletableFuture<Void> w = feed(fifo, Files.readAllBytes(content));
    String[] args = new String[template.length];
    for (int i = 0; i < args.length; i++) args[i] = template[i].replace("{fifo}", fifo.toString());
    Cli.Result r = Cli.runBuilt(args);
    drain(fifo, w);
    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    assertThat(r.messageLines()).as("%s", r).hasSize(1);
    assertThat(r.err()).contains(words).contains(why).doesNotContain("no such file").doesNotContain("Illegal seek");
    Files.delete(fifo);
  }

  private Path fifo(String name) throws Exception {
    Path p = dir.resolve(name);
    Process mk;
    try {
      mk = new ProcessBuilder("mkfifo", p.toString()).redirectErrorStream(true).start();
    } catch (IOException e) {
      assumeTrue(false, "mkfifo is not available: " + e.getMessage());
      return null;
    }
    assumeTrue(mk.waitFor() == 0, "mkfifo failed; skipped");
    return p;
  }

  /** Writes {@code bytes} into the FIFO from another thread (blocks until a reader opens it). */
  private static CompletableFuture<Void> feed(Path fifo, byte[] bytes) {
    return CompletableFuture.runAsync(() -> {
      try (OutputStream out = new FileOutputStream(fifo.toFile())) {
        out.write(bytes);
      } catch (IOException e) {
        // the reader stopped early (a refused command): nothing more to deliver
      }
    });
  }

  /**
   * Lets a writer still waiting for a reader (the command refused before opening the FIFO) finish: opening
   * the FIFO read-write never blocks on Linux, and the small contents fit in the pipe's buffer.
   */
  private static void drain(Path fifo, CompletableFuture<Void> writer) throws Exception {
    try {
      writer.get(2, TimeUnit.SECONDS);
    } catch (java.util.concurrent.TimeoutException e) {
      try (java.io.RandomAccessFile unblock = new java.io.RandomAccessFile(fifo.toFile(), "rw")) {
        writer.get(60, TimeUnit.SECONDS);
      }
    }
  }

  private static Cli.Result withStdin(byte[] input, String... args) {
    InputStream saved = System.in;
    System.setIn(new ByteArrayInputStream(input));
    try {
      return Cli.runBuilt(args);
    } finally {
      System.setIn(saved);
    }
  }
}
