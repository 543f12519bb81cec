package steelyard.cli;

import java.nio.file.Path;
import java.util.List;
import steelyard.history.InputFile;
import steelyard.tune.TuneJob;

/** What {@code tune --history} records: the tuned weights on the dev set, as a rescoring run with references. */
final class TuneHistory {
  private TuneHistory() {}

  static void record(HistoryOption history, TuneJob.Outcome o, Path model, Path rules, int threads, List<String> warnings) {
    if (history.target() == null) return;
    var dev = o.dev();
    history.record(history.run().method(o.result().method().label()).weights(o.weights())
        .unit(dev.session().unit(), null).warnings(warnings)
        .model(model, dev.session().modelIdentity())
        .input(InputFile.HYPOTHESES, dev.hypotheses(), dev.set().hypotheses())
        .input(InputFile.REFERENCES, dev.references(), dev.set().size() + dev.set().missingHypotheses().size() - dev.set().missingReferences().size())
        .input(InputFile.RULES, rules, InputFile.UNKNOWN_ROWS));
  }
}
