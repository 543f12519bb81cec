package steelyard.rescore;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.List;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.TokenSequence;

/**
 * The unweighted score terms of every kept hypothesis of one utterance, computed once (LM included) so
 * that any number of weightings can be tried without scoring again.
 *
 * <p>Storage, n = kept hypotheses, F = features: {@code features} is a row-major {@code double[n·F]}
 * (natural log, higher is better, as imported), {@code lmLogProb} a {@code double[n]} (ln P of the sentence
 * with {@code <s>}/{@code </s>}; 0 when no model is loaded), {@code oovCount} and {@code tokenCount}
 * {@code int[n]}, {@code row} {@code int[n]} (index into the utterance's hypotheses), {@code tieOrder}
 * {@code int[n]}, {@code system} {@code int[n]} (index into {@code systems}, sorted names). About
 * 8·F + 28 bytes per hypothesis plus the token lists. Immutable after construction except for the lazily
 * built token-id view, which is not thread-safe (one utterance is handled by one thread).
 */
public final class ScoredUtterance {
  private final UtteranceHypotheses utterance;
  private final int[] row;
  private final int featureCount;
  private final double[] features;
  private final double[] lmLogProb;
  private final int[] oovCount;
  private final int[] tokenCount;
  private final int[] tieOrder;
  private final int[] system;
  private final List<String> systems;
  private final List<TokenSequence> tokens;
  private int[][] tokenIds;
  private Object2IntOpenHashMap<String> localVocabulary;

  ScoredUtterance(UtteranceHypotheses utterance, int[] row, int featureCount, double[] features, double[] lmLogProb,
      int[] oovCount, int[] tokenCount, int[] tieOrder, int[] system, List<String> systems, List<TokenSequence> tokens) {
    this.utterance = utterance;
    this.row = row;
    this.featureCount = featureCount;
    this.features = features;
    this.lmLogProb = lmLogProb;
    this.oovCount = oovCount;
    this.tokenCount = tokenCount;
    this.tieOrder = tieOrder;
    this.system = system;
    this.systems = List.copyOf(systems);
    this.tokens = List.copyOf(tokens);
  }

  public UtteranceHypotheses utterance() { return utterance; }
  public String uttId() { return utterance.uttId(); }
  /** Number of kept hypotheses (after {@code --max-hyps}). */
  public int size() { return row.length; }
  public int featureCount() { return featureCount; }
  /** The imported row of kept hypothesis {@code i}. */
  public Hypothesis hypothesis(int i) { return utterance.hypotheses().get(row[i]); }
  /** Index of kept hypothesis {@code i} in the utterance's rows. */
  public int row(int i) { return row[i]; }
  /** Natural-log value of feature {@code f} of hypothesis {@code i}. */
  public double feature(int i, int f) { return features[i * featureCount + f]; }
  public double lmLogProb(int i) { return lmLogProb[i]; }
  public int oovCount(int i) { return oovCount[i]; }
  public int tokenCount(int i) { return tokenCount[i]; }
  /** Position of hypothesis {@code i} in the tie order: rank, then system name, then file order (0 first). */
  public int tieOrder(int i) { return tieOrder[i]; }
  /** Index into {@link #systems()} of hypothesis {@code i}'s system. */
  public int systemIndex(int i) { return system[i]; }
  /** Distinct system names of this utterance, sorted. */
  public List<String> systems() { return systems; }
  /** Normalised tokens of hypothesis {@code i} in the scoring unit. */
  public TokenSequence tokens(int i) { return tokens.get(i); }

  /** Kept index of the recogniser's own pick (rank 1); always kept. */
  public int firstIndex() {
    int pick = utterance.recognizerPick();
    for (int i = 0; i < row.length; i++) if (row[i] == pick) return i;
    throw new IllegalStateException("rank 1 of " + uttId() + " was not kept");
  }

  /** Token ids (an utterance-local vocabulary) of each hypothesis' scoring tokens, for edit distances. */
  public int[][] tokenIds() {
    if (tokenIds == null) {
      tokenIds = new int[row.length][];
      for (int i = 0; i < row.length; i++) tokenIds[i] = idsOf(tokens.get(i).tokens());
    }
    return tokenIds;
  }

  /** Ids of {@code toks} in the same local vocabulary as {@link #tokenIds()} (new tokens get new ids). */
  public int[] idsOf(List<String> toks) {
    if (localVocabulary == null) localVocabulary = new Object2IntOpenHashMap<>();
    int[] ids = new int[toks.size()];
    for (int k = 0; k < ids.length; k++) {
      String t = toks.get(k);
      int id = localVocabulary.getInt(t);
      if (id == 0 && !localVocabulary.containsKey(t)) {
        id = localVocabulary.size();
        localVocabulary.put(t, id);
      }
      ids[k] = id;
    }
    return ids;
  }
}
