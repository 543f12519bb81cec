package steelyard.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.demo.DemoData;

/** Regenerate the bundled demo data (seeded; byte-identical). */
@Command(
    name = "demo-data",
    mixinStandardHelpOptions = true,
    description = {
      "Regenerate the bundled demo data of the invented produce-warehouse cooperative: voice-log N-best lists, docket-line OCR readings, their references and the domain corpora.",
      "Same seed, same bytes. Generation is single-threaded: --threads has no effect on it."
    })
public final class DemoDataCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--out", paramLabel = "DIR", required = true, description = "Directory to write into (created if needed; files of the same name are replaced).")
  Path out;

  @Mixin RunInput run;

  @Override
  public Integer call() {
    List<Path> written = DemoData.write(out, run.seed, DemoData.Sizes.DEFAULT);
    spec.commandLine().getErr().printf("demo-data: wrote %d files to %s (seed %d)%n", written.size(), out, run.seed);
    spec.commandLine().getErr().flush();
    return Main.OK;
  }
}
