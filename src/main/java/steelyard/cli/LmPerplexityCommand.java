package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Perplexity and OOV rate of a model on held-out text. */
@Command(name = "perplexity", mixinStandardHelpOptions = true, description = "Perplexity and OOV rate of a model on held-out text.")
public final class LmPerplexityCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'perplexity' is not built yet");
  }
}
