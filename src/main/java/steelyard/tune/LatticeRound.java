package steelyard.tune;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import steelyard.eval.Aligner;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;

/**
 * Tuning of λ′ and μ′ of the lattice method at fixed posteriors (one posterior scale and set of system
 * weights), by Och's iterative scheme (Och 2003, §5): build every utterance's confusion network once, search
 * each for its k best paths at the current (λ′, μ′), merge them into the utterance's {@link PathPool}, tune
 * (λ′, μ′) by exact line search over the pools (for fixed posteriors a path's score is linear in them), and
 * repeat at the new weights until a search finds no path that is not pooled yet (or the round cap is reached).
 * Every tried (λ′, μ′) is checked by the search itself: its best path per utterance gives the true errors, and
 * the round keeps the weights with the fewest true errors (the earliest on ties).
 *
 * <p>Cost per round: one k-best search per utterance (O(slots × beam × arcs × k)) and one pool tuning; memory:
 * the networks of all utterances (about 20 bytes per arc plus 8 per hypothesis and slot) and the pools.
 */
final class LatticeRound {
  /**
   * @param lmWeight, lengthWeight the chosen λ′, μ′
   * @param errors                 true errors per utterance at them, aligned with the utterances searched
   * @param iterations             search rounds made
   * @param pool                   the final pools, as a candidate table with columns {ln posterior, ln P_LM, tokens},
   *                               its utterance k being the k-th utterance searched
   */
  record Result(double lmWeight, double lengthWeight, int[] errors, long total, int iterations, CandidateTable pool) {}

  private final NetworkData data;
  private final TuneSettings settings;
  private final LinearTuner.Effort effort;
  private final int[] dims;
  private final double[] low;
  private final double[] high;
  private final Workers workers;

  LatticeRound(NetworkData data, TuneSettings settings, Workers workers) {
    this.data = data;
    this.settings = settings;
    this.effort = settings.effort();
    this.workers = workers;
    WeightRange lm = settings.range(WeightNames.LATTICE_LM);
    WeightRange len = settings.range(WeightNames.LATTICE_LENGTH);
    low = new double[] {1, lm.low(), len.low()};
    high = new double[] {1, lm.high(), len.high()};
    dims = data.latticeDims(settings);
  }

  /** Whether λ′ or μ′ moves at all. */
  boolean tunes() {
    return dims.length > 0;
  }

  /** The networks of {@code utts} at the posteriors of {@code w}, built once. */
  private record Networks(int[] utts, ConfusionNetwork[] nets, double[][] post, int[] firstErrors, int[] refTokens, int[] positions) {}

  private Networks networks(RescoreWeights w, int[] utts) {
    int u = utts.length;
    NbestRescorer rescorer = new NbestRescorer(null, data.input.featureNames(), w, RescoreMethod.LATTICE, data.input.model(),
        () -> new Aligner()::distance);
    ConfusionNetwork[] nets = new ConfusionNetwork[u];
    double[][] post = new double[u][];
    workers.blocks(u, (b, from, to) -> {
      for (int k = from; k < to; k++) {
        ScoredUtterance s = data.scores(utts[k]);
        post[k] = rescorer.posteriors(s, rescorer.weighting().totals(s, new double[s.size()]));
        nets[k] = Lattices.network(data.tokens(utts[k]), post[k], w.latticeSettings());
      }
    });
    int[] firstErrors = new int[u];
    int[] refTokens = new int[u];
    int[] positions = new int[u];
    for (int k = 0; k < u; k++) {
      firstErrors[k] = data.nbest.firstErrors[utts[k]];
      refTokens[k] = data.nbest.refTokens[utts[k]];
      positions[k] = k;
    }
    return new Networks(utts, nets, post, firstErrors, refTokens, positions);
  }

  /**
   * The pools of {@code utts} gathered by k-best searches at each {λ′, μ′} of {@code points}, at the posteriors of
   * {@code w} (for sweeps and surfaces: exact over the pooled paths).
   */
  CandidateTable gather(RescoreWeights w, int[] utts, double[][] points) {
    Networks n = networks(w, utts);
    PathPool pool = new PathPool(utts.length);
    for (double[] p : points) search(n, pool, w, new double[] {1, p[0], p[1]}, new int[utts.length]);
    return pool.table(n.firstErrors(), n.refTokens());
  }

  /** Runs the rounds over {@code utts} at the posterior scale and system weights of {@code w}, from its λ′ and μ′. */
  Result run(RescoreWeights w, int[] utts, SplittableRandom rnd) {
    int u = utts.length;
    Networks n = networks(w, utts);
    PathPool pool = new PathPool(u);
    double[] cur = {1, w.latticeLmWeight(), w.latticeLengthWeight()};
    double[] best = cur.clone();
    int[] bestErrors = null;
    long bestTotal = Long.MAX_VALUE;
    int it = 0;
    CandidateTable table;
    while (true) {
      int[] top = new int[u];
      int added = search(n, pool, w, cur, top);
      long total = Arrays.stream(top).asLongStream().sum();
      if (total < bestTotal) {
        bestTotal = total;
        bestErrors = top;
        best = cur.clone();
      }
      it++;
      table = pool.table(n.firstErrors(), n.refTokens());
      if ((it > 1 && added == 0) || it >= settings.maxPoolIterations() || dims.length == 0) break;
      double[] next = tuner(table, n.positions()).run(cur, rnd).weights();
      if (Arrays.equals(next, cur)) break;
      cur = next;
    }
    return new Result(best[1], best[2], bestErrors, bestTotal, it, table);
  }

  /** Tunes (λ′, μ′) from the start weights over utterances {@code utts} of a pool table: {λ′, μ′, pool errors}. */
  double[] tuneOnPool(CandidateTable pool, int[] utts, RescoreWeights start, SplittableRandom rnd) {
    LinearTuner.Outcome o = tuner(pool, utts).run(new double[] {1, start.latticeLmWeight(), start.latticeLengthWeight()}, rnd);
    return new double[] {o.weights()[1], o.weights()[2], o.errors()};
  }

  /** Exact best intervals of the tuned columns at (λ′, μ′) over the pool; rows follow {@link NetworkData#latticeDims}. */
  double[][] intervals(CandidateTable pool, double lmWeight, double lengthWeight) {
    return tuner(pool, pool.all()).intervals(new double[] {1, lmWeight, lengthWeight});
  }

  private LinearTuner tuner(CandidateTable pool, int[] utts) {
    return new LinearTuner(pool, utts, dims, low, high, effort, workers);
  }

  /** k-best search of every utterance at {1, λ′, μ′}; pools the paths, fills the best path's errors, counts new paths. */
  private int search(Networks n, PathPool pool, RescoreWeights w, double[] cur, int[] top) {
    LatticeSettings ls = new LatticeSettings(cur[1], cur[2], w.beam(), w.latticeMaxHypotheses());
    int[] utts = n.utts();
    int[] added = new int[Workers.blockCount(utts.length)];
    workers.blocks(utts.length, (b, from, to) -> {
      Aligner aligner = new Aligner();
      boolean[] isNew = new boolean[1];
      for (int k = from; k < to; k++) {
        int x = utts[k];
        ScoredUtterance s = data.scores(x);
        List<List<String>> toks = data.tokens(x);
        List<LatticeChoice> paths = Lattices.searchKBest(n.nets()[k], toks, n.post()[k], data.input.model(), ls, settings.kBest());
        int[] refIds = s.idsOf(data.reference(x).tokens());
        boolean[] refOptional = data.reference(x).optional();
        for (int p = 0; p < paths.size(); p++) {
          int e = pool.add(k, s, paths.get(p), data.nbest.errors, data.nbest.start[x], refIds, refOptional, data.input.model(),
              aligner, isNew);
          if (isNew[0]) added[b]++;
          if (p == 0) top[k] = e;
        }
      }
    });
    return Arrays.stream(added).sum();
  }
}
