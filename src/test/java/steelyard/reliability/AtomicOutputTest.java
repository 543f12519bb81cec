package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Outputs are replaced atomically: a real command in a child JVM, paused by the test-only switch
 * {@code -Dsteelyard.test.pauseAfterBytes=N} after N bytes of its temporary file, is killed with SIGKILL
 * ({@link Process#destroyForcibly()} on Linux); the existing output must be intact byte for byte. The next
 * normal run writes the complete output, removes the killed run's temporary file (its process is gone) and
 * leaves none of its own. An output path equal to an input path is refused with exit code 2.
 */
class AtomicOutputTest {
  private static final String PAUSE = "steelyard.test.pauseAfterBytes";
  private static final byte[] PRECIOUS = "utt_id,note\nbay-001,an earlier report the user keeps\n".getBytes(StandardCharsets.UTF_8);

  /** A command writing {@code target}; {@code command.apply(target)} gives its arguments. */
  record Case(String name, String fileName, Function<Path, List<String>> command) {
    @Override
    public String toString() {
      return name;
    }
  }

  static Stream<Arguments> writers() {
    String hyps = Fixtures.valid("hyps.csv").toString();
    String refs = Fixtures.valid("refs.csv").toString();
    String arpa = Fixtures.valid("small.arpa").toString();
    return Stream.of(
        Arguments.of(new Case("score --csv", "table.csv",
            t -> List.of("score", "--hyps", hyps, "--refs", refs, "--features", "acoustic", "--csv", t.toString()))),
        Arguments.of(new Case("score --json", "summary.json",
            t -> List.of("score", "--hyps", hyps, "--refs", refs, "--pick", "oracle", "--json", t.toString()))),
        Arguments.of(new Case("rescore --out picks.csv", "picks.csv",
            t -> List.of("rescore", "--hyps", hyps, "--features", "acoustic", "--method", "nbest", "--out", t.toString()))),
        Arguments.of(new Case("lm copy --out .bin", "model.bin",
            t -> List.of("lm", "copy", "--lm", arpa, "--out", t.toString()))));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("writers")
  void killedWriteLeavesTheExistingOutputIntactAndTheNextRunCompletes(Case c, @TempDir Path tmp) throws Exception {
    Path reference = Files.createDirectories(tmp.resolve("reference")).resolve(c.fileName());
    Cli.Result normal = Cli.runBuilt(c.command().apply(reference).toArray(String[]::new));
    assertThat(normal.exit()).as("%s", normal).isZero();
    byte[] complete = Files.readAllBytes(reference);
    assertThat(complete.length).as("output long enough to pause in the middle").isGreaterThan(8);
    long pauseAt = complete.length / 2;

    Path dir = Files.createDirectories(tmp.resolve("work"));
    Path target = dir.resolve(c.fileName());
    Files.write(target, PRECIOUS);
    Process p = Cli.start(List.of("-Xmx256m", "-XX:TieredStopAtLevel=1", "-D" + PAUSE + "=" + pauseAt),
        tmp.resolve("child.out"), tmp.resolve("child.err"), c.command().apply(target).toArray(String[]::new));
    Path temp;
    try {
      temp = awaitTemporaryFile(p, dir, target, pauseAt, tmp.resolve("child.err"));
    } finally {
      p.destroyForcibly().waitFor();
    }
    assertThat(temp.getParent()).as("temporary file beside the target").isEqualTo(dir);
    assertThat(Files.readAllBytes(target)).as("existing output intact after SIGKILL").isEqualTo(PRECIOUS);

    Cli.Result rerun = Cli.run(c.command().apply(target).toArray(String[]::new));
    assertThat(rerun.exit()).as("%s", rerun).isZero();
    assertThat(Files.readAllBytes(target)).as("complete new output").isEqualTo(complete);
    assertThat(rerun.err()).as("the rerun says what it removed").contains("removed " + temp);
    assertThat(Fixtures.listing(dir).keySet()).as("the killed run's temporary file removed, none left by the rerun")
        .containsExactly(c.fileName());
  }

  /** Polls until a new file beside {@code target} holds at least {@code bytes} bytes; fails if the child exits. */
  private static Path awaitTemporaryFile(Process p, Path dir, Path target, long bytes, Path childErr) throws Exception {
    long deadline = System.nanoTime() + 60_000_000_000L;
    while (System.nanoTime() < deadline) {
      Optional<Path> temp = newFile(dir, target).filter(f -> size(f) >= bytes);
      if (temp.isPresent()) return temp.get();
      if (!p.isAlive()) {
        fail("child exited (" + p.exitValue() + ") before pausing: " + Files.readString(childErr));
      }
      Thread.sleep(20);
    }
    fail("no paused temporary file after 60 s: " + Files.readString(childErr));
    return null;
  }

  private static Optional<Path> newFile(Path dir, Path target) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.filter(f -> !f.equals(target)).findFirst();
    }
  }

  private static long size(Path f) {
    try {
      return Files.size(f);
    } catch (IOException e) {
      return -1;
    }
  }

  static Stream<Arguments> sameAsInput() {
    return Stream.of(
        Arguments.of("score --csv = --hyps", "hyps.csv", (Function<Path, List<String>>) h -> List.of("score", "--hyps", h.toString(),
            "--refs", Fixtures.valid("refs.csv").toString(), "--csv", h.toString())),
        Arguments.of("score --json = --refs", "refs.csv", (Function<Path, List<String>>) r -> List.of("score",
            "--hyps", Fixtures.valid("hyps.csv").toString(), "--refs", r.toString(), "--json", r.toString())),
        Arguments.of("rescore --out = --hyps", "hyps.csv", (Function<Path, List<String>>) h -> List.of("rescore", "--hyps", h.toString(),
            "--features", "acoustic", "--out", h.toString())),
        Arguments.of("lm copy --out = --lm", "small.arpa", (Function<Path, List<String>>) m -> List.of("lm", "copy",
            "--lm", m.toString(), "--out", m.toString())));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("sameAsInput")
  void refusesAnOutputPathThatIsAnInput(String name, String file, Function<Path, List<String>> command, @TempDir Path tmp) throws IOException {
    Path input = tmp.resolve(file);
    Files.copy(Fixtures.valid(file), input);
    byte[] before = Files.readAllBytes(input);
    List<String> args = new ArrayList<>(command.apply(input));
    Cli.Result r = Cli.runBuilt(args.toArray(String[]::new));
    assertThat(r.exit()).as("%s", r).isEqualTo(2);
    assertThat(r.messageLines()).as("%s", r).hasSize(1);
    assertThat(r.err()).doesNotContain("Exception");
    assertThat(Files.readAllBytes(input)).as("input untouched").isEqualTo(before);
    assertThat(Fixtures.listing(tmp).keySet()).containsExactly(file);
  }
}
