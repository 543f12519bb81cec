package steelyard.tune;

import java.util.List;
import java.util.function.Function;
import steelyard.eval.Aligner;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.ScoredUtterance;
import steelyard.rescore.UtteranceResult;

/**
 * The tuning objective: the corpus error count (S+D+I in the scoring unit, so WER or CER) of the picks of any
 * method against the references. A pick that is one of the hypotheses takes that hypothesis's count (optional
 * tokens free on both sides); a new transcript from a network is aligned against the reference with the
 * reference's optional tokens free, as {@link steelyard.rescore.ReferenceScorer} scores it.
 */
public final class DevErrors {
  private DevErrors() {}

  /**
   * Errors of a whole dev set.
   *
   * @param errors          Σ S+D+I
   * @param referenceTokens Σ scored reference tokens (N)
   * @param perUtterance    errors of each utterance, in input order
   */
  public record Score(long errors, long referenceTokens, int[] perUtterance) {
    /** errors / N, NaN when N = 0. */
    public double rate() {
      return referenceTokens == 0 ? Double.NaN : (double) errors / referenceTokens;
    }
  }

  /** The errors of {@code method} with {@code weights} over the dev set of {@code input}, on {@code threads} threads. */
  public static Score score(TuneInput input, RescoreWeights weights, RescoreMethod method, int threads) {
    try (Workers workers = new Workers(threads, () -> false)) {
      CandidateTable t = NbestTuning.table(input, workers);
      int[] all = t.all();
      int[] e = of(input, t, input.chooser().create(weights, method), all, workers);
      return score(t, all, e);
    }
  }

  static Score score(CandidateTable t, int[] utts, int[] errors) {
    long sum = 0;
    for (int e : errors) sum += e;
    return new Score(sum, t.referenceTokens(utts), errors);
  }

  /** Errors of the picks of {@code choose} for {@code utts}, aligned with it. */
  static int[] of(TuneInput input, CandidateTable nbest, Function<ScoredUtterance, UtteranceResult> choose, int[] utts,
      Workers workers) {
    int[] out = new int[utts.length];
    workers.blocks(utts.length, (b, from, to) -> {
      Aligner aligner = new Aligner();
      for (int i = from; i < to; i++) {
        int u = utts[i];
        DevUtterance d = input.utterances().get(u);
        UtteranceResult r = choose.apply(d.scores());
        out[i] = r.chosen() >= 0 ? nbest.errors[nbest.start[u] + r.chosen()] : aligned(aligner, d, r.newTokens());
      }
    });
    return out;
  }

  private static int aligned(Aligner aligner, DevUtterance d, List<String> tokens) {
    ScoredUtterance s = d.scores();
    int[] ref = s.idsOf(d.reference().tokens());
    return (int) aligner.count(ref, d.reference().optional(), s.idsOf(tokens), new boolean[tokens.size()]).errors();
  }

  /** Spreads {@code errors} (aligned with {@code utts}) into a per-utterance array of length {@code n}. */
  static void scatter(int[] utts, int[] errors, int[] into) {
    for (int i = 0; i < utts.length; i++) into[utts[i]] = errors[i];
  }
}
