package steelyard.audit;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import steelyard.audit.DecisiveNgrams.Contribution;
import steelyard.audit.DecisiveNgrams.NgramUse;
import steelyard.eval.Aligner;
import steelyard.eval.Alignment;
import steelyard.lm.LanguageModel;
import steelyard.lm.NgramTrace;

/** Builds {@link DecisiveNgrams} from two token sequences. Not thread-safe (keeps an {@link Aligner}). */
final class NgramDiff {
  private static final Comparator<Listed> LARGEST_FIRST =
      Comparator.comparingDouble((Listed l) -> -Math.abs(l.contribution.difference())).thenComparingInt(l -> l.column);

  private final Aligner aligner = new Aligner();

  /** The decisive n-grams of {@code pick} against {@code first} (tokens in the model's unit) under {@code lm}. */
  DecisiveNgrams compare(LanguageModel lm, String tokenisation, List<String> pick, List<String> first) {
    NgramTrace a = NgramTrace.of(lm, pick);
    NgramTrace b = NgramTrace.of(lm, first);
    Object2IntOpenHashMap<String> ids = new Object2IntOpenHashMap<>();
    Alignment al = aligner.alignment(ids(first, ids), ids(pick, ids));
    List<Listed> listed = new ArrayList<>();
    int region = -1;
    boolean open = false;
    for (int c = 0; c <= al.size(); c++) {
      boolean end = c == al.size(); // the </s> column, matched on both sides
      int ai = end ? a.size() - 1 : al.hypIndex(c);
      int bi = end ? b.size() - 1 : al.refIndex(c);
      boolean same = (end || al.op(c) == Alignment.CORRECT) && a.sameContext(ai, b, bi);
      if (same) {
        open = false;
        continue;
      }
      if (!open) region++;
      open = true;
      listed.add(new Listed(c, new Contribution(region, use(lm, a, ai), use(lm, b, bi))));
    }
    listed.sort(LARGEST_FIRST);
    List<Contribution> out = new ArrayList<>(listed.size());
    for (Listed l : listed) out.add(l.contribution);
    return new DecisiveNgrams(tokenisation, a.total(), b.total(), region + 1, out);
  }

  private static NgramUse use(LanguageModel lm, NgramTrace t, int k) {
    if (k < 0) return null;
    return new NgramUse(k, t.ngram(k), t.matchedOrder(k), t.logProb(k), t.id(k) == lm.unknownId());
  }

  /** Ids in an alignment-local vocabulary (by string: distinct unknown words stay distinct). */
  private static int[] ids(List<String> tokens, Object2IntOpenHashMap<String> vocab) {
    int[] out = new int[tokens.size()];
    for (int k = 0; k < out.length; k++) {
      String t = tokens.get(k);
      int id = vocab.getInt(t);
      if (id == 0 && !vocab.containsKey(t)) vocab.put(t, id = vocab.size());
      out[k] = id;
    }
    return out;
  }

  private record Listed(int column, Contribution contribution) {}
}
