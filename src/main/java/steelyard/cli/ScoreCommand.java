package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import steelyard.eval.Bootstrap;
import steelyard.eval.CorpusScore;
import steelyard.eval.CorpusScorer;
import steelyard.eval.MissingHypothesisPolicy;
import steelyard.eval.Pick;
import steelyard.eval.SystemFilter;
import steelyard.eval.UtteranceOverlap;
import steelyard.history.InputFile;
import steelyard.io.AtomicOutput;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.io.OutputSet;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.io.JsonOutput;
import steelyard.report.OutputPaths;
import steelyard.report.ScoreContext;
import steelyard.report.ScoreReport;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * {@code steelyard score}: one pick of hypotheses against references, with a bootstrap interval, groups, the most
 * frequent errors and what is missing. Reads everything before writing anything, so bad input writes nothing.
 */
@Command(
    name = "score",
    mixinStandardHelpOptions = true,
    description = {
      "Score hypotheses against references: WER/CER with a 95%% bootstrap interval, sentence error rate, groups,"
          + " most frequent errors and missing utterances.",
      "The plain-text report goes to stdout (to stderr when --json or --csv is '-')."
    })
public final class ScoreCommand implements Callable<Integer> {
  /** Upper limit of {@code --resamples}: the resample rates are held in memory (8 bytes each). */
  static final int MAX_RESAMPLES = 1_000_000;

  @Mixin HypothesesInput hypotheses;
  @Mixin NormalisationInput normalisation;
  @Mixin RunInput run;
  @Mixin HistoryOption history;
  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Mixin ReferencesInput references;

  @Option(names = "--system", paramLabel = "NAME",
      description = "Score only this value of the system column (its own smallest rank is its pick).")
  String system;

  @Option(names = "--pick", paramLabel = "first|oracle", defaultValue = "first",
      description = "Hypothesis scored per utterance: first = the recogniser's rank 1, oracle = fewest errors (default ${DEFAULT-VALUE}).")
  Pick pick;

  @Option(names = "--missing-hyp", paramLabel = "all-deletions|exclude", defaultValue = "all-deletions",
      converter = MissingPolicyConverter.class,
      description = "How a reference without any hypothesis counts (default ${DEFAULT-VALUE}).")
  MissingHypothesisPolicy missing;

  @Option(names = "--resamples", paramLabel = "N", defaultValue = "1000", description = "Bootstrap resamples (default ${DEFAULT-VALUE}).")
  int resamples;

  @Option(names = "--top", paramLabel = "K", defaultValue = "10", description = "How many frequent substitutions, deletions and insertions to list (default ${DEFAULT-VALUE}).")
  int top;

  @Mixin JsonOutputOption json;

  @Option(names = "--csv", paramLabel = "FILE|-", description = "Write the per-utterance table as CSV to FILE, or to stdout with '-'.")
  Path csv;

  @Option(names = "--spreadsheet-safe", paramLabel = "true|false", arity = "1", defaultValue = "true",
      description = "In the CSV, prefix cells starting with = + - @ tab or CR with an apostrophe (default ${DEFAULT-VALUE}).")
  boolean spreadsheetSafe;

  @Override
  public Integer call() {
    Path refs = references.require();
    checkOptions(pick, resamples, top);
    LinkedHashMap<String, Path> outputs = new LinkedHashMap<>();
    outputs.put("--json", json.file);
    outputs.put("--csv", csv);
    OutputSet outputSet = OutputSet.open(outputs, Arrays.asList(hypotheses.hyps, refs, normalisation.rules));

    List<String> warnings = new ArrayList<>();
    ImportOptions options = hypotheses.imports.importOptions(spec.commandLine().getErr(), w -> {
      synchronized (warnings) {
        warnings.add(w);
      }
    });
    Normaliser normaliser = Normaliser.create(normalisation.options());
    Unit unit = normalisation.unit;
    LinkedHashMap<String, Reference> refMap = ReferencesReader.readAll(refs, withoutFeatures(options));
    CorpusScorer scorer = new CorpusScorer(raw -> normaliser.tokens(raw, unit),
        new CorpusScorer.Settings(pick, missing, top, csv != null));
    CorpusScore score;
    long hypRows;
    try (HypothesesReader reader = HypothesesReader.open(hypotheses.hyps, options)) {
      if (system != null && !reader.hasSystemColumn())
        throw InputException.inFile(hypotheses.hyps, "--system needs a 'system' column, which this file does not have", "a column named system");
      SystemFilter filter = system == null ? null : new SystemFilter(reader, system);
      score = scorer.score(refMap, filter == null ? reader : filter);
      if (filter != null) filter.requireSeen("--system", hypotheses.hyps);
      hypRows = reader.rowsRead();
    }
    warnAbout(UtteranceOverlap.check(hypotheses.hyps.toString() + (system == null ? "" : " system=" + system), refs, new ArrayList<>(refMap.keySet()), score.missingHypotheses(),
        score.missingReferences()), warnings, spec.commandLine().getErr());
    Bootstrap.Interval ci = Bootstrap.corpusRate(score.table().includedErrors(), score.table().includedReferenceTokens(),
        resamples, run.seed, run.effectiveThreads());
    String source = system == null ? hypotheses.hyps.toString() : hypotheses.hyps + " system=" + system;
    ScoreContext context = new ScoreContext(source, refs.toString(), unit,
        normaliser.describe(), normaliser.ruleUsage(), run.seed, resamples, ci,
        hypotheses.skipped(), warnings);

    PrintWriter stdout = spec.commandLine().getOut();
    if (csv != null) AtomicOutput.writeText(csv, stdout, out -> ScoreReport.csv(score, out, spreadsheetSafe));
    json.write(ScoreReport.json(score, context), stdout);
    outputSet.commit();
    printReport(spec, OutputPaths.isStdout(csv) ? csv : json.file, ScoreReport.text(score, context));
    history.record(history.run().warnings(warnings).scored(score).interval(ci, resamples, run.seed).unit(unit, normaliser.describe())
        .label(system).input(InputFile.HYPOTHESES, hypotheses.hyps, hypRows).input(InputFile.REFERENCES, refs, refMap.size())
        .input(InputFile.RULES, normalisation.rules, InputFile.UNKNOWN_ROWS));
    return Main.OK;
  }

  /** Prints a text report to the command's stdout, or to its stderr when {@code other} is stdout. */
  static void printReport(CommandLine.Model.CommandSpec spec, Path other, String text) {
    PrintWriter w = OutputPaths.isStdout(other) ? spec.commandLine().getErr() : spec.commandLine().getOut();
    w.print(text);
    w.flush();
  }

  /** Prints {@code warning} (if not null) on the command's stderr {@code err} and keeps it for the report's warnings. */
  static void warnAbout(String warning, List<String> warnings, PrintWriter err) {
    if (warning == null) return;
    synchronized (warnings) {
      warnings.add(warning);
    }
    RescoreSupport.warn(err, warning);
  }

  /** Validates the counts every scoring command takes. */
  static void checkOptions(Pick pick, int resamples, int top) {
    if (pick == Pick.GIVEN) throw InputException.option("--pick", "'given' is for programs, not the command line", "first or oracle");
    if (resamples < 1 || resamples > MAX_RESAMPLES)
      throw InputException.option("--resamples", "must be between 1 and " + MAX_RESAMPLES + ", got " + resamples, "a number such as 1000");
    if (top < 0) throw InputException.option("--top", "must not be negative, got " + top, "0 or more");
  }

  /** The same options with no feature columns (a references file has none). */
  static ImportOptions withoutFeatures(ImportOptions o) {
    return new ImportOptions(List.of(), o.primarySystem(), o.maxBadRows(), o.warnings(), o.skipped());
  }

  /** Reads {@code all-deletions} or {@code exclude}. */
  static final class MissingPolicyConverter implements CommandLine.ITypeConverter<MissingHypothesisPolicy> {
    @Override
    public MissingHypothesisPolicy convert(String value) {
      MissingHypothesisPolicy p = MissingHypothesisPolicy.fromLabel(value);
      if (p == null) throw new CommandLine.TypeConversionException("'" + value + "' is not one of all-deletions, exclude");
      return p;
    }
  }
}
