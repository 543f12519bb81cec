package steelyard.cli;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import steelyard.history.RunHistory;
import steelyard.report.CompareReport;
import steelyard.report.OutputPaths;

/**
 * {@code steelyard runs compare ID ID}: two recorded runs on the same references compared from their stored
 * per-utterance counts, with the statistics and report of {@code compare}.
 */
@Command(name = "compare", mixinStandardHelpOptions = true,
    description = {
      "Compare two recorded runs on the same references as 'steelyard compare' compares the files: both rates with 95%%"
          + " intervals, the paired-bootstrap interval of the difference, the probability that B is better, an exact sign test.",
      "The plain-text report goes to stdout (to stderr when --json is '-')."
    })
public final class RunsCompareCommand implements Callable<Integer> {
  @Mixin HistoryOption history;
  @Mixin RunInput run;

  @Parameters(index = "0", paramLabel = "A", description = "Id of run A.")
  long a;

  @Parameters(index = "1", paramLabel = "B", description = "Id of run B.")
  long b;

  @Option(names = "--names", paramLabel = "A,B", split = ",",
      description = "Display names (default: the runs' labels when both have distinct ones, else 'run ID').")
  List<String> names;

  @Option(names = "--resamples", paramLabel = "N", defaultValue = "1000", description = "Bootstrap resamples (default ${DEFAULT-VALUE}).")
  int resamples;

  @Mixin JsonOutputOption json;
  @picocli.CommandLine.Spec picocli.CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ScoreCommand.checkOptions(steelyard.eval.Pick.FIRST, resamples, 0);
    if (names != null) CompareCommand.checkNames(names);
    try (RunHistory h = history.openExisting()) {
      LinkedHashMap<String, Path> outputs = new LinkedHashMap<>();
      outputs.put("--json", json.file);
      OutputPaths.refuseClashes(outputs, List.of(h.file()));
      CompareReport.CompareRun report = h.compare(a, b, names, resamples, run.seed, run.effectiveThreads());
      json.write(CompareReport.json(report), spec.commandLine().getOut());
      ScoreCommand.printReport(spec, json.file, CompareReport.text(report));
    }
    return Main.OK;
  }
}
