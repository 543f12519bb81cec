package steelyard.lattice;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import steelyard.lm.BackoffModel;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * A reference scorer written for the tests: a HashMap from space-joined n-gram to {log10 prob, log10 back-off}
 * and the ARPA back-off rule P(w|h) = P*(h w) if listed, else bow(h)·P(w|h′), bow = 1 when h is not listed.
 * The same entries are fed to {@link BackoffModel.Builder} so the search and this scorer see one model.
 */
final class NaiveBackoffLm {
  final int order;
  final Map<String, double[]> entries = new HashMap<>();
  private final List<String[]> added = new ArrayList<>();

  NaiveBackoffLm(int order) {
    this.order = order;
  }

  void add(double log10Prob, double log10Bow, String... ngram) {
    if (entries.putIfAbsent(String.join(" ", ngram), new double[] {log10Prob, log10Bow}) == null) added.add(ngram);
  }

  /** log10 P(w | history), history truncated to order−1 words. */
  double log10(List<String> history, String w) {
    List<String> h = history.subList(Math.max(0, history.size() - (order - 1)), history.size());
    double bow = 0;
    while (true) {
      double[] e = entries.get(h.isEmpty() ? w : String.join(" ", h) + " " + w);
      if (e != null) return bow + e[0];
      if (h.isEmpty()) return bow + entries.get("<unk>")[0];
      double[] ctx = entries.get(String.join(" ", h));
      if (ctx != null) bow += ctx[1];
      h = h.subList(1, h.size());
    }
  }

  /** Natural-log probability of {@code <s> tokens </s>}. */
  double sentenceLn(List<String> tokens) {
    List<String> hist = new ArrayList<>(List.of("<s>"));
    double log10 = 0;
    for (String t : tokens) {
      log10 += log10(hist, t);
      hist.add(t);
    }
    log10 += log10(hist, "</s>");
    return log10 * Math.log(10);
  }

  BackoffModel model() {
    BackoffModel.Builder b = new BackoffModel.Builder(order, Unit.WORD, NormalisationOptions.EXACT);
    for (String[] g : added) {
      int[] ids = new int[g.length];
      for (int i = 0; i < g.length; i++) ids[i] = b.tokenId(g[i]);
      double[] e = entries.get(String.join(" ", g));
      b.add(ids, e[0], e[1]);
    }
    return b.build();
  }

  /** Random unigrams over {@code vocab} plus random higher-order n-grams (test data: arbitrary but valid back-off). */
  static NaiveBackoffLm random(SplittableRandom rnd, List<String> vocab, int order, int higher) {
    NaiveBackoffLm lm = new NaiveBackoffLm(order);
    lm.add(-99, -0.5 * rnd.nextDouble(), "<s>");
    lm.add(-1 - rnd.nextDouble(), 0, "</s>");
    lm.add(-3, 0, "<unk>");
    for (String w : vocab) lm.add(-0.5 - 2 * rnd.nextDouble(), -rnd.nextDouble(), w);
    for (int i = 0; i < higher; i++) {
      int n = 2 + rnd.nextInt(order - 1);
      String[] g = new String[n];
      g[0] = rnd.nextInt(4) == 0 ? "<s>" : vocab.get(rnd.nextInt(vocab.size()));
      for (int j = 1; j < n; j++) g[j] = j == n - 1 && rnd.nextInt(6) == 0 ? "</s>" : vocab.get(rnd.nextInt(vocab.size()));
      lm.add(-0.05 - rnd.nextDouble(), g[n - 1].equals("</s>") ? 0 : -rnd.nextDouble(), g);
    }
    return lm;
  }
}
