package steelyard.audit;

import it.unimi.dsi.fastutil.objects.Object2LongLinkedOpenHashMap;
import it.unimi.dsi.fastutil.objects.Object2LongMap;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import steelyard.eval.Aligner;
import steelyard.eval.Alignment;
import steelyard.eval.TokenTally;
import steelyard.rescore.ScoredUtterance;
import steelyard.text.TokenSequence;

/**
 * Errors of a transcript against its reference, counted exactly as rescoring's reference scorer counts them
 * (unit-cost alignment, optional tokens free), with the error pairs of the alignment: (reference token,
 * hypothesis token) for a substitution, (token, "") for a deletion, ("", token) for an insertion. Not
 * thread-safe (keeps an {@link Aligner}).
 */
final class ErrorPairs {
  /** Most frequent first; ties by reference text, then hypothesis text. */
  static final Comparator<TokenTally> ORDER =
      Comparator.comparingLong(TokenTally::count).reversed().thenComparing(TokenTally::ref)
          .thenComparing(TokenTally::hyp);

  private final Aligner aligner = new Aligner();

  /** One transcript's errors and its error pairs (pair → count, in alignment order). */
  record Errors(long errors, long referenceTokens, Object2LongLinkedOpenHashMap<Pair> pairs) {}

  /** A (reference, hypothesis) token pair; an empty side is a deletion or insertion. */
  record Pair(String ref, String hyp) {}

  /** Errors of kept hypothesis {@code i} of {@code s} against {@code ref}. */
  Errors of(ScoredUtterance s, TokenSequence ref, int i) {
    return of(s, ref, s.tokens(i).tokens(), s.idsOf(s.tokens(i).tokens()), s.tokens(i).optional());
  }

  /** Errors of new tokens (a network path: nothing optional) against {@code ref}. */
  Errors ofNew(ScoredUtterance s, TokenSequence ref, List<String> tokens) {
    return of(s, ref, tokens, s.idsOf(tokens), new boolean[tokens.size()]);
  }

  /**
   * Error count only (no pairs) of kept hypothesis {@code i}, or of {@code newTokens} when {@code i} is −1, for
   * utterances that are not overrules. Token ids come from the utterance's local vocabulary for just these tokens
   * ({@link ScoredUtterance#idsOf}), so the other hypotheses are never converted.
   */
  long count(ScoredUtterance s, TokenSequence ref, int i, List<String> newTokens) {
    List<String> hyp = i < 0 ? newTokens : s.tokens(i).tokens();
    boolean[] optional = i < 0 ? new boolean[hyp.size()] : s.tokens(i).optional();
    return aligner.count(s.idsOf(ref.tokens()), ref.optional(), s.idsOf(hyp), optional).errors();
  }

  private Errors of(ScoredUtterance s, TokenSequence ref, List<String> hyp, int[] hypIds, boolean[] hypOptional) {
    Alignment al = aligner.alignment(s.idsOf(ref.tokens()), ref.optional(), hypIds, hypOptional);
    Object2LongLinkedOpenHashMap<Pair> pairs = new Object2LongLinkedOpenHashMap<>();
    for (int k = 0; k < al.size(); k++) {
      byte op = al.op(k);
      if (op == Alignment.CORRECT) continue;
      String r = op == Alignment.INSERTION ? "" : ref.tokens().get(al.refIndex(k));
      String h = op == Alignment.DELETION ? "" : hyp.get(al.hypIndex(k));
      pairs.addTo(new Pair(r, h), 1);
    }
    var c = al.counts();
    return new Errors(c.errors(), c.referenceTokens(), pairs);
  }

  /** The pairs of {@code a} not matched by a pair of {@code b} (multiset difference a − b), most frequent first. */
  static List<TokenTally> minus(Errors a, Errors b) {
    List<TokenTally> out = new ArrayList<>();
    for (Object2LongMap.Entry<Pair> e : a.pairs().object2LongEntrySet()) {
      long n = e.getLongValue() - b.pairs().getLong(e.getKey());
      if (n > 0) out.add(new TokenTally(e.getKey().ref(), e.getKey().hyp(), n));
    }
    out.sort(ORDER);
    return out;
  }
}
