package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Compare two systems on the same references: paired bootstrap and sign test. */
@Command(name = "compare", mixinStandardHelpOptions = true, description = "Compare two systems on the same references: paired bootstrap and sign test.")
public final class CompareCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'compare' is not built yet");
  }
}
