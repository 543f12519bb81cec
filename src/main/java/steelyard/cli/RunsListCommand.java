package steelyard.cli;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import steelyard.history.RunFilter;
import steelyard.history.RunHistory;
import steelyard.history.RunText;

/** {@code steelyard runs list}: one line per recorded run. */
@Command(name = "list", mixinStandardHelpOptions = true,
    description = "List the recorded runs: id, start time (UTC), command, test data (first digits of the references' SHA-256),"
        + " method, error rate with its 95%% interval, label.")
public final class RunsListCommand implements Callable<Integer> {
  @Mixin HistoryOption history;
  @picocli.CommandLine.Spec picocli.CommandLine.Model.CommandSpec spec;

  @Option(names = "--filter", paramLabel = "KEY=VALUE",
      description = "Only runs with command=NAME, data=SHA256-PREFIX, method=NAME or text=TEXT (in the command line,"
          + " label or an input path); repeat to combine.")
  List<String> filters = new ArrayList<>();

  @Override
  public Integer call() {
    RunFilter filter = RunFilter.parse(filters);
    try (RunHistory h = history.openExisting()) {
      ScoreCommand.printReport(spec, null, RunText.table(h.list(filter)));
    }
    return Main.OK;
  }
}
