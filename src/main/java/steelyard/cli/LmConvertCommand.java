package steelyard.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.OutputSet;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;

/** Convert a model between ARPA and the binary format. */
@Command(name = "convert", mixinStandardHelpOptions = true, description = "Convert a model between ARPA (.arpa, .arpa.gz) and the binary format (.bin); the format follows the file names.")
public final class LmConvertCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Output model: .arpa, .arpa.gz or .bin (written atomically).")
  Path out;

  @Override
  public Integer call() {
    ModelFiles.outputKind(out);
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--out", out), java.util.List.of(input.lm));
    BackoffModel model = input.loadExact(spec.commandLine().getErr());
    ModelFiles.save(model, out);
    outputs.commit();
    long n = 0;
    for (int k = 1; k <= model.order(); k++) n += model.ngramCount(k);
    java.io.PrintWriter report = out.toString().equals("-") ? spec.commandLine().getErr() : spec.commandLine().getOut();
    report.println("wrote " + out + ": order " + model.order() + ", " + n + " n-grams, " + model.vocabularySize() + " tokens");
    report.flush();
    return 0;
  }
}
