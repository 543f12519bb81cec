package steelyard.lattice;

import it.unimi.dsi.fastutil.ints.IntArrayList;
import it.unimi.dsi.fastutil.ints.IntArrays;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;

/**
 * LM-rescored search of a {@link ConfusionNetwork}: the k best paths under
 * {@code Σ ln(arc posterior) + λ′·ln P_LM(<s> path </s>) + μ′·(non-empty tokens)} (natural log, higher is
 * better), by a slot-synchronous Viterbi search over states (slot boundary, LM state).
 *
 * <p>Paths whose LM states are {@link LmState#equals equal} recombine: they score every continuation alike,
 * so keeping the best k partial paths of each state loses nothing, and with an unbounded beam the search is
 * exact. Partial paths of one state with the same text keep only the better one, so the k results are k
 * distinct texts. The beam keeps the {@code beam} states with the best partial score after each slot
 * (ties: the state created first); for k = 1 and λ′ ≥ 0 an extension that cannot reach a running lower bound
 * on the slot's beam-th state score is skipped, mostly before its LM query, which keeps exactly the same
 * states ({@link Layer#bound}). Arcs are tried by descending posterior. Empty arcs leave the LM state
 * unchanged; arcs of posterior 0 are never taken. When λ′ = 0 the LM is not consulted and all paths share one state: the search then picks per slot
 * the arc maximising ln p + μ′·[non-empty], which with μ′ = 0 is consensus decoding.
 *
 * <p>Storage: partial paths in a pool of parallel primitive arrays (score, Σ ln posterior, LM log-prob,
 * token count, parent, arc, text hash: 48 bytes each, one per kept extension); per layer an array of
 * {@link LmState}s reused across slots, k node indices per state, and an {@code Object2IntOpenHashMap} from
 * state to index. Work O(slots × beam × arcs × k) LM queries and insertions. Not thread-safe; one per search.
 */
final class LatticeSearch {
  private final ConfusionNetwork net;
  private final LanguageModel lm;
  private final double lmWeight;
  private final double lengthWeight;
  private final int beam;
  private final int k;
  private final int[] lmIds;
  private final double[] lnPost;
  /** Arcs of each slot by descending posterior (ties: arc order), in the slot's own index range. */
  private final int[] arcOrder;
  /** Whether a path's LM term can only lower its score, so posterior and length bound it from above. */
  private final boolean boundable;
  private final IntArrayList textA = new IntArrayList();
  private final IntArrayList textB = new IntArrayList();
  private double[] nScore = new double[256];
  private double[] nLogPost = new double[256];
  private double[] nLm = new double[256];
  private int[] nTokens = new int[256];
  private int[] nParent = new int[256];
  private int[] nArc = new int[256];
  private long[] nHash = new long[256];
  private int nodes;
  private boolean pruned;

  LatticeSearch(ConfusionNetwork net, LanguageModel lm, LatticeSettings settings, int k) {
    if (k < 1) throw new IllegalArgumentException("k must be >= 1: " + k);
    if (settings.lmWeight() != 0 && lm == null) throw new IllegalArgumentException("an LM weight needs a language model");
    if (!Double.isFinite(settings.lmWeight()) || !Double.isFinite(settings.lengthWeight()))
      throw new IllegalArgumentException("weights must be finite: " + settings);
    this.net = net;
    this.lm = settings.lmWeight() == 0 ? null : lm;
    this.lmWeight = settings.lmWeight();
    this.lengthWeight = settings.lengthWeight();
    this.beam = settings.beam();
    this.k = k;
    int arcs = net.arcCount();
    lmIds = new int[arcs];
    lnPost = new double[arcs];
    for (int a = 0; a < arcs; a++) {
      lnPost[a] = Math.log(net.arcPosterior(a));
      if (this.lm != null && !net.isEmpty(a)) lmIds[a] = this.lm.wordId(net.arcText(a));
    }
    arcOrder = new int[arcs];
    for (int a = 0; a < arcs; a++) arcOrder[a] = a;
    for (int s = 0; s < net.slotCount(); s++) {
      IntArrays.mergeSort(arcOrder, net.arcStart(s), net.arcEnd(s), (x, y) -> {
        int c = Double.compare(lnPost[y], lnPost[x]);
        return c != 0 ? c : Integer.compare(x, y);
      });
    }
    boundable = k == 1 && lmWeight >= 0;
  }

  /** Whether the beam dropped states in the last {@link #run}. */
  boolean pruned() {
    return pruned;
  }

  /** The best paths, best first (at most k, fewer when the network has fewer distinct texts). */
  List<Path> run() {
    nodes = 0;
    pruned = false;
    Layer cur = new Layer(lm, k, beam);
    Layer next = new Layer(lm, k, beam);
    LmState scratch = lm == null ? null : lm.newState();
    if (lm != null) lm.beginSentence(scratch);
    int root = newNode(0, 0, 0, 0, -1, -1, 17L);
    int start = cur.find(scratch);
    cur.count[start] = 1;
    cur.nodes[0] = root;
    cur.best[start] = 0;
    cur.finish(beam);
    for (int s = 0; s < net.slotCount(); s++) {
      next.clear();
      expand(cur, next, s, scratch);
      pruned |= next.finish(beam);
      Layer t = cur;
      cur = next;
      next = t;
    }
    return finals(cur, scratch);
  }

  private void expand(Layer cur, Layer next, int slot, LmState scratch) {
    int live = Math.min(cur.size, beam);
    for (int o = 0; o < live; o++) {
      int st = cur.order[o];
      double from = cur.best[st];
      for (int x = net.arcStart(slot); x < net.arcEnd(slot); x++) {
        int a = arcOrder[x];
        if (lnPost[a] == Double.NEGATIVE_INFINITY) break;
        boolean token = !net.isEmpty(a);
        double upper = from + lnPost[a] + (token ? lengthWeight : 0);
        if (boundable && upper < next.bound()) {
          pruned |= lm != null; // without an LM there is one state, which the beam always keeps
          // k = 1 and λ′ ≥ 0: the LM can only lower a score. Arcs come by descending posterior and states
          // by descending score, so once even the best case of this arc misses the bound, so does every
          // later arc of this state, and when it is the state's first arc, every later state.
          if (from + lnPost[a] + Math.max(0, lengthWeight) < next.bound()) {
            if (x == net.arcStart(slot)) return;
            break;
          }
          continue;
        }
        double lmDelta = 0;
        int target;
        if (lm == null) {
          target = next.find(null);
        } else if (token) {
          lmDelta = lm.score(cur.states[st], lmIds[a], scratch);
          if (boundable && upper + lmWeight * lmDelta < next.bound()) {
            pruned = true;
            continue;
          }
          target = next.find(scratch);
        } else {
          target = next.find(cur.states[st]);
        }
        double add = lnPost[a] + lmWeight * lmDelta + (token ? lengthWeight : 0);
        for (int r = 0; r < cur.count[st]; r++) offer(next, target, cur.nodes[st * k + r], a, add, lmDelta, token);
      }
    }
  }

  private void offer(Layer layer, int target, int parent, int arc, double add, double lmDelta, boolean token) {
    double score = nScore[parent] + add;
    int base = target * k;
    int cnt = layer.count[target];
    if (cnt == k && !(score > nScore[layer.nodes[base + k - 1]])) return;
    long hash = token ? (nHash[parent] * 0x9E3779B97F4A7C15L) ^ (net.arcToken(arc) + 0x632BE59BD9B4E019L) : nHash[parent];
    if (k > 1) {
      for (int r = 0; r < cnt; r++) {
        int other = layer.nodes[base + r];
        if (nHash[other] != hash || !sameText(other, parent, arc)) continue;
        if (!(score > nScore[other])) return;
        System.arraycopy(layer.nodes, base + r + 1, layer.nodes, base + r, cnt - r - 1);
        cnt--;
        break;
      }
    }
    if (cnt == 0) layer.created(score);
    int node = newNode(score, nLogPost[parent] + lnPost[arc], nLm[parent] + lmDelta,
        nTokens[parent] + (token ? 1 : 0), parent, arc, hash);
    int pos = Math.min(cnt, k - 1);
    while (pos > 0 && score > nScore[layer.nodes[base + pos - 1]]) {
      if (pos < k) layer.nodes[base + pos] = layer.nodes[base + pos - 1];
      pos--;
    }
    layer.nodes[base + pos] = node;
    layer.count[target] = Math.min(cnt + 1, k);
    layer.best[target] = nScore[layer.nodes[base]];
  }

  private boolean sameText(int node, int parent, int arc) {
    texts(node, textA);
    texts(parent, textB);
    if (!net.isEmpty(arc)) textB.add(net.arcToken(arc));
    return textA.equals(textB);
  }

  private void texts(int node, IntArrayList out) {
    out.clear();
    for (int n = node; n >= 0 && nArc[n] >= 0; n = nParent[n]) if (!net.isEmpty(nArc[n])) out.add(net.arcToken(nArc[n]));
    Collections.reverse(out);
  }

  private List<Path> finals(Layer cur, LmState scratch) {
    int live = Math.min(cur.size, beam);
    IntArrayList cand = new IntArrayList();
    it.unimi.dsi.fastutil.doubles.DoubleArrayList finalScore = new it.unimi.dsi.fastutil.doubles.DoubleArrayList();
    it.unimi.dsi.fastutil.doubles.DoubleArrayList finalLm = new it.unimi.dsi.fastutil.doubles.DoubleArrayList();
    for (int o = 0; o < live; o++) {
      int st = cur.order[o];
      double end = lm == null ? 0 : lm.score(cur.states[st], lm.sentenceEndId(), scratch);
      for (int r = 0; r < cur.count[st]; r++) {
        int node = cur.nodes[st * k + r];
        cand.add(node);
        finalScore.add(nScore[node] + lmWeight * end);
        finalLm.add(nLm[node] + end);
      }
    }
    int[] order = new int[cand.size()];
    for (int i = 0; i < order.length; i++) order[i] = i;
    IntArrays.mergeSort(order, (x, y) -> {
      int c = Double.compare(finalScore.getDouble(y), finalScore.getDouble(x));
      return c != 0 ? c : Integer.compare(x, y);
    });
    List<Path> out = new ArrayList<>();
    for (int i = 0; i < Math.min(k, order.length); i++) {
      int node = cand.getInt(order[i]);
      IntArrayList toks = new IntArrayList();
      texts(node, toks);
      List<String> tokens = new ArrayList<>(toks.size());
      for (int t : toks) tokens.add(net.vocabulary().token(t));
      out.add(new Path(tokens, finalScore.getDouble(order[i]), nLogPost[node], finalLm.getDouble(order[i]), nTokens[node]));
    }
    return out;
  }

  private int newNode(double score, double logPost, double lmLp, int tokens, int parent, int arc, long hash) {
    if (nodes == nScore.length) {
      int c = nodes * 2;
      nScore = java.util.Arrays.copyOf(nScore, c);
      nLogPost = java.util.Arrays.copyOf(nLogPost, c);
      nLm = java.util.Arrays.copyOf(nLm, c);
      nTokens = java.util.Arrays.copyOf(nTokens, c);
      nParent = java.util.Arrays.copyOf(nParent, c);
      nArc = java.util.Arrays.copyOf(nArc, c);
      nHash = java.util.Arrays.copyOf(nHash, c);
    }
    nScore[nodes] = score;
    nLogPost[nodes] = logPost;
    nLm[nodes] = lmLp;
    nTokens[nodes] = tokens;
    nParent[nodes] = parent;
    nArc[nodes] = arc;
    nHash[nodes] = hash;
    return nodes++;
  }

  /** One result path: natural-log terms as in {@link LatticeChoice}. */
  record Path(List<String> tokens, double score, double logPosterior, double lmLogProb, int tokenCount) {}
}
