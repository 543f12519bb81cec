package steelyard.report;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;
import steelyard.io.JsonOutput;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.Unit;
import steelyard.tune.ErrorSurface;
import steelyard.tune.MethodFigures;
import steelyard.tune.TuneJob;
import steelyard.tune.TuneResult;
import steelyard.tune.WeightInterval;

/**
 * The JSON summary of a tuning run ({@code tune --json}). Rates are errors / reference tokens of the dev set
 * (WER or CER by {@code unit}) with {@value RescoreSummary#RATE_DIGITS} decimals, as {@code rescore} writes them, so
 * {@code dev_error_rate} compares exactly with {@code rescore --weights … --refs} on the same data; a rate that does
 * not exist (no cross-validation) and an unbounded interval end are {@code null}. Nothing depends on the thread
 * count or the clock.
 *
 * <p>Keys: {@code notice}, {@code method}, {@code unit}, {@code error_measure}, {@code seed}, {@code folds},
 * {@code utterances}, {@code reference_tokens}, {@code dev_first_error_rate} (recogniser rank 1),
 * {@code dev_error_rate} (tuned, in-sample) with {@code dev_ci95_low}/{@code _high}, {@code cv_error_rate},
 * {@code weights} (the weights file written), {@code best_interval}, {@code per_method}, {@code surface},
 * {@code left_out} and {@code warnings}.
 */
public final class TuneJson {
  private static final int DIGITS = RescoreSummary.RATE_DIGITS;

  private TuneJson() {}

  /** The summary of {@code o}, with all its warnings ({@link TuneJob.Outcome#warnings}). */
  public static ObjectNode json(TuneJob.Outcome o) {
    TuneResult r = o.result();
    Unit unit = o.dev().session().unit();
    ObjectNode j = JsonOutput.object();
    j.put("notice", RescoreSummary.NOTICE);
    j.put("method", r.method().label());
    j.put("unit", unit.label());
    j.put("error_measure", unit == Unit.CHAR ? "CER" : "WER");
    j.put("seed", r.seed());
    j.put("folds", r.folds());
    j.put("utterances", r.utterances());
    j.put("reference_tokens", r.referenceTokens());
    rate(j, "dev_first_error_rate", r.devFirstErrorRate());
    rate(j, "dev_error_rate", r.devErrorRate());
    rate(j, "dev_ci95_low", r.devInterval().low());
    rate(j, "dev_ci95_high", r.devInterval().high());
    rate(j, "cv_error_rate", r.cvErrorRate());
    j.set("weights", weights(o.weights()));
    j.set("best_interval", intervals(r.bestInterval()));
    ArrayNode per = j.putArray("per_method");
    for (MethodFigures f : r.perMethod()) per.add(method(f, r.referenceTokens(), o.weights()));
    j.set("surface", surface(r.surface()));
    ObjectNode left = j.putObject("left_out");
    left.put("utterances_without_reference", o.dev().set().missingReferences().size());
    left.put("references_without_hypotheses", o.dev().set().missingHypotheses().size());
    j.set("warnings", JsonOutput.strings(o.warnings()));
    return j;
  }

  private static ObjectNode method(MethodFigures f, long n, WeightsSpec written) {
    ObjectNode m = JsonOutput.object();
    m.put("method", f.method().label());
    m.put("dev_errors", f.devErrors());
    rate(m, "dev_error_rate", f.devErrorRate());
    if (f.cvErrors() < 0) m.putNull("cv_errors");
    else m.put("cv_errors", f.cvErrors());
    rate(m, "cv_error_rate", f.cvErrorRate());
    m.put("start_errors", f.startErrors());
    rate(m, "start_error_rate", n == 0 ? Double.NaN : (double) f.startErrors() / n);
    m.put("kept_start", f.keptStart());
    m.put("iterations", f.iterations());
    m.set("best_interval", intervals(f.bestInterval()));
    m.set("weights", weights(WeightsSpec.of(f.weights(), written.unit, written.model)));
    return m;
  }

  /** Per weight: its tuned value, the ends of its best interval (null when unbounded) and whether it is exact. */
  private static ObjectNode intervals(Map<String, WeightInterval> m) {
    ObjectNode o = JsonOutput.object();
    for (Map.Entry<String, WeightInterval> e : m.entrySet()) {
      WeightInterval iv = e.getValue();
      ObjectNode w = o.putObject(e.getKey());
      w.put("chosen", iv.chosen());
      number(w, "low", iv.low());
      number(w, "high", iv.high());
      w.put("exact", iv.exact());
    }
    return o;
  }

  private static ObjectNode surface(ErrorSurface s) {
    if (s == null) return null;
    ObjectNode o = JsonOutput.object();
    o.put("method", s.method().label());
    o.put("rows", s.rowWeight());
    o.put("columns", s.columnWeight());
    o.put("points", s.rows().length * s.columns().length);
    o.put("exact", s.exact());
    return o;
  }

  private static com.fasterxml.jackson.databind.JsonNode weights(WeightsSpec s) {
    return JsonOutput.parse(WeightsFile.toJson(s));
  }

  private static void rate(ObjectNode o, String key, double v) {
    if (Double.isFinite(v)) o.put(key, JsonOutput.fixed(v, DIGITS));
    else o.putNull(key);
  }

  private static void number(ObjectNode o, String key, double v) {
    if (Double.isFinite(v)) o.put(key, v);
    else o.putNull(key);
  }
}
