package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Train an n-gram language model from a text corpus. */
@Command(name = "train", mixinStandardHelpOptions = true, description = "Train an n-gram language model from a text corpus.")
public final class LmTrainCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'train' is not built yet");
  }
}
