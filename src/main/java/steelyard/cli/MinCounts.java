package steelyard.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import steelyard.io.InputException;

/**
 * The per-order minimum counts of {@code lm train}: {@code --min-count ORDER=C,…} (orders named, 2 and up;
 * an n-gram of that order is kept only when seen at least C times), and the translation of release 0.1's
 * {@code --cutoffs C1,C2,…} (an n-gram of order k seen at most Ck times dropped, C1 = 0, the last value
 * repeating for higher orders), which is the minimum count Ck + 1.
 */
final class MinCounts {
  private static final String FORM = "ORDER=C with whole numbers, e.g. 2=2 (keep bigrams seen at least twice)";

  private MinCounts() {}

  /** The minimum count of every order 1 … {@code order} (index k−1; 1 keeps all), or empty when none is named. */
  static int[] parse(List<String> items, int order) {
    if (items.isEmpty()) return new int[0];
    int[] m = ones(order);
    boolean[] named = new boolean[order + 1];
    for (String item : items) {
      int eq = item.indexOf('=');
      int k = eq < 0 ? -1 : whole(item.substring(0, eq));
      int c = eq < 0 ? -1 : whole(item.substring(eq + 1));
      if (k < 0 || c < 0) throw option("'" + item + "' is not ORDER=C", FORM);
      if (k == 1) throw option("'" + item + "' names order 1", "orders 2 and up (use --vocab-min-count to drop rare words)");
      if (k < 2 || k > order)
        throw option("'" + item + "' names order " + k + ", which a " + order + "-gram model does not have",
            order < 2 ? "no --min-count for a unigram model (use --vocab-min-count)" : "an order from 2 to " + order);
      if (c < 1) throw option("'" + item + "' asks for a minimum count of " + c, "a count of 1 or more (1 keeps every n-gram)");
      if (named[k]) throw option("order " + k + " is named twice", "each order once");
      named[k] = true;
      m[k - 1] = c;
    }
    return m;
  }

  /**
   * The minimum counts meant by 0.1's cut-offs {@code cutoffs} for a model of order {@code order}; prints the
   * one-line notice with the {@code --min-count} to use instead. Refused together with {@code --min-count}.
   */
  static int[] fromCutoffs(int[] cutoffs, int order, List<String> minCount, PrintWriter err) {
    if (!minCount.isEmpty()) throw InputException.option("--cutoffs", "given together with --min-count", "only --min-count");
    if (cutoffs.length == 0) throw InputException.option("--cutoffs", "no values", "C1,C2,… (or, better, --min-count ORDER=C,…)");
    for (int c : cutoffs) {
      if (c < 0 || c == Integer.MAX_VALUE) throw InputException.option("--cutoffs", "cut-off " + c + " is out of range", "counts of 0 or more");
    }
    if (cutoffs[0] != 0)
      throw InputException.option("--cutoffs", "the unigram cut-off is " + cutoffs[0], "0 for unigrams (use --vocab-min-count to drop rare words)");
    int[] m = ones(order);
    for (int k = 2; k <= order; k++) m[k - 1] = cutoffs[Math.min(k, cutoffs.length) - 1] + 1;
    err.println(OldSpellings.notice("--cutoffs " + joined(cutoffs), order < 2 ? "no --min-count for a unigram model" : "--min-count " + spelled(m)));
    err.flush();
    return m;
  }

  /** {@code 2=C2,3=C3,…}: every order from 2, as {@code --min-count} takes it. */
  static String spelled(int[] minCounts) {
    List<String> parts = new ArrayList<>();
    for (int k = 2; k <= minCounts.length; k++) parts.add(k + "=" + minCounts[k - 1]);
    return String.join(",", parts);
  }

  private static int[] ones(int order) {
    int[] m = new int[order];
    Arrays.fill(m, 1);
    return m;
  }

  private static String joined(int[] values) {
    List<String> parts = new ArrayList<>();
    for (int v : values) parts.add(Integer.toString(v));
    return String.join(",", parts);
  }

  /** A non-negative decimal integer, or −1. */
  private static int whole(String s) {
    String t = s.strip();
    if (t.isEmpty() || !t.chars().allMatch(ch -> ch >= '0' && ch <= '9')) return -1;
    try {
      return Integer.parseInt(t);
    } catch (NumberFormatException e) {
      return -1;
    }
  }

  private static InputException option(String problem, String expected) {
    return InputException.option("--min-count", problem, expected);
  }
}
