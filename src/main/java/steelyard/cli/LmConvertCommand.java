package steelyard.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.io.OutputSet;
import steelyard.io.OutputTarget;
import steelyard.lm.BackoffModel;
import steelyard.lm.ModelFiles;

/** {@code lm copy}: write a model into another file, in the format its name asks for (ARPA text or packed binary). */
@Command(name = "copy", mixinStandardHelpOptions = true,
    description = "Copy a model into another file format: ARPA text (.arpa, .arpa.gz) or Steelyard's packed binary (.bin, fast to load); the format follows the file names.")
public final class LmConvertCommand implements Callable<Integer> {
  @Spec picocli.CommandLine.Model.CommandSpec spec;
  @Mixin LmModelInput input;

  @Option(names = "--out", required = true, paramLabel = "FILE", description = "Output model: .arpa, .arpa.gz or .bin (written atomically).")
  Path out;

  @Override
  public Integer call() {
    input.require();
    ModelFiles.outputKind(out);
    OutputSet outputs = OutputSet.open(java.util.Collections.singletonMap("--out", out), java.util.List.of(input.lm));
    BackoffModel model = input.loadExact(spec.commandLine().getErr());
    ModelFiles.save(model, out, spec.commandLine().getOut());
    outputs.commit();
    long n = 0;
    for (int k = 1; k <= model.order(); k++) n += model.ngramCount(k);
    // With --out - the model itself takes standard output: the line goes to stderr then.
    java.io.PrintWriter report = OutputTarget.kind(out) == OutputTarget.Kind.STDOUT ? spec.commandLine().getErr() : spec.commandLine().getOut();
    report.println("copied " + input.lm + " to " + out + ": " + model.order() + "-gram model, " + n + " n-grams, "
        + model.vocabularySize() + " token ids");
    report.flush();
    return 0;
  }
}
