package steelyard.rescore;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.List;
import steelyard.eval.Aligner;
import steelyard.eval.EditCounts;
import steelyard.lattice.LatticeSettings;
import steelyard.lattice.Lattices;
import steelyard.text.TokenSequence;

/**
 * Scores a rescoring result against its reference: the chosen transcript, the recogniser's rank 1, the
 * N-best oracle and optionally the lattice oracle. Tokens flagged optional by the normalisation rules cost
 * nothing. Not thread-safe (keeps an {@link Aligner}); use one per thread.
 */
public final class ReferenceScorer {
  private final Aligner aligner = new Aligner();
  private final Tokenizer tokens;
  private final LatticeSettings network;

  /**
   * @param tokens  the scoring normalisation, the same that produced the hypotheses' scoring tokens
   * @param network settings of the confusion network for the lattice oracle; null when not wanted
   */
  public ReferenceScorer(Tokenizer tokens, LatticeSettings network) {
    this.tokens = tokens;
    this.network = network;
  }

  public UtteranceErrors score(UtteranceResult r, String referenceText) {
    return score(r, tokens.tokenize(referenceText));
  }

  /**
   * Errors of {@code r} against a reference already tokenised in the scoring unit. The lattice oracle reuses
   * the network that travels with the result ({@link UtteranceResult#network()}); it is built here only for a
   * result that has none.
   */
  public UtteranceErrors score(UtteranceResult r, TokenSequence ref) {
    ScoredUtterance s = r.scores();
    int[] refIds = s.idsOf(ref.tokens());
    int[][] ids = s.tokenIds();
    EditCounts best = null;
    EditCounts[] per = new EditCounts[s.size()];
    for (int i = 0; i < s.size(); i++) {
      per[i] = aligner.count(refIds, ref.optional(), ids[i], s.tokens(i).optional());
      if (best == null || per[i].errors() < best.errors()) best = per[i];
    }
    EditCounts chosen;
    if (r.isNewTranscript()) {
      List<String> t = r.newTokens();
      chosen = aligner.count(refIds, ref.optional(), s.idsOf(t), new boolean[t.size()]);
    } else {
      chosen = per[r.chosen()];
    }
    long lattice = -1;
    if (r.network() != null) {
      lattice = Lattices.oracle(r.network(), ref.tokens()).errors();
    } else if (network != null) {
      lattice = Lattices.oracleErrors(NbestRescorer.tokenLists(s), r.posteriors(), ref.tokens(), network);
    }
    return new UtteranceErrors(chosen, per[s.firstIndex()], best, lattice);
  }

  /** Counts for an utterance with no hypotheses: every reference token deleted. */
  public EditCounts missingHypotheses(String referenceText) {
    return allDeleted(tokens.tokenize(referenceText));
  }

  /** Counts for a tokenised reference with no hypotheses: every token that is not optional deleted. */
  public static EditCounts allDeleted(TokenSequence ref) {
    long n = 0;
    for (boolean o : ref.optional()) if (!o) n++;
    return new EditCounts(0, 0, n, 0);
  }

  /**
   * Errors (S + D + I) of every kept hypothesis of {@code s} against {@code ref}, optional tokens free on both
   * sides, as {@link #score} counts them. Uses its own token ids, never the lazily built ones of {@code s}, so it
   * may run while other threads read {@code s} (a window choosing in the background).
   */
  public static int[] hypothesisErrors(ScoredUtterance s, TokenSequence ref, Aligner aligner) {
    Object2IntOpenHashMap<String> vocabulary = new Object2IntOpenHashMap<>();
    int[] refIds = localIds(ref.tokens(), vocabulary);
    int[] out = new int[s.size()];
    for (int i = 0; i < out.length; i++) {
      TokenSequence h = s.tokens(i);
      out[i] = (int) aligner.count(refIds, ref.optional(), localIds(h.tokens(), vocabulary), h.optional()).errors();
    }
    return out;
  }

  /** Errors of a new transcript's {@code tokens} (none optional) against {@code ref}, as {@link #score} counts them. */
  public static int transcriptErrors(List<String> tokens, TokenSequence ref, Aligner aligner) {
    Object2IntOpenHashMap<String> vocabulary = new Object2IntOpenHashMap<>();
    int[] refIds = localIds(ref.tokens(), vocabulary);
    return (int) aligner.count(refIds, ref.optional(), localIds(tokens, vocabulary), new boolean[tokens.size()]).errors();
  }

  /**
   * Ids of {@code tokens} in {@code vocabulary}, a caller-owned map that grows with new tokens (ids 0, 1, …); for
   * aligning token lists without touching an utterance's own lazily built ids.
   */
  public static int[] localIds(List<String> tokens, Object2IntOpenHashMap<String> vocabulary) {
    int[] ids = new int[tokens.size()];
    for (int k = 0; k < ids.length; k++) {
      String t = tokens.get(k);
      int id = vocabulary.getInt(t);
      if (id == 0 && !vocabulary.containsKey(t)) {
        id = vocabulary.size();
        vocabulary.put(t, id);
      }
      ids[k] = id;
    }
    return ids;
  }
}
