package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Choose the best transcript per utterance with an n-gram model and tunable weights. */
@Command(name = "rescore", mixinStandardHelpOptions = true, description = "Choose the best transcript per utterance with an n-gram model and tunable weights.")
public final class RescoreCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'rescore' is not built yet");
  }
}
