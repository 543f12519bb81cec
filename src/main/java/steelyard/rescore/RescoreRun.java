package steelyard.rescore;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import steelyard.eval.Bootstrap;
import steelyard.eval.PairedComparison;
import steelyard.eval.UtteranceOverlap;
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
   * @param warnings    the session's warnings, then the caller's, then the run's own (e.g. collapsed posteriors)
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
    return run(session, hyps, refs, outputs, threads, seed, skipped, stdout, List.of());
  }

  /**
   * As {@link #run(RescoreSession, Path, Path, Outputs, int, long, List, Writer)}, with warnings the caller found
   * in its own options ({@code callerWarnings}, already shown by the caller), listed in the JSON after the
   * session's. Refuses a wrong answer before any output is complete: references that share no utterance id with
   * the hypotheses ({@link UtteranceOverlap}; a small overlap is a warning) and a system weight of the
   * configuration's upper layer naming a system absent from {@code hyps} are {@link steelyard.io.InputException}s.
   */
  public static Result run(RescoreSession session, Path hyps, Path refs, Outputs outputs, int threads, long seed,
      List<SkippedRow> skipped, Writer stdout, List<String> callerWarnings) {
    Map<String, Reference> references = refs == null ? null : session.readReferences(refs);
    RescoreSummary[] summary = new RescoreSummary[1];
    Set<String> systemsSeen = new HashSet<>();
    writeRows(session, outputs, stdout, sink -> {
      try {
        summary[0] = session.run(hyps, references, threads, o -> {
          systemsSeen.addAll(o.result().scores().systems());
          sink.accept(o.result());
        });
      } catch (UncheckedIOException e) {
        throw e.getCause();
      }
      // Inside the writes: a refused run leaves the picks and breakdown unwritten.
      refuseWrongAnswers(session, hyps, refs, references, summary[0], systemsSeen);
    });
    return finish(session, summary[0], refs != null, outputs, threads, seed, skipped, stdout, callerWarnings);
  }

  /**
   * Writes the outputs of a run already chosen in memory (e.g. by {@code report.AuditRun}) exactly as {@link #run}
   * writes them for the same choices: picks and breakdown rows of {@code results} in their order, the JSON summary
   * of {@code summary} with its bootstrap interval and paired test (same seed, so the same figures), the weights.
   *
   * @param results        every rescored utterance, in input order
   * @param withReferences whether {@code summary} holds error counts
   */
  public static Result write(RescoreSession session, List<UtteranceResult> results, RescoreSummary summary, boolean withReferences,
      Outputs outputs, int threads, long seed, Writer stdout) {
    writeRows(session, outputs, stdout, sink -> {
      for (UtteranceResult r : results) sink.accept(r);
    });
    return finish(session, summary, withReferences, outputs, threads, seed, List.of(), stdout, List.of());
  }

  /** Receives rescored utterances in input order. */
  private interface RowSink {
    void accept(UtteranceResult r) throws IOException;
  }

  /** Hands every rescored utterance to the sink, in input order. */
  private interface Rows {
    void each(RowSink sink) throws IOException;
  }

  /** Writes picks.csv and the breakdown (when asked) of the rows, each file atomically. */
  private static void writeRows(RescoreSession session, Outputs outputs, Writer stdout, Rows rows) {
    PicksWriter writer = new PicksWriter(session.featureNames(), session.unit());
    try {
      write(outputs.picks(), stdout, pw -> write(outputs.breakdown(), stdout, bw -> {
        CsvWriter picks = CsvWriter.plain(pw);
        CsvWriter breakdown = CsvWriter.plain(bw);
        writer.picksHeader(picks);
        if (outputs.breakdown() != null) writer.breakdownHeader(breakdown);
        rows.each(r -> {
          writer.pick(picks, r);
          if (outputs.breakdown() != null) writer.breakdown(breakdown, r);
        });
        picks.flush();
        breakdown.flush();
      }));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Files about different utterances, or a system weight for a system the file lacks: refused; a small overlap: a warning. */
  private static void refuseWrongAnswers(RescoreSession session, Path hyps, Path refs, Map<String, Reference> references,
      RescoreSummary summary, Set<String> systemsSeen) {
    if (references != null) {
      String overlap = UtteranceOverlap.check(hyps.toString(), refs, new ArrayList<>(references.keySet()),
          summary.missingHypothesisIds(), summary.missingReferenceIds());
      if (overlap != null) summary.warn(overlap);
    }
    RescoreWeights.requireSystemsPresent(session.config().overrides().systemWeights.keySet(), systemsSeen, hyps);
  }

  private static Result finish(RescoreSession session, RescoreSummary summary, boolean withReferences, Outputs outputs,
      int threads, long seed, List<SkippedRow> skipped, Writer stdout, List<String> callerWarnings) {
    Bootstrap.Interval ci = null;
    PairedComparison paired = null;
    if (withReferences) {
      ci = summary.interval(Bootstrap.DEFAULT_RESAMPLES, seed, threads);
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
    warnings.addAll(callerWarnings);
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
