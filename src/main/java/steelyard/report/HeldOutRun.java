package steelyard.report;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.function.BooleanSupplier;
import steelyard.io.AtomicOutput;
import steelyard.io.JsonOutput;
import steelyard.report.html.ReportModel;
import steelyard.rescore.RescoreConfig;
import steelyard.rescore.RescoreRun;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.UtteranceResult;
import steelyard.rescore.WeightsFile;
import steelyard.tune.TuneJob;
import steelyard.tune.TuneProgress;
import steelyard.tune.TuneSettings;

/**
 * Dev-tuned weights checked on held-out data, end to end: tune on a dev set ({@link TuneJob}), choose the dev set
 * again and the test set with the tuned weights and method and audit both ({@link AuditRun}), write the files a user
 * keeps, and map the run onto one section of the HTML report ({@link ReportSections}). What the demo runs for each of
 * its data sets, and what a window offering "tune on dev, check on test" calls.
 *
 * <pre>{@code
 * HeldOutRun.Result r = HeldOutRun.run(new HeldOutRun.Spec("Voice logs", config, devHyps, devRefs, testHyps, testRefs,
 *     TuneSettings.defaults().withThreads(2)), 2, seed, TuneProgress.NONE, () -> false);
 * r.write(outDir, "voice", stdout);
 * HtmlReport.write(new ReportModel(title, List.of(), List.of(r.section(2))), outDir.resolve("report.html"));
 * }</pre>
 *
 * <p>Everything depends only on the inputs, the settings and the seed, never on the thread count.
 */
public final class HeldOutRun {
  private HeldOutRun() {}

  /**
   * One data set.
   *
   * @param name     heading of its report section, e.g. "Voice logs"
   * @param config   features, normalisation, model, unit; its weights (file and overrides) are where tuning starts
   * @param devHyps  dev hypotheses (tuned on)
   * @param devRefs  dev references
   * @param testHyps held-out hypotheses (chosen with the tuned weights, audited)
   * @param testRefs held-out references
   * @param settings how to tune (methods, weights that move, folds, seed, threads)
   */
  public record Spec(String name, RescoreConfig config, Path devHyps, Path devRefs, Path testHyps, Path testRefs,
      TuneSettings settings) {}

  /**
   * What a run produced.
   *
   * @param spec   what was run
   * @param tuning the tuning on the dev set (result, weights file, the dev set in memory)
   * @param dev    the dev set chosen with the tuned weights: rank 1 and tuned error with their paired intervals
   * @param test   the test set chosen with the tuned weights, audited
   */
  public record Result(Spec spec, TuneJob.Outcome tuning, AuditRun.Result dev, AuditRun.Result test) {
    /** The session with the tuned weights and method. */
    public RescoreSession tuned() {
      return test.session();
    }

    /** The tuning's warnings (the session's first), then the test run's own. */
    public List<String> warnings() {
      List<String> w = new ArrayList<>(tuning.warnings());
      w.addAll(test.summary().warnings());
      return w;
    }

    /**
     * The report section: the dev rows of the tuning (in-sample with its interval, cross-validated), the test row
     * with the paired test against rank 1, the tuned weights with their best intervals, the test audit, and the
     * charts of the tuned weights' exact sweeps on the test set.
     */
    public ReportModel.Section section(int threads) {
      return ReportSections.section(test.section(spec.name(), "test").tuning(tuning.result()).charts(test.charts(threads)).build());
    }

    /** The endings of the files {@link #write} writes after its stem, in the order written. */
    public static final List<String> FILES = List.of(".weights.json", "-dev.tune.json", "-test.picks.csv", "-test.breakdown.csv",
        "-test.summary.json");

    /**
     * Writes the files a user keeps, each atomically: {@code STEM.weights.json} (the tuned weights file, for
     * {@code rescore --weights}), {@code STEM-dev.tune.json} (the tuning summary, as {@code tune --json}),
     * {@code STEM-test.picks.csv}, {@code STEM-test.breakdown.csv} and {@code STEM-test.summary.json} (as
     * {@code rescore --weights STEM.weights.json --refs} writes them for the test set).
     */
    public void write(Path dir, String stem, Writer stdout) {
      String weights = WeightsFile.toJson(tuning.weights());
      ObjectNode summary = TuneJson.json(tuning);
      AtomicOutput.writeText(dir.resolve(stem + ".weights.json"), stdout, w -> w.write(weights));
      JsonOutput.write(dir.resolve(stem + "-dev.tune.json"), summary, stdout);
      List<UtteranceResult> picks = new ArrayList<>(test.inputs().size());
      test.inputs().forEach(in -> picks.add(in.result()));
      RescoreRun.write(tuned(), picks, test.summary(), test.set().withReferences(),
          new RescoreRun.Outputs(dir.resolve(stem + "-test.picks.csv"), dir.resolve(stem + "-test.breakdown.csv"),
              dir.resolve(stem + "-test.summary.json"), null), 1, test.seed(), stdout);
    }
  }

  /**
   * Tunes on the dev set, then chooses and audits the dev and test sets with the tuned weights. {@code progress}
   * hears the tuning; {@code cancelled} is polled while loading and tuning.
   *
   * @throws java.util.concurrent.CancellationException when cancelled
   */
  public static Result run(Spec spec, int threads, long seed, TuneProgress progress, BooleanSupplier cancelled) {
    RescoreSession session = RescoreSession.open(spec.config());
    TuneJob.Dev dev = TuneJob.load(session, spec.devHyps(), spec.devRefs(), threads, RescoreSession.LoadListener.NONE, cancelled);
    TuneJob.Outcome tuning = TuneJob.run(dev, spec.settings(), progress, cancelled);
    RescoreSession tuned = session.withWeights(tuning.result().weights(), tuning.result().method());
    AuditRun.Result devCheck = AuditRun.of(tuned, dev.set(), dev.referenceOrder(), threads, seed);
    AuditRun.Result test = AuditRun.run(tuned, spec.testHyps(), spec.testRefs(), threads, seed, RescoreSession.LoadListener.NONE, cancelled);
    return new Result(spec, tuning, devCheck, test);
  }
}
