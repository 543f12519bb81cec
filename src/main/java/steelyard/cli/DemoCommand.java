package steelyard.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.demo.DemoRun;
import steelyard.io.ImportOptions;
import steelyard.demo.DemoFiles;
import steelyard.io.InputException;
import steelyard.io.OutputSet;

/**
 * Runs the main job on the bundled demo data ({@link DemoRun}): the invented produce-warehouse cooperative's voice
 * logs (word N-best lists, the bundled word 3-gram) and scanned delivery dockets (several OCR configurations per line
 * in a character confusion network with the bundled character 5-gram). For each, the weights are tuned on the dev
 * set and applied to the held-out test set, which is audited; the files and one HTML report go to the output folder.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
    description = "Run the main job on the bundled demo data and models: tune the weights on the dev sets, pick the best "
        + "transcript of every test utterance and docket line with them, audit the overrules and write an HTML report.")
public final class DemoCommand implements Callable<Integer> {
  @Spec CommandLine.Model.CommandSpec spec;

  @Option(names = "--data-dir", paramLabel = "DIR",
      description = "Project folder holding sample-hypotheses/ and models/ (default: the one this program was built in, else the current folder).")
  Path dataDir;

  @Option(names = "--out-dir", paramLabel = "DIR", defaultValue = "demo-out",
      description = "Where the report, tuned weights, picks, summaries and breakdowns are written (default ${DEFAULT-VALUE}).")
  Path outDir;

  @Mixin RunInput run;

  @Override
  public Integer call() {
    PrintWriter err = spec.commandLine().getErr();
    ImportOptions imports = new ImportOptions(List.of(), null, 0, w -> RescoreSupport.warn(err, w), s -> { });
    List<DemoRun.Part> parts = DemoRun.bundled(dataDir != null ? dataDir : DemoFiles.root(), "--data-dir", imports, run.effectiveThreads(), run.seed);
    try {
      Files.createDirectories(outDir);
    } catch (IOException e) {
      throw InputException.option("--out-dir", "cannot create " + outDir + " (" + e.getMessage() + ")", "a writable folder");
    }
    DemoRun.Result r;
    // All outputs of both parts and the report are one set: a failure leaves the output folder as it was.
    try (OutputSet outputs = OutputSet.open(DemoRun.outputs(parts, outDir), List.of());
        TuneProgressBar bar = new TuneProgressBar(err, ConsoleProgress.wanted(false), System::nanoTime)) {
      r = DemoRun.run(parts, outDir, run.effectiveThreads(), run.seed, bar, () -> false, spec.commandLine().getOut());
      outputs.commit();
    }
    r.runs().forEach(p -> p.warnings().forEach(w -> RescoreSupport.warn(err, w)));
    PrintWriter out = spec.commandLine().getOut();
    out.print(DemoRun.summary(r));
    out.flush();
    return Main.OK;
  }
}
