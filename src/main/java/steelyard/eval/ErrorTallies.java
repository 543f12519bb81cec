package steelyard.eval;

import it.unimi.dsi.fastutil.ints.Int2LongMap;
import it.unimi.dsi.fastutil.ints.Int2LongOpenHashMap;
import it.unimi.dsi.fastutil.longs.Long2LongMap;
import it.unimi.dsi.fastutil.longs.Long2LongOpenHashMap;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import steelyard.text.Vocabulary;

/**
 * Counts of substitution pairs, deleted tokens and inserted tokens over a corpus, by token id.
 *
 * <p>Storage: fastutil open-addressing maps without boxing: substitution pairs keyed by a {@code long} packing
 * (reference id &lt;&lt; 32 | hypothesis id), deletions and insertions keyed by {@code int} id; about 16–24
 * bytes per distinct key at the default load factor. Not thread-safe.
 */
final class ErrorTallies {
  private final Long2LongOpenHashMap substitutions = new Long2LongOpenHashMap();
  private final Int2LongOpenHashMap deletions = new Int2LongOpenHashMap();
  private final Int2LongOpenHashMap insertions = new Int2LongOpenHashMap();

  /** Adds the errors of one alignment of {@code hyp} against {@code ref}. */
  void add(Alignment al, int[] ref, int[] hyp) {
    for (int k = 0; k < al.size(); k++) {
      switch (al.op(k)) {
        case Alignment.SUBSTITUTION:
          substitutions.addTo(((long) ref[al.refIndex(k)] << 32) | (hyp[al.hypIndex(k)] & 0xFFFFFFFFL), 1);
          break;
        case Alignment.DELETION:
          deletions.addTo(ref[al.refIndex(k)], 1);
          break;
        case Alignment.INSERTION:
          insertions.addTo(hyp[al.hypIndex(k)], 1);
          break;
        default:
          break;
      }
    }
  }

  /** Counts every non-optional reference token as deleted (a missing hypothesis). */
  void addAllDeleted(int[] ref, boolean[] optional) {
    for (int i = 0; i < ref.length; i++) if (optional == null || !optional[i]) deletions.addTo(ref[i], 1);
  }

  // Most frequent first; ties by reference text, then hypothesis text (String order), for determinism.
  private static final Comparator<TokenTally> ORDER =
      Comparator.comparingLong(TokenTally::count).reversed()
          .thenComparing(TokenTally::ref)
          .thenComparing(TokenTally::hyp);

  List<TokenTally> topSubstitutions(Vocabulary vocab, int k) {
    List<TokenTally> all = new ArrayList<>(substitutions.size());
    for (Long2LongMap.Entry e : substitutions.long2LongEntrySet()) {
      long key = e.getLongKey();
      all.add(new TokenTally(vocab.token((int) (key >>> 32)), vocab.token((int) key), e.getLongValue()));
    }
    return top(all, k);
  }

  List<TokenTally> topDeletions(Vocabulary vocab, int k) {
    return top(singles(deletions, vocab, true), k);
  }

  List<TokenTally> topInsertions(Vocabulary vocab, int k) {
    return top(singles(insertions, vocab, false), k);
  }

  private static List<TokenTally> singles(Int2LongOpenHashMap map, Vocabulary vocab, boolean asRef) {
    List<TokenTally> all = new ArrayList<>(map.size());
    for (Int2LongMap.Entry e : map.int2LongEntrySet()) {
      String t = vocab.token(e.getIntKey());
      all.add(asRef ? new TokenTally(t, "", e.getLongValue()) : new TokenTally("", t, e.getLongValue()));
    }
    return all;
  }

  private static List<TokenTally> top(List<TokenTally> all, int k) {
    all.sort(ORDER);
    return List.copyOf(all.subList(0, Math.min(k, all.size())));
  }
}
