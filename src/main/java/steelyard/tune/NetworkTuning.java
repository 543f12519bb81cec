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
 * <p><b>Sample</b>: the outer search scores its configurations on a seeded sample of at most
 * {@link TuneSettings#outerSample()} utterances (all of them when there are fewer); for the lattice method λ′ and
 * μ′ are then tuned again on all utterances at the chosen α and system weights. α is one number per run, and
 * a few thousand utterances fix it as well as all of them do; the sample keeps large dev sets affordable.
 *
 * <p><b>Cross-validation</b>: every configuration keeps its true errors on each sampled utterance (MBR,
 * consensus) or, for the lattice method, the (λ′, μ′) tuned over each fold's sampled training utterances of its
 * pools. Fold f takes the configuration with the fewest errors on its sampled training utterances and is scored
 * on all its held-out utterances by the chooser. Two approximations are documented in the README: the N-best
 * weights that feed the posteriors, and the set of configurations tried, come from the whole dev set.
 */
final class NetworkTuning {
  /**
   * The chosen weights, the start's true errors on every utterance, the cross-validated errors per utterance
   * (null without folds), configurations tried, rounds, the exact-over-pool intervals of λ′/μ′ and their pools.
   */
  record Outcome(RescoreWeights weights, int[] startErrors, int[] cvErrors, int evaluations, int iterations,
      Map<String, WeightInterval> intervals, CandidateTable pool) {}

  /** One configuration: errors per sampled utterance; per fold its (λ′, μ′) (lattice) and training errors. */
  private record Config(RescoreWeights weights, int[] errors, long total, double[][] foldWeights, long[] foldTrain) {}

  /** Receives the number of configurations evaluated so far. */
  @FunctionalInterface
  interface Progress {
    void evaluated(int count, RescoreWeights w);
  }

  private final NetworkData data;
  private final RescoreMethod method;
  private final TuneSettings settings;
  private final Folds folds;
  private final Workers workers;
  private final LatticeRound round;
  private final SplittableRandom rnd;
  private final Progress progress;
  private final int[] sample;
  /** Per fold, the positions in {@link #sample} of its training utterances. */
  private final int[][] foldTrain;
  private final Map<String, Config> tried = new LinkedHashMap<>();
  private Config best;
  /** The path pools of {@link #best} (lattice only), kept for its intervals and the error surface. */
  private CandidateTable bestPool;
  private int iterations;

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
    this.sample = sample(data.size(), settings.outerSample(), rnd.split());
    this.foldTrain = new int[folds == null ? 0 : folds.count()][];
    for (int f = 0; f < foldTrain.length; f++) {
      int[] pos = new int[sample.length];
      int n = 0;
      for (int i = 0; i < sample.length; i++) if (folds.of(sample[i]) != f) pos[n++] = i;
      foldTrain[f] = Arrays.copyOf(pos, n);
    }
  }

  /** 0 … n−1 when n ≤ max (or max = 0), else a seeded sample of max of them, ascending. */
  static int[] sample(int n, int max, SplittableRandom rnd) {
    int[] all = new int[n];
    for (int i = 0; i < n; i++) all[i] = i;
    if (max == 0 || n <= max) return all;
    for (int i = 0; i < max; i++) {
      int j = i + rnd.nextInt(n - i);
      int t = all[i];
      all[i] = all[j];
      all[j] = t;
    }
    int[] s = Arrays.copyOf(all, max);
    Arrays.sort(s);
    return s;
  }

  /** Tunes from the start weights, the N-best part replaced by {@code nbest}'s ({@code nbestVector} its columns). */
  Outcome run(RescoreWeights nbest, double[] nbestVector) {
    int[] startErrors = DevErrors.of(data.input, data.nbest, data.input.chooser().create(data.input.start(), method), data.all(), workers);
    int[] onSample = new int[sample.length];
    for (int i = 0; i < sample.length; i++) onSample[i] = startErrors[sample[i]];
    best = fixed(data.input.start(), onSample);
    tried.put("start", best);
    ScaleGrid grid = ScaleGrid.of(data.nbest, nbestVector, settings.range(WeightNames.POSTERIOR_SHARPNESS), nbest.posteriorScale());
    boolean scale = settings.moves(WeightNames.POSTERIOR_SHARPNESS, true);
    for (double a : scale ? grid.coarse() : new double[] {nbest.posteriorScale()}) evaluate(nbest, a, nbest.systemWeights());
    if (scale) for (double f : grid.refinements()) refine(nbest, f);
    if (systems(nbest) && scale && grid.refinements().length > 0) refine(nbest, grid.refinements()[grid.refinements().length - 1]);
    RescoreWeights chosen = best.weights();
    if (round != null && round.tunes() && sample.length < data.size() && best != tried.get("start")) {
      LatticeRound.Result r = round.run(chosen, data.all(), rnd.split());
      iterations += r.iterations();
      chosen = with(chosen, chosen.posteriorScale(), chosen.systemWeights(), r.lmWeight(), r.lengthWeight());
      bestPool = r.pool();
    }
    return new Outcome(chosen, startErrors, crossValidate(), tried.size(), iterations, intervals(chosen), bestPool);
  }

  /** Each system's weight by the factors 1/4, 1/2, 2, 4 in turn; whether any system weight was tried. */
  private boolean systems(RescoreWeights nbest) {
    List<String> names = data.systems();
    boolean any = false;
    for (String s : names.size() > 1 ? names : List.<String>of()) {
      if (!settings.moves(WeightNames.system(s), true)) continue;
      any = true;
      WeightRange r = settings.range(WeightNames.system(s));
      for (double f : new double[] {0.25, 0.5, 2, 4}) {
        Map<String, Double> sw = new TreeMap<>(best.weights().systemWeights());
        sw.put(s, r.clip(best.weights().systemWeight(s) * f));
        evaluate(nbest, best.weights().posteriorScale(), sw);
      }
    }
    return any;
  }

  private void refine(RescoreWeights nbest, double factor) {
    double a = best.weights().posteriorScale();
    WeightRange r = settings.range(WeightNames.POSTERIOR_SHARPNESS);
    evaluate(nbest, r.clip(ScaleGrid.round3(a / factor)), best.weights().systemWeights());
    evaluate(nbest, r.clip(ScaleGrid.round3(a * factor)), best.weights().systemWeights());
  }

  /** Evaluates (α, system weights) on the sample, warm-starting λ′ and μ′ from the best configuration so far. */
  private void evaluate(RescoreWeights nbest, double scale, Map<String, Double> systems) {
    String key = scale + " " + new TreeMap<>(systems);
    if (tried.containsKey(key)) return;
    RescoreWeights w = with(nbest, scale, systems, best.weights().latticeLmWeight(), best.weights().latticeLengthWeight());
    Config c;
    CandidateTable pool = null;
    if (round != null && round.tunes()) {
      LatticeRound.Result r = round.run(w, sample, rnd.split());
      iterations += r.iterations();
      double[][] fw = new double[foldTrain.length][];
      long[] train = new long[fw.length];
      for (int f = 0; f < fw.length; f++) {
        double[] t = round.tuneOnPool(r.pool(), foldTrain[f], data.input.start(), rnd.split());
        fw[f] = new double[] {t[0], t[1]};
        train[f] = (long) t[2];
      }
      c = new Config(with(w, scale, systems, r.lmWeight(), r.lengthWeight()), r.errors(), r.total(), fw, train);
      pool = r.pool();
    } else {
      c = fixed(w, DevErrors.of(data.input, data.nbest, data.input.chooser().create(w, method), sample, workers));
      iterations++;
    }
    tried.put(key, c);
    if (c.total() < best.total()) {
      best = c;
      bestPool = pool;
    }
    progress.evaluated(tried.size(), c.weights());
  }

  /** The configuration at exactly {@code w} with its errors on the sample. */
  private Config fixed(RescoreWeights w, int[] errors) {
    long[] train = new long[foldTrain.length];
    for (int f = 0; f < train.length; f++) for (int i : foldTrain[f]) train[f] += errors[i];
    return new Config(w, errors, Arrays.stream(errors).asLongStream().sum(), null, train);
  }

  /** Held-out errors per utterance of the configuration each fold chooses on its training utterances; null without folds. */
  private int[] crossValidate() {
    if (folds == null) return null;
    int[] cv = new int[data.size()];
    for (int f = 0; f < folds.count(); f++) {
      Config pick = null;
      for (Config c : tried.values()) if (pick == null || c.foldTrain()[f] < pick.foldTrain()[f]) pick = c;
      RescoreWeights w = pick.weights();
      if (pick.foldWeights() != null)
        w = with(w, w.posteriorScale(), w.systemWeights(), pick.foldWeights()[f][0], pick.foldWeights()[f][1]);
      int[] test = folds.test(f);
      DevErrors.scatter(test, DevErrors.of(data.input, data.nbest, data.input.chooser().create(w, method), test, workers), cv);
    }
    return cv;
  }

  private Map<String, WeightInterval> intervals(RescoreWeights w) {
    Map<String, WeightInterval> out = new LinkedHashMap<>();
    if (bestPool == null) return out;
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
