package steelyard.history;

import java.io.PrintStream;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

/**
 * The one call a command makes at the end of a run to keep it in the run history, honouring the opt-in: nothing
 * is recorded (and no input is hashed) unless {@code --history FILE} was given or the environment variable
 * {@value #ENVIRONMENT_VARIABLE} names a file. A history that cannot be written never fails the run: the command
 * says so on stderr and keeps its other outputs and its exit code.
 *
 * <pre>{@code
 * HistoryRecording.record(HistoryRecording.target(historyOption, System.getenv()), System.err,
 *     RunRecord.builder("score", started, clock).scored(score).interval(ci, resamples, seed) ...);
 * }</pre>
 */
public final class HistoryRecording {
  /** Names the history file when {@code --history} is not given. */
  public static final String ENVIRONMENT_VARIABLE = "STEELYARD_HISTORY";

  private HistoryRecording() {}

  /**
   * The history file in effect: {@code option} when given, else the environment variable when set and not
   * blank, else null (record nothing).
   */
  public static Path target(Path option, Map<String, String> environment) {
    if (option != null) return option;
    String v = environment.get(ENVIRONMENT_VARIABLE);
    return v == null || v.isBlank() ? null : Path.of(v);
  }

  /**
   * Builds and records {@code runs} in one transaction when {@code historyOrNull} is not null. Never throws: a
   * failure (the file is damaged, foreign, locked, read-only, an input vanished before it was hashed) is one line
   * on {@code err} starting {@code steelyard: warning: run not recorded in the history}.
   *
   * @return the new runs' ids; empty when nothing was recorded
   */
  public static List<Long> record(Path historyOrNull, PrintStream err, RunRecord.Builder... runs) {
    return record(historyOrNull, new PrintWriter(err, true, java.nio.charset.StandardCharsets.UTF_8), runs);
  }

  /** As {@link #record(Path, PrintStream, RunRecord.Builder...)}, the warning going to a writer (a command's stderr). */
  public static List<Long> record(Path historyOrNull, PrintWriter err, RunRecord.Builder... runs) {
    if (historyOrNull == null) return List.of();
    try {
      List<RunRecord> built = new ArrayList<>(runs.length);
      for (RunRecord.Builder b : runs) built.add(b.build());
      try (RunHistory h = RunHistory.open(historyOrNull)) {
        return h.recordAll(built);
      }
    } catch (RuntimeException e) {
      err.println("steelyard: warning: run not recorded in the history: " + message(e));
      err.flush();
      return List.of();
    }
  }

  private static String message(RuntimeException e) {
    if (e instanceof steelyard.io.InputException) return e.getMessage();
    return "internal error (please report it): " + e;
  }
}
