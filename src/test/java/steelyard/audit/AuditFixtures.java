package steelyard.audit;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import steelyard.eval.Aligner;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.lattice.LatticeSettings;
import steelyard.lm.BackoffModel;
import steelyard.lm.LanguageModel;
import steelyard.rescore.HypothesisScorer;
import steelyard.rescore.NbestRescorer;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.Tokenizer;
import steelyard.text.NormalisationOptions;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

/** Hand-built utterances, models and rescorers for the audit tests (no importer or normaliser needed). */
final class AuditFixtures {
  static final double LN10 = Math.log(10);

  private AuditFixtures() {}

  /** Splits at single spaces; an empty text has no tokens; nothing optional. */
  static final Tokenizer WHITESPACE = raw -> {
    List<String> t = raw.isEmpty() ? List.of() : Arrays.asList(raw.split(" "));
    return new TokenSequence(t, new boolean[t.size()]);
  };

  /** An utterance from rows of {text, acoustic}: rank = row number, system "", group {@code group}. */
  static UtteranceHypotheses utterance(String uttId, String group, Object[]... rows) {
    List<Hypothesis> hyps = new ArrayList<>();
    for (int i = 0; i < rows.length; i++) {
      double acoustic = ((Number) rows[i][1]).doubleValue();
      hyps.add(new Hypothesis(uttId, "", i + 1, (String) rows[i][0], new double[] {acoustic}, group, i, i + 2));
    }
    return new UtteranceHypotheses(uttId, hyps, 0);
  }

  static Object[] row(String text, double acoustic) {
    return new Object[] {text, acoustic};
  }

  /** A unigram model with the given log10 probabilities ({@code <s>} at −99). */
  static BackoffModel unigrams(Map<String, Double> log10) {
    BackoffModel.Builder b = new BackoffModel.Builder(1, Unit.WORD, NormalisationOptions.EXACT);
    b.add(new int[] {b.tokenId(BackoffModel.SENTENCE_START)}, -99, 0);
    log10.forEach((w, p) -> b.add(new int[] {b.tokenId(w)}, p, 0));
    return b.build();
  }

  /** Weights with acoustic weight 1, λ, μ, posterior scale α and the network's λ′, μ′ (large beam). */
  static RescoreWeights weights(double lambda, double mu, double alpha, double latticeLambda, double latticeMu) {
    return new RescoreWeights(Map.of("acoustic", 1.0), lambda, 0, mu, alpha, Map.of(), RescoreWeights.DEFAULT_MBR_MAX_HYPOTHESES,
        latticeLambda, latticeMu, 4096, LatticeSettings.DEFAULT_MAX_HYPOTHESES);
  }

  static NbestRescorer rescorer(LanguageModel lm, RescoreWeights w, RescoreMethod method) {
    HypothesisScorer scorer = new HypothesisScorer(lm, WHITESPACE, WHITESPACE, 1, 0);
    return new NbestRescorer(scorer, List.of("acoustic"), w, method, lm, () -> new Aligner()::distance);
  }

  static AuditSettings settings(LanguageModel lm, RescoreWeights w) {
    return new AuditSettings(List.of("acoustic"), Unit.WORD, lm, lm == null ? null : WHITESPACE, w.latticeSettings(), 50, 10);
  }

  static TokenSequence tokens(String text) {
    return WHITESPACE.tokenize(text);
  }
}
