package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static steelyard.history.HistoryFixtures.file;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Two real processes recording into one new history at once (write-ahead log, busy timeout, one transaction per run). */
class ConcurrentWritersTest {
  private static final int RUNS_EACH = 100;

  @TempDir Path dir;

  private static String classPath() {
    String cp = System.getProperty("surefire.test.class.path");
    if (cp == null || cp.isBlank()) cp = System.getProperty("java.class.path");
    return Path.of("target", "classes").toAbsolutePath() + File.pathSeparator
        + Path.of("target", "test-classes").toAbsolutePath() + File.pathSeparator + cp;
  }

  private Process start(Path history, String prefix, Path refs) throws Exception {
    List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx256m", "-cp",
        classPath(), HistoryWriterChild.class.getName(), history.toString(), prefix, Integer.toString(RUNS_EACH), refs.toString()));
    return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve(prefix + ".log").toFile()).start();
  }

  @Test
  void twoProcessesRecordingAtOnceLoseAndDuplicateNothing() throws Exception {
    Path history = dir.resolve("runs.db");
    Path refs = file(dir, "refs.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay four\n");
    Process one = start(history, "one", refs);
    Process two = start(history, "two", refs);
    for (Process p : List.of(one, two)) {
      assertThat(p.waitFor(240, TimeUnit.SECONDS)).as("child finished").isTrue();
    }
    assertThat(one.exitValue()).as(Files.readString(dir.resolve("one.log"), StandardCharsets.UTF_8)).isZero();
    assertThat(two.exitValue()).as(Files.readString(dir.resolve("two.log"), StandardCharsets.UTF_8)).isZero();

    Set<String> expected = new HashSet<>();
    for (int i = 0; i < RUNS_EACH; i++) {
      expected.add("one-" + i);
      expected.add("two-" + i);
    }
    try (RunHistory h = RunHistory.openExisting(history)) {
      List<RunSummary> runs = h.list(RunFilter.ALL);
      assertThat(runs).hasSize(2 * RUNS_EACH);
      assertThat(runs).extracting(RunSummary::label).doesNotHaveDuplicates().containsExactlyInAnyOrderElementsOf(expected);
      // Not asserted (it depends on scheduling), printed to show the writers took turns.
      int turns = 0;
      for (int k = 1; k < runs.size(); k++) if (runs.get(k).label().charAt(0) != runs.get(k - 1).label().charAt(0)) turns++;
      System.out.println("ConcurrentWritersTest: the two processes' runs alternate " + turns + " times in id order");
      for (RunSummary s : runs) {
        String label = s.label();
        int i = Integer.parseInt(label.substring(label.indexOf('-') + 1));
        assertThat(h.get(s.id()).run().utterances()).as(label).isEqualTo(HistoryFixtures.rows(i, 50));
      }
    }
  }
}
