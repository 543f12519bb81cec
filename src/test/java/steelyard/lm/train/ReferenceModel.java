package steelyard.lm.train;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * A deliberately slow, obvious n-gram model written straight from the published formulas, sharing no code
 * with the trainer: maps from {@code List<String>} to counts, recursion over the history.
 *
 * <p>Sources: Chen &amp; Goodman 1998, "An empirical study of smoothing techniques for language modeling"
 * (TR-10-98): interpolated modified Kneser-Ney, eq. (26) discounts and the interpolated form with
 * continuation counts N1+(• w…) for lower orders; Witten-Bell, eq. (8)-(9) in its interpolated form;
 * absolute discounting (Ney, Essen &amp; Kneser 1994) with D = n1/(n1 + 2·n2); add-k (Lidstone). The
 * fallback defaults and the add-k history rule are this project's documented choices.
 */
final class ReferenceModel {
  static final String BOS = "<s>";
  static final String EOS = "</s>";
  static final String UNK = "<unk>";

  final int order;
  final Smoothing smoothing;
  final double addK;
  final Map<List<String>, Integer> raw = new HashMap<>();
  final Set<String> vocabulary = new TreeSet<>();
  private final Map<List<String>, Set<String>> leftWords = new HashMap<>();
  private final Map<Integer, double[]> discounts = new HashMap<>();

  ReferenceModel(List<List<String>> sentences, int order, Smoothing smoothing, double addK) {
    this.order = order;
    this.smoothing = smoothing;
    this.addK = addK;
    vocabulary.add(EOS);
    vocabulary.add(UNK);
    for (List<String> s : sentences) {
      if (s.isEmpty()) continue;
      List<String> framed = new ArrayList<>();
      framed.add(BOS);
      framed.addAll(s);
      framed.add(EOS);
      vocabulary.addAll(s);
      for (int i = 0; i < framed.size(); i++) {
        for (int n = 1; n <= order && i + n <= framed.size(); n++) {
          List<String> g = List.copyOf(framed.subList(i, i + n));
          raw.merge(g, 1, Integer::sum);
          if (i > 0) leftWords.computeIfAbsent(g, x -> new HashSet<>()).add(framed.get(i - 1));
        }
      }
    }
  }

  /** The count an n-gram is estimated from (Chen &amp; Goodman: raw at the top order, continuation below). */
  int count(List<String> g) {
    if (smoothing != Smoothing.MKN || g.size() == order || g.get(0).equals(BOS)) return raw.getOrDefault(g, 0);
    Set<String> left = leftWords.get(g);
    return left == null ? 0 : left.size();
  }

  double[] discounts(int n) {
    return discounts.computeIfAbsent(n, this::computeDiscounts);
  }

  private double[] computeDiscounts(int n) {
    long[] cc = new long[5];
    for (List<String> g : raw.keySet()) {
      if (g.size() != n || g.equals(List.of(BOS))) continue;
      int c = count(g);
      if (c >= 1 && c <= 4) cc[c]++;
    }
    if (smoothing == Smoothing.ABS) {
      double d = (double) cc[1] / (cc[1] + 2.0 * cc[2]);
      return new double[] {cc[1] > 0 && d > 0 && d <= 1 ? d : 0.5};
    }
    double y = (double) cc[1] / (cc[1] + 2.0 * cc[2]);
    double d1 = 1 - 2 * y * cc[2] / cc[1];
    double d2 = 2 - 3 * y * cc[3] / cc[2];
    double d3 = 3 - 4 * y * cc[4] / cc[3];
    boolean y_ok = cc[1] > 0 && cc[2] > 0;
    return new double[] {
      y_ok && d1 > 0 && d1 <= 1 ? d1 : 0.5,
      y_ok && cc[3] > 0 && d2 > 0 && d2 <= 2 ? d2 : 1.0,
      y_ok && cc[3] > 0 && cc[4] > 0 && d3 > 0 && d3 <= 3 ? d3 : 1.5
    };
  }

  private double discount(int n, int c) {
    double[] d = discounts(n);
    return smoothing == Smoothing.ABS ? d[0] : d[Math.min(c, 3) - 1];
  }

  /** P(w | history), the history truncated to its last order−1 tokens. */
  double prob(List<String> history, String w) {
    List<String> h = history.size() > order - 1 ? history.subList(history.size() - (order - 1), history.size()) : history;
    if (smoothing == Smoothing.ADDK) return addK(h, w);
    return interpolated(List.copyOf(h), w);
  }

  private double interpolated(List<String> h, String w) {
    double lower = h.isEmpty() ? 1.0 / vocabulary.size() : interpolated(h.subList(1, h.size()), w);
    double[] stats = historyStats.computeIfAbsent(h, this::historyStats);
    double total = stats[0], distinct = stats[1], discounted = stats[2];
    if (total == 0) return lower;
    int c = count(concat(h, w));
    if (smoothing == Smoothing.WB) return (c + distinct * lower) / (total + distinct);
    double alpha = c == 0 ? 0 : (c - discount(h.size() + 1, c)) / total;
    return alpha + discounted / total * lower;
  }

  private final Map<List<String>, double[]> historyStats = new HashMap<>();

  /** Σ_v c(h v), the number of v with c(h v) > 0, and Σ_v D(c(h v)) over the vocabulary. */
  private double[] historyStats(List<String> h) {
    double total = 0, distinct = 0, discounted = 0;
    for (String v : vocabulary) {
      int c = count(concat(h, v));
      if (c == 0) continue;
      total += c;
      distinct++;
      if (smoothing != Smoothing.WB) discounted += discount(h.size() + 1, c);
    }
    return new double[] {total, distinct, discounted};
  }

  private double addK(List<String> h, String w) {
    long total = 0;
    for (String v : vocabulary) total += raw.getOrDefault(concat(h, v), 0);
    if (total == 0 && !h.isEmpty()) return addK(h.subList(1, h.size()), w);
    int c = raw.getOrDefault(concat(h, w), 0);
    return (c + addK) / (total + addK * vocabulary.size());
  }

  static List<String> concat(List<String> h, String w) {
    List<String> g = new ArrayList<>(h);
    g.add(w);
    return g;
  }
}
