package steelyard.history;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import steelyard.io.AtomicOutput;
import steelyard.io.CsvWriter;
import steelyard.io.JsonOutput;
import steelyard.report.Numbers;
import steelyard.report.ReportText;
import steelyard.rescore.ModelIdentity;

/**
 * Exports the runs a filter lets through: CSV (one row per run, for spreadsheets) or JSON (one object per run
 * with its inputs, model, weights and warnings, optionally its per-utterance rows). Rates are fractions with
 * {@value #RATE_DIGITS} decimals, as in every report; written atomically.
 */
public final class HistoryExport {
  static final int RATE_DIGITS = 6;

  /** Columns of the CSV export. */
  public static final String[] CSV_HEADER = {
    "id", "started_at", "command", "label", "data_sha256", "method", "unit", "utterances", "reference_tokens", "errors",
    "error_rate", "ci95_low", "ci95_high", "resamples", "seed", "wall_ms", "tool_version", "references_file",
    "hypotheses_file", "model_file", "model_order", "model_sha256", "command_line"
  };

  private HistoryExport() {}

  /** Writes the CSV export to {@code target} ({@code -} for stdout). */
  public static void csv(RunHistory h, RunFilter filter, Path target, boolean spreadsheetSafe, Writer stdout) {
    AtomicOutput.writeText(target, stdout, out -> csv(h, filter, out, spreadsheetSafe));
  }

  static void csv(RunHistory h, RunFilter filter, Writer out, boolean spreadsheetSafe) throws IOException {
    CsvWriter csv = new CsvWriter(out, spreadsheetSafe);
    csv.row(CSV_HEADER);
    for (RunSummary s : h.list(filter)) {
      RunRecord r = h.find(s.id(), false).orElseThrow().run();
      ModelIdentity m = r.model();
      csv.row(Long.toString(s.id()), HistoryJson.time(s.startedAt()), s.command(), s.label(), s.dataSha256(), s.method(),
          ReportText.unitLabel(s.unit()), Long.toString(s.utterances()), Long.toString(s.referenceTokens()),
          Long.toString(s.errors()), rate(s.errorRate()), rate(s.ci95().low()), rate(s.ci95().high()),
          Integer.toString(r.resamples()), Long.toString(r.seed()), Long.toString(r.wallMillis()), r.toolVersion(),
          r.inputPath(InputFile.REFERENCES), r.inputPath(InputFile.HYPOTHESES), m == null ? null : m.file(),
          m == null ? null : Integer.toString(m.order()), m == null ? null : m.sha256(), RunText.commandLine(r.commandLine()));
    }
    csv.flush();
  }

  /** Writes the JSON export to {@code target} ({@code -} for stdout). */
  public static void json(RunHistory h, RunFilter filter, boolean withUtterances, Path target, Writer stdout) {
    JsonOutput.write(target, json(h, filter, withUtterances), stdout);
  }

  /** The JSON export: an array of runs, oldest id first. */
  public static ArrayNode json(RunHistory h, RunFilter filter, boolean withUtterances) {
    ArrayNode runs = JsonOutput.array();
    for (RunSummary s : h.list(filter)) run(runs.addObject(), s, h.find(s.id(), withUtterances).orElseThrow().run(), withUtterances);
    return runs;
  }

  private static void run(ObjectNode o, RunSummary s, RunRecord r, boolean withUtterances) {
    o.put("id", s.id());
    o.put("started_at", HistoryJson.time(s.startedAt()));
    o.put("wall_ms", r.wallMillis());
    o.put("tool_version", r.toolVersion());
    o.put("command", r.command());
    o.set("command_line", JsonOutput.strings(r.commandLine()));
    o.put("label", r.label());
    ArrayNode inputs = o.putArray("inputs");
    for (InputFile f : r.inputs())
      inputs.addObject().put("role", f.role()).put("path", f.path()).put("bytes", f.bytes()).put("sha256", f.sha256()).put("rows", f.rows());
    model(o, r.model());
    o.put("data_sha256", s.dataSha256());
    o.put("method", r.method());
    o.put("unit", ReportText.unitLabel(r.unit()));
    o.put("normalisation", r.normalisation());
    o.put("missing_hypothesis_policy", r.missingPolicy() == null ? null : r.missingPolicy().label());
    o.put("utterances", s.utterances());
    o.put("reference_tokens", r.totals().referenceTokens());
    o.put("correct", r.totals().correct());
    o.put("substitutions", r.totals().substitutions());
    o.put("deletions", r.totals().deletions());
    o.put("insertions", r.totals().insertions());
    o.put("errors", r.totals().errors());
    o.put("error_rate", Numbers.decimal(s.errorRate(), RATE_DIGITS));
    o.put("ci95_low", Numbers.decimal(r.ci95().low(), RATE_DIGITS));
    o.put("ci95_high", Numbers.decimal(r.ci95().high(), RATE_DIGITS));
    o.put("resamples", r.resamples());
    o.put("seed", r.seed());
    o.set("warnings", JsonOutput.strings(r.warnings()));
    o.set("weights", r.weightsJson() == null ? null : HistoryJson.tree(r.weightsJson()));
    if (withUtterances) utterances(o.putArray("utterance_rows"), r.utterances());
  }

  private static void model(ObjectNode o, ModelIdentity m) {
    if (m == null) {
      o.putNull("model");
      return;
    }
    o.putObject("model").put("path", m.file()).put("order", m.order()).put("bytes", m.bytes()).put("sha256", m.sha256());
  }

  private static void utterances(ArrayNode a, UtteranceCounts u) {
    for (int r = 0; r < u.size(); r++)
      a.addObject().put("utt_id", u.uttId(r)).put("status", u.status(r).label()).put("errors", u.errors(r))
          .put("reference_tokens", u.referenceTokens(r));
  }

  private static String rate(double v) {
    return Double.isFinite(v) ? Numbers.fixed(v, RATE_DIGITS) : "";
  }
}
