package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Per-sentence log10 probabilities of a text file. */
@Command(name = "sentence-scores", mixinStandardHelpOptions = true, description = "Per-sentence log10 probabilities of a text file.")
public final class LmSentenceScoresCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'sentence-scores' is not built yet");
  }
}
