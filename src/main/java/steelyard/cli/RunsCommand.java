package steelyard.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/** Groups the run-history commands. */
@Command(
    name = "runs",
    mixinStandardHelpOptions = true,
    description = {
      "List, inspect, compare and export the runs kept in a run history (score and compare record into one with"
          + " --history FILE or the environment variable STEELYARD_HISTORY)."
    },
    subcommands = {
      RunsListCommand.class,
      RunsShowCommand.class,
      RunsWeightsCommand.class,
      RunsCompareCommand.class,
      RunsExportCommand.class
    })
public final class RunsCommand implements Runnable {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "a runs subcommand is required; see 'steelyard runs --help'");
  }
}
