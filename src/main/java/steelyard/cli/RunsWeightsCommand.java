package steelyard.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import steelyard.history.RunHistory;
import steelyard.io.AtomicOutput;

/**
 * {@code steelyard runs weights ID --out FILE}: a run's weights as a weights file for {@code rescore --weights}: the
 * bytes {@code --save-weights} wrote in that run, checked to read back first.
 */
@Command(name = "weights", mixinStandardHelpOptions = true,
    description = "Write the weights a run used as a weights file, for 'steelyard rescore --weights FILE'.")
public final class RunsWeightsCommand implements Callable<Integer> {
  @Mixin HistoryOption history;
  @picocli.CommandLine.Spec picocli.CommandLine.Model.CommandSpec spec;

  @Parameters(paramLabel = "ID", description = "The run's id (see 'steelyard runs list').")
  long id;

  @Option(names = "--out", required = true, paramLabel = "FILE|-", description = "The weights file to write ('-' for stdout).")
  Path out;

  @Override
  public Integer call() {
    try (RunHistory h = history.openExisting()) {
      AtomicOutput.refuseOverwritingInput(out, h.file());
      h.weights(id); // refuses weights this version could not read back
      String json = h.weightsJson(id);
      AtomicOutput.writeText(out, spec.commandLine().getOut(), w -> w.write(json));
    }
    return Main.OK;
  }
}
