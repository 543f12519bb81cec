package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Relative-entropy pruning of a back-off model. */
@Command(name = "prune", mixinStandardHelpOptions = true, description = "Relative-entropy pruning of a back-off model.")
public final class LmPruneCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'prune' is not built yet");
  }
}
