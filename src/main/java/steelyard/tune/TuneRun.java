package steelyard.tune;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import steelyard.eval.Bootstrap;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/** One tuning run ({@link Tuner#tune}): the N-best weights, each network method, the choice of method, the report. */
final class TuneRun {
  /** Share of the progress bar taken by the N-best part when network methods follow. */
  private static final double NBEST_SHARE = 0.15;
  /** Configurations a network method is expected to evaluate (for the progress bar only). */
  private static final int EXPECTED_CONFIGS = 20;

  private record NbestPart(RescoreWeights weights, double[] vector, MethodFigures figures, int[] errors) {}

  private final TuneInput input;
  private final TuneSettings settings;
  private final TuneProgress progress;
  private final Workers workers;
  private final List<String> warnings = new ArrayList<>();
  private final Map<RescoreMethod, MethodFigures> figures = new EnumMap<>(RescoreMethod.class);
  private final Map<RescoreMethod, int[]> inSample = new EnumMap<>(RescoreMethod.class);
  private CandidateTable table;
  private NbestTuning nbest;
  private Folds folds;
  private int[] all;
  private double done;
  private CandidateTable latticePool;

  TuneRun(TuneInput input, TuneSettings settings, TuneProgress progress, Workers workers) {
    this.input = input;
    this.settings = settings;
    this.progress = progress;
    this.workers = workers;
  }

  TuneResult run() {
    report(0, "scoring every hypothesis against its reference");
    table = NbestTuning.table(input, workers);
    all = table.all();
    long n = table.referenceTokens(all);
    if (n == 0) throw new IllegalArgumentException("the dev references hold no scored token");
    nbest = new NbestTuning(input, table, settings);
    folds = folds();
    SplittableRandom root = new SplittableRandom(settings.seed());
    List<RescoreMethod> methods = Tuner.order(settings);
    long networkCount = methods.stream().filter(m -> m != RescoreMethod.NBEST).count();
    double nbestShare = networkCount > 0 ? NBEST_SHARE : 0.95;
    NbestPart np = tuneNbest(root.split(), nbestShare);
    if (methods.contains(RescoreMethod.NBEST)) {
      figures.put(RescoreMethod.NBEST, np.figures());
      inSample.put(RescoreMethod.NBEST, np.errors());
    }
    NetworkData data = networkCount == 0 ? null : new NetworkData(input, table);
    double share = networkCount == 0 ? 0 : (0.95 - nbestShare) / networkCount;
    for (RescoreMethod m : methods) if (m != RescoreMethod.NBEST) tuneNetwork(data, m, np, root.split(), share);
    RescoreMethod chosen = choose();
    MethodFigures f = figures.get(chosen);
    report(0.95, "computing the error surface and the bootstrap interval");
    ErrorSurface surface = settings.surface() ? surface(chosen, np) : null;
    Bootstrap.Interval iv = Bootstrap.corpusRate(inSample.get(chosen), table.refTokens, Bootstrap.DEFAULT_RESAMPLES, settings.seed(),
        workers.threads());
    overfitWarning(f, iv);
    report(1, "done");
    List<MethodFigures> per = new ArrayList<>(figures.values());
    return new TuneResult(chosen, (double) table.firstErrors(all) / n, f.devErrorRate(), iv, f.cvErrorRate(), n, f.weights(),
        f.bestInterval(), per, surface, warnings, f.iterations(), input.size(), folds == null ? 0 : folds.count(), settings.seed());
  }

  private Folds folds() {
    int k = settings.folds();
    int u = input.size();
    if (k < 2 || u < 2) {
      warnings.add("cross-validation is off: the dev error of tuned weights is optimistic; check them on held-out data");
      return null;
    }
    if (u < k) {
      warnings.add(String.format(Locale.ROOT, "only %d utterances: cross-validation uses %d folds instead of %d", u, u, k));
      k = u;
    }
    return new Folds(u, k, settings.seed());
  }

  private NbestPart tuneNbest(SplittableRandom rnd, double share) {
    RescoreWeights start = input.start();
    report(done, "tuning the N-best weights");
    LinearTuner tuner = nbest.tuner(all, settings, workers);
    LinearTuner.Outcome o = tuner.run(nbest.vector(start), rnd.split());
    RescoreWeights tuned = nbest.apply(start, o.weights());
    int[] startErrors = DevErrors.of(input, table, input.chooser().create(start, RescoreMethod.NBEST), all, workers);
    int[] tunedErrors = DevErrors.of(input, table, input.chooser().create(tuned, RescoreMethod.NBEST), all, workers);
    boolean kept = sum(tunedErrors) >= sum(startErrors);
    double[] vector = kept ? nbest.vector(start) : o.weights();
    int[] errors = kept ? startErrors : tunedErrors;
    // The N-best folds matter only when the N-best method itself is reported (the network methods take the
    // N-best weights of the whole dev set; see NetworkTuning).
    boolean validate = folds != null && settings.methods().contains(RescoreMethod.NBEST);
    double foldShare = validate ? share * 0.8 / folds.count() : 0;
    report(done + (validate ? share * 0.2 : share), "N-best weights tuned");
    int[] cv = null;
    if (validate) {
      cv = new int[all.length];
      for (int f = 0; f < folds.count(); f++) {
        LinearTuner.Outcome fo = nbest.tuner(folds.train(f), settings, workers).run(nbest.vector(start), rnd.split());
        int[] test = folds.test(f);
        DevErrors.scatter(test, table.errorsOf(test, fo.weights(), workers), cv);
        report(done + foldShare, String.format(Locale.ROOT, "N-best cross-validation: fold %d of %d", f + 1, folds.count()));
      }
    }
    Map<String, WeightInterval> intervals = new LinkedHashMap<>();
    double[][] iv = tuner.intervals(vector);
    for (int i = 0; i < nbest.dims.length; i++) {
      int c = nbest.dims[i];
      intervals.put(nbest.names.get(c), new WeightInterval(iv[i][0], iv[i][1], vector[c], true));
    }
    // Only a reported N-best method with weights to move can have kept its starting weights in the user's eyes.
    if (kept && settings.methods().contains(RescoreMethod.NBEST) && nbest.dims.length > 0) keptWarning(RescoreMethod.NBEST);
    RescoreWeights weights = kept ? start : tuned;
    MethodFigures fig = figures(RescoreMethod.NBEST, weights, errors, cv, sum(startErrors), kept, intervals, o.passes());
    return new NbestPart(weights, vector, fig, errors);
  }

  private void tuneNetwork(NetworkData data, RescoreMethod m, NbestPart np, SplittableRandom rnd, double share) {
    double from = done;
    report(from, "tuning " + m.label());
    NetworkTuning.Outcome o = new NetworkTuning(data, m, settings, folds, rnd, workers, (count, w) -> report(
        from + share * Math.min(0.95, (double) count / EXPECTED_CONFIGS),
        String.format(Locale.ROOT, "tuning %s: %d settings tried, posterior scale %s", m.label(), count, w.posteriorScale())))
        .run(np.weights(), np.vector());
    int[] errors = DevErrors.of(input, table, input.chooser().create(o.weights(), m), all, workers);
    long start = sum(o.startErrors());
    boolean kept = o.weights().equals(input.start()) || sum(errors) >= start;
    if (kept) keptWarning(m);
    RescoreWeights w = kept ? input.start() : o.weights();
    int[] e = kept ? o.startErrors() : errors;
    Map<String, WeightInterval> intervals = kept ? Map.of() : o.intervals();
    if (m == RescoreMethod.LATTICE && !kept) latticePool = o.pool();
    figures.put(m, figures(m, w, e, o.cvErrors(), start, kept, intervals, o.iterations()));
    inSample.put(m, e);
    report(from + share, m.label() + " tuned");
  }

  private MethodFigures figures(RescoreMethod m, RescoreWeights w, int[] errors, int[] cv, long start, boolean kept,
      Map<String, WeightInterval> intervals, int iterations) {
    long n = table.referenceTokens(all);
    long dev = sum(errors);
    long cvSum = cv == null ? -1 : sum(cv);
    return new MethodFigures(m, w, dev, (double) dev / n, cvSum, cv == null ? Double.NaN : (double) cvSum / n, start, kept, intervals,
        iterations);
  }

  /** Lowest cross-validated errors (without folds: dev errors); ties to fewer dev errors, then the simpler method. */
  private RescoreMethod choose() {
    MethodFigures best = null;
    for (MethodFigures f : figures.values()) {
      long key = folds != null ? f.cvErrors() : f.devErrors();
      long bestKey = best == null ? 0 : folds != null ? best.cvErrors() : best.devErrors();
      if (best == null || key < bestKey || (key == bestKey && f.devErrors() < best.devErrors())) best = f;
    }
    return best.method();
  }

  private ErrorSurface surface(RescoreMethod chosen, NbestPart np) {
    if (chosen == RescoreMethod.LATTICE) {
      if (latticePool == null) return null;
      RescoreWeights w = figures.get(chosen).weights();
      return WeightSweep.around(latticePool, new double[] {1, w.latticeLmWeight(), w.latticeLengthWeight()}, chosen, 1,
          WeightNames.LATTICE_LM, settings.range(WeightNames.LATTICE_LM), 2, WeightNames.LATTICE_LENGTH,
          settings.range(WeightNames.LATTICE_LENGTH), false, workers);
    }
    if (input.model() == null) return null;
    int f = input.featureNames().size();
    return WeightSweep.around(table, np.vector(), RescoreMethod.NBEST, f, WeightNames.LM, settings.range(WeightNames.LM), f + 2,
        WeightNames.LENGTH, settings.range(WeightNames.LENGTH), true, workers);
  }

  private void overfitWarning(MethodFigures f, Bootstrap.Interval iv) {
    if (Double.isNaN(f.cvErrorRate()) || iv.contains(f.cvErrorRate())) return;
    warnings.add(String.format(Locale.ROOT,
        "%s: the cross-validated error rate %.2f %% lies outside the 95 %% bootstrap interval %.2f %% to %.2f %% of the "
            + "in-sample rate %.2f %%: the tuned weights may fit this dev set better than new data",
        f.method().label(), 100 * f.cvErrorRate(), 100 * iv.low(), 100 * iv.high(), 100 * f.devErrorRate()));
  }

  private void keptWarning(RescoreMethod m) {
    warnings.add(m.label() + ": no tuned weights made fewer dev errors than the starting weights; kept the starting weights");
  }

  private void report(double fraction, String message) {
    workers.check();
    done = Math.max(done, Math.min(1, fraction));
    progress.update(done, message);
  }

  private static long sum(int[] x) {
    long s = 0;
    for (int v : x) s += v;
    return s;
  }
}
