package steelyard.rescore;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.function.BooleanSupplier;
import steelyard.eval.Aligner;
import steelyard.eval.EditCounts;
import steelyard.io.FeatureSpec;
import steelyard.io.HypothesesReader;
import steelyard.io.ImportOptions;
import steelyard.io.Reference;
import steelyard.io.ReferencesReader;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.LatticeChoice;
import steelyard.lm.LanguageModel;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/**
 * The one rescoring service every consumer calls (the {@code rescore}, {@code network} and {@code demo}
 * commands, weight tuning, the audit, the window). Built once from a {@link RescoreConfig}, it
 * <ul>
 *   <li>resolves the weights from their layers: defaults, then the weights file, then the overrides
 *       (command line); a run without {@code features} takes them from the weights file;</li>
 *   <li>loads the model (or takes the one given), and refuses to run without one when λ, ω or the lattice
 *       search's λ′ is not 0;</li>
 *   <li>settles the scoring unit (given, else the weights file's, else the model's, else words) and the two
 *       tokenisers: the scoring unit's (user normalisation) and the model's;</li>
 *   <li>collects warnings in {@link #warnings()} (a scoring unit taken from the weights file or the model rather
 *       than given, weights tuned at another unit or with another model (named by size and SHA-256), a vote
 *       confidence the method ignores, a model in another unit, model-loading warnings) without printing.</li>
 * </ul>
 * It then offers: {@link #score} (unweighted terms, LM included, computed once per utterance), {@link #choose}
 * (weights and method applied, cheap), {@link #withWeights} (a session with other weights or method sharing the
 * loaded model and tokenisers: what a tuner or a slider calls), {@link #errors} (against a reference, reusing
 * the confusion network that travels with the result), {@link #kBestPaths}, a streaming {@link #run} over a
 * hypotheses file (ordered batches on a thread pool, identical results for any thread count) and
 * {@link #loadAll}, which reads a whole file (and its references) into a {@link ScoredSet}.
 *
 * <pre>{@code
 * RescoreSession dev = RescoreSession.open(config);
 * ScoredSet set = dev.loadAll(devHyps, devRefs, threads, RescoreSession.LoadListener.NONE, () -> false);
 * RescoreSession tried = dev.withWeights(candidate, RescoreMethod.NBEST);
 * for (ScoredSet.Entry e : set.utterances()) tried.errors(tried.choose(e.scores()), e.reference());
 * }</pre>
 *
 * <p>Thread-safe: every method may be called from several threads (per-thread work arrays live in
 * {@link ThreadLocal}s).
 */
public final class RescoreSession {
  /** Receives loading progress from {@link #loadAll}: utterances and hypotheses read so far (no total is known). */
  @FunctionalInterface
  public interface LoadListener {
    LoadListener NONE = (utterances, hypotheses) -> { };

    void loaded(long utterances, long hypotheses);
  }

  /** Receives the outcomes of {@link #run} in input order, on the calling thread; may throw (e.g. an I/O error). */
  @FunctionalInterface
  public interface OutcomeSink {
    void accept(UtteranceOutcome outcome) throws Exception;
  }

  private final SessionSetup setup;
  private final NbestRescorer rescorer;
  private final ThreadLocal<ReferenceScorer> referenceScorer;

  private RescoreSession(SessionSetup setup, RescoreWeights weights, RescoreMethod method) {
    if (setup.model == null && SessionSetup.modelNeeded(weights, method))
      throw new IllegalArgumentException("no model is loaded, but the LM weight, OOV weight or lattice LM weight is not 0");
    this.setup = setup;
    this.rescorer = new NbestRescorer(setup.scorer, setup.featureNames, weights, method, setup.model, () -> new Aligner()::distance);
    this.referenceScorer = ThreadLocal.withInitial(
        () -> new ReferenceScorer(setup.unitTokens, method.usesNetwork() ? weights.latticeSettings() : null));
  }

  /**
   * Resolves {@code config}: reads the weights file, loads the model, settles unit and tokenisers. Expensive (the
   * model); derive variants with {@link #withWeights}. User errors are {@link steelyard.io.InputException}s.
   */
  public static RescoreSession open(RescoreConfig config) {
    SessionSetup s = new SessionSetup(config);
    return new RescoreSession(s, s.weights, s.method);
  }

  /**
   * A session with other weights and method that shares this one's model, tokenisers and scorer: cheap (no
   * file is read). {@code weights} must cover the same features. Warnings stay those found when opening.
   *
   * @throws IllegalArgumentException when the weights need a model and none is loaded
   */
  public RescoreSession withWeights(RescoreWeights weights, RescoreMethod method) {
    return new RescoreSession(setup, weights, method);
  }

  public RescoreConfig config() { return setup.config; }
  public RescoreWeights weights() { return rescorer.weights(); }
  public RescoreMethod method() { return rescorer.method(); }
  /** The feature columns in use (from the configuration, else the weights file). */
  public List<FeatureSpec> featureSpecs() { return setup.featureSpecs; }
  public List<String> featureNames() { return setup.featureNames; }
  public Unit unit() { return setup.unit; }
  /** The model, or null when none is configured. */
  public LanguageModel model() { return setup.model; }
  /** The weights file's layer as read (empty without a file). */
  public WeightsSpec fileWeights() { return setup.fileSpec; }
  /** Warnings found when opening, in the order found; never printed by the session. */
  public List<String> warnings() { return setup.warnings; }
  /** The import options of this session: the configured ones with this session's features. */
  public ImportOptions importOptions() { return setup.importOptions; }
  /** The weighting of {@link #weights()} (each term's weighted contribution). */
  public LogLinear weighting() { return rescorer.weighting(); }
  /** The underlying rescorer (what {@link #choose} calls). */
  public NbestRescorer rescorer() { return rescorer; }

  /**
   * Whether this session's weights and method use the model at all: λ or ω not 0, or λ′ not 0 with the lattice
   * search. A model loaded for weights that are all 0 scores nothing (worth a warning where the user chose it).
   */
  public boolean usesModel() {
    return SessionSetup.modelNeeded(weights(), method());
  }

  /** The scoring normalisation in one line ({@link steelyard.text.Normaliser#describe()}), as a run history records it. */
  public String normalisationDescription() {
    return setup.normalisation;
  }

  /** The model's tokenisation of raw text (how ln P is scored), or null without a model. */
  public Tokenizer modelTokens() {
    return setup.model == null ? null : setup.lmTokens;
  }

  /** The model file's identity (hashes the file on the first call, then cached); null without a model file. */
  public ModelIdentity modelIdentity() {
    return setup.modelIdentity();
  }

  /** {@code raw} in the scoring unit with the scoring normalisation (references are tokenised so). */
  public TokenSequence tokens(String raw) {
    return setup.unitTokens.tokenize(raw);
  }

  /** The unweighted score terms of every kept hypothesis (features, ln P, OOV and token counts). */
  public ScoredUtterance score(UtteranceHypotheses u) {
    return setup.scorer.score(u);
  }

  /** The choice for an already scored utterance with this session's weights and method. */
  public UtteranceResult choose(ScoredUtterance s) {
    return rescorer.choose(s);
  }

  /** {@link #score} then {@link #choose}. */
  public UtteranceResult rescore(UtteranceHypotheses u) {
    return rescorer.rescore(u);
  }

  /** The posteriors this session gives the hypotheses of {@code s} (as the network methods and MBR see them). */
  public double[] posteriors(ScoredUtterance s) {
    return rescorer.posteriors(s, rescorer.weighting().totals(s, new double[s.size()]));
  }

  /** Errors of {@code r} (choice, rank 1, N-best oracle, lattice oracle for network methods) against a reference text. */
  public UtteranceErrors errors(UtteranceResult r, String referenceText) {
    return referenceScorer.get().score(r, referenceText);
  }

  /** As {@link #errors(UtteranceResult, String)} for a reference already in the scoring unit (see {@link #tokens}). */
  public UtteranceErrors errors(UtteranceResult r, TokenSequence reference) {
    return referenceScorer.get().score(r, reference);
  }

  /** Counts for a reference that has no hypotheses: every token that is not optional deleted. */
  public EditCounts missingHypotheses(String referenceText) {
    return ReferenceScorer.allDeleted(tokens(referenceText));
  }

  /**
   * The {@code k} best paths of the LM search through the confusion network of {@code r} (its own network for
   * the network methods, else one built from its posteriors), best first, with this session's λ′, μ′ and beam.
   */
  public List<LatticeChoice> kBestPaths(UtteranceResult r, int k) {
    if (k < 1) throw new IllegalArgumentException("k must be >= 1: " + k);
    if (setup.model == null && weights().latticeLmWeight() != 0)
      throw new IllegalArgumentException("no model is loaded, but the lattice LM weight is not 0");
    return rescorer.searchKBest(r, k);
  }

  /** Opens the hypotheses file with this session's import options (the caller closes it). */
  public HypothesesReader open(Path hyps) {
    return HypothesesReader.open(hyps, setup.importOptions);
  }

  /** Reads a references file whole with this session's import options (no features), in file order. */
  public Map<String, Reference> readReferences(Path refs) {
    ImportOptions o = setup.importOptions;
    return ReferencesReader.readAll(refs, new ImportOptions(List.of(), o.primarySystem(), o.maxBadRows(), o.warnings(), o.skipped()));
  }

  /**
   * Rescores a hypotheses file one utterance at a time: batches on {@code threads} workers, outcomes to
   * {@code sink} in input order, so everything the sink writes is the same for any thread count. With
   * {@code references} (may be null) each outcome carries its errors; utterances without a reference and
   * references without hypotheses (all deletions) are recorded in the returned summary. Memory stays flat
   * apart from the ids seen (for the missing-hypotheses check).
   */
  public RescoreSummary run(Path hyps, Map<String, Reference> references, int threads, OutcomeSink sink) {
    return SessionRuns.stream(this, hyps, references, threads, sink);
  }

  /**
   * Reads and scores a whole hypotheses file (and optionally its references) into memory. {@code listener}
   * hears progress after every utterance (on the calling thread); when {@code cancelled} turns true the load
   * stops within one batch and throws {@link java.util.concurrent.CancellationException}.
   *
   * @param refs references file, or null
   */
  public ScoredSet loadAll(Path hyps, Path refs, int threads, LoadListener listener, BooleanSupplier cancelled) {
    return loadWithReferences(hyps, refs == null ? null : readReferences(refs), threads, listener, cancelled);
  }

  /** As {@link #loadAll(Path, Path, int, LoadListener, BooleanSupplier)} with references already read (may be null). */
  public ScoredSet loadWithReferences(Path hyps, Map<String, Reference> references, int threads, LoadListener listener,
      BooleanSupplier cancelled) {
    return SessionRuns.load(this, hyps, references, threads, listener, cancelled);
  }
}
