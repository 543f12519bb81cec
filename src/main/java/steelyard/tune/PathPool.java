package steelyard.tune;

import java.util.Arrays;
import java.util.List;
import steelyard.eval.Aligner;
import steelyard.lattice.LatticeChoice;
import steelyard.lm.LanguageModel;
import steelyard.lm.LmState;
import steelyard.rescore.ScoredUtterance;

/**
 * Per utterance, the distinct confusion-network paths found so far by k-best searches (Och 2003 §5, merged
 * candidate pools), with the terms that make the lattice score linear in (λ′, μ′):
 * {@code score = logPosterior + λ′·lnP_LM + μ′·tokens} (see {@link LatticeChoice}), and each path's errors.
 *
 * <p>A path is known by a 64-bit hash of its token ids in the utterance's local vocabulary; two different paths
 * with the same hash (probability about n²/2⁶⁴ for n paths) would keep only the first, which can only narrow
 * the pool, never change a reported error. Storage per utterance: growable parallel arrays of hash, three
 * terms, errors and an unchanged flag (45 bytes per path). Each utterance is added to by one thread at a time.
 */
final class PathPool {
  private static final int INITIAL = 8;

  private final long[][] keys;
  private final double[][] logPost;
  private final double[][] lmLogProb;
  private final int[][] tokens;
  private final int[][] errors;
  private final boolean[][] unchanged;
  private final int[] size;

  PathPool(int utterances) {
    keys = new long[utterances][INITIAL];
    logPost = new double[utterances][INITIAL];
    lmLogProb = new double[utterances][INITIAL];
    tokens = new int[utterances][INITIAL];
    errors = new int[utterances][INITIAL];
    unchanged = new boolean[utterances][INITIAL];
    size = new int[utterances];
  }

  int size(int u) {
    return size[u];
  }

  /**
   * Adds {@code path} of utterance u unless already pooled; returns its errors either way.
   *
   * @param hypErrors errors of the kept hypotheses of {@code s}, from {@code hypErrors[offset]} on (a path equal
   *                  to a hypothesis takes its count)
   * @param added     set to whether the path was new
   */
  int add(int u, ScoredUtterance s, LatticeChoice path, int[] hypErrors, int offset, int[] refIds, boolean[] refOptional,
      LanguageModel lm, Aligner aligner, boolean[] added) {
    int[] ids = s.idsOf(path.tokens());
    long key = hash(ids);
    for (int i = 0; i < size[u]; i++) {
      if (keys[u][i] == key) {
        added[0] = false;
        return errors[u][i];
      }
    }
    int e = path.sourceHypothesis() >= 0
        ? hypErrors[offset + path.sourceHypothesis()]
        : (int) aligner.count(refIds, refOptional, ids, new boolean[ids.length]).errors();
    grow(u);
    int i = size[u]++;
    keys[u][i] = key;
    logPost[u][i] = path.logPosterior();
    lmLogProb[u][i] = lm == null ? 0 : sentenceLogProb(lm, path.tokens());
    tokens[u][i] = path.tokenCount();
    errors[u][i] = e;
    unchanged[u][i] = path.tokens().equals(s.tokens(s.firstIndex()).tokens());
    added[0] = true;
    return e;
  }

  /** ln P(&lt;s&gt; tokens &lt;/s&gt;), summed in the order the lattice search sums it. */
  static double sentenceLogProb(LanguageModel lm, List<String> toks) {
    LmState s = lm.newState();
    LmState t = lm.newState();
    lm.beginSentence(s);
    double ln = 0;
    for (String w : toks) {
      ln += lm.score(s, lm.wordId(w), t);
      LmState x = s;
      s = t;
      t = x;
    }
    return ln + lm.score(s, lm.sentenceEndId(), t);
  }

  private static long hash(int[] ids) {
    long h = 0x9E3779B97F4A7C15L ^ ids.length;
    for (int id : ids) {
      h = (h ^ id) * 0xBF58476D1CE4E5B9L;
      h ^= h >>> 31;
    }
    return h;
  }

  private void grow(int u) {
    if (size[u] < keys[u].length) return;
    int c = keys[u].length * 2;
    keys[u] = Arrays.copyOf(keys[u], c);
    logPost[u] = Arrays.copyOf(logPost[u], c);
    lmLogProb[u] = Arrays.copyOf(lmLogProb[u], c);
    tokens[u] = Arrays.copyOf(tokens[u], c);
    errors[u] = Arrays.copyOf(errors[u], c);
    unchanged[u] = Arrays.copyOf(unchanged[u], c);
  }

  /**
   * The pools as a candidate table with columns {logPosterior, lnP_LM, tokens} (weights {1, λ′, μ′}); tie order
   * is the order in which paths were found.
   */
  CandidateTable table(int[] firstErrors, int[] refTokens) {
    int u = size.length;
    int[] start = new int[u + 1];
    for (int k = 0; k < u; k++) start[k + 1] = start[k] + size[k];
    int h = start[u];
    double[][] column = new double[3][h];
    int[] err = new int[h];
    int[] tie = new int[h];
    boolean[] same = new boolean[h];
    for (int k = 0; k < u; k++) {
      int n = size[k];
      int at = start[k];
      System.arraycopy(logPost[k], 0, column[0], at, n);
      System.arraycopy(lmLogProb[k], 0, column[1], at, n);
      for (int i = 0; i < n; i++) {
        column[2][at + i] = tokens[k][i];
        tie[at + i] = i;
      }
      System.arraycopy(errors[k], 0, err, at, n);
      System.arraycopy(unchanged[k], 0, same, at, n);
    }
    return new CandidateTable(start, column, err, tie, same, firstErrors, refTokens);
  }
}
