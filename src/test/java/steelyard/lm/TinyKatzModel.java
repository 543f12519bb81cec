package steelyard.lm;

import it.unimi.dsi.fastutil.objects.Object2IntOpenHashMap;
import java.util.ArrayList;
import java.util.List;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * A small, obviously normalised back-off model for file tests: absolute discounting with D = 0.5 at every
 * order above 1 and Katz back-off weights (Katz 1987; Ney, Essen &amp; Kneser 1994 for the discount),
 * α(h) = (1 − Σ_{w seen after h} P(w|h)) / (1 − Σ_{w seen after h} P(w|h′)); unigrams are maximum-likelihood
 * over the words and {@code </s>}, mixed with a uniform share for {@code <unk>}. Written from the formulas,
 * with no code in common with the trainer; for a few hundred tokens only (quadratic in places).
 */
public final class TinyKatzModel {
  private TinyKatzModel() {}

  public static BackoffModel train(List<String> sentences, int order) {
    List<Object2IntOpenHashMap<List<String>>> counts = new ArrayList<>();
    for (int k = 0; k < order; k++) counts.add(new Object2IntOpenHashMap<>());
    for (String s : sentences) {
      List<String> t = new ArrayList<>();
      t.add(BackoffModel.SENTENCE_START);
      for (String w : s.split(" ")) t.add(w);
      t.add(BackoffModel.SENTENCE_END);
      for (int i = 0; i < t.size(); i++) {
        for (int k = 1; k <= order && i + k <= t.size(); k++) {
          List<String> g = List.copyOf(t.subList(i, i + k));
          if (k == 1 && g.get(0).equals(BackoffModel.SENTENCE_START)) continue;
          counts.get(k - 1).addTo(g, 1);
        }
      }
    }
    BackoffModel.Builder b = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
    long total = 0;
    for (int c : counts.get(0).values()) total += c;
    double unkShare = 0.01;
    java.util.Map<List<String>, Double> prob = new java.util.HashMap<>();
    List<List<String>> unigrams = sorted(counts.get(0).keySet());
    for (List<String> g : unigrams) prob.put(g, (1 - unkShare) * counts.get(0).getInt(g) / total);
    prob.put(List.of(BackoffModel.UNKNOWN), unkShare);
    for (int k = 2; k <= order; k++) {
      Object2IntOpenHashMap<List<String>> ck = counts.get(k - 1);
      for (List<String> g : sorted(ck.keySet())) {
        List<String> h = g.subList(0, k - 1);
        prob.put(g, (ck.getInt(g) - 0.5) / historyCount(counts, h));
      }
    }
    java.util.Map<List<String>, Double> bow = new java.util.HashMap<>();
    for (int k = 1; k < order; k++) {
      for (List<String> h : sorted(k == 1 ? withStart(counts.get(0).keySet()) : counts.get(k - 1).keySet())) {
        double seen = 0;
        double lower = 0;
        for (List<String> g : counts.get(k).keySet()) {
          if (!g.subList(0, k).equals(h)) continue;
          seen += prob.get(g);
          lower += backedOff(prob, bow, g.subList(1, g.size()));
        }
        if (seen > 0) bow.put(h, (1 - seen) / (1 - lower));
      }
    }
    for (int k = 1; k <= order; k++) {
      List<List<String>> grams = k == 1 ? withStart(prob.keySet().stream().filter(g -> g.size() == 1).toList())
          : sorted(counts.get(k - 1).keySet());
      for (List<String> g : grams) {
        int[] ids = g.stream().mapToInt(b::tokenId).toArray();
        double p = g.equals(List.of(BackoffModel.SENTENCE_START)) ? -99 : Math.log10(prob.get(g));
        b.add(ids, p, k < order ? Math.log10(bow.getOrDefault(g, 1.0)) : 0);
      }
    }
    return b.build();
  }

  /** P(w | h) by back-off from the maps (for the back-off weight denominators). */
  private static double backedOff(java.util.Map<List<String>, Double> prob, java.util.Map<List<String>, Double> bow, List<String> g) {
    Double p = prob.get(g);
    if (p != null) return p;
    List<String> h = g.subList(0, g.size() - 1);
    return bow.getOrDefault(h, 1.0) * backedOff(prob, bow, g.subList(1, g.size()));
  }

  private static double historyCount(List<Object2IntOpenHashMap<List<String>>> counts, List<String> h) {
    // c(h) as a history = number of n-grams h·w; equals c(h) except at the sentence end
    int k = h.size() + 1;
    long n = 0;
    for (var e : counts.get(k - 1).object2IntEntrySet()) if (e.getKey().subList(0, k - 1).equals(h)) n += e.getIntValue();
    return n;
  }

  private static List<List<String>> withStart(java.util.Collection<List<String>> unigrams) {
    List<List<String>> out = new ArrayList<>(sorted(unigrams));
    if (!out.contains(List.of(BackoffModel.SENTENCE_START))) out.add(0, List.of(BackoffModel.SENTENCE_START));
    return out;
  }

  private static List<List<String>> sorted(java.util.Collection<List<String>> grams) {
    List<List<String>> out = new ArrayList<>(grams);
    out.sort((a, c) -> String.join(" ", a).compareTo(String.join(" ", c)));
    return out;
  }
}
