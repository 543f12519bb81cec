package steelyard.lattice;

import java.util.ArrayList;
import java.util.List;
import steelyard.lm.LanguageModel;

/**
 * Entry points of the confusion-network methods, used by the rescore command. Hypotheses are given as
 * normalised token lists in one unit (words, or grapheme clusters with the space token), with their
 * posteriors (probabilities ≥ 0, normally summing to 1; they are renormalised over the hypotheses that enter
 * the network; the caller computes them, e.g. per system and mixed by system weights). At most
 * {@link LatticeSettings#maxHypotheses()} hypotheses enter, highest posterior first (ties: input order);
 * {@link LatticeChoice#capped()} says when that cap (or the search beam) applied.
 *
 * <p>Every method builds the network afresh; to run several methods over one utterance build it once with
 * {@link #network} and use the overloads taking a {@link ConfusionNetwork}.
 */
public final class Lattices {
  private Lattices() {}

  /** The confusion network of one utterance's hypotheses. */
  public static ConfusionNetwork network(List<List<String>> hypotheses, double[] posteriors, LatticeSettings settings) {
    return ConfusionNetwork.build(hypotheses, posteriors, settings.maxHypotheses());
  }

  /**
   * Consensus decoding: the highest-posterior arc per slot, empty arcs dropped from the output. Ties go to
   * the arc that appeared first in the slot, i.e. the arc of the earliest-entered hypothesis (highest
   * posterior, then input order). The weights of {@code settings} are not used: the score is Σ ln posterior.
   */
  public static LatticeChoice consensus(List<List<String>> hypotheses, double[] posteriors, LatticeSettings settings) {
    return consensus(network(hypotheses, posteriors, settings), hypotheses, posteriors);
  }

  /** Consensus decoding of a built network ({@code hypotheses}, {@code posteriors}: the inputs it was built from). */
  public static LatticeChoice consensus(ConfusionNetwork net, List<List<String>> hypotheses, double[] posteriors) {
    List<String> tokens = new ArrayList<>();
    double logPost = 0;
    for (int s = 0; s < net.slotCount(); s++) {
      int best = net.consensusArc(s);
      logPost += Math.log(net.arcPosterior(best));
      if (!net.isEmpty(best)) tokens.add(net.arcText(best));
    }
    return new LatticeChoice(tokens, sourceOf(tokens, hypotheses, posteriors), logPost, logPost, 0, tokens.size(), net.capped());
  }

  /**
   * The best path under Σ ln arc-posterior + λ′·LM + μ′·tokens, by beam search over (slot, LM state); see
   * {@link LatticeSearch}. {@code lm} may be null when λ′ = 0. With λ′ = μ′ = 0 this is consensus decoding.
   */
  public static LatticeChoice search(
      List<List<String>> hypotheses, double[] posteriors, LanguageModel lm, LatticeSettings settings) {
    return searchKBest(hypotheses, posteriors, lm, settings, 1).get(0);
  }

  /** The {@code k} best distinct paths (fewer when the network has fewer), best first. */
  public static List<LatticeChoice> searchKBest(
      List<List<String>> hypotheses, double[] posteriors, LanguageModel lm, LatticeSettings settings, int k) {
    return searchKBest(network(hypotheses, posteriors, settings), hypotheses, posteriors, lm, settings, k);
  }

  /** As {@link #searchKBest(List, double[], LanguageModel, LatticeSettings, int)} over a built network. */
  public static List<LatticeChoice> searchKBest(
      ConfusionNetwork net, List<List<String>> hypotheses, double[] posteriors, LanguageModel lm, LatticeSettings settings, int k) {
    LatticeSearch search = new LatticeSearch(net, lm, settings, k);
    List<LatticeSearch.Path> paths = search.run();
    boolean capped = net.capped() || search.pruned();
    List<LatticeChoice> out = new ArrayList<>(paths.size());
    for (LatticeSearch.Path p : paths) {
      double lmLp = settings.lmWeight() == 0 ? 0 : p.lmLogProb();
      out.add(new LatticeChoice(
          p.tokens(), sourceOf(p.tokens(), hypotheses, posteriors), p.score(), p.logPosterior(), lmLp, p.tokenCount(), capped));
    }
    return out;
  }

  /** Fewest errors (S+D+I against {@code reference}) of any path through the network: the lattice oracle. */
  public static int oracleErrors(List<List<String>> hypotheses, double[] posteriors, List<String> reference, LatticeSettings settings) {
    return oracle(network(hypotheses, posteriors, settings), reference).errors();
  }

  /** The lattice-oracle path of a built network and its errors against {@code reference}. */
  public static OraclePath oracle(ConfusionNetwork net, List<String> reference) {
    return LatticeOracle.best(net, reference);
  }

  /**
   * Weighted voting over one output per system (system combination with equal confidence): consensus of the
   * network built with posteriors proportional to the system weights.
   */
  public static LatticeChoice vote(List<List<String>> outputs, double[] systemWeights) {
    double[] ones = new double[outputs.size()];
    java.util.Arrays.fill(ones, 1);
    return vote(outputs, systemWeights, ones);
  }

  /**
   * Weighted voting with a confidence per output: posterior ∝ system weight × confidence (both ≥ 0). Works
   * at any unit; for OCR lines pass grapheme clusters with the space token.
   */
  public static LatticeChoice vote(List<List<String>> outputs, double[] systemWeights, double[] confidences) {
    double[] p = votePosteriors(outputs, systemWeights, confidences);
    return consensus(outputs, p, new LatticeSettings(0, 0, LatticeSettings.DEFAULT_BEAM, outputs.size()));
  }

  /**
   * Weighted voting with the LM in the search: the lattice search over the voting network (posterior ∝
   * system weight × confidence), with λ′, μ′ and the beam of {@code settings}; every output enters.
   */
  public static LatticeChoice vote(
      List<List<String>> outputs, double[] systemWeights, double[] confidences, LanguageModel lm, LatticeSettings settings) {
    double[] p = votePosteriors(outputs, systemWeights, confidences);
    LatticeSettings all = new LatticeSettings(settings.lmWeight(), settings.lengthWeight(), settings.beam(), outputs.size());
    return search(outputs, p, lm, all);
  }

  private static double[] votePosteriors(List<List<String>> outputs, double[] systemWeights, double[] confidences) {
    if (outputs.isEmpty()) throw new IllegalArgumentException("no outputs to vote over");
    if (systemWeights.length != outputs.size() || confidences.length != outputs.size())
      throw new IllegalArgumentException("need one system weight and one confidence per output: " + outputs.size());
    double[] p = new double[outputs.size()];
    double sum = 0;
    for (int i = 0; i < p.length; i++) sum += p[i] = systemWeights[i] * confidences[i];
    if (!(sum > 0) || Double.isInfinite(sum))
      throw new IllegalArgumentException("system weights × confidences must have a positive finite sum");
    for (int i = 0; i < p.length; i++) p[i] /= sum;
    return p;
  }

  /**
   * Index of the input whose tokens equal {@code tokens}: the one with the highest posterior, ties the
   * lowest index; −1 when none does (a new transcript).
   */
  static int sourceOf(List<String> tokens, List<List<String>> hypotheses, double[] posteriors) {
    int found = -1;
    for (int i = 0; i < hypotheses.size(); i++) {
      if (!hypotheses.get(i).equals(tokens)) continue;
      if (found < 0 || posteriors[i] > posteriors[found]) found = i;
    }
    return found;
  }
}
