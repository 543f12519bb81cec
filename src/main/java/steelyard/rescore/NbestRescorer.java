package steelyard.rescore;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Supplier;
import steelyard.io.Hypothesis;
import steelyard.io.InputException;
import steelyard.io.Messages;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.lm.LanguageModel;

/**
 * The rescoring service: scores each utterance's hypotheses once ({@link HypothesisScorer}), weighs them
 * log-linearly ({@link LogLinear}), turns totals into posteriors ({@link Posteriors}) and chooses by the
 * configured {@link RescoreMethod}. {@link #choose} re-weighs already scored utterances without scoring
 * again (what weight tuning needs).
 *
 * <p>Thread-safe: call {@link #rescore} from several threads; per-thread edit-distance work arrays come from a
 * {@link ThreadLocal}.
 */
public final class NbestRescorer {
  private final HypothesisScorer scorer;
  private final List<String> featureNames;
  private final RescoreWeights weights;
  private final RescoreMethod method;
  private final LanguageModel lm;
  private final LogLinear weighting;
  private final ThreadLocal<EditDistance> distance;
  private final int confidenceFeature;

  /**
   * @param lm       the model for the network search of {@link RescoreMethod#LATTICE}; may be null when λ′ = 0
   * @param distance makes one edit-distance instance per thread (for MBR)
   */
  public NbestRescorer(HypothesisScorer scorer, List<String> featureNames, RescoreWeights weights, RescoreMethod method,
      LanguageModel lm, Supplier<EditDistance> distance) {
    this.scorer = scorer;
    this.featureNames = List.copyOf(featureNames);
    this.weights = weights;
    this.method = method;
    this.lm = lm;
    this.weighting = LogLinear.of(weights, this.featureNames);
    this.distance = ThreadLocal.withInitial(distance);
    this.confidenceFeature = weights.voteConfidence() == null ? -1 : this.featureNames.indexOf(weights.voteConfidence());
    if (weights.voteConfidence() != null && confidenceFeature < 0)
      throw new IllegalArgumentException("vote confidence '" + weights.voteConfidence() + "' is not a feature");
  }

  public RescoreWeights weights() { return weights; }
  public RescoreMethod method() { return method; }
  public List<String> featureNames() { return featureNames; }
  public LogLinear weighting() { return weighting; }

  /** Scores and chooses one utterance. */
  public UtteranceResult rescore(UtteranceHypotheses u) {
    return choose(scorer.score(u));
  }

  /** Chooses for an already scored utterance with this rescorer's weights and method. */
  public UtteranceResult choose(ScoredUtterance s) {
    int n = s.size();
    double[] totals = weighting.totals(s, new double[n]);
    double[] post = posteriors(s, totals);
    switch (method) {
      case NBEST:
        return result(s, totals, post, LogLinear.best(s, totals), List.of(), null, null, null);
      case MBR: {
        MbrChoice m = new MbrChooser(distance.get(), weights.mbrMaxHypotheses()).choose(s.tokenIds(), post, tieOrders(s));
        return result(s, totals, post, m.chosen(), List.of(), m, null, null);
      }
      case CONSENSUS:
      case LATTICE: {
        List<List<String>> toks = tokenLists(s);
        ConfusionNetwork net = Lattices.network(toks, post, weights.latticeSettings());
        LatticeChoice c = network(net, toks, post);
        if (!Double.isFinite(c.score())) throw nonFinitePath(s, c);
        int chosen = c.sourceHypothesis();
        return result(s, totals, post, chosen, chosen < 0 ? c.tokens() : List.of(), null, c, net);
      }
      default:
        throw new AssertionError(method);
    }
  }

  /**
   * The posteriors this rescorer gives the hypotheses of {@code s} (totals from {@link #weighting}): the
   * system-mixed softmax, and for the network methods with a vote confidence the confidence-weighted mass
   * that enters the confusion network.
   */
  public double[] posteriors(ScoredUtterance s, double[] totals) {
    requireFinite(s, totals);
    double[] post = Posteriors.compute(s, totals, weights.posteriorScale(), systemWeights(s), new double[s.size()]);
    if (confidenceFeature >= 0 && method.usesNetwork()) Posteriors.weighByConfidence(s, post, confidenceFeature, post);
    return post;
  }

  /**
   * Refuses a total that is not finite, or a total times the posterior scale beyond
   * {@link Posteriors#MAX_SCALED_TOTAL}: finite weights and scores can still overflow, and an infinite or NaN
   * total, or posteriors flattened by clamping, would make the choice arbitrary and leave empty cells.
   */
  private void requireFinite(ScoredUtterance s, double[] totals) {
    double scale = weights.posteriorScale();
    for (int i = 0; i < s.size(); i++) {
      if (!Double.isFinite(totals[i])) {
        throw nonFinite(s, i, "the total is " + totals[i] + " (" + weighting.describeTerms(s, i, featureNames) + ")");
      }
      if (!(Math.abs(scale * totals[i]) <= Posteriors.MAX_SCALED_TOTAL)) {
        throw nonFinite(s, i, "the posterior scale " + scale + " × the total " + totals[i] + " = " + scale * totals[i]
            + " is beyond ±" + Posteriors.MAX_SCALED_TOTAL + ", where posteriors can no longer be told apart");
      }
    }
  }

  private static InputException nonFinite(ScoredUtterance s, int i, String problem) {
    Hypothesis h = s.hypothesis(i);
    String who = "utterance '" + Messages.shown(s.uttId(), 40) + "', " + (h.system().isEmpty() ? "" : "system '" + Messages.shown(h.system(), 40) + "', ")
        + "rank " + h.rank() + " (line " + h.line() + ")";
    return InputException.option("weights", who + ": " + problem,
        "weights and scores whose weighted sum stays finite (below 1.8e308 in magnitude): smaller weights or rescaled score columns");
  }

  private InputException nonFinitePath(ScoredUtterance s, LatticeChoice c) {
    return InputException.option("weights", "utterance '" + Messages.shown(s.uttId(), 40) + "': the best path of the confusion network"
        + " scores " + c.score() + " (Σ ln posterior " + c.logPosterior() + ", lattice LM weight " + weights.latticeLmWeight()
        + " × ln P " + c.lmLogProb() + ", lattice length weight " + weights.latticeLengthWeight() + " × " + c.tokenCount() + " tokens)",
        "lattice weights whose weighted sum stays finite (below 1.8e308 in magnitude)");
  }

  /** The confusion-network choice in {@code net}, built from the kept hypotheses with their (system-mixed) posteriors. */
  private LatticeChoice network(ConfusionNetwork net, List<List<String>> toks, double[] post) {
    return method == RescoreMethod.CONSENSUS
        ? Lattices.consensus(net, toks, post)
        : Lattices.searchKBest(net, toks, post, lm, weights.latticeSettings(), 1).get(0);
  }

  /**
   * The {@code k} best paths of the LM search in the network of {@code r} (built for a network method; else
   * built here from its posteriors), best first.
   */
  public List<LatticeChoice> searchKBest(UtteranceResult r, int k) {
    List<List<String>> toks = tokenLists(r.scores());
    LatticeSettings settings = weights.latticeSettings();
    ConfusionNetwork net = r.network() != null ? r.network() : Lattices.network(toks, r.posteriors(), settings);
    return Lattices.searchKBest(net, toks, r.posteriors(), lm, settings, k);
  }

  /** The scoring-unit token lists of the kept hypotheses, as the network methods take them. */
  public static List<List<String>> tokenLists(ScoredUtterance s) {
    List<List<String>> toks = new ArrayList<>(s.size());
    for (int i = 0; i < s.size(); i++) toks.add(s.tokens(i).tokens());
    return toks;
  }

  private UtteranceResult result(ScoredUtterance s, double[] totals, double[] post, int chosen, List<String> tokens,
      MbrChoice mbr, LatticeChoice lattice, ConfusionNetwork net) {
    return new UtteranceResult(s, weighting, method, totals, post, chosen, tokens, mbr, lattice, net);
  }

  /** Each present system's weight, aligned with {@code s.systems()}. */
  public double[] systemWeights(ScoredUtterance s) {
    List<String> names = s.systems();
    double[] w = new double[names.size()];
    for (int k = 0; k < w.length; k++) w[k] = weights.systemWeight(names.get(k));
    return w;
  }

  private static int[] tieOrders(ScoredUtterance s) {
    int[] t = new int[s.size()];
    for (int i = 0; i < t.length; i++) t[i] = s.tieOrder(i);
    return t;
  }
}
