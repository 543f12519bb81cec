package steelyard.gui.model;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;
import steelyard.eval.Aligner;
import steelyard.eval.Alignment;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.Lattices;
import steelyard.lm.LanguageModel;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.LogLinear;
import steelyard.rescore.ModelIdentity;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;
import steelyard.rescore.WeightsFile;
import steelyard.rescore.WeightsSpec;
import steelyard.text.TokenSequence;

/**
 * The window's one link to the rescoring core. {@link #open} reads the files of an {@link OpenRequest} and
 * scores every hypothesis once ({@link WorkspaceLoader}); afterwards every choice reads the cached terms:
 * {@link #rerank} (N-best: {@link LogLinear} totals and argmax over the kept arrays, no allocation per
 * hypothesis, fast enough for a slider), {@link #choose} (any method, the core's {@link NbestRescorer} per
 * utterance on all cores, with progress and cancel) and {@link #explain} (one utterance with every term).
 *
 * <p>Thread safety: immutable after {@link #open}; every method may be called from any thread. The lazily
 * built token-id view of a {@link ScoredUtterance} (used by MBR) is initialised under the utterance's lock
 * before any choice reads it.
 */
public final class Workspace {
  private final OpenRequest request;
  private final Corpus corpus;
  private final LanguageModel model;
  private final RescoreWeights initialWeights;
  private final List<String> warnings;
  private final HypothesisScorer scorer;
  private final int maxHypotheses;

  Workspace(OpenRequest request, Corpus corpus, LanguageModel model, HypothesisScorer scorer, RescoreWeights initialWeights,
      List<String> warnings) {
    this.request = request;
    this.scorer = scorer;
    this.corpus = corpus;
    this.model = model;
    this.initialWeights = initialWeights;
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
  /** The model, or null when none was given. */
  public LanguageModel model() { return model; }
  /** The weights of the weights file (defaults where it says nothing). */
  public RescoreWeights initialWeights() { return initialWeights; }
  /** Warnings of the import (rank gaps, skipped rows, unit mismatches), in the command line's words. */
  public List<String> warnings() { return warnings; }

  /**
   * The N-best choice under {@code w}: each utterance's totals from the cached terms and the best by the
   * core's tie order. Cost: (F + 3) multiply-adds per hypothesis plus one pass per utterance; no scoring, no
   * alignment (errors were aligned once at load).
   */
  public Choices rerank(RescoreWeights w) {
    LogLinear weighting = LogLinear.of(w, corpus.featureNames());
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
    return choices(w, RescoreMethod.NBEST, chosen, null, errors, changed);
  }

  /** The choice under {@code w} by {@code method}; N-best goes through {@link #rerank}. Runs on all cores. */
  public Choices choose(RescoreWeights w, RescoreMethod method, TaskProgress progress) {
    if (method == RescoreMethod.NBEST) return rerank(w);
    NbestRescorer rescorer = rescorer(w, method);
    int n = corpus.size();
    int[] chosen = new int[n];
    int[] errors = new int[n];
    boolean[] changed = new boolean[n];
    List<List<String>> fresh = Collections.synchronizedList(new ArrayList<>(Collections.nCopies(n, null)));
    AtomicInteger done = new AtomicInteger();
    progress.report(0, "choosing by " + method.label());
    IntStream.range(0, n).parallel().forEach(u -> {
      progress.checkCancelled();
      UtteranceResult r = chooseOne(rescorer, u);
      chosen[u] = r.chosen();
      changed[u] = r.changed();
      if (r.isNewTranscript()) fresh.set(u, r.newTokens());
      errors[u] = r.isNewTranscript() ? errorsOf(u, r.newTokens()) : corpus.errors(u, r.chosen());
      int k = done.incrementAndGet();
      if ((k & 31) == 0) progress.report((double) k / n, "choosing by " + method.label());
    });
    progress.checkCancelled();
    return choices(w, method, chosen, new ArrayList<>(fresh), errors, changed);
  }

  /** The full result of utterance {@code u} under {@code w} and {@code method}: totals, posteriors, every term. */
  public UtteranceResult explain(int u, RescoreWeights w, RescoreMethod method) {
    return chooseOne(rescorer(w, method), u);
  }

  /** The confusion network of {@code r}'s hypotheses with its posteriors, as the network methods build it. */
  public ConfusionNetwork network(UtteranceResult r, RescoreWeights w) {
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
    return new Aligner().alignment(ids(ref.tokens(), ids), ref.optional(), ids(tokens, ids), optional);
  }

  /** Writes {@code w} as a weights file (with the unit and, for a model file, its identity). */
  public void saveWeights(Path target, RescoreWeights w) {
    ModelIdentity identity = request.lm() == null || model == null ? null : ModelIdentity.of(request.lm(), model.order());
    WeightsFile.save(target, WeightsSpec.of(w, corpus.unit(), identity));
  }

  /** The choice of one utterance with the core's rescorer (MBR's token-id view built under the lock first). */
  private UtteranceResult chooseOne(NbestRescorer rescorer, int u) {
    ScoredUtterance s = corpus.scored(u);
    if (rescorer.method() == RescoreMethod.MBR) {
      synchronized (s) {
        s.tokenIds();
      }
    }
    return rescorer.choose(s);
  }

  private NbestRescorer rescorer(RescoreWeights w, RescoreMethod method) {
    return new NbestRescorer(scorer, corpus.featureNames(), w, method, model, () -> new Aligner()::distance);
  }

  /** Errors of a new transcript against utterance {@code u}'s reference (as the rescore summary counts them). */
  private int errorsOf(int u, List<String> tokens) {
    TokenSequence ref = corpus.referenceTokens(u);
    if (ref == null) return Corpus.NO_REFERENCE;
    Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
    return (int) new Aligner().count(ids(ref.tokens(), ids), ref.optional(), ids(tokens, ids), new boolean[tokens.size()]).errors();
  }

  static int[] ids(List<String> tokens, Object2IntOpenHashMap<String> ids) {
    int[] out = new int[tokens.size()];
    for (int k = 0; k < out.length; k++) {
      String t = tokens.get(k);
      int id = ids.getInt(t);
      if (id == 0 && !ids.containsKey(t)) {
        id = ids.size();
        ids.put(t, id);
      }
      out[k] = id;
    }
    return out;
  }

  private Choices choices(RescoreWeights w, RescoreMethod method, int[] chosen, List<List<String>> fresh, int[] errors,
      boolean[] changed) {
    int n = corpus.size();
    int scored = 0;
    int nChanged = 0;
    int helped = 0;
    int hurt = 0;
    int news = 0;
    long tokens = 0;
    long e = 0;
    long first = 0;
    long oracle = 0;
    for (int u = 0; u < n; u++) {
      if (changed[u]) nChanged++;
      if (chosen[u] < 0) news++;
      if (!corpus.hasReference(u)) continue;
      scored++;
      tokens += corpus.referenceLength(u);
      e += errors[u];
      int f = corpus.firstErrors(u);
      first += f;
      oracle += corpus.oracleErrors(u);
      if (errors[u] < f) helped++;
      else if (errors[u] > f) hurt++;
    }
    int orphans = corpus.orphanReferences().size();
    long lost = corpus.orphanTokens();
    CorpusFigures figures = new CorpusFigures(n, scored + orphans, tokens + lost, e + lost, first + lost, oracle + lost,
        nChanged, helped, hurt, news);
    return new Choices(w, method, chosen, fresh, errors, changed, figures);
  }

  @Override
  public String toString() {
    return "Workspace[" + request.hyps() + ", " + corpus.size() + " utterances, " + Arrays.asList(corpus.featureNames()) + "]";
  }
}
