package steelyard.audit;

import java.util.List;

/**
 * Which n-grams of the model decided the LM difference between the pick and rank 1. Both token sequences are
 * scored prediction by prediction ({@link steelyard.lm.NgramTrace}) and aligned (unit-cost edit distance, as in
 * scoring). A column of the alignment is listed when its tokens differ, or when they match but the model's
 * context before them differs (right after a difference: at most order − 1 tokens in a model whose n-grams are
 * suffix-closed); {@code </s>} is the last column. Every other column scores the same token in the same context
 * on both sides, so the listed differences add up to {@link #delta()} (up to rounding).
 *
 * @param tokenisation  {@code model} when the sentences are the raw texts in the model's tokenisation (how N-best
 *                      and MBR scored ln P), {@code path} when they are the network tokens (how the search scored them)
 * @param pickLogProb   ln P_LM of the pick's sentence, {@code <s>}/{@code </s>} included
 * @param firstLogProb  ln P_LM of rank 1's sentence
 * @param regions       number of runs of consecutive listed columns
 * @param contributions the listed columns, largest |difference| first (ties: sentence order)
 */
public record DecisiveNgrams(
    String tokenisation, double pickLogProb, double firstLogProb, int regions, List<Contribution> contributions) {
  public DecisiveNgrams {
    contributions = List.copyOf(contributions);
  }

  /** ln P(pick) − ln P(rank 1). */
  public double delta() {
    return pickLogProb - firstLogProb;
  }

  /** Σ of the listed differences (equals {@link #delta()} up to rounding). */
  public double listedSum() {
    double s = 0;
    for (Contribution c : contributions) s += c.difference();
    return s;
  }

  /**
   * One listed column.
   *
   * @param region     which run of listed columns it belongs to (0 first, in sentence order)
   * @param pick       the pick's prediction in this column; null when only rank 1 has a token here
   * @param first      rank 1's prediction; null when only the pick has a token here
   */
  public record Contribution(int region, NgramUse pick, NgramUse first) {
    /** ln p of the pick's prediction − ln p of rank 1's (a missing side counts 0). */
    public double difference() {
      return (pick == null ? 0 : pick.logProb()) - (first == null ? 0 : first.logProb());
    }
  }

  /**
   * One prediction of the model.
   *
   * @param position 0-based index of the predicted token in its sentence ({@code </s>} is the last)
   * @param ngram    the n-gram whose own probability decided it, oldest token first, ending with the predicted
   *                 token as written in the sentence ({@code <s>} and {@code </s>} as markers)
   * @param order    its order: where the model backed off to (0: no n-gram, the unknown-token floor)
   * @param logProb  ln p of the prediction, back-off weights included
   * @param unknown  whether the predicted token is out of the model's vocabulary (scored as {@code <unk>})
   */
  public record NgramUse(int position, List<String> ngram, int order, double logProb, boolean unknown) {
    public NgramUse {
      ngram = List.copyOf(ngram);
    }
  }
}
