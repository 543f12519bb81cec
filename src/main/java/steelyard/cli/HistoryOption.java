package steelyard.cli;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.history.HistoryRecording;
import steelyard.history.RunHistory;
import steelyard.history.RunRecord;
import steelyard.io.InputException;

/**
 * {@code --history FILE}: the run history a command records into (opt-in) or the {@code runs} commands read.
 * Without the option, the environment variable {@code STEELYARD_HISTORY} names the file; without either, nothing
 * is recorded. The run's start time is taken when the command line is built, before parsing.
 */
public final class HistoryOption {
  @Option(names = "--history", paramLabel = "FILE",
      description = "Run history (an SQLite file): scoring commands record the run in it, creating it when missing;"
          + " the runs commands read it. Default: the file named by the environment variable "
          + HistoryRecording.ENVIRONMENT_VARIABLE + "; with neither, nothing is recorded.")
  Path file;

  @Spec(Spec.Target.MIXEE) CommandSpec spec;

  private final Clock clock = Clock.systemUTC();
  private final Instant started = clock.instant();

  /** The history file in effect, or null when recording is off. */
  public Path target() {
    return HistoryRecording.target(file, System.getenv());
  }

  /** A record of this command's run with its name, arguments, tool version and start time filled in. */
  public RunRecord.Builder run() {
    return RunRecord.builder(spec.name(), started, clock).commandLine(spec.commandLine().getParseResult().originalArgs());
  }

  /** Records the runs when history is on; a failure is one warning on stderr and never changes the exit code. */
  public List<Long> record(RunRecord.Builder... runs) {
    return HistoryRecording.record(target(), spec.commandLine().getErr(), runs);
  }

  /** Opens the history for reading (the {@code runs} commands); an {@link InputException} when none is named. */
  RunHistory openExisting() {
    Path f = target();
    if (f == null)
      throw InputException.option("--history", "no run history named",
          "--history FILE, or the environment variable " + HistoryRecording.ENVIRONMENT_VARIABLE);
    return RunHistory.openExisting(f);
  }
}
