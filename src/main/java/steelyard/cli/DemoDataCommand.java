package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Regenerate the bundled demo data (seeded; byte-identical). */
@Command(name = "demo-data", hidden = true, mixinStandardHelpOptions = true, description = "Regenerate the bundled demo data (seeded; byte-identical).")
public final class DemoDataCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'demo-data' is not built yet");
  }
}
