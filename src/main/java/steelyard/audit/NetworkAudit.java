package steelyard.audit;

import it.unimi.dsi.fastutil.doubles.DoubleArrayList;
import java.util.ArrayList;
import java.util.List;
import steelyard.audit.PathComparison.PathTerms;
import steelyard.lattice.ConfusionNetwork;
import steelyard.lattice.LatticeChoice;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.lm.LanguageModel;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.UtteranceResult;

/**
 * The network side of an overrule by the consensus or lattice method: the confusion network is rebuilt from
 * the result's hypotheses and posteriors with the run's settings (the same network the method searched), and
 * read for rank 1's own path and for the k-best path pool. Consensus decoding is the search with λ′ = μ′ = 0.
 */
final class NetworkAudit {
  private final UtteranceResult r;
  private final LanguageModel lm;
  private final LatticeSettings settings;
  private final List<List<String>> hypotheses;
  private final ConfusionNetwork net;

  NetworkAudit(AuditSettings audit, UtteranceResult r) {
    LatticeSettings given = audit.network();
    if (given == null)
      throw new IllegalArgumentException("the " + r.method().label() + " method needs the network settings");
    this.r = r;
    this.lm = audit.lm();
    this.settings = r.method() == RescoreMethod.CONSENSUS
        ? new LatticeSettings(0, 0, given.beam(), given.maxHypotheses())
        : given;
    this.hypotheses = NbestRescorer.tokenLists(r.scores());
    this.net = Lattices.network(hypotheses, r.posteriors(), given);
  }

  /** The chosen path against rank 1's own path in the network. */
  PathComparison paths(int first) {
    LatticeChoice c = r.lattice();
    PathTerms pick = new PathTerms(c.logPosterior(), lmLogProb(c.tokens()), c.tokenCount());
    int k = enteredPath(first);
    List<String> own = hypotheses.get(first);
    PathTerms rank1 = k < 0 ? null : new PathTerms(pathLogPosterior(k), lmLogProb(own), own.size());
    return new PathComparison(settings.lmWeight(), settings.lengthWeight(), pick, rank1);
  }

  /**
   * Flip weights along λ′ (μ′ held) over the pool: the chosen path, the {@code k} best paths of a re-search at
   * the run's weights, and rank 1's own path; each is the line Σ ln posterior + μ′·tokens + λ′·ln P_LM. Null
   * without a model.
   */
  FlipWeights poolFlip(int first, int k) {
    if (lm == null) return null;
    List<List<String>> tokens = new ArrayList<>();
    DoubleArrayList a = new DoubleArrayList();
    DoubleArrayList b = new DoubleArrayList();
    LatticeChoice c = r.lattice();
    addLine(tokens, a, b, c.tokens(), c.logPosterior());
    for (LatticeChoice p : Lattices.searchKBest(net, hypotheses, r.posteriors(), lm, settings, k))
      addLine(tokens, a, b, p.tokens(), p.logPosterior());
    int entered = enteredPath(first);
    if (entered >= 0) addLine(tokens, a, b, hypotheses.get(first), pathLogPosterior(entered));
    int[] tie = new int[tokens.size()];
    for (int i = 0; i < tie.length; i++) tie[i] = i;
    return FlipFinder.find(FlipWeights.Basis.POOL, a.toDoubleArray(), b.toDoubleArray(), tie, tokens,
        settings.lmWeight(), c.tokens(), hypotheses.get(first));
  }

  /** Adds a path's line unless it is not finite (an arc of posterior 0 on rank 1's own path). */
  private void addLine(
      List<List<String>> tokens, DoubleArrayList a, DoubleArrayList b, List<String> path, double logPosterior) {
    double intercept = logPosterior + settings.lengthWeight() * path.size();
    double slope = lmLogProb(path);
    if (!Double.isFinite(intercept) || !Double.isFinite(slope)) return;
    tokens.add(path);
    a.add(intercept);
    b.add(slope);
  }

  /** Entry number of rank 1's path, else of an entered hypothesis with the same tokens; −1 when none entered. */
  private int enteredPath(int first) {
    int k = net.enteredIndexOf(first);
    for (int e = 0; k < 0 && e < net.enteredCount(); e++)
      if (hypotheses.get(net.enteredInput(e)).equals(hypotheses.get(first))) k = e;
    return k;
  }

  private double pathLogPosterior(int entered) {
    double sum = 0;
    for (int s = 0; s < net.slotCount(); s++) sum += Math.log(net.arcPosterior(net.pathArc(entered, s)));
    return sum;
  }

  /** ln P_LM of network tokens as the search scores them (each token goes to the model as it is); 0 without one. */
  private double lmLogProb(List<String> tokens) {
    return lm == null ? 0 : lm.sentenceLogProb(tokens);
  }
}
