package steelyard.audit;

import java.util.ArrayList;
import java.util.List;
import steelyard.audit.ScoreBreakdown.Kind;
import steelyard.audit.ScoreBreakdown.Term;
import steelyard.rescore.LogLinear;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;

/** The log-linear side of an overrule: term breakdown and the exact flip weights along λ. */
final class Breakdowns {
  private Breakdowns() {}

  /** The terms of kept hypotheses {@code pick} and {@code first} side by side. */
  static ScoreBreakdown of(UtteranceResult r, List<String> featureNames, int pick, int first) {
    ScoredUtterance s = r.scores();
    LogLinear w = r.weighting();
    int f = featureCount(w, featureNames);
    List<Term> terms = new ArrayList<>(f + 3);
    for (int t = 0; t < f; t++)
      terms.add(term(Kind.FEATURE, featureNames.get(t), s.feature(pick, t), s.feature(first, t), r, t, pick, first));
    terms.add(term(Kind.LM, "lm", s.lmLogProb(pick), s.lmLogProb(first), r, f + LogLinear.LM_TERM, pick, first));
    terms.add(term(Kind.OOV, "oov", s.oovCount(pick), s.oovCount(first), r, f + LogLinear.OOV_TERM, pick, first));
    terms.add(term(Kind.LENGTH, "length", s.tokenCount(pick), s.tokenCount(first), r, f + LogLinear.LENGTH_TERM, pick,
        first));
    return new ScoreBreakdown(terms, r.totals()[pick], r.totals()[first]);
  }

  private static Term term(
      Kind kind, String name, double pv, double fv, UtteranceResult r, int t, int pick, int first) {
    LogLinear w = r.weighting();
    return new Term(kind, name, pv, fv, w.term(r.scores(), pick, t), w.term(r.scores(), first, t));
  }

  /**
   * Exact flip weights along λ: every kept hypothesis is the line (Σ of its other weighted terms) + λ·ln P, with
   * its tie order; the envelope of all of them decides the N-best pick at every λ.
   */
  static FlipWeights exactFlip(UtteranceResult r, int first) {
    ScoredUtterance s = r.scores();
    LogLinear w = r.weighting();
    int n = s.size();
    int lmTerm = w.termCount() - 3 + LogLinear.LM_TERM;
    double[] a = new double[n];
    double[] b = new double[n];
    int[] tie = new int[n];
    List<List<String>> tokens = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      double sum = 0;
      for (int t = 0; t < w.termCount(); t++) if (t != lmTerm) sum += w.term(s, i, t);
      a[i] = sum;
      b[i] = s.lmLogProb(i);
      tie[i] = s.tieOrder(i);
      tokens.add(s.tokens(i).tokens());
    }
    return FlipFinder.find(FlipWeights.Basis.EXACT, a, b, tie, tokens, w.lmWeight(), r.chosenTokens(),
        s.tokens(first).tokens());
  }

  private static int featureCount(LogLinear w, List<String> names) {
    int f = w.termCount() - 3;
    if (f != names.size())
      throw new IllegalArgumentException(
          "the weighting has " + f + " feature terms but " + names.size() + " feature names: " + names);
    return f;
  }
}
