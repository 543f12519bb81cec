package steelyard.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import steelyard.eval.Aligner;
import steelyard.lm.LanguageModel;
import steelyard.rescore.LogLinear;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.ReferenceScorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.Tokenizer;
import steelyard.rescore.UtteranceErrors;
import steelyard.rescore.UtteranceResult;

/** The audit's checks over a whole run, shared by the random and the realistic tests. */
final class AuditChecks {
  private AuditChecks() {}

  /**
   * Net error change against the corpus difference computed by rescoring's own reference scorer (rank 1 −
   * chosen, summed over utterances with a reference), and the verdict counts against a brute recount with a
   * Levenshtein distance from commons-text (the texts have no optional tokens).
   */
  static void countsAndNetChange(AuditReport report, List<AuditInput> inputs, List<String> refTexts, Tokenizer unit) {
    ReferenceScorer scorer = new ReferenceScorer(unit, null);
    long first = 0;
    long chosen = 0;
    long[] verdicts = new long[Verdict.values().length];
    for (int k = 0; k < inputs.size(); k++) {
      UtteranceResult r = inputs.get(k).result();
      String ref = refTexts.get(k);
      if (ref != null) {
        UtteranceErrors e = scorer.score(r, ref);
        first += e.first().errors();
        chosen += e.chosen().errors();
      }
      if (!r.changed()) continue;
      if (ref == null) {
        verdicts[Verdict.UNVERIFIED.ordinal()]++;
        continue;
      }
      List<String> refTokens = unit.tokenize(ref).tokens();
      int pickErrors = levenshtein(refTokens, r.chosenTokens());
      int firstErrors = levenshtein(refTokens, r.scores().tokens(r.scores().firstIndex()).tokens());
      verdicts[(pickErrors < firstErrors ? Verdict.HELPED : pickErrors > firstErrors ? Verdict.HURT : Verdict.NEUTRAL).ordinal()]++;
    }
    assertThat(report.total().netErrorChange()).isEqualTo(first - chosen);
    assertThat(report.firstErrors()).isEqualTo(first);
    assertThat(report.chosenErrors()).isEqualTo(chosen);
    AuditCounts t = report.total();
    assertThat(new long[] {t.helped(), t.hurt(), t.neutral(), t.unverified()}).containsExactly(verdicts);
    assertThat(t.overrules()).isEqualTo(report.overrules().size());
    assertThat(report.groups().stream().mapToLong(AuditCounts::netErrorChange).sum()).isEqualTo(t.netErrorChange());
  }

  /**
   * The decisive n-grams add up to Δ ln P of the two sentences within 1e-9, and Δ ln P is the difference of the
   * ln P the run itself used (the hypotheses' ln P for N-best, the path ln P for the network methods).
   */
  static void ngramSums(AuditReport report, Map<String, UtteranceResult> results, LanguageModel lm) {
    for (Overrule o : report.overrules()) {
      DecisiveNgrams d = o.ngrams();
      assertThat(d.listedSum()).as(o.uttId()).isCloseTo(d.delta(), within(1e-9));
      ScoredUtterance s = results.get(o.uttId()).scores();
      if (o.method().usesNetwork()) {
        assertThat(d.pickLogProb()).isEqualTo(lm.sentenceLogProb(o.pick().tokens()));
        assertThat(d.firstLogProb()).isEqualTo(lm.sentenceLogProb(o.first().tokens()));
      } else {
        assertThat(d.pickLogProb()).as(o.uttId()).isEqualTo(s.lmLogProb(o.pick().index()));
        assertThat(d.firstLogProb()).as(o.uttId()).isEqualTo(s.lmLogProb(o.first().index()));
      }
    }
  }

  /**
   * N-best flip weights: re-choosing (highest total, the rescorer's own tie rule) just inside each finite edge
   * gives the pick, just outside it another transcript; just inside rank 1's nearest interval, rank 1. Returns
   * the number of edges checked.
   */
  static int nbestFlips(AuditReport report, Map<String, UtteranceResult> results, double mu) {
    int edges = 0;
    for (Overrule o : report.overrules()) {
      FlipWeights f = o.flip();
      assertThat(f).as(o.uttId()).isNotNull();
      ScoredUtterance s = results.get(o.uttId()).scores();
      for (double edge : new double[] {f.lower(), f.upper()}) {
        if (Double.isInfinite(edge)) continue;
        double eps = epsilon(edge, f.upper() - f.lower());
        double inward = edge == f.lower() ? eps : -eps;
        assertThat(nbestPick(s, edge + inward, mu)).as("%s inside %s", o.uttId(), edge).isEqualTo(o.pick().tokens());
        assertThat(nbestPick(s, edge - inward, mu)).as("%s outside %s", o.uttId(), edge).isNotEqualTo(o.pick().tokens());
        edges++;
      }
      if (f.returnsToFirst()) {
        double back = f.returnWeight();
        double eps = epsilon(back, f.firstHigh() - f.firstLow());
        assertThat(nbestPick(s, back == f.firstHigh() ? back - eps : back + eps, mu)).isEqualTo(o.first().tokens());
      }
    }
    return edges;
  }

  /**
   * Network (pool) flip weights: re-searching the whole network at each finite edge ± ε. Outside the pick's
   * interval the search never returns the pick (the pick's own path is its best path at every λ′, since its LM and
   * length terms depend on its words only, and the pool's winner there beats it). Inside it a path outside the pool
   * may win, so the pool is only checked to hold the pick at the run's own weight. Returns the edges checked.
   */
  static int networkFlips(AuditReport report, Map<String, UtteranceResult> results, RescoreWeights w, LanguageModel lm) {
    int edges = 0;
    for (Overrule o : report.overrules()) {
      FlipWeights f = o.flip();
      assertThat(f).as(o.uttId()).isNotNull();
      assertThat(f.basis()).isEqualTo(FlipWeights.Basis.POOL);
      ScoredUtterance s = results.get(o.uttId()).scores();
      assertThat(networkPick(s, w, f.weight(), lm)).isEqualTo(o.pick().tokens());
      for (double edge : new double[] {f.lower(), f.upper()}) {
        if (Double.isInfinite(edge)) continue;
        double outward = edge == f.lower() ? -epsilon(edge, 1) : epsilon(edge, 1);
        assertThat(networkPick(s, w, edge + outward, lm)).as("%s outside %s", o.uttId(), edge).isNotEqualTo(o.pick().tokens());
        edges++;
      }
    }
    return edges;
  }

  /** A step well above the rounding of the totals and below a quarter of the interval. */
  private static double epsilon(double x, double width) {
    return Math.min(1e-7 * Math.max(1, Math.abs(x)), width / 4);
  }

  private static List<String> nbestPick(ScoredUtterance s, double lambda, double mu) {
    LogLinear w = new LogLinear(new double[] {1}, lambda, 0, mu);
    return s.tokens(LogLinear.best(s, w.totals(s, new double[s.size()]))).tokens();
  }

  private static List<String> networkPick(ScoredUtterance s, RescoreWeights w, double latticeLambda, LanguageModel lm) {
    RescoreWeights at = new RescoreWeights(w.features(), w.lmWeight(), w.oovWeight(), w.lengthWeight(), w.posteriorScale(),
        w.systemWeights(), w.mbrMaxHypotheses(), latticeLambda, w.latticeLengthWeight(), w.beam(), w.latticeMaxHypotheses());
    return new NbestRescorer(null, List.copyOf(w.features().keySet()), at, RescoreMethod.LATTICE, lm, () -> new Aligner()::distance)
        .choose(s).chosenTokens();
  }

  /** Unit-cost edit distance from commons-text (a reference library), tokens mapped to code points. */
  static int levenshtein(List<String> a, List<String> b) {
    Map<String, Integer> ids = new java.util.HashMap<>();
    return new org.apache.commons.text.similarity.LevenshteinDistance().apply(codePoints(a, ids), codePoints(b, ids));
  }

  private static String codePoints(List<String> tokens, Map<String, Integer> ids) {
    StringBuilder sb = new StringBuilder();
    for (String t : tokens) sb.appendCodePoint(0x4E00 + ids.computeIfAbsent(t, k -> ids.size()));
    return sb.toString();
  }
}
