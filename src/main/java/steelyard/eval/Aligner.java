package steelyard.eval;

/**
 * Unit-cost edit-distance alignment (Levenshtein; Wagner &amp; Fischer 1974) of a hypothesis token-id sequence
 * against a reference, with backtrace for S/D/I counts.
 *
 * <p>An instance keeps reusable work arrays so that aligning many short pairs allocates nothing; it is
 * therefore <b>not thread-safe</b>: use one per thread. Tie-breaking of the backtrace is fixed and documented
 * in the README so that counts are reproducible.
 */
public final class Aligner {

  public Aligner() {}

  /** Edit distance (S + D + I, unit costs) between {@code ref} and {@code hyp}. */
  public int distance(int[] ref, int[] hyp) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** C/S/D/I of the minimum-cost alignment of {@code hyp} against {@code ref}. */
  public EditCounts count(int[] ref, int[] hyp) {
    throw new UnsupportedOperationException("not built yet");
  }

  /**
   * C/S/D/I where tokens flagged optional (hesitations, noise markers) cost nothing whether matched,
   * deleted or inserted, and are not counted in N.
   */
  public EditCounts count(int[] ref, boolean[] refOptional, int[] hyp, boolean[] hypOptional) {
    throw new UnsupportedOperationException("not built yet");
  }
}
