package steelyard.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.function.BooleanSupplier;
import java.util.stream.IntStream;
import steelyard.audit.AuditAccumulator;
import steelyard.audit.AuditInput;
import steelyard.audit.AuditReport;
import steelyard.audit.AuditSettings;
import steelyard.audit.Overrule;
import steelyard.audit.OverruleAuditor;
import steelyard.eval.Bootstrap;
import steelyard.eval.EditCounts;
import steelyard.eval.PairedComparison;
import steelyard.io.Reference;
import steelyard.report.SectionInput.ChartSeries;
import steelyard.report.SectionInput.GroupCounts;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreSummary;
import steelyard.rescore.ScoredSet;
import steelyard.rescore.UtteranceErrors;
import steelyard.rescore.UtteranceResult;
import steelyard.text.Unit;
import steelyard.tune.TuneInput;

/**
 * The audit of one rescoring run, end to end, as the {@code audit} command and the demo run it: load and score the
 * hypotheses with the session ({@link RescoreSession#loadAll}), choose each utterance with the session's weights and
 * method, score the choice against its reference, audit every overrule ({@link OverruleAuditor}), and sum the run as
 * {@code rescore --refs} does ({@link RescoreSummary}: the same error counts, bootstrap interval and paired test
 * against rank 1, the same seed). The result maps onto a report section ({@link Result#section}) and computes the
 * chart series on demand ({@link Result#charts}).
 *
 * <p>Choosing and auditing run on {@code threads} threads, one utterance per task; results are summed in input
 * order, so everything is the same for any thread count.
 *
 * <pre>{@code
 * AuditRun.Result r = AuditRun.run(session, hyps, refs, threads, seed, RescoreSession.LoadListener.NONE, () -> false);
 * AuditJson.write(Path.of("audit.json"), r.audit());
 * ReportModel.Section s = ReportSections.section(r.section("Voice logs, test", "test").charts(r.charts(threads)).build());
 * }</pre>
 */
public final class AuditRun {
  /**
   * What an audit run produced.
   *
   * @param session     the session that chose (its weights, method, unit, warnings)
   * @param set         the scored utterances and references
   * @param inputs      every audited utterance in input order (result, reference tokens, group)
   * @param audit       the audit
   * @param summary     the run summed as {@code rescore} sums it (errors when references were given)
   * @param ci95        95 % bootstrap interval of the picks' error rate; null without references
   * @param versusFirst the paired test of the picks against rank 1; null without references
   * @param groups      error counts per group (reference's group, else rank 1's), sorted by name
   * @param oracleErrors errors of the N-best oracle over the utterances with hypotheses and a reference
   * @param seed        the seed of the bootstrap
   */
  public record Result(RescoreSession session, ScoredSet set, List<AuditInput> inputs, AuditReport audit, RescoreSummary summary,
      Bootstrap.Interval ci95, PairedComparison versusFirst, List<GroupCounts> groups, long oracleErrors, long seed) {
    public Result {
      inputs = List.copyOf(inputs);
      groups = List.copyOf(groups);
    }

    /** The session's warnings followed by the run's own (collapsed posteriors). */
    public List<String> warnings() {
      List<String> w = new ArrayList<>(session.warnings());
      w.addAll(summary.warnings());
      return w;
    }

    /** Reference tokens of the references without hypotheses (counted as all deleted). */
    public long missingTokens() {
      long n = 0;
      for (ScoredSet.Missing m : set.missingHypotheses()) n += m.errors().referenceTokens();
      return n;
    }

    /**
     * A section of the run named {@code name}, its error row labelled {@code dataSet}: the audit with alignments,
     * the error rates with intervals, the paired test, the weights, the groups and the run's warnings. Charts are
     * left to the caller ({@link #charts}: they cost a line search per grid row).
     */
    public SectionInput.Builder section(String name, String dataSet) {
      SectionInput.Builder b = SectionInput.builder(name, session.method(), session.weights())
          .characters(session.unit() == Unit.CHAR).audit(audit, inputs).groups(groups).notes(warnings());
      if (versusFirst != null)
        b.errors(ReportSections.errorRow(dataSet, summary, versusFirst)).pairedTest(ReportSections.pairedTest(dataSet, versusFirst));
      return b;
    }

    /** The chart series at the session's weights over the utterances with a reference ({@link ReportSweeps}); null without any. */
    public ChartSeries charts(int threads) {
      if (set.utterances().stream().allMatch(e -> e.reference() == null)) return null;
      TuneInput input = TuneInput.of(set, session, session.weights());
      return ReportSweeps.series(input, session.weights(), session.method(), oracleErrors, missingTokens(), threads);
    }
  }

  private record Audited(AuditInput input, UtteranceErrors errors, Overrule overrule) {}

  private AuditRun() {}

  /**
   * Runs the audit of {@code hyps} with {@code session}'s weights and method.
   *
   * @param refs      references file, or null (every overrule unverified)
   * @param seed      seed of the bootstrap interval and the paired test
   * @param listener  hears loading progress
   * @param cancelled when it turns true, loading stops ({@link java.util.concurrent.CancellationException})
   */
  public static Result run(RescoreSession session, Path hyps, Path refs, int threads, long seed, RescoreSession.LoadListener listener,
      BooleanSupplier cancelled) {
    Map<String, Reference> references = refs == null ? null : session.readReferences(refs);
    ScoredSet set = session.loadWithReferences(hyps, references, threads, listener, cancelled);
    return of(session, set, references == null ? null : references.keySet(), threads, seed);
  }

  /**
   * The audit of an already loaded set with {@code session}'s weights and method (e.g. a dev set loaded for tuning,
   * chosen again with the tuned weights).
   *
   * @param referenceOrder the references file's ids in file order (the order a run history stores); null when the
   *                       set was loaded without references
   */
  public static Result of(RescoreSession session, ScoredSet set, Collection<String> referenceOrder, int threads, long seed) {
    OverruleAuditor auditor = new OverruleAuditor(AuditSettings.of(session.featureNames(), session.unit(), session.model(),
        session.modelTokens(), session.weights().latticeSettings()));
    List<Audited> audited = auditEach(session, auditor, set, threads);
    AuditAccumulator acc = auditor.accumulator();
    RescoreSummary summary = new RescoreSummary();
    if (referenceOrder != null) summary.referenceOrder(referenceOrder);
    Map<String, long[]> groups = new TreeMap<>();
    long oracle = 0;
    List<AuditInput> inputs = new ArrayList<>(audited.size());
    for (Audited a : audited) {
      UtteranceResult r = a.input().result();
      inputs.add(a.input());
      acc.add(a.input(), a.overrule());
      summary.add(r, a.errors());
      if (set.withReferences() && a.errors() == null) summary.missingReference(r.uttId());
      if (a.errors() == null) continue;
      oracle += a.errors().oracle().errors();
      add(groups, a.input().effectiveGroup(), a.errors().first(), a.errors().chosen());
    }
    for (ScoredSet.Missing m : set.missingHypotheses()) {
      summary.missingHypotheses(m.uttId(), m.errors());
      add(groups, m.group(), m.errors(), m.errors());
    }
    Bootstrap.Interval ci = null;
    PairedComparison paired = null;
    if (set.withReferences()) {
      ci = summary.interval(Bootstrap.DEFAULT_RESAMPLES, seed, threads);
      paired = summary.versusFirst(Bootstrap.DEFAULT_RESAMPLES, seed, threads);
    }
    return new Result(session, set, inputs, acc.finish(), summary, ci, paired, groupCounts(groups), oracle, seed);
  }

  /** Chooses, scores and audits every utterance on {@code threads} threads; results in input order. */
  private static List<Audited> auditEach(RescoreSession session, OverruleAuditor auditor, ScoredSet set, int threads) {
    List<ScoredSet.Entry> entries = set.utterances();
    if (threads <= 1) return IntStream.range(0, entries.size()).mapToObj(k -> audit(session, auditor, entries.get(k))).toList();
    ForkJoinPool pool = new ForkJoinPool(threads);
    try {
      return pool.submit(() -> IntStream.range(0, entries.size()).parallel().mapToObj(k -> audit(session, auditor, entries.get(k))).toList())
          .get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while auditing", e);
    } catch (ExecutionException e) {
      if (e.getCause() instanceof RuntimeException re) throw re;
      throw new IllegalStateException(e.getCause());
    } finally {
      pool.shutdownNow();
    }
  }

  private static Audited audit(RescoreSession session, OverruleAuditor auditor, ScoredSet.Entry e) {
    UtteranceResult r = session.choose(e.scores());
    UtteranceErrors errors = e.reference() == null ? null : session.errors(r, e.reference());
    AuditInput in = new AuditInput(r, e.reference(), e.group());
    return new Audited(in, errors, auditor.audit(in));
  }

  private static void add(Map<String, long[]> groups, String group, EditCounts first, EditCounts chosen) {
    long[] g = groups.computeIfAbsent(group == null ? "" : group, k -> new long[3]);
    g[0] += chosen.referenceTokens();
    g[1] += first.errors();
    g[2] += chosen.errors();
  }

  private static List<GroupCounts> groupCounts(Map<String, long[]> groups) {
    List<GroupCounts> out = new ArrayList<>(groups.size());
    for (Map.Entry<String, long[]> e : groups.entrySet()) out.add(new GroupCounts(e.getKey(), e.getValue()[0], e.getValue()[1], e.getValue()[2]));
    return out;
  }
}
