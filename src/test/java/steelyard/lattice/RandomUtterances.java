package steelyard.lattice;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/** Seeded random N-best lists with shared structure: noisy copies of one reference (test data, not check values). */
final class RandomUtterances {
  final List<String> reference;
  final List<List<String>> hypotheses;
  final double[] posteriors;

  private RandomUtterances(List<String> reference, List<List<String>> hypotheses, double[] posteriors) {
    this.reference = reference;
    this.hypotheses = hypotheses;
    this.posteriors = posteriors;
  }

  /** A reference of 1…maxLength words over {@code vocab} words and {@code n} hypotheses with edit rate {@code rate}. */
  static RandomUtterances draw(SplittableRandom rnd, int vocab, int maxLength, int n, double rate) {
    List<String> ref = new ArrayList<>();
    int len = 1 + rnd.nextInt(maxLength);
    for (int i = 0; i < len; i++) ref.add("w" + rnd.nextInt(vocab));
    List<List<String>> hyps = new ArrayList<>();
    double[] p = new double[n];
    double sum = 0;
    for (int h = 0; h < n; h++) {
      List<String> hyp = new ArrayList<>();
      for (String w : ref) {
        double u = rnd.nextDouble();
        if (u < rate / 3) continue; // deletion
        hyp.add(u < 2 * rate / 3 ? "w" + rnd.nextInt(vocab) : w); // substitution or copy
        if (rnd.nextDouble() < rate / 3) hyp.add("w" + rnd.nextInt(vocab)); // insertion
      }
      hyps.add(hyp);
      sum += p[h] = Math.exp(3 * rnd.nextDouble());
    }
    for (int h = 0; h < n; h++) p[h] /= sum;
    return new RandomUtterances(ref, hyps, p);
  }

  /** Unit-cost edit distance (Levenshtein), written here so that the checks do not rely on the code under test. */
  static int editDistance(List<String> a, List<String> b) {
    int[] prev = new int[b.size() + 1];
    int[] cur = new int[b.size() + 1];
    for (int j = 0; j <= b.size(); j++) prev[j] = j;
    for (int i = 1; i <= a.size(); i++) {
      cur[0] = i;
      for (int j = 1; j <= b.size(); j++) {
        int sub = prev[j - 1] + (a.get(i - 1).equals(b.get(j - 1)) ? 0 : 1);
        cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
      }
      int[] t = prev;
      prev = cur;
      cur = t;
    }
    return prev[b.size()];
  }
}
