package steelyard.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;

/** Score hypotheses against references: WER/CER with confidence intervals. */
@Command(name = "score", mixinStandardHelpOptions = true, description = "Score hypotheses against references: WER/CER with confidence intervals.")
public final class ScoreCommand implements Callable<Integer> {
  @Override
  public Integer call() {
    throw new UnsupportedOperationException("'score' is not built yet");
  }
}
