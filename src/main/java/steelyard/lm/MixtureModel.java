package steelyard.lm;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Exact linear interpolation of component models: P(w | h) = Σᵢ λᵢ·Pᵢ(w | h), every Pᵢ with its own
 * back-off. Scores are natural log, like every {@link LanguageModel}.
 *
 * <p>The vocabulary is the union of the vocabularies of the components with a weight above 0 (first
 * component's ids first, in order); a component with weight 0 takes no part at all, so weights 1, 0 give
 * exactly the first model. A token outside one component's vocabulary gets probability 0 from that component
 * (as history it counts as that component's {@code <unk>}), and the union's {@code <unk>} — every token outside
 * the union — gets Σᵢ λᵢ·Pᵢ({@code <unk>} | h). So the mixture sums to 1 over its vocabulary in every context, as
 * each component does over its own. (Scoring a token a component lacks as that component's {@code <unk>}
 * would give every such token the whole {@code <unk>} mass again: the sum would exceed 1, the exact mixture's
 * perplexity would be flattering, and its static approximation, which must renormalise, would score worse than
 * its own components even at weights 1, 0.) A state keeps the last
 * (max order − 1) tokens; each query replays that history through every component, so a query costs
 * O(components · order) component queries — exact, not fast. For speed, write the static approximation
 * ({@link steelyard.lm.mix.StaticMixture}) and query that.
 *
 * <p>Storage: per component an {@code int[]} mapping union ids to component ids (4 bytes per token per
 * component). Immutable; safe for concurrent readers (working states are per thread).
 */
public final class MixtureModel implements LanguageModel {
  private final List<LanguageModel> components;
  private final double[] weights;
  private final int order;
  private final List<String> tokens = new ArrayList<>();
  private final Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
  private final int[][] componentIds;
  private final ThreadLocal<LmState[]> scratch;
  /** Marks a union token that a component does not know: probability 0 there, {@code <unk>} as history. */
  private static final int ABSENT = -1;

  /** Mixes {@code components} with {@code weights} (non-negative, summing to 1 within 1e-9). */
  public MixtureModel(List<? extends LanguageModel> components, double[] weights) {
    if (components.isEmpty()) throw new IllegalArgumentException("no components");
    if (weights.length != components.size())
      throw new IllegalArgumentException("weights " + weights.length + " != components " + components.size());
    double sum = 0;
    for (double w : weights) {
      if (!(w >= 0)) throw new IllegalArgumentException("mixture weight must be >= 0: " + w);
      sum += w;
    }
    if (Math.abs(sum - 1) > 1e-9) throw new IllegalArgumentException("mixture weights must sum to 1: " + sum);
    this.components = List.copyOf(components);
    this.weights = weights.clone();
    ids.defaultReturnValue(-1);
    int maxOrder = 1;
    for (String special : new String[] {BackoffModel.SENTENCE_START, BackoffModel.SENTENCE_END, BackoffModel.UNKNOWN})
      intern(special);
    for (int i = 0; i < this.components.size(); i++) {
      if (weights[i] == 0) continue;
      LanguageModel c = this.components.get(i);
      maxOrder = Math.max(maxOrder, c.order());
      for (int id = 0; id < c.vocabularySize(); id++) intern(c.token(id));
    }
    this.order = maxOrder;
    componentIds = new int[this.components.size()][];
    for (int i = 0; i < componentIds.length; i++) {
      LanguageModel c = this.components.get(i);
      int[] map = new int[tokens.size()];
      for (int u = 0; u < map.length; u++) map[u] = idIn(c, tokens.get(u));
      componentIds[i] = map;
    }
    scratch = ThreadLocal.withInitial(() -> {
      LmState[] s = new LmState[this.components.size()];
      for (int i = 0; i < s.length; i++) s[i] = this.components.get(i).newState();
      return s;
    });
  }

  /** The component's id of {@code token}, or {@link #ABSENT} when the component does not know it. */
  private static int idIn(LanguageModel c, String token) {
    int id = c.wordId(token);
    return id >= 0 && c.token(id).equals(token) ? id : ABSENT;
  }

  private void intern(String t) {
    if (ids.getInt(t) >= 0) return;
    ids.put(t, tokens.size());
    tokens.add(t);
  }

  public List<LanguageModel> components() { return components; }
  public double[] weights() { return weights.clone(); }

  @Override public int order() { return order; }
  @Override public Unit unit() { return components.get(0).unit(); }
  @Override public NormalisationOptions normalisation() { return components.get(0).normalisation(); }
  @Override public int vocabularySize() { return tokens.size(); }
  @Override public String token(int id) { return tokens.get(id); }
  @Override public int unknownId() { return 2; }
  @Override public int sentenceStartId() { return 0; }
  @Override public int sentenceEndId() { return 1; }

  @Override
  public int wordId(String token) {
    int id = ids.getInt(token);
    return id < 0 ? unknownId() : id;
  }

  @Override
  public LmState newState() {
    return new LmState(order - 1);
  }

  @Override
  public void beginSentence(LmState out) {
    out.length = 0;
    out.handle = 0;
    if (order > 1) {
      out.history[0] = sentenceStartId();
      out.length = 1;
    }
  }

  @Override
  public double score(LmState in, int word, LmState out) {
    double p = 0;
    LmState[] states = scratch.get();
    for (int i = 0; i < components.size(); i++) {
      if (weights[i] == 0) continue;
      p += weights[i] * Math.exp(componentLogProb(i, states[i], in, word));
    }
    shift(in, word, out);
    return Math.log(p);
  }

  /** ln Pᵢ(word | history of {@code in}) of component {@code i}; −∞ for a token outside its vocabulary. */
  public double componentLogProb(int i, LmState in, int word) {
    return componentLogProb(i, scratch.get()[i], in, word);
  }

  private double componentLogProb(int i, LmState s, LmState in, int word) {
    int id = componentIds[i][word];
    if (id == ABSENT) return Double.NEGATIVE_INFINITY;
    replay(i, s, in);
    return components.get(i).score(s, id, s);
  }

  /**
   * The longest n-gram that any component with a non-zero weight listed for {@code word} after this history
   * (each component backs off on its own, so a mixture has no single back-off path).
   */
  @Override
  public int matchedOrder(LmState in, int word) {
    LmState[] states = scratch.get();
    int best = 0;
    for (int i = 0; i < components.size(); i++) {
      if (weights[i] == 0) continue;
      int id = componentIds[i][word];
      if (id == ABSENT) continue; // outside this component's vocabulary: it lists nothing for the word
      replay(i, states[i], in);
      best = Math.max(best, components.get(i).matchedOrder(states[i], id));
    }
    return best;
  }

  /** Sets {@code s} to component {@code i}'s state after the (at most its order − 1) last tokens of {@code in}. */
  private void replay(int i, LmState s, LmState in) {
    LanguageModel c = components.get(i);
    int[] map = componentIds[i];
    s.length = 0;
    s.handle = 0;
    int skip = Math.max(0, in.length - (c.order() - 1));
    for (int j = skip; j < in.length; j++) {
      int h = in.history[j];
      if (h == sentenceStartId() && j == skip && j == 0) c.beginSentence(s);
      else c.score(s, map[h] == ABSENT ? c.unknownId() : map[h], s);
    }
  }

  private void shift(LmState in, int word, LmState out) {
    int cap = order - 1;
    if (cap == 0) {
      out.length = 0;
      return;
    }
    int keep = Math.min(in.length, cap - 1);
    System.arraycopy(in.history, in.length - keep, out.history, 0, keep);
    out.history[keep] = word;
    out.length = keep + 1;
    out.handle = 0;
  }
}
