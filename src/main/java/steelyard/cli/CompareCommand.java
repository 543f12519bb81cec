package steelyard.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import steelyard.eval.CorpusScore;
import steelyard.eval.CorpusScorer;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.PairedComparison;
import steelyard.eval.Pick;
import steelyard.eval.SystemFilter;
import steelyard.eval.UtteranceOverlap;
import steelyard.history.InputFile;
import steelyard.history.RunRecord;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.OutputSet;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.report.CompareReport;
import steelyard.io.JsonOutput;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * {@code steelyard compare}: two systems on the same references. Each is scored as {@code score} would; the
 * paired statistics (paired bootstrap, sign test) use the utterances both systems are counted on.
 */
@Command(
    name = "compare",
    mixinStandardHelpOptions = true,
    description = {
      "Compare two systems on the same references: both rates with 95%% intervals, the paired-bootstrap interval"
          + " of the difference, the probability that B is better and an exact sign test.",
      "The plain-text report goes to stdout (to stderr when --json is '-')."
    })
public final class CompareCommand implements Callable<Integer> {
  // The shared hypotheses mixin takes one --hyps; compare takes two, so it uses the import options alone.
  @Option(names = "--hyps", required = true, paramLabel = "FILE",
      description = "Hypotheses CSV of a system; give two (A, then B), or one together with --systems.")
  List<Path> hyps;

  @Option(names = "--systems", paramLabel = "A,B", split = ",",
      description = "Compare two values of the system column of one hypotheses file (A, then B).")
  List<String> systems;

  @Option(names = "--names", paramLabel = "A,B", split = ",", description = "Display names of the two systems (default A,B).")
  List<String> names;

  @Mixin ImportInput imports;

  @Mixin NormalisationInput normalisation;
  @Mixin RunInput run;
  @Mixin HistoryOption history;
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Mixin ReferencesInput references;

  @Option(names = "--pick", paramLabel = "first|oracle", defaultValue = "first", description = "Hypothesis scored per utterance (default ${DEFAULT-VALUE}).")
  Pick pick;

  @Option(names = "--missing-hyp", paramLabel = "all-deletions|exclude", defaultValue = "all-deletions",
      converter = ScoreCommand.MissingPolicyConverter.class,
      description = "How a reference without a hypothesis counts (default ${DEFAULT-VALUE}); with exclude it leaves the comparison.")
  MissingHypothesisPolicy missing;

  @Option(names = "--resamples", paramLabel = "N", defaultValue = "1000", description = "Bootstrap resamples (default ${DEFAULT-VALUE}).")
  int resamples;

  @Mixin JsonOutputOption json;

  @Override
  public Integer call() {
    Path refs = references.require();
    if (systems == null && hyps.size() != 2)
      throw InputException.option("--hyps", "given " + hyps.size() + " time(s)", "two hypotheses files, A then B, or one file with --systems A,B");
    if (systems != null && (hyps.size() != 1 || systems.size() != 2 || systems.get(0).equals(systems.get(1))))
      throw InputException.option("--systems", "needs one --hyps file and two distinct system names, got " + hyps.size()
          + " file(s) and '" + String.join(",", systems) + "'", "--hyps FILE --systems A,B");
    List<String> display = names != null ? names : systems != null ? systems : List.of("A", "B");
    checkNames(display);
    ScoreCommand.checkOptions(pick, resamples, 0);
    LinkedHashMap<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--json", json.file);
    List<Path> inputs = new ArrayList<>(hyps);
    inputs.add(refs);
    inputs.add(normalisation.rules);
    OutputSet outputSet = OutputSet.open(outputs, inputs);
    if (systems != null) InputFiles.requireRereadable(hyps.get(0), "--systems scores it once per system");

    List<String> warnings = new ArrayList<>();
    ImportOptions options = imports.importOptions(spec.commandLine().getErr(), warnings::add);
    Normaliser normaliser = Normaliser.create(normalisation.options());
    Unit unit = normalisation.unit;
    LinkedHashMap<String, Reference> refMap = ReferencesReader.readAll(refs, ScoreCommand.withoutFeatures(options));
    CorpusScorer scorer = new CorpusScorer(raw -> normaliser.tokens(raw, unit), new CorpusScorer.Settings(pick, missing, 0, false));
    Path fileA = hyps.get(0);
    Path fileB = systems == null ? hyps.get(1) : hyps.get(0);
    long[] hypRows = new long[2];
    CorpusScore a = scoreFile(scorer, refMap, fileA, systems == null ? null : systems.get(0), options, hypRows, 0);
    CorpusScore b = scoreFile(scorer, refMap, fileB, systems == null ? null : systems.get(1), options, hypRows, 1);
    List<String> refIds = new ArrayList<>(refMap.keySet());
    ScoreCommand.warnAbout(UtteranceOverlap.check(label(fileA, 0), refs, refIds, a.missingHypotheses(), a.missingReferences()), warnings, spec.commandLine().getErr());
    ScoreCommand.warnAbout(UtteranceOverlap.check(label(fileB, 1), refs, refIds, b.missingHypotheses(), b.missingReferences()), warnings, spec.commandLine().getErr());
    PairedComparison comparison = PairedComparison.of(a, b, resamples, run.seed, run.effectiveThreads());
    CompareReport.CompareRun report = new CompareReport.CompareRun(refs.toString(), unit, normaliser.describe(),
        new CompareReport.SystemRun(display.get(0), label(fileA, 0), a),
        new CompareReport.SystemRun(display.get(1), label(fileB, 1), b),
        comparison, run.seed, imports.skipped, warnings);

    json.write(CompareReport.json(report), spec.commandLine().getOut());
    outputSet.commit();
    ScoreCommand.printReport(spec, json.file, CompareReport.text(report));
    history.record(recorded(display.get(0), fileA, hypRows[0], a, warnings, normaliser, refMap.size()),
        recorded(display.get(1), fileB, hypRows[1], b, warnings, normaliser, refMap.size()));
    return Main.OK;
  }

  /** Refuses display names that are not two distinct, non-blank names. */
  static void checkNames(List<String> display) {
    if (display.size() != 2 || display.get(0).isBlank() || display.get(1).isBlank() || display.get(0).equals(display.get(1)))
      throw InputException.option("--names", "'" + String.join(",", display) + "' is not two distinct names", "two names such as baseline,tuned");
  }

  // One compared system as a run of its own, labelled with its display name; its interval is computed only when recorded.
  private RunRecord.Builder recorded(
      String name, Path file, long hypRows, CorpusScore score, List<String> warnings, Normaliser normaliser, int refRows) {
    return history.run().label(name).warnings(warnings).scored(score).bootstrap(resamples, run.seed, run.effectiveThreads())
        .unit(normalisation.unit, normaliser.describe()).input(InputFile.HYPOTHESES, file, hypRows)
        .input(InputFile.REFERENCES, references.refs, refRows).input(InputFile.RULES, normalisation.rules, InputFile.UNKNOWN_ROWS);
  }

  // The file, with the system when one file holds both: "dockets.csv system=line-gray".
  private String label(Path file, int which) {
    return systems == null ? file.toString() : file + " system=" + systems.get(which);
  }

  // Scores one system; the rows read from its file go to rowsRead[which].
  private static CorpusScore scoreFile(CorpusScorer scorer, LinkedHashMap<String, Reference> refMap, Path file, String system,
      ImportOptions options, long[] rowsRead, int which) {
    try (HypothesesReader reader = HypothesesReader.open(file, options)) {
      if (system != null && !reader.hasSystemColumn())
        throw InputException.inFile(file, "--systems needs a 'system' column, which this file does not have", "a column named system");
      SystemFilter filter = system == null ? null : new SystemFilter(reader, system);
      CorpusScore score = scorer.score(refMap, filter == null ? reader : filter);
      if (filter != null) filter.requireSeen("--systems", file);
      rowsRead[which] = reader.rowsRead();
      return score;
    }
  }
}
