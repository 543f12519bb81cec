package steelyard.rescore;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import steelyard.io.Hypothesis;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.TokenSequence;

/** Hand-built utterances and a whitespace tokenizer for the service tests (no importer or normaliser needed). */
final class Fixtures {
  private Fixtures() {}

  /** Splits at single spaces; an empty text has no tokens. */
  static final Tokenizer WHITESPACE = raw -> {
    List<String> t = raw.isEmpty() ? List.of() : Arrays.asList(raw.split(" "));
    return new TokenSequence(t, new boolean[t.size()]);
  };

  /** Builds an utterance from rows {system, rank, text, feature...}; rank 1 is the smallest rank, earliest row. */
  static UtteranceHypotheses utterance(String uttId, Object[]... rows) {
    List<Hypothesis> hyps = new ArrayList<>();
    int pick = 0;
    for (int i = 0; i < rows.length; i++) {
      Object[] r = rows[i];
      double[] f = new double[r.length - 3];
      for (int k = 3; k < r.length; k++) f[k - 3] = ((Number) r[k]).doubleValue();
      hyps.add(new Hypothesis(uttId, (String) r[0], (Integer) r[1], (String) r[2], f, "", i, i + 2));
      if ((Integer) r[1] < hyps.get(pick).rank()) pick = i;
    }
    return new UtteranceHypotheses(uttId, hyps, pick);
  }

  static Object[] row(String system, int rank, String text, double... features) {
    Object[] r = new Object[3 + features.length];
    r[0] = system;
    r[1] = rank;
    r[2] = text;
    for (int k = 0; k < features.length; k++) r[3 + k] = features[k];
    return r;
  }

  /** Edit distance from commons-text (a reference library), token ids mapped to code points. */
  static int referenceDistance(int[] a, int[] b) {
    return new org.apache.commons.text.similarity.LevenshteinDistance().apply(codePoints(a), codePoints(b));
  }

  private static String codePoints(int[] ids) {
    StringBuilder sb = new StringBuilder();
    for (int id : ids) sb.appendCodePoint(0x4E00 + id);
    return sb.toString();
  }

  static NbestRescorer rescorer(RescoreWeights w, RescoreMethod method, steelyard.lm.LanguageModel lm, List<String> features) {
    HypothesisScorer scorer = new HypothesisScorer(lm, WHITESPACE, WHITESPACE, features.size(), 0);
    return new NbestRescorer(scorer, features, w, method, lm, () -> Fixtures::referenceDistance);
  }
}
