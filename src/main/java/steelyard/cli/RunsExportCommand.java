package steelyard.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import steelyard.history.HistoryExport;
import steelyard.history.RunFilter;
import steelyard.history.RunHistory;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;

/** {@code steelyard runs export --csv FILE | --json FILE}: the recorded runs for a spreadsheet or a program. */
@Command(name = "export", mixinStandardHelpOptions = true,
    description = "Export the recorded runs: CSV (one row per run) or JSON (one object per run with its inputs, model, weights).")
public final class RunsExportCommand implements Callable<Integer> {
  @Mixin HistoryOption history;
  @picocli.CommandLine.Spec picocli.CommandLine.Model.CommandSpec spec;

  @ArgGroup(exclusive = true, multiplicity = "1")
  Target target;

  static final class Target {
    @Option(names = "--csv", paramLabel = "FILE|-", description = "Write CSV to FILE ('-' for stdout).")
    Path csv;

    @Option(names = "--json", paramLabel = "FILE|-", description = "Write JSON to FILE ('-' for stdout).")
    Path json;
  }

  @Option(names = "--filter", paramLabel = "KEY=VALUE",
      description = "Only runs with command=NAME, data=SHA256-PREFIX, method=NAME or text=TEXT; repeat to combine.")
  List<String> filters = new ArrayList<>();

  @Option(names = "--utterances", description = "JSON only: add each run's per-utterance rows (utt_id, status, errors, reference_tokens).")
  boolean utterances;

  @Option(names = "--spreadsheet-safe", paramLabel = "true|false", arity = "1", defaultValue = "true",
      description = "In the CSV, prefix cells starting with = + - @ tab or CR with an apostrophe (default ${DEFAULT-VALUE}).")
  boolean spreadsheetSafe;

  @Override
  public Integer call() {
    RunFilter filter = RunFilter.parse(filters);
    if (utterances && target.csv != null)
      throw InputException.option("--utterances", "adds rows to the JSON export only", "--json FILE together with --utterances");
    try (RunHistory h = history.openExisting()) {
      Path out = target.csv != null ? target.csv : target.json;
      AtomicOutput.refuseOverwritingInput(out, h.file());
      if (target.csv != null) HistoryExport.csv(h, filter, target.csv, spreadsheetSafe, spec.commandLine().getOut());
      else HistoryExport.json(h, filter, utterances, target.json, spec.commandLine().getOut());
    }
    return Main.OK;
  }
}
