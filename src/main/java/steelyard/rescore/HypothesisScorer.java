package steelyard.rescore;

import it.unimi.dsi.fastutil.ints.IntArrays;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.TreeMap;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;
import steelyard.text.TokenSequence;

/**
 * Computes the unweighted terms of every hypothesis ({@link ScoredUtterance}): features as imported, the
 * model's ln P(sentence) with {@code <s>}/{@code </s>} (every unknown token scored as {@code <unk>}), the
 * number of out-of-vocabulary tokens (in the model's tokenisation) and the number of tokens (in the scoring
 * unit). Thread-safe: the model is shared, LM states are per call.
 */
public final class HypothesisScorer {
  private final LanguageModel lm;
  private final Tokenizer lmTokens;
  private final Tokenizer unitTokens;
  private final int featureCount;
  private final int maxHyps;

  /**
   * @param lm         the model, or null when no LM term is wanted (ln P and OOV count are then 0)
   * @param lmTokens   tokenisation with the model's recorded normalisation and unit (ignored without a model)
   * @param unitTokens tokenisation in the scoring unit (length term, MBR, networks, references); may be the
   *                   same object as {@code lmTokens}, and is then run once
   * @param maxHyps    keep at most this many hypotheses per system, by rank (≤ 0: all)
   */
  public HypothesisScorer(LanguageModel lm, Tokenizer lmTokens, Tokenizer unitTokens, int featureCount, int maxHyps) {
    this.lm = lm;
    this.lmTokens = lmTokens;
    this.unitTokens = unitTokens;
    this.featureCount = featureCount;
    this.maxHyps = maxHyps;
  }

  public boolean hasModel() {
    return lm != null;
  }

  public ScoredUtterance score(UtteranceHypotheses u) {
    List<Hypothesis> hyps = u.hypotheses();
    int[] row = keptRows(u);
    int n = row.length;
    double[] feats = new double[n * featureCount];
    double[] lnP = new double[n];
    int[] oov = new int[n];
    int[] len = new int[n];
    List<TokenSequence> toks = new ArrayList<>(n);
    LmState state = lm == null ? null : lm.newState();
    for (int i = 0; i < n; i++) {
      Hypothesis h = hyps.get(row[i]);
      double[] f = h.features();
      if (f.length != featureCount)
        throw new IllegalArgumentException("hypothesis has " + f.length + " features, expected " + featureCount);
      System.arraycopy(f, 0, feats, i * featureCount, featureCount);
      TokenSequence unit = unitTokens.tokenize(h.text());
      toks.add(unit);
      len[i] = unit.size();
      if (lm != null) {
        List<String> lmToks = lmTokens == unitTokens ? unit.tokens() : lmTokens.tokenize(h.text()).tokens();
        lnP[i] = sentence(lmToks, state, oov, i);
      }
    }
    List<String> systems = new ArrayList<>();
    int[] sys = systemIndexes(hyps, row, systems);
    return new ScoredUtterance(u, row, featureCount, feats, lnP, oov, len, tieOrder(hyps, row), sys, systems, toks);
  }

  /** Index of each kept row's system among the sorted distinct names (filled into {@code names}). */
  private static int[] systemIndexes(List<Hypothesis> hyps, int[] row, List<String> names) {
    int n = row.length;
    int[] sys = new int[n];
    String only = hyps.get(row[0]).system();
    boolean single = true;
    for (int i = 1; i < n && single; i++) single = hyps.get(row[i]).system().equals(only);
    if (single) {
      names.add(only);
      return sys;
    }
    TreeMap<String, Integer> ids = new TreeMap<>();
    for (int r : row) ids.put(hyps.get(r).system(), 0);
    names.addAll(ids.keySet());
    for (int k = 0; k < names.size(); k++) ids.put(names.get(k), k);
    for (int i = 0; i < n; i++) sys[i] = ids.get(hyps.get(row[i]).system());
    return sys;
  }

  private double sentence(List<String> tokens, LmState s, int[] oov, int i) {
    int unk = lm.unknownId();
    lm.beginSentence(s);
    double ln = 0;
    int unknown = 0;
    for (int k = 0, m = tokens.size(); k < m; k++) {
      int id = lm.wordId(tokens.get(k));
      if (id == unk) unknown++;
      ln += lm.score(s, id, s);
    }
    oov[i] = unknown;
    return ln + lm.score(s, lm.sentenceEndId(), s);
  }

  /** Rows kept by {@code --max-hyps}: per system, the {@code maxHyps} smallest ranks; file order kept. */
  private int[] keptRows(UtteranceHypotheses u) {
    List<Hypothesis> hyps = u.hypotheses();
    int n = hyps.size();
    if (maxHyps <= 0 || n <= maxHyps) return identity(n);
    TreeMap<String, List<Integer>> bySystem = new TreeMap<>();
    for (int i = 0; i < n; i++) bySystem.computeIfAbsent(hyps.get(i).system(), k -> new ArrayList<>()).add(i);
    boolean[] keep = new boolean[n];
    for (List<Integer> rows : bySystem.values()) {
      rows.sort(Comparator.comparingInt((Integer r) -> hyps.get(r).rank()).thenComparingInt(r -> r));
      for (int k = 0; k < Math.min(maxHyps, rows.size()); k++) keep[rows.get(k)] = true;
    }
    int[] out = new int[n];
    int m = 0;
    for (int i = 0; i < n; i++) if (keep[i]) out[m++] = i;
    return Arrays.copyOf(out, m);
  }

  private static int[] identity(int n) {
    int[] r = new int[n];
    for (int i = 0; i < n; i++) r[i] = i;
    return r;
  }

  /** Position of each kept hypothesis when sorted by rank, then system name, then file order. */
  private static int[] tieOrder(List<Hypothesis> hyps, int[] row) {
    int n = row.length;
    int[] idx = identity(n);
    IntArrays.quickSort(idx, (a, b) -> {
      Hypothesis x = hyps.get(row[a]);
      Hypothesis y = hyps.get(row[b]);
      int c = Integer.compare(x.rank(), y.rank());
      if (c != 0) return c;
      c = x.system().compareTo(y.system());
      return c != 0 ? c : Integer.compare(x.fileOrder(), y.fileOrder());
    });
    int[] order = new int[n];
    for (int k = 0; k < n; k++) order[idx[k]] = k;
    return order;
  }
}
