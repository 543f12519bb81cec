package steelyard.demo;

import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Locale;
import java.util.Set;
import java.util.function.BooleanSupplier;
import steelyard.audit.AuditCounts;
import steelyard.eval.PairedComparison;
import steelyard.io.FeatureSpec;
import steelyard.io.ImportOptions;
import steelyard.io.InputException;
import steelyard.report.HeldOutRun;
import steelyard.report.Numbers;
import steelyard.report.TuneText;
import steelyard.report.html.HtmlReport;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSummary;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;
import steelyard.tune.TuneProgress;
import steelyard.tune.TuneResult;
import steelyard.tune.TuneSettings;
import steelyard.tune.WeightNames;

/**
 * The main job on the bundled demo data, end to end: for the invented cooperative's voice logs (word N-best lists,
 * the voice 3-gram) and scanned delivery dockets (five OCR configurations per line, the character 5-gram), tune the
 * weights on the dev set, choose and audit the held-out test set with them ({@link HeldOutRun}), write each data
 * set's files and one HTML report with both. What {@code steelyard demo} runs; a window's "run the demo" calls the
 * same.
 *
 * <p>The tuning is restricted so that the demo stays quick: the voice logs tune the N-best and lattice methods over
 * every weight; the dockets tune the lattice method over α, λ′ and μ′ (the confidence column alone already orders
 * the configurations, and the system weights cost most of the time while gaining little on the dev set). The README's
 * {@code tune} commands for {@code models/*-demo.weights.json} use exactly these settings, so the bundled weights
 * files are what the demo tunes.
 */
public final class DemoRun {
  /** The report's file name in the output folder. */
  public static final String REPORT = "report.html";

  private DemoRun() {}

  /**
   * One bundled data set: its {@link HeldOutRun.Spec}, the stem of its output files, and its one-line description.
   */
  public record Part(String stem, String description, HeldOutRun.Spec spec) {}

  /** What the demo produced: each data set's run, in order, and where the files went. */
  public record Result(List<Part> parts, List<HeldOutRun.Result> runs, Path outDir, Path report) {}

  /** Weights the dockets tune (see the class comment). */
  static final Set<String> DOCKET_WEIGHTS = Set.of(WeightNames.POSTERIOR_SHARPNESS, WeightNames.LATTICE_LM, WeightNames.LATTICE_LENGTH);

  /**
   * The two bundled data sets under {@code root} ({@code sample-hypotheses/}, {@code models/}); an
   * {@link InputException} naming {@code option} when they are not there.
   */
  public static List<Part> bundled(Path root, String option, ImportOptions imports, int threads, long seed) {
    Path data = root.resolve("sample-hypotheses");
    Path models = root.resolve("models");
    if (!Files.isDirectory(data) || !Files.isDirectory(models))
      throw InputException.option(option, "no sample-hypotheses/ and models/ under " + root, "the Steelyard project folder");
    TuneSettings base = TuneSettings.defaults().withThreads(threads).withSeed(seed).withSurface(false);
    RescoreConfig voice = RescoreConfig.builder().features(FeatureSpec.parseList("acoustic,lm"))
        .normalisation(new NormalisationOptions(false, false, false, false, data.resolve("voice.rules")))
        .modelPath(models.resolve("voice-3gram.arpa.gz")).unit(Unit.WORD).importOptions(imports).build();
    RescoreConfig dockets = RescoreConfig.builder().features(FeatureSpec.parseList("confidence"))
        .modelPath(models.resolve("dockets-char-5gram.arpa.gz")).unit(Unit.CHAR).importOptions(imports).build();
    return List.of(
        new Part("voice", "word N-best lists: acoustic + first-pass LM + domain 3-gram", new HeldOutRun.Spec("Voice logs", voice,
            data.resolve("voice-dev.nbest.csv"), data.resolve("voice-dev.refs.csv"), data.resolve("voice-test.nbest.csv"),
            data.resolve("voice-test.refs.csv"), base.withMethods(EnumSet.of(RescoreMethod.NBEST, RescoreMethod.LATTICE)))),
        new Part("dockets", "five OCR configurations combined in a character confusion network with a 5-gram",
            new HeldOutRun.Spec("Delivery dockets", dockets, data.resolve("dockets-dev.nbest.csv"), data.resolve("dockets-dev.refs.csv"),
                data.resolve("dockets-test.nbest.csv"), data.resolve("dockets-test.refs.csv"),
                base.withMethods(EnumSet.of(RescoreMethod.LATTICE)).withTune(DOCKET_WEIGHTS))));
  }

  /** Every file {@link #run} writes into {@code outDir}, keyed by its name: what a caller stages as one all-or-none set. */
  public static Map<String, Path> outputs(List<Part> parts, Path outDir) {
    Map<String, Path> out = new LinkedHashMap<>();
    for (Part p : parts)
      for (String ending : HeldOutRun.Result.FILES) out.put(p.stem() + ending, outDir.resolve(p.stem() + ending));
    out.put(REPORT, outDir.resolve(REPORT));
    return out;
  }

  /**
   * Runs every part in order, writes each part's files ({@link HeldOutRun.Result#write}) and the report into
   * {@code outDir} (which must exist). {@code progress} hears each part's tuning in turn.
   */
  public static Result run(List<Part> parts, Path outDir, int threads, long seed, TuneProgress progress, BooleanSupplier cancelled,
      Writer stdout) {
    List<HeldOutRun.Result> runs = new ArrayList<>();
    List<ReportModel.Section> sections = new ArrayList<>();
    for (Part p : parts) {
      HeldOutRun.Result r = HeldOutRun.run(p.spec(), threads, seed, progress, cancelled);
      r.write(outDir, p.stem(), stdout);
      runs.add(r);
      sections.add(r.section(threads));
    }
    Path report = outDir.resolve(REPORT);
    HtmlReport.write(new ReportModel("Steelyard demo: the Tallowmere Produce Cooperative (invented)", List.of(
        "Weights tuned on each dev set (cross-validated) and applied to its held-out test set; the overrules are those of the test set."),
        sections), report);
    return new Result(parts, runs, outDir, report);
  }

  /** The printed summary: per data set the method and weights, dev and test error before and after, the overrules. */
  public static String summary(Result r) {
    StringBuilder sb = new StringBuilder();
    sb.append("Steelyard demo: the invented Tallowmere Produce Cooperative (voice logs and scanned delivery dockets)\n");
    sb.append("Weights are tuned on each dev set and applied to its held-out test set.\n\n");
    for (int k = 0; k < r.runs().size(); k++) part(sb, r.parts().get(k), r.runs().get(k));
    sb.append("Report: ").append(r.report()).append(" (figures, charts, every test overrule aligned with its reference)\n");
    sb.append("Also in ").append(r.outDir()).append("/: *.weights.json (tuned weights, for rescore --weights), *-dev.tune.json, ")
        .append("*-test.picks.csv, *-test.summary.json, *-test.breakdown.csv\n");
    sb.append(RescoreSummary.NOTICE).append('\n');
    return sb.toString();
  }

  private static void part(StringBuilder sb, Part p, HeldOutRun.Result run) {
    TuneResult t = run.tuning().result();
    String measure = run.tuned().unit() == Unit.CHAR ? "CER" : "WER";
    List<String> methods = new ArrayList<>();
    t.perMethod().forEach(f -> methods.add(f.method().label()));
    sb.append(p.spec().name()).append(", ").append(p.description()).append('\n');
    sb.append("  method    ").append(t.method().label()).append(methods.size() < 2 ? "" : String.format(Locale.ROOT,
        " (of %s: the lowest %d-fold cross-validated %s)", String.join(", ", methods), t.folds(), measure)).append('\n');
    sb.append("  weights   ").append(TuneText.weights(t.weights(), t.method())).append('\n');
    sb.append(String.format(Locale.ROOT, "  %s dev   %s; cross-validated %s%n", measure, beforeAfter(run.dev().versusFirst()),
        Numbers.percent(t.cvErrorRate(), 2)));
    RescoreSummary test = run.test().summary();
    sb.append(String.format(Locale.ROOT, "  %s test  %s; N-best oracle %s%n", measure, beforeAfter(run.test().versusFirst()),
        Numbers.percent((double) test.oracle().errors() / test.oracle().referenceTokens(), 2)));
    AuditCounts c = run.test().audit().total();
    sb.append(String.format(Locale.ROOT, "  overrules %d of %d test utterances (%d new transcripts): %d helped, %d hurt, %d neutral; %s%n%n",
        c.overrules(), run.test().audit().utterances(), test.newTranscripts(), c.helped(), c.hurt(), c.neutral(), net(c.netErrorChange())));
  }

  /** The net error change of the overrules in words: "461 errors fewer", "3 errors more", "no net change". */
  private static String net(long change) {
    if (change == 0) return "no net change in errors";
    return Math.abs(change) + (change > 0 ? " errors fewer" : " errors more") + " in all";
  }

  /** "rank 1 22.67% (20.93% to 24.49%) -> 8.86% (7.35% to 10.42%)": both with their 95 % bootstrap intervals. */
  private static String beforeAfter(PairedComparison c) {
    return "rank 1 " + rate(c.rateA(), c.intervalA().low(), c.intervalA().high()) + " -> tuned " + rate(c.rateB(), c.intervalB().low(),
        c.intervalB().high());
  }

  private static String rate(double v, double low, double high) {
    return Numbers.percent(v, 2) + " (" + Numbers.percent(low, 2) + " to " + Numbers.percent(high, 2) + ")";
  }
}
