package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Interpolate two or more models with EM-tuned mixture weights. */
@Command(name = "mix", mixinStandardHelpOptions = true, description = "Interpolate two or more models with EM-tuned mixture weights.")
public final class LmMixCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'mix' is not built yet");
  }
}
