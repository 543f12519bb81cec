package steelyard.demo;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Test-scope error rates of the generated sets, with an edit distance of its own (unit-cost Levenshtein,
 * Wagner &amp; Fischer 1974), independent of the product's scorer. Words split on whitespace; characters are
 * UTF-16 units (the generated data is ASCII) of the words joined by single spaces (a whitespace run counts as one
 * character). Run {@code main} to print the figures quoted in the README.
 */
final class DemoScoring {
  private DemoScoring() {}

  /** Summed errors and reference tokens of a choice of hypotheses. */
  record Rate(long errors, long tokens) {
    double value() {
      return tokens == 0 ? 0 : (double) errors / tokens;
    }

    @Override
    public String toString() {
      return String.format(Locale.ROOT, "%.2f %% (%d / %d)", 100 * value(), errors, tokens);
    }
  }

  /** Rank-1 and oracle rates of one set. */
  record Figures(Rate firstWord, Rate oracleWord, Rate firstChar, Rate oracleChar) {}

  static int distance(String[] a, String[] b) {
    int[] prev = new int[b.length + 1];
    int[] cur = new int[b.length + 1];
    for (int j = 0; j <= b.length; j++) prev[j] = j;
    for (int i = 1; i <= a.length; i++) {
      cur[0] = i;
      for (int j = 1; j <= b.length; j++) {
        int sub = prev[j - 1] + (a[i - 1].equals(b[j - 1]) ? 0 : 1);
        cur[j] = Math.min(sub, Math.min(prev[j], cur[j - 1]) + 1);
      }
      int[] t = prev;
      prev = cur;
      cur = t;
    }
    return prev[b.length];
  }

  static String[] words(String s) {
    String t = s.strip();
    return t.isEmpty() ? new String[0] : t.split("\\s+");
  }

  static String[] chars(String s) {
    String t = String.join(" ", words(s));
    String[] out = new String[t.length()];
    for (int i = 0; i < t.length(); i++) out[i] = String.valueOf(t.charAt(i));
    return out;
  }

  /** Hypotheses grouped by utterance in file order; within an utterance, in rank order. */
  static Map<String, List<String>> byUtterance(List<Map<String, String>> rows) {
    Map<String, List<String[]>> tmp = new LinkedHashMap<>();
    for (Map<String, String> r : rows) tmp.computeIfAbsent(r.get("utt_id"), k -> new ArrayList<>()).add(new String[] {r.get("rank"), r.get("text")});
    Map<String, List<String>> out = new LinkedHashMap<>();
    for (Map.Entry<String, List<String[]>> e : tmp.entrySet()) {
      List<String[]> l = e.getValue();
      l.sort((x, y) -> Integer.compare(Integer.parseInt(x[0]), Integer.parseInt(y[0])));
      List<String> texts = new ArrayList<>();
      for (String[] x : l) texts.add(x[1]);
      out.put(e.getKey(), texts);
    }
    return out;
  }

  static Figures figures(byte[] nbest, byte[] refs) {
    Map<String, List<String>> hyps = byUtterance(SimpleCsv.rows(nbest));
    long[] acc = new long[6];
    for (Map<String, String> r : SimpleCsv.rows(refs)) {
      List<String> h = hyps.get(r.get("utt_id"));
      String ref = r.get("text");
      accumulate(acc, 0, ref, h, true);
      accumulate(acc, 3, ref, h, false);
    }
    return new Figures(new Rate(acc[0], acc[2]), new Rate(acc[1], acc[2]), new Rate(acc[3], acc[5]), new Rate(acc[4], acc[5]));
  }

  private static void accumulate(long[] acc, int at, String ref, List<String> hyps, boolean wordLevel) {
    String[] r = wordLevel ? words(ref) : chars(ref);
    int first = -1;
    int best = Integer.MAX_VALUE;
    for (String h : hyps) {
      int d = distance(r, wordLevel ? words(h) : chars(h));
      if (first < 0) first = d;
      best = Math.min(best, d);
    }
    acc[at] += first;
    acc[at + 1] += best;
    acc[at + 2] += r.length;
  }

  /** Character error rate of each configuration alone (OCR sets: one reading per system and line). */
  static Map<String, Rate> perSystemChar(byte[] nbest, byte[] refs) {
    Map<String, String> ref = new LinkedHashMap<>();
    for (Map<String, String> r : SimpleCsv.rows(refs)) ref.put(r.get("utt_id"), r.get("text"));
    Map<String, long[]> acc = new java.util.TreeMap<>();
    for (Map<String, String> row : SimpleCsv.rows(nbest)) {
      String[] r = chars(ref.get(row.get("utt_id")));
      long[] a = acc.computeIfAbsent(row.get("system"), k -> new long[2]);
      a[0] += distance(r, chars(row.get("text")));
      a[1] += r.length;
    }
    Map<String, Rate> out = new java.util.TreeMap<>();
    acc.forEach((k, v) -> out.put(k, new Rate(v[0], v[1])));
    return out;
  }

  /** Prints the figures of the default generation (used to fill the README). */
  public static void main(String[] args) {
    long seed = args.length > 0 ? Long.parseLong(args[0]) : DemoData.DEFAULT_SEED;
    Map<String, byte[]> files = DemoData.generate(seed, DemoData.Sizes.DEFAULT);
    for (String set : new String[] {"voice-dev", "voice-test", "dockets-dev", "dockets-test"}) {
      Figures f = figures(files.get(set + ".nbest.csv"), files.get(set + ".refs.csv"));
      System.out.println(set + ": WER rank1 " + f.firstWord() + ", oracle " + f.oracleWord() + "; CER rank1 " + f.firstChar() + ", oracle " + f.oracleChar());
      if (set.startsWith("dockets")) System.out.println("  CER per configuration: " + perSystemChar(files.get(set + ".nbest.csv"), files.get(set + ".refs.csv")));
    }
  }
}
