package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import steelyard.rescore.LogLinear;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;

/**
 * One hypothesis of the open utterance with every term, as the detail table shows it.
 *
 * @param kept      index among the kept hypotheses
 * @param newOrder  1-based position when sorted by total, ties as the core breaks them
 * @param rank      the recogniser's rank
 * @param system    system name (empty without a system column)
 * @param text      raw text
 * @param raw       unweighted terms in {@link ScoreTerms} order
 * @param weighted  weighted contributions, same order; they sum to {@code total}
 * @param total     the log-linear total (natural log, higher is better)
 * @param posterior the posterior under the current α (and system weights)
 * @param errors    errors against the reference, or {@link Corpus#NO_REFERENCE}
 * @param chosen    whether this is the choice
 * @param first     whether this is the recogniser's rank 1
 */
public record HypothesisRow(
    int kept, int newOrder, int rank, String system, String text, double[] raw, double[] weighted, double total,
    double posterior, int errors, boolean chosen, boolean first) {

  /** The rows of {@code r} (utterance {@code u} of {@code corpus}) in their new order. */
  public static List<HypothesisRow> of(Corpus corpus, int u, UtteranceResult r) {
    ScoredUtterance s = r.scores();
    LogLinear w = r.weighting();
    int n = s.size();
    int terms = w.termCount();
    Integer[] order = new Integer[n];
    for (int i = 0; i < n; i++) order[i] = i;
    double[] totals = r.totals();
    java.util.Arrays.sort(order, (a, b) -> totals[a] != totals[b] ? Double.compare(totals[b], totals[a])
        : Integer.compare(s.tieOrder(a), s.tieOrder(b)));
    List<HypothesisRow> rows = new ArrayList<>(n);
    for (int k = 0; k < n; k++) {
      int i = order[k];
      double[] raw = new double[terms];
      double[] weighted = new double[terms];
      for (int t = 0; t < terms; t++) {
        raw[t] = ScoreTerms.raw(s, i, t);
        weighted[t] = w.term(s, i, t);
      }
      var h = s.hypothesis(i);
      rows.add(new HypothesisRow(i, k + 1, h.rank(), h.system(), h.text(), raw, weighted, totals[i], r.posteriors()[i],
          corpus.errors(u, i), i == r.chosen(), i == s.firstIndex()));
    }
    return rows;
  }
}
