package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Convert a model between ARPA and the binary format. */
@Command(name = "convert", mixinStandardHelpOptions = true, description = "Convert a model between ARPA and the binary format.")
public final class LmConvertCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'convert' is not built yet");
  }
}
