package steelyard.gui.model;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;
import steelyard.eval.Aligner;
import steelyard.eval.Alignment;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.Lattices;
import steelyard.lm.LanguageModel;
import steelyard.rescore.LogLinear;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.ReferenceScorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreSession;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredSet;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.TokenSequence;
import steelyard.io.InputException;
import steelyard.audit.AuditAccumulator;
import steelyard.audit.AuditInput;
import steelyard.audit.AuditReport;
import steelyard.audit.AuditSettings;
import steelyard.audit.OverruleAuditor;
import steelyard.report.AuditRun;
import steelyard.lm.ModelText;
import steelyard.rescore.Tokenizer;
import steelyard.text.Normaliser;
import steelyard.tune.DevUtterance;
import steelyard.tune.TuneInput;
import steelyard.tune.TuneResult;
import steelyard.tune.TuneSettings;
import steelyard.tune.Tuner;
import steelyard.tune.WeightSweep;
import java.util.Set;

/**
 * The window's one link to the rescoring core. {@link #open} builds a {@link RescoreSession} and reads the
 * files into a {@link ScoredSet} (every hypothesis scored once); afterwards every choice reads the cached
 * terms: {@link #rerank} (N-best: the session's {@link LogLinear} totals and argmax over the kept arrays, no
 * allocation per hypothesis, fast enough for a slider), {@link #choose} (any method: the session's choice per
 * utterance on all cores, with progress and cancel) and {@link #explain} (one utterance with every term).
 *
 * <p>Thread safety: every method may be called from any thread. The lazily built token ids of a
 * {@link ScoredUtterance} (MBR, the tuner, the audit) are built under the utterance's lock before anything that
 * extends them runs, so that concurrent choices only read them.
 */
public final class Workspace {
  private final OpenRequest request;
  private final RescoreSession session;
  private final ScoredSet set;
  private final Corpus corpus;
  private final List<String> warnings;
  private final int maxHypotheses;
  private volatile List<DevUtterance> devUtterances;
  private volatile boolean idsBuilt;
  private WeightSweep sweeps;

  Workspace(OpenRequest request, RescoreSession session, ScoredSet set, Corpus corpus, List<String> warnings) {
    this.request = request;
    this.session = session;
    this.set = set;
    this.corpus = corpus;
    this.warnings = List.copyOf(warnings);
    int max = 1;
    for (int u = 0; u < corpus.size(); u++) max = Math.max(max, corpus.scored(u).size());
    this.maxHypotheses = max;
  }

  /**
   * Reads and scores everything {@code request} names. User errors are {@link steelyard.io.InputException}s
   * with the command line's {@code file:line: problem; expected …} message; a cancelled load throws
   * {@link java.util.concurrent.CancellationException}.
   */
  public static Workspace open(OpenRequest request, TaskProgress progress) {
    return WorkspaceLoader.load(request, progress);
  }

  public OpenRequest request() { return request; }
  public Corpus corpus() { return corpus; }
  /** The rescoring session the files were opened with. */
  public RescoreSession session() { return session; }
  /** The scored utterances and references as the service read them. */
  public ScoredSet scoredSet() { return set; }
  /** The model, or null when none was given. */
  public LanguageModel model() { return session.model(); }
  /** The weights of the weights file (defaults where it says nothing). */
  public RescoreWeights initialWeights() { return session.weights(); }
  /** Warnings of the import (rank gaps, skipped rows, unit mismatches), in the command line's words. */
  public List<String> warnings() { return warnings; }

  /**
   * The N-best choice under {@code w}: each utterance's totals from the cached terms and the best by the
   * core's tie order. Cost: (F + 3) multiply-adds per hypothesis plus one pass per utterance; no scoring, no
   * alignment (errors were counted once at load).
   */
  public Choices rerank(RescoreWeights w) {
    LogLinear weighting = session.withWeights(w, RescoreMethod.NBEST).weighting();
    int n = corpus.size();
    int[] chosen = new int[n];
    int[] errors = new int[n];
    boolean[] changed = new boolean[n];
    double[] totals = new double[maxHypotheses];
    for (int u = 0; u < n; u++) {
      ScoredUtterance s = corpus.scored(u);
      int c = LogLinear.best(s, weighting.totals(s, totals));
      chosen[u] = c;
      errors[u] = corpus.errors(u, c);
      changed[u] = !corpus.sameAsFirst(u, c);
    }
    return Choices.of(corpus, w, RescoreMethod.NBEST, chosen, null, errors, changed);
  }

  /** The choice under {@code w} by {@code method}; N-best goes through {@link #rerank}. Runs on all cores. */
  public Choices choose(RescoreWeights w, RescoreMethod method, TaskProgress progress) {
    if (method == RescoreMethod.NBEST) return rerank(w);
    RescoreSession tried = session.withWeights(w, method);
    int n = corpus.size();
    int[] chosen = new int[n];
    int[] errors = new int[n];
    boolean[] changed = new boolean[n];
    List<List<String>> fresh = Collections.synchronizedList(new ArrayList<>(Collections.nCopies(n, null)));
    AtomicInteger done = new AtomicInteger();
    ThreadLocal<Aligner> aligners = ThreadLocal.withInitial(Aligner::new);
    progress.report(0, "choosing by " + method.label());
    IntStream.range(0, n).parallel().forEach(u -> {
      progress.checkCancelled();
      UtteranceResult r = chooseOne(tried, u);
      chosen[u] = r.chosen();
      changed[u] = r.changed();
      TokenSequence ref = corpus.referenceTokens(u);
      if (r.isNewTranscript()) fresh.set(u, r.newTokens());
      errors[u] = !r.isNewTranscript() ? corpus.errors(u, r.chosen())
          : ref == null ? Corpus.NO_REFERENCE : ReferenceScorer.transcriptErrors(r.newTokens(), ref, aligners.get());
      int k = done.incrementAndGet();
      if ((k & 31) == 0) progress.report((double) k / n, "choosing by " + method.label());
    });
    progress.checkCancelled();
    return Choices.of(corpus, w, method, chosen, new ArrayList<>(fresh), errors, changed);
  }

  /** The full result of utterance {@code u} under {@code w} and {@code method}: totals, posteriors, every term. */
  public UtteranceResult explain(int u, RescoreWeights w, RescoreMethod method) {
    return chooseOne(session.withWeights(w, method), u);
  }

  /** The confusion network of {@code r}: its own for the network methods, else one built from its posteriors. */
  public ConfusionNetwork network(UtteranceResult r, RescoreWeights w) {
    if (r.network() != null) return r.network();
    return Lattices.network(NbestRescorer.tokenLists(r.scores()), r.posteriors(), w.latticeSettings());
  }

  /**
   * The alignment of {@code tokens} (scoring unit; {@code optional} flags or null) against utterance
   * {@code u}'s reference, optional tokens left out as in scoring; null without a reference.
   */
  public Alignment align(int u, List<String> tokens, boolean[] optional) {
    TokenSequence ref = corpus.referenceTokens(u);
    if (ref == null) return null;
    Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
    return new Aligner().alignment(ReferenceScorer.localIds(ref.tokens(), ids), ref.optional(), ReferenceScorer.localIds(tokens, ids), optional);
  }

  /**
   * The utterances with a reference as the tuner takes them, starting from {@code start}. The tuner builds
   * the utterances' token ids from its threads; they are built here first, under each utterance's lock, so
   * that a choice on another thread only reads them.
   */
  public TuneInput tuneInput(RescoreWeights start) {
    List<DevUtterance> dev = devUtterances;
    if (dev == null) {
      buildTokenIds();
      List<DevUtterance> d = new ArrayList<>();
      for (ScoredSet.Entry e : set.utterances()) {
        if (e.reference() != null) d.add(new DevUtterance(e.scores(), e.reference(), e.group()));
      }
      devUtterances = dev = List.copyOf(d);
    }
    if (dev.isEmpty()) throw InputException.option("tune", "no utterance has a reference", "a references file (File ▸ Open)");
    return TuneInput.of(dev, corpus.featureNames(), model(), start);
  }

  /**
   * The tuner's sweeps over this corpus ({@link WeightSweep}): every hypothesis scored against its reference
   * once, on the first call (the costly part), then one exact line search per sweep. Not thread-safe: the
   * window calls it from its one background thread.
   */
  public synchronized WeightSweep weightSweep() {
    if (sweeps == null) sweeps = WeightSweep.of(tuneInput(initialWeights()), Runtime.getRuntime().availableProcessors());
    return sweeps;
  }

  /**
   * Tunes the weights on this corpus from {@code start} ({@link Tuner}): the given methods (empty: all four),
   * {@code folds}-fold cross-validation (0: none), on all cores; the progress and cancel of {@code progress}.
   */
  public TuneResult tune(RescoreWeights start, Set<RescoreMethod> methods, int folds, TaskProgress progress) {
    TuneSettings settings = TuneSettings.defaults().withMethods(methods).withFolds(folds).withSurface(false)
        .withThreads(Runtime.getRuntime().availableProcessors());
    return Tuner.tune(tuneInput(start), settings, progress::report, progress::isCancelled);
  }

  /**
   * The overrule audit of the choice under {@code w} and {@code method} ({@link OverruleAuditor}): every
   * utterance whose pick differs from rank 1 with its verdict, margin, flip weights and decisive n-grams.
   * Chooses every utterance again (on all cores), then audits in input order.
   */
  public AuditReport audit(RescoreWeights w, RescoreMethod method, TaskProgress progress) {
    buildTokenIds();
    RescoreSession tried = session.withWeights(w, method);
    int n = corpus.size();
    AuditInput[] inputs = new AuditInput[n];
    AtomicInteger done = new AtomicInteger();
    IntStream.range(0, n).parallel().forEach(u -> {
      progress.checkCancelled();
      inputs[u] = new AuditInput(chooseOne(tried, u), corpus.referenceTokens(u), corpus.group(u));
      int k = done.incrementAndGet();
      if ((k & 31) == 0) progress.report(0.5 * k / n, "choosing by " + method.label());
    });
    progress.report(0.5, "auditing the overrules");
    LanguageModel lm = model();
    Tokenizer lmTokens = null;
    if (lm != null) {
      Normaliser text = ModelText.normaliser(lm, request.normalisation().rulesFile());
      lmTokens = raw -> text.tokens(raw, lm.unit());
    }
    OverruleAuditor auditor = new OverruleAuditor(AuditSettings.of(corpus.featureNames(), corpus.unit(), lm, lmTokens,
        method.usesNetwork() ? w.latticeSettings() : null));
    AuditAccumulator acc = auditor.accumulator();
    for (int u = 0; u < n; u++) {
      progress.checkCancelled();
      acc.add(inputs[u], auditor.audit(inputs[u]));
      if ((u & 31) == 0) progress.report(0.5 + 0.5 * u / n, "auditing the overrules");
    }
    return acc.finish();
  }

  /**
   * The audit run of the choice under {@code w} and {@code method} as the {@code audit} command runs it
   * ({@link AuditRun#of}): every utterance chosen again, scored, audited and summed with the bootstrap interval and
   * paired test of {@code seed}, on all cores. Token ids are built first under each utterance's lock.
   */
  public AuditRun.Result auditRun(RescoreWeights w, RescoreMethod method, long seed) {
    buildTokenIds();
    return AuditRun.of(session.withWeights(w, method), set, null, Runtime.getRuntime().availableProcessors(), seed);
  }

  /** Writes {@code w} as a weights file (with the unit and, for a model file, its identity). */
  public void saveWeights(Path target, RescoreWeights w) {
    WeightsFile.save(target, WeightsSpec.of(w, corpus.unit(), session.modelIdentity()));
  }

  /**
   * Builds every utterance's lazily built token ids under its lock, once: the tuner and the audit extend an
   * utterance's vocabulary from their threads, and a choice on another thread must then only read the ids.
   */
  private void buildTokenIds() {
    if (idsBuilt) return;
    for (int u = 0; u < corpus.size(); u++) {
      ScoredUtterance s = corpus.scored(u);
      synchronized (s) {
        s.tokenIds();
      }
    }
    idsBuilt = true;
  }

  /** The session's choice of one utterance (MBR's token ids built under the utterance's lock first). */
  private UtteranceResult chooseOne(RescoreSession s, int u) {
    ScoredUtterance scored = corpus.scored(u);
    if (s.method() == RescoreMethod.MBR) {
      synchronized (scored) {
        scored.tokenIds();
      }
    }
    return s.choose(scored);
  }


  @Override
  public String toString() {
    return "Workspace[" + request.hyps() + ", " + corpus.size() + " utterances, " + corpus.featureNames() + "]";
  }
}
