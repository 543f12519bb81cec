package steelyard.tune;

import java.util.EnumSet;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import steelyard.rescore.RescoreMethod;

/**
 * How a tuning run searches. Immutable; made by {@link #defaults()} or a {@link #builder()}; the {@code with…}
 * methods return changed copies.
 *
 * @param methods           methods to tune (empty: all four, keeping the one with the lowest cross-validated error)
 * @param tune              names of the weights that move ({@link WeightNames}); null: the default set, i.e. every
 *                          weight that can change a pick except the first feature's (it fixes the scale of the
 *                          N-best total, which is otherwise free)
 * @param ranges            allowed ranges by weight name, overriding {@link WeightNames#defaultRange}
 * @param folds             cross-validation folds over utterances (0 or 1: none); default 5
 * @param seed              seeds fold assignment, random directions and restarts
 * @param threads           worker threads (≥ 1); results are the same for any count
 * @param restarts          random restarts of the N-best and path-pool searches, besides the start point
 * @param randomDirections  random directions tried after each pass of coordinate ascent that found nothing
 * @param maxPasses         cap on passes of one coordinate-ascent run
 * @param kBest             paths per utterance added to the lattice pools by each search
 * @param maxPoolIterations cap on search-and-tune rounds of the lattice pools per posterior scale
 * @param outerSample       the network methods' search over α and system weights runs on a seeded sample of at
 *                          most this many utterances (0: all); the lattice method's λ′ and μ′ are then tuned again
 *                          on all utterances at the chosen α
 * @param surface           whether to compute the error surface of the chosen method
 */
public record TuneSettings(
    Set<RescoreMethod> methods,
    Set<String> tune,
    Map<String, WeightRange> ranges,
    int folds,
    long seed,
    int threads,
    int restarts,
    int randomDirections,
    int maxPasses,
    int kBest,
    int maxPoolIterations,
    int outerSample,
    boolean surface) {

  public static final int DEFAULT_FOLDS = 5;
  public static final long DEFAULT_SEED = 20261202L;

  public TuneSettings {
    methods = methods.isEmpty() ? EnumSet.allOf(RescoreMethod.class) : EnumSet.copyOf(methods);
    tune = tune == null ? null : Set.copyOf(tune);
    ranges = java.util.Collections.unmodifiableMap(new TreeMap<>(ranges));
    if (folds < 0 || threads < 1 || restarts < 0 || randomDirections < 0 || maxPasses < 1 || kBest < 1 || maxPoolIterations < 1
        || outerSample < 0)
      throw new IllegalArgumentException("folds, restarts, random directions, sample >= 0; threads, passes, k-best, pool iterations >= 1");
  }

  public static final int DEFAULT_OUTER_SAMPLE = 1000;

  /**
   * All methods, the default weights, 5 folds, 1 thread, 5 restarts, 3 random directions, at most 30 passes,
   * 10-best searches for the pools, at most 8 pool rounds, an outer sample of 1000 utterances, a surface.
   */
  public static TuneSettings defaults() {
    return builder().build();
  }

  /** A builder starting from {@link #defaults()}. */
  public static Builder builder() {
    return new Builder();
  }

  /** A builder starting from these settings. */
  public Builder toBuilder() {
    Builder b = new Builder();
    b.methods = methods;
    b.tune = tune;
    b.ranges = ranges;
    b.folds = folds;
    b.seed = seed;
    b.threads = threads;
    b.restarts = restarts;
    b.randomDirections = randomDirections;
    b.maxPasses = maxPasses;
    b.kBest = kBest;
    b.maxPoolIterations = maxPoolIterations;
    b.outerSample = outerSample;
    b.surface = surface;
    return b;
  }

  /** Builds {@link TuneSettings}; each setter returns the builder. */
  public static final class Builder {
    private Set<RescoreMethod> methods = Set.of();
    private Set<String> tune;
    private Map<String, WeightRange> ranges = Map.of();
    private int folds = DEFAULT_FOLDS;
    private long seed = DEFAULT_SEED;
    private int threads = 1;
    private int restarts = 5;
    private int randomDirections = 3;
    private int maxPasses = 30;
    private int kBest = 10;
    private int maxPoolIterations = 8;
    private int outerSample = DEFAULT_OUTER_SAMPLE;
    private boolean surface = true;

    private Builder() {}

    public Builder methods(Set<RescoreMethod> m) { methods = m; return this; }
    public Builder tune(Set<String> names) { tune = names; return this; }
    public Builder ranges(Map<String, WeightRange> r) { ranges = r; return this; }
    public Builder folds(int k) { folds = k; return this; }
    public Builder seed(long s) { seed = s; return this; }
    public Builder threads(int t) { threads = t; return this; }
    /** Restarts, random directions per pass without progress, and the cap on passes of one run. */
    public Builder search(int restarts, int randomDirections, int maxPasses) {
      this.restarts = restarts;
      this.randomDirections = randomDirections;
      this.maxPasses = maxPasses;
      return this;
    }
    /** Paths per search added to the lattice pools, and the cap on pool rounds per posterior scale. */
    public Builder pools(int kBest, int maxPoolIterations) {
      this.kBest = kBest;
      this.maxPoolIterations = maxPoolIterations;
      return this;
    }
    public Builder outerSample(int n) { outerSample = n; return this; }
    public Builder surface(boolean s) { surface = s; return this; }

    public TuneSettings build() {
      return new TuneSettings(methods, tune, ranges, folds, seed, threads, restarts, randomDirections, maxPasses, kBest,
          maxPoolIterations, outerSample, surface);
    }
  }

  public TuneSettings withMethods(Set<RescoreMethod> m) {
    return toBuilder().methods(m).build();
  }

  public TuneSettings withTune(Set<String> names) {
    return toBuilder().tune(names).build();
  }

  public TuneSettings withRanges(Map<String, WeightRange> r) {
    return toBuilder().ranges(r).build();
  }

  public TuneSettings withFolds(int k) {
    return toBuilder().folds(k).build();
  }

  public TuneSettings withSeed(long s) {
    return toBuilder().seed(s).build();
  }

  public TuneSettings withThreads(int t) {
    return toBuilder().threads(t).build();
  }

  public TuneSettings withSearch(int restarts, int randomDirections, int maxPasses) {
    return toBuilder().search(restarts, randomDirections, maxPasses).build();
  }

  public TuneSettings withPools(int kBest, int maxPoolIterations) {
    return toBuilder().pools(kBest, maxPoolIterations).build();
  }

  public TuneSettings withOuterSample(int n) {
    return toBuilder().outerSample(n).build();
  }

  public TuneSettings withSurface(boolean s) {
    return toBuilder().surface(s).build();
  }

  /** The allowed range of {@code name}: the override when given, else the default. */
  public WeightRange range(String name) {
    WeightRange r = ranges.get(name);
    return r != null ? r : WeightNames.defaultRange(name);
  }

  /** Whether {@code name} moves: listed in {@link #tune}, or (when that is null) {@code byDefault}. */
  boolean moves(String name, boolean byDefault) {
    return tune == null ? byDefault : tune.contains(name);
  }

  LinearTuner.Effort effort() {
    return new LinearTuner.Effort(restarts, randomDirections, maxPasses);
  }
}
