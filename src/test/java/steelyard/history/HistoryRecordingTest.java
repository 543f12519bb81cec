package steelyard.history;

import static org.assertj.core.api.Assertions.assertThat;
import static steelyard.history.HistoryFixtures.T0;
import static steelyard.history.HistoryFixtures.file;
import static steelyard.history.HistoryFixtures.rows;
import static steelyard.history.HistoryFixtures.scoreRun;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class HistoryRecordingTest {
  @TempDir Path dir;

  private final ByteArrayOutputStream errBytes = new ByteArrayOutputStream();
  private final PrintStream err = new PrintStream(errBytes, true, StandardCharsets.UTF_8);

  private String err() {
    return errBytes.toString(StandardCharsets.UTF_8);
  }

  @Test
  void theOptionWinsOverTheEnvironmentWhichWinsOverNothing() {
    Map<String, String> env = Map.of(HistoryRecording.ENVIRONMENT_VARIABLE, "/var/tpc/runs.db");
    assertThat(HistoryRecording.target(Path.of("mine.db"), env)).isEqualTo(Path.of("mine.db"));
    assertThat(HistoryRecording.target(null, env)).isEqualTo(Path.of("/var/tpc/runs.db"));
    assertThat(HistoryRecording.target(null, Map.of(HistoryRecording.ENVIRONMENT_VARIABLE, "  "))).isNull();
    assertThat(HistoryRecording.target(null, Map.of())).isNull();
  }

  @Test
  void withoutAHistoryNothingIsBuiltOrWritten() throws IOException {
    // The input does not exist: building the record would fail, so an empty answer shows it was never built.
    RunRecord.Builder run = scoreRun(file(dir, "refs.csv", "utt_id,text\n"), "first", rows(1, 3), T0)
        .input(InputFile.HYPOTHESES, dir.resolve("gone.csv"), 3);
    assertThat(HistoryRecording.record(null, err, run)).isEmpty();
    assertThat(err()).isEmpty();
    try (var files = Files.list(dir)) {
      assertThat(files).containsExactly(dir.resolve("refs.csv"));
    }
  }

  @Test
  void recordsAllRunsOfOneCommandTogether() throws IOException {
    Path db = dir.resolve("runs.db");
    Path refs = file(dir, "refs.csv", "utt_id,text\n");
    List<Long> ids = HistoryRecording.record(db, err, scoreRun(refs, "first", rows(1, 3), T0).label("A"),
        scoreRun(refs, "first", rows(2, 3), T0).label("B"));
    assertThat(ids).containsExactly(1L, 2L);
    try (RunHistory h = RunHistory.openExisting(db)) {
      assertThat(h.list(RunFilter.ALL)).extracting(RunSummary::label).containsExactly("A", "B");
    }
  }

  @Test
  void aHistoryThatCannotBeWrittenIsOneWarningAndTheFileStaysAsItWas() throws IOException {
    Path db = file(dir, "runs.db", "utt_id,text\nnot,a database\n");
    byte[] before = Files.readAllBytes(db);
    List<Long> ids = HistoryRecording.record(db, err, scoreRun(file(dir, "refs.csv", "utt_id,text\n"), "first", rows(1, 3), T0));
    assertThat(ids).isEmpty();
    assertThat(err()).startsWith("steelyard: warning: run not recorded in the history: " + db + ": is not an SQLite database");
    assertThat(err().lines()).hasSize(1);
    assertThat(Files.readAllBytes(db)).isEqualTo(before);
  }

  @Test
  void anInputThatVanishedBeforeHashingIsAWarningNotAFailure() throws IOException {
    Path db = dir.resolve("runs.db");
    RunRecord.Builder run = scoreRun(file(dir, "refs.csv", "utt_id,text\n"), "first", rows(1, 3), T0)
        .input(InputFile.HYPOTHESES, dir.resolve("gone.csv"), 3);
    assertThat(HistoryRecording.record(db, err, run)).isEmpty();
    assertThat(err()).contains("gone.csv: file not found");
  }
}
