package steelyard.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.history.HistoryRecording;
import steelyard.history.RunFilter;
import steelyard.history.RunHistory;
import steelyard.history.RunSummary;

/** The opt-in through the environment, in real child processes (the variable cannot be set in-process). */
class HistoryEnvironmentTest {
  @TempDir Path dir;

  private int steelyard(String historyVariable, String... args) throws Exception {
    List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx256m", "-cp",
        classPath(), Main.class.getName()));
    cmd.addAll(List.of(args));
    ProcessBuilder pb = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("child.log").toFile());
    pb.environment().remove(HistoryRecording.ENVIRONMENT_VARIABLE);
    if (historyVariable != null) pb.environment().put(HistoryRecording.ENVIRONMENT_VARIABLE, historyVariable);
    Process p = pb.start();
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(p.exitValue()).as(Files.readString(dir.resolve("child.log"), StandardCharsets.UTF_8)).isZero();
    return p.exitValue();
  }

  private static String classPath() {
    String cp = System.getProperty("surefire.test.class.path");
    if (cp == null || cp.isBlank()) cp = System.getProperty("java.class.path");
    return Path.of("target", "classes").toAbsolutePath() + File.pathSeparator + cp;
  }

  @Test
  void theVariableTurnsRecordingOnAndTheOptionOverridesIt() throws Exception {
    Path refs = ScoreCommandTest.write(dir, "refs.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay four\n");
    Path hyps = ScoreCommandTest.write(dir, "hyps.csv", "utt_id,text\ntpc-v-0001,pallet nine to bay for\n");
    Path fromVariable = dir.resolve("variable.db");
    Path fromOption = dir.resolve("option.db");
    steelyard(null, "score", "--refs", refs.toString(), "--hyps", hyps.toString());
    assertThat(dir.resolve("variable.db")).doesNotExist();
    steelyard(fromVariable.toString(), "score", "--refs", refs.toString(), "--hyps", hyps.toString());
    steelyard(fromVariable.toString(), "score", "--refs", refs.toString(), "--hyps", hyps.toString(), "--history", fromOption.toString());
    try (RunHistory h = RunHistory.openExisting(fromVariable)) {
      List<RunSummary> runs = h.list(RunFilter.ALL);
      assertThat(runs).hasSize(1);
      // Worked by hand: one substitution (four → for) in five words.
      assertThat(runs.get(0).errorRate()).isEqualTo(0.2);
    }
    try (RunHistory h = RunHistory.openExisting(fromOption)) {
      assertThat(h.list(RunFilter.ALL)).hasSize(1);
    }
  }
}
