package steelyard.gui.model;

import java.util.List;

/**
 * The data of the score-breakdown chart: one bar per hypothesis (new order), one stacked segment per
 * weighted term. Relative mode subtracts the pick's own term from each term, so the pick's bar is empty and
 * every other bar sums to its total minus the pick's: the segments show which terms made it lose (or win).
 *
 * @param labels    bar labels, e.g. {@code "#2 · rank 3"}
 * @param terms     term names ({@link ScoreTerms#names})
 * @param values    {@code values[bar][term]}, natural-log units
 * @param relative  whether the pick's terms were subtracted
 */
public record Breakdown(List<String> labels, List<String> terms, double[][] values, boolean relative) {

  /** The breakdown of {@code rows} (with at most {@code maxBars} bars, the best totals first). */
  public static Breakdown of(List<HypothesisRow> rows, List<String> terms, boolean relative, int maxBars) {
    int n = Math.min(rows.size(), maxBars);
    double[] base = new double[terms.size()];
    if (relative) {
      for (HypothesisRow r : rows) if (r.chosen()) base = r.weighted().clone();
    }
    String[] labels = new String[n];
    double[][] values = new double[n][terms.size()];
    for (int k = 0; k < n; k++) {
      HypothesisRow r = rows.get(k);
      labels[k] = "#" + r.newOrder() + " · rank " + r.rank() + (r.system().isEmpty() ? "" : " " + r.system()) + (r.chosen() ? " (pick)" : "");
      for (int t = 0; t < terms.size(); t++) values[k][t] = r.weighted()[t] - base[t];
    }
    return new Breakdown(List.of(labels), List.copyOf(terms), values, relative);
  }
}
