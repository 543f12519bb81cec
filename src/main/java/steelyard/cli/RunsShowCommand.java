package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Parameters;
import steelyard.history.RunHistory;
import steelyard.history.RunText;

/** {@code steelyard runs show ID}: everything recorded about one run. */
@Command(name = "show", mixinStandardHelpOptions = true,
    description = "Show everything recorded about one run: command line, inputs with their SHA-256, model, scores, weights.")
public final class RunsShowCommand implements Callable<Integer> {
  @Mixin HistoryOption history;
  @picocli.CommandLine.Spec picocli.CommandLine.Model.CommandSpec spec;

  @Parameters(paramLabel = "ID", description = "The run's id (see 'steelyard runs list').")
  long id;

  @Override
  public Integer call() {
    try (RunHistory h = history.openExisting()) {
      ScoreCommand.printReport(spec, null, RunText.details(h.get(id)));
    }
    return Main.OK;
  }
}
