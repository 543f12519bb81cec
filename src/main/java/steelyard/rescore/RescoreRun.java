package steelyard.rescore;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import steelyard.eval.Bootstrap;
import steelyard.eval.PairedComparison;
import steelyard.io.AtomicOutput;
import steelyard.io.CsvWriter;
import steelyard.io.JsonOutput;
import steelyard.io.Reference;
import steelyard.io.SkippedRow;

/**
 * A complete rescoring run over one hypotheses file with its outputs, as the {@code rescore} command and the
 * demo produce them: {@code picks.csv}, the per-hypothesis breakdown, the JSON summary (with error rates, the
 * bootstrap interval and the paired test against rank 1 when references are given) and the weights in effect.
 * Every output is written atomically; {@code -} writes to the given stdout writer.
 */
public final class RescoreRun {
  /**
   * Where the outputs go; any may be null (not written).
   *
   * @param picks       one row per utterance
   * @param breakdown   one row per kept hypothesis
   * @param json        the JSON summary
   * @param saveWeights the weights in effect (a weights file)
   */
  public record Outputs(Path picks, Path breakdown, Path json, Path saveWeights) {}

  /**
   * What a run produced.
   *
   * @param summary  the totals (error counts when references were given)
   * @param ci95        the bootstrap interval of the chosen error rate; null without references
   * @param versusFirst the paired test of the choice against rank 1; null without references
   * @param json        the JSON summary (also when it was not written)
   * @param warnings    the session's warnings followed by the run's own (e.g. collapsed posteriors)
   */
  public record Result(RescoreSummary summary, Bootstrap.Interval ci95, PairedComparison versusFirst, ObjectNode json,
      List<String> warnings) {
    /** The run's own warnings (the session's were known before it started). */
    public List<String> runWarnings() {
      return summary.warnings();
    }
  }

  private RescoreRun() {}

  /**
   * Rescores {@code hyps} with {@code session} and writes the outputs.
   *
   * @param refs    references file, or null
   * @param skipped rows skipped so far in lenient mode (filled while reading; listed in the JSON)
   * @param seed    seed of the bootstrap, recorded in the JSON
   * @param stdout  where an output named {@code -} goes
   */
  public static Result run(RescoreSession session, Path hyps, Path refs, Outputs outputs, int threads, long seed,
      List<SkippedRow> skipped, Writer stdout) {
    Map<String, Reference> references = refs == null ? null : session.readReferences(refs);
    PicksWriter writer = new PicksWriter(session.featureNames(), session.unit());
    RescoreSummary[] summary = new RescoreSummary[1];
    try {
      write(outputs.picks(), stdout, pw -> write(outputs.breakdown(), stdout, bw -> {
        CsvWriter picks = CsvWriter.plain(pw);
        CsvWriter breakdown = CsvWriter.plain(bw);
        writer.picksHeader(picks);
        if (outputs.breakdown() != null) writer.breakdownHeader(breakdown);
        try {
          summary[0] = session.run(hyps, references, threads, o -> {
            writer.pick(picks, o.result());
            if (outputs.breakdown() != null) writer.breakdown(breakdown, o.result());
          });
        } catch (UncheckedIOException e) {
          throw e.getCause();
        }
        picks.flush();
        breakdown.flush();
      }));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return finish(session, summary[0], refs != null, outputs, threads, seed, skipped, stdout);
  }

  private static Result finish(RescoreSession session, RescoreSummary summary, boolean withReferences, Outputs outputs,
      int threads, long seed, List<SkippedRow> skipped, Writer stdout) {
    Bootstrap.Interval ci = null;
    PairedComparison paired = null;
    if (withReferences) {
      ci = Bootstrap.corpusRate(summary.errorsPerUtterance(), summary.referenceTokensPerUtterance(),
          Bootstrap.DEFAULT_RESAMPLES, seed, threads);
      paired = summary.versusFirst(Bootstrap.DEFAULT_RESAMPLES, seed, threads);
    }
    ObjectNode node = summary.toJson(session.method().label(), session.unit().label(), seed, withReferences,
        ci == null ? null : new double[] {ci.low(), ci.high()});
    if (withReferences) {
      node.put("resamples", Bootstrap.DEFAULT_RESAMPLES);
      node.set("versus_first", RescoreSummary.versusFirstJson(paired));
    }
    ArrayNode rows = node.putArray("skipped_rows");
    synchronized (skipped) {
      skipped.forEach(s -> rows.addObject().put("file", s.file()).put("line", s.line()).put("reason", s.reason()));
    }
    List<String> warnings = new ArrayList<>(session.warnings());
    warnings.addAll(summary.warnings());
    node.set("warnings", JsonOutput.strings(warnings));
    boolean identify = session.config().modelPath() != null && (outputs.saveWeights() != null || session.fileWeights().model != null);
    WeightsSpec effective = WeightsSpec.of(session.weights(), session.unit(), identify ? session.modelIdentity() : null);
    node.set("weights", JsonOutput.parse(WeightsFile.toJson(effective)));
    if (outputs.json() != null) JsonOutput.write(outputs.json(), node, stdout);
    if (outputs.saveWeights() != null) WeightsFile.save(outputs.saveWeights(), effective, stdout);
    return new Result(summary, ci, paired, node, warnings);
  }

  private interface Body {
    void write(Writer w) throws IOException;
  }

  /** Writes to {@code target} atomically; without a target the body writes to nothing. */
  private static void write(Path target, Writer stdout, Body body) throws IOException {
    if (target == null) {
      body.write(Writer.nullWriter());
    } else {
      AtomicOutput.writeText(target, stdout, body::write);
    }
  }
}
