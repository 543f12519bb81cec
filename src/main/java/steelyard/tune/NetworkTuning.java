package steelyard.tune;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.TreeMap;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * Tuning of a network method (MBR, consensus, lattice) after the N-best weights: an outer search over the
 * posterior scale α and, with several systems, the system weights (they enter the posteriors non-linearly), and
 * for the lattice method at each of its points the inner tuning of λ′ and μ′ ({@link LatticeRound}).
 *
 * <p><b>Outer search: a coarse-to-fine grid on log α</b> ({@link ScaleGrid}), then each system weight by factors
 * 1/4, 1/2, 2, 4, then one more refinement of α. The error is a step function of α without any promise of
 * unimodality, so golden-section search could settle in a poor local minimum; the grid instead spans every
 * regime the posteriors can be in (from nearly uniform to collapsed onto one hypothesis, measured from the dev
 * scores), so no regime is skipped, and refinement near the best point costs a few evaluations per halving.
 * The starting weights are evaluated first and win ties: the result is never worse on the dev set than them.
 *
 * <p><b>Cross-validation</b>: every evaluated configuration keeps each utterance's true errors (MBR, consensus)
 * or, for the lattice method, the (λ′, μ′) tuned over each fold's training utterances of its pools. Fold f takes
 * the configuration with the fewest training errors and is scored on its held-out utterances (exact for MBR and
 * consensus; by a full search at the fold's weights for the lattice method). Two approximations are documented
 * in the README: the N-best weights that feed the posteriors, and the set of configurations tried, come from the
 * whole dev set.
 */
final class NetworkTuning {
  /** The chosen weights, their true per-utterance errors, the cross-validated errors, and the search's size. */
  record Outcome(RescoreWeights weights, int[] errors, long total, int[] startErrors, int[] cvErrors, int evaluations,
      int iterations, Map<String, WeightInterval> intervals, CandidateTable pool) {}

  private record Config(RescoreWeights weights, int[] errors, long total, double[][] foldWeights, long[] foldTrain) {}

  private final NetworkData data;
  private final RescoreMethod method;
  private final TuneSettings settings;
  private final Folds folds;
  private final Workers workers;
  private final LatticeRound round;
  private final SplittableRandom rnd;
  private final Map<String, Config> tried = new LinkedHashMap<>();
  private final Progress progress;
  private Config best;
  /** The path pools of {@link #best} (lattice only), kept for its intervals and the error surface. */
  private CandidateTable bestPool;
  private int iterations;

  /** Receives the number of configurations evaluated so far. */
  @FunctionalInterface
  interface Progress {
    void evaluated(int count, RescoreWeights w);
  }

  NetworkTuning(NetworkData data, RescoreMethod method, TuneSettings settings, Folds folds, SplittableRandom rnd, Workers workers,
      Progress progress) {
    this.data = data;
    this.method = method;
    this.settings = settings;
    this.folds = folds;
    this.rnd = rnd;
    this.workers = workers;
    this.progress = progress;
    this.round = method == RescoreMethod.LATTICE ? new LatticeRound(data, settings, workers) : null;
  }

  /** Tunes from the start weights, the N-best part replaced by {@code nbest}'s ({@code nbestVector} its columns). */
  Outcome run(RescoreWeights nbest, double[] nbestVector) {
    best = evaluateFixed(data.input.start());
    tried.put("start", best);
    ScaleGrid grid = ScaleGrid.of(data.nbest, nbestVector, settings.range(WeightNames.POSTERIOR_SCALE), nbest.posteriorScale());
    boolean scale = settings.moves(WeightNames.POSTERIOR_SCALE, true);
    Map<String, Double> systems = new TreeMap<>(nbest.systemWeights());
    for (double a : scale ? grid.coarse() : new double[] {nbest.posteriorScale()}) evaluate(nbest, a, systems);
    if (scale) for (double f : grid.refinements()) refine(nbest, f);
    List<String> names = data.systems();
    boolean anySystem = false;
    for (String s : names.size() > 1 ? names : List.<String>of()) {
      if (!settings.moves(WeightNames.system(s), true)) continue;
      anySystem = true;
      WeightRange r = settings.range(WeightNames.system(s));
      for (double f : new double[] {0.25, 0.5, 2, 4}) {
        Map<String, Double> sw = new TreeMap<>(best.weights().systemWeights());
        sw.put(s, r.clip(best.weights().systemWeight(s) * f));
        evaluate(nbest, best.weights().posteriorScale(), sw);
      }
    }
    if (scale && anySystem && grid.refinements().length > 0) refine(nbest, grid.refinements()[grid.refinements().length - 1]);
    return new Outcome(best.weights(), best.errors(), best.total(), tried.get("start").errors(), crossValidate(), tried.size(),
        iterations, intervals(), bestPool);
  }

  private void refine(RescoreWeights nbest, double factor) {
    double a = best.weights().posteriorScale();
    WeightRange r = settings.range(WeightNames.POSTERIOR_SCALE);
    evaluate(nbest, r.clip(ScaleGrid.round3(a / factor)), best.weights().systemWeights());
    evaluate(nbest, r.clip(ScaleGrid.round3(a * factor)), best.weights().systemWeights());
  }

  /** Evaluates (α, system weights), warm-starting λ′ and μ′ from the best configuration so far. */
  private void evaluate(RescoreWeights nbest, double scale, Map<String, Double> systems) {
    String key = scale + " " + systems;
    if (tried.containsKey(key)) return;
    RescoreWeights w = with(nbest, scale, systems, best.weights().latticeLmWeight(), best.weights().latticeLengthWeight());
    Config c;
    CandidateTable pool = null;
    if (round != null && round.tunes()) {
      LatticeRound.Result r = round.run(w, rnd.split());
      iterations += r.iterations();
      double[][] fw = new double[folds == null ? 0 : folds.count()][];
      long[] train = new long[fw.length];
      for (int f = 0; f < fw.length; f++) {
        double[] t = round.tuneOnPool(r.pool(), folds.train(f), data.input.start(), rnd.split());
        fw[f] = new double[] {t[0], t[1]};
        train[f] = (long) t[2];
      }
      c = new Config(with(w, scale, systems, r.lmWeight(), r.lengthWeight()), r.errors(), r.total(), fw, train);
      pool = r.pool();
    } else {
      c = evaluateFixed(w);
      iterations++;
    }
    tried.put(key, c);
    if (c.total() < best.total()) {
      best = c;
      bestPool = pool;
    }
    progress.evaluated(tried.size(), c.weights());
  }

  /** The configuration at exactly {@code w}, errors from the chooser. */
  private Config evaluateFixed(RescoreWeights w) {
    int[] all = data.all();
    int[] e = DevErrors.of(data.input, data.nbest, data.input.chooser().create(w, method), all, workers);
    long[] train = new long[folds == null ? 0 : folds.count()];
    for (int f = 0; f < train.length; f++) for (int u : folds.train(f)) train[f] += e[u];
    return new Config(w, e, Arrays.stream(e).asLongStream().sum(), null, train);
  }

  /** Held-out errors per utterance of the configuration each fold chooses on its training utterances; null without folds. */
  private int[] crossValidate() {
    if (folds == null) return null;
    int[] cv = new int[data.size()];
    for (int f = 0; f < folds.count(); f++) {
      Config pick = null;
      for (Config c : tried.values()) if (pick == null || c.foldTrain()[f] < pick.foldTrain()[f]) pick = c;
      int[] test = folds.test(f);
      if (pick.foldWeights() == null) {
        for (int u : test) cv[u] = pick.errors()[u];
        continue;
      }
      RescoreWeights w = with(pick.weights(), pick.weights().posteriorScale(), pick.weights().systemWeights(),
          pick.foldWeights()[f][0], pick.foldWeights()[f][1]);
      DevErrors.scatter(test, DevErrors.of(data.input, data.nbest, data.input.chooser().create(w, method), test, workers), cv);
    }
    return cv;
  }

  private Map<String, WeightInterval> intervals() {
    Map<String, WeightInterval> out = new LinkedHashMap<>();
    if (bestPool == null) return out;
    RescoreWeights w = best.weights();
    double[][] iv = round.intervals(bestPool, w.latticeLmWeight(), w.latticeLengthWeight());
    int[] dims = data.latticeDims(settings);
    for (int i = 0; i < dims.length; i++) {
      boolean lm = dims[i] == 1;
      out.put(lm ? WeightNames.LATTICE_LM : WeightNames.LATTICE_LENGTH,
          new WeightInterval(iv[i][0], iv[i][1], lm ? w.latticeLmWeight() : w.latticeLengthWeight(), false));
    }
    return out;
  }

  static RescoreWeights with(RescoreWeights b, double scale, Map<String, Double> systems, double lmWeight, double lengthWeight) {
    return new RescoreWeights(b.features(), b.lmWeight(), b.oovWeight(), b.lengthWeight(), scale, systems, b.mbrMaxHypotheses(),
        lmWeight, lengthWeight, b.beam(), b.latticeMaxHypotheses(), b.voteConfidence());
  }
}
