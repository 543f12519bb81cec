package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Describe a model: orders, counts, vocabulary, normalisation, bytes per n-gram. */
@Command(name = "info", mixinStandardHelpOptions = true, description = "Describe a model: orders, counts, vocabulary, normalisation, bytes per n-gram.")
public final class LmInfoCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'info' is not built yet");
  }
}
