package steelyard.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import steelyard.audit.AuditCounts;
import steelyard.audit.AuditReport;
import steelyard.io.InputException;
import steelyard.report.AuditOutputs;
import steelyard.report.AuditRun;
import steelyard.report.ReportSections;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreSession;
import steelyard.text.Unit;

/**
 * {@code steelyard audit}: rescores a hypotheses file with the given weights and explains every overrule (a pick
 * that differs from the recogniser's rank 1): verdict against the reference, score terms side by side, how close the
 * call was along the LM weight, and the n-grams that decided it. Writes JSON, CSV and the HTML report by extension,
 * all or none, and a short summary on stderr.
 */
@Command(
    name = "audit",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Explain where the language model overruled the recogniser: helped, hurt or neutral against the references,"
          + " by how much, which n-grams decided it and at what LM weight the decision flips.",
      "Outputs by extension: .json, .csv (one row per overrule), .html (a self-contained report with charts)."
    })
public final class AuditCommand implements Callable<Integer> {
  @Mixin HypothesesInput input;
  @Mixin ReferencesInput references;
  @Mixin LmModelInput model;
  @Mixin RescoreWeightOptions weightOptions;
  @Mixin NormalisationInput normalisation;
  @Mixin RunInput run;

  @Mixin RescoreChoiceOptions choice;

  @Option(names = "--out", required = true, paramLabel = "FILE",
      description = "An output, repeatable; the format follows the name: .json, .csv or .html. '-' writes to stdout in the --stdout-format.")
  List<Path> outs;

  @Option(names = "--stdout-format", paramLabel = "json|csv|html", defaultValue = "json",
      converter = FormatConverter.class, description = "Format of an --out '-' (default ${DEFAULT-VALUE}).")
  AuditOutputs.Format stdoutFormat;

  @Option(names = "--spreadsheet-safe", paramLabel = "true|false", arity = "1", defaultValue = "true",
      description = "In the CSV, prefix cells starting with = + - @ tab or CR with an apostrophe (default ${DEFAULT-VALUE}).")
  boolean spreadsheetSafe;

  @Mixin HistoryOption history;
  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    if (run.threads < 0) throw InputException.option("--threads", "is " + run.threads, "0 (all cores) or a positive number");
    AuditOutputs outputs = AuditOutputs.plan("--out", outs, stdoutFormat,
        Arrays.asList(input.hyps, model.lm, references.refs, weightOptions.weightsFile, normalisation.rules));
    PrintWriter err = spec.commandLine().getErr();
    RescoreSession session = RescoreSession.open(
        choice.apply(RescoreSupport.config(spec, input, normalisation, model, weightOptions)).build());
    session.warnings().forEach(w -> RescoreSupport.warn(err, w));
    int threads = run.effectiveThreads();
    AuditRun.Result r = AuditRun.run(session, input.hyps, references.refs, threads, run.seed, RescoreSession.LoadListener.NONE, () -> false);
    ReportModel html = outputs.wantsHtml() ? report(r, threads) : null;
    outputs.write(r, html, spreadsheetSafe, spec.commandLine().getOut());
    r.summary().warnings().forEach(w -> RescoreSupport.warn(err, w));
    printSummary(err, r);
    if (references.refs != null) {
      RescoreSupport.record(history, session, new RescoreSupport.InputsUsed(input.hyps, references.refs, normalisation.rules,
          weightOptions.weightsFile), r.summary(), r.ci95(), run.seed);
    } else if (history.file != null) {
      RescoreSupport.warn(err, "run not recorded in the history: --history records audits with --refs only");
    }
    return Main.OK;
  }

  private ReportModel report(AuditRun.Result r, int threads) {
    String name = String.valueOf(input.hyps.getFileName());
    ReportModel.Section section = ReportSections.section(r.section(name, "this data, weights as given").charts(r.charts(threads)).build());
    return new ReportModel("Steelyard audit: " + name, List.of(), List.of(section));
  }

  /** Overrules by verdict, the net error change and the corpus error rate before and after, then the notice. */
  private static void printSummary(PrintWriter err, AuditRun.Result r) {
    AuditReport a = r.audit();
    AuditCounts t = a.total();
    err.printf(Locale.ROOT, "steelyard audit: %d utterances by %s; %d overrules: %d helped, %d hurt, %d neutral, %d unverified%n",
        a.utterances(), r.session().method().label(), t.overrules(), t.helped(), t.hurt(), t.neutral(), t.unverified());
    if (r.versusFirst() != null) {
      String measure = a.unit() == Unit.CHAR ? "CER" : "WER";
      long net = t.netErrorChange();
      err.printf(Locale.ROOT, "  net error change %+d (%s); %s %s with rank 1, %s with the picks, over %d utterances%n",
          net, net > 0 ? "fewer errors" : net < 0 ? "more errors" : "no change", measure, RescoreSupport.percent(r.summary().first()),
          RescoreSupport.percent(r.summary().chosen()), r.summary().scored());
      RescoreSupport.printVersusFirst(err, r.versusFirst());
    }
    err.println("  note: " + AuditReport.NOTICE);
    err.flush();
  }

  /** Reads {@code json}, {@code csv} or {@code html}. */
  static final class FormatConverter implements CommandLine.ITypeConverter<AuditOutputs.Format> {
    @Override
    public AuditOutputs.Format convert(String value) {
      AuditOutputs.Format f = AuditOutputs.Format.named(value);
      if (f == null) throw new CommandLine.TypeConversionException("'" + value + "' is not one of json, csv, html");
      return f;
    }
  }
}
