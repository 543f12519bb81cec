package steelyard.cli;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/** Groups the language-model commands. */
@Command(
    name = "lm",
    mixinStandardHelpOptions = true,
    description = "Train, evaluate, mix, prune, copy and describe n-gram language models.",
    subcommands = {
      LmTrainCommand.class,
      LmPerplexityCommand.class,
      LmSentenceScoresCommand.class,
      LmMixCommand.class,
      LmPruneCommand.class,
      LmConvertCommand.class,
      LmInfoCommand.class
    })
public final class LmCommand implements Runnable {
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public void run() {
    throw new CommandLine.ParameterException(spec.commandLine(), "an lm subcommand is required; see 'steelyard lm --help'");
  }
}
