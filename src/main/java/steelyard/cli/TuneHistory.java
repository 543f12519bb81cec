package steelyard.cli;

import java.nio.file.Path;
import steelyard.report.AuditRun;
import steelyard.rescore.RescoreSession;
import steelyard.tune.TuneJob;

/**
 * What {@code tune --history} records: the dev set chosen again with the tuned weights and method, as a rescoring
 * run with references ({@code rescore --refs} would record the same counts), with the tuned weights file as the
 * weights in effect. Nothing is computed or hashed when history is off.
 */
final class TuneHistory {
  private TuneHistory() {}

  static void record(HistoryOption history, TuneJob.Outcome o, Path rules, Path startWeights, int threads, long seed) {
    if (history.target() == null) return;
    TuneJob.Dev dev = o.dev();
    RescoreSession tuned = dev.session().withWeights(o.result().weights(), o.result().method());
    AuditRun.Result check = AuditRun.of(tuned, dev.set(), dev.referenceOrder(), threads, seed);
    RescoreSupport.record(history, tuned, new RescoreSupport.InputsUsed(dev.hypotheses(), dev.references(), rules, startWeights),
        check.summary(), check.ci95(), seed, o.weights());
  }
}
