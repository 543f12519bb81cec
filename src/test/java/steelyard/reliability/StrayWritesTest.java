package steelyard.reliability;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * A command writes only the paths the user gives (plus temporary files beside them, gone afterwards): run in
 * a child JVM whose {@code java.io.tmpdir}, {@code user.home} and working directory are fresh empty
 * directories that must stay empty; the inputs are unchanged, the output directory holds exactly the named
 * outputs, and the parent directory's entries (names and modification times) are as before. The JVM itself
 * keeps a performance-data file in {@code /tmp/hsperfdata_USER/} unless told not to: the launcher passes
 * {@code -XX:-UsePerfData}, checked here against a child JVM paused mid-run.
 */
class StrayWritesTest {
  static Stream<Arguments> commands() {
    return Stream.of(
        Arguments.of("score", List.of("score", "--hyps", "{in}/hyps.csv", "--refs", "{in}/refs.csv", "--features", "acoustic",
            "--json", "{out}/summary.json", "--csv", "{out}/table.csv"), List.of("summary.json", "table.csv")),
        Arguments.of("rescore", List.of("rescore", "--hyps", "{in}/hyps.csv", "--refs", "{in}/refs.csv", "--lm", "{in}/small.arpa",
            "--features", "acoustic", "--lm-weight", "0.5", "--method", "nbest",
            "--out", "{out}/picks.csv", "--breakdown", "{out}/breakdown.csv", "--json", "{out}/summary.json"),
            List.of("picks.csv", "breakdown.csv", "summary.json")),
        Arguments.of("demo-data", List.of("demo-data", "--out", "{out}/demo"), List.of("demo")));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("commands")
  void writesOnlyTheGivenOutputs(String name, List<String> template, List<String> outputs, @TempDir Path parent) throws Exception {
    Path in = Files.createDirectories(parent.resolve("inputs"));
    for (String f : List.of("hyps.csv", "refs.csv", "small.arpa")) Files.copy(Fixtures.valid(f), in.resolve(f));
    Path out = Files.createDirectories(parent.resolve("out"));
    Path tmp = Files.createDirectories(parent.resolve("java-tmp"));
    Path home = Files.createDirectories(parent.resolve("home"));
    Path cwd = Files.createDirectories(parent.resolve("cwd"));
    Path logs = Files.createTempDirectory("stray-writes-logs");
    List<String> args = new ArrayList<>();
    for (String a : template) args.add(a.replace("{in}", in.toString()).replace("{out}", out.toString()));

    Cli.requireBuilt(Cli.run(args.toArray(String[]::new)), args.toArray(String[]::new));
    for (String o : outputs) deleteTree(out.resolve(o));
    Map<String, Long> parentBefore = Fixtures.listing(parent);
    parentBefore.remove("out");
    Map<String, String> inputsBefore = Fixtures.snapshot(in);

    Process p = Cli.start(List.of("-Xmx256m", "-XX:TieredStopAtLevel=1", "-Djava.io.tmpdir=" + tmp, "-Duser.home=" + home),
        cwd, logs.resolve("out"), logs.resolve("err"), args.toArray(String[]::new));
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).as("child finished").isTrue();
    assertThat(p.exitValue()).as("exit code; stderr: %s", Files.readString(logs.resolve("err"))).isZero();

    assertThat(Fixtures.listing(out).keySet()).as("exactly the given outputs, no temporary file left").containsExactlyInAnyOrderElementsOf(outputs);
    assertThat(Fixtures.snapshot(out).keySet()).as("no temporary (hidden) file left anywhere in the outputs")
        .noneMatch(f -> Path.of(f).getFileName().toString().startsWith("."));
    assertThat(Fixtures.listing(tmp)).as("nothing in java.io.tmpdir").isEmpty();
    assertThat(Fixtures.listing(home)).as("nothing in user.home").isEmpty();
    assertThat(Fixtures.listing(cwd)).as("nothing in the working directory").isEmpty();
    assertThat(Fixtures.snapshot(in)).as("inputs unchanged").isEqualTo(inputsBefore);
    Map<String, Long> parentAfter = Fixtures.listing(parent);
    parentAfter.remove("out");
    assertThat(parentAfter).as("parent directory entries unchanged").isEqualTo(parentBefore);
    deleteTree(logs);
  }

  @Test
  void theLauncherStopsTheJvmFromKeepingPerformanceDataInTmp(@TempDir Path dir) throws Exception {
    List<String> options = launcherJvmOptions();
    assertThat(options).as("JVM options in the launcher ./steelyard").contains("-XX:-UsePerfData");
    Path perfDir = Path.of("/tmp", "hsperfdata_" + System.getProperty("user.name"));
    assumeTrue(Files.isDirectory(Path.of("/tmp")), "HotSpot keeps performance data under /tmp on Linux only");
    // Control: without the option the JVM does write there, so the check below can fail.
    assumeTrue(perfFileExistsWhileRunning(List.of(), perfDir, dir.resolve("a")), "this JVM keeps no performance data file anyway");
    assertThat(perfFileExistsWhileRunning(options, perfDir, dir.resolve("b"))).as("performance data file with the launcher's options").isFalse();
  }

  /** The JVM options of the launcher's {@code exec java … -jar} line. */
  private static List<String> launcherJvmOptions() throws java.io.IOException {
    for (String line : Files.readAllLines(Path.of("steelyard"))) {
      String t = line.strip();
      if (!t.startsWith("exec java ")) continue;
      List<String> out = new ArrayList<>();
      for (String w : t.split("\\s+")) if (w.startsWith("-XX:") || w.startsWith("-D")) out.add(w);
      return out;
    }
    throw new AssertionError("no 'exec java' line in ./steelyard");
  }

  /** Starts a command paused mid-write with {@code options}; whether /tmp/hsperfdata_USER/PID exists meanwhile. */
  private static boolean perfFileExistsWhileRunning(List<String> options, Path perfDir, Path dir) throws Exception {
    Files.createDirectories(dir);
    List<String> jvm = new ArrayList<>(options);
    jvm.add("-D" + steelyard.io.AtomicOutput.PAUSE_PROPERTY + "=10");
    Path err = dir.resolve("err.txt");
    Process p = Cli.start(jvm, dir.resolve("out.txt"), err, "rescore", "--hyps", Fixtures.valid("hyps.csv").toString(),
        "--features", "acoustic", "--out", dir.resolve("picks.csv").toString());
    try {
      long deadline = System.nanoTime() + 60_000_000_000L;
      while (!Files.readString(err).contains("test pause")) {
        assertThat(p.isAlive()).as("child paused; stderr: %s", Files.readString(err)).isTrue();
        assertThat(System.nanoTime()).as("child paused within 60 s").isLessThan(deadline);
        Thread.sleep(20);
      }
      return Files.exists(perfDir.resolve(Long.toString(p.pid())));
    } finally {
      p.destroyForcibly().waitFor();
    }
  }

  private static void deleteTree(Path p) throws java.io.IOException {
    try (Stream<Path> s = Files.walk(p)) {
      for (Path f : (Iterable<Path>) s.sorted(java.util.Comparator.reverseOrder())::iterator) Files.delete(f);
    }
  }
}
