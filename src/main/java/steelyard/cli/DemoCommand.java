package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Run the main job on the bundled demo data and model. */
@Command(name = "demo", mixinStandardHelpOptions = true, description = "Run the main job on the bundled demo data and model.")
public final class DemoCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'demo' is not built yet");
  }
}
