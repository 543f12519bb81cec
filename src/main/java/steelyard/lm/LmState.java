package steelyard.lm;

import java.util.Arrays;

/**
 * The part of a sentence's history a language model needs to score the next token: up to order−1 previous
 * token ids (most recent last), plus a backend-specific handle that lets the model continue without
 * looking the context up again.
 *
 * <p>Mutable and caller-owned so that scoring allocates nothing: create one per search hypothesis with
 * {@link LanguageModel#newState()} and reuse. Two states are {@link #equals equal} when their histories are
 * equal; a model may shorten a history to the longest context it actually has, so equal states always score
 * every continuation identically (what a lattice search needs for recombination).
 *
 * <p>Memory: two {@code int[order-1]} plus about 24 bytes of fields. Not thread-safe; share models, not states.
 */
public final class LmState {
  final int[] history;
  /**
   * For models built on {@link BackoffModel}-style storage: {@code contextIndex[j]} is the entry index of the
   * history suffix of length j+1 in the order-(j+1) table (so index 0 is the last word's unigram); for
   * {@link CompactModel}, the slot of that suffix in the order-(j+1) record array (index 0 is the word id).
   */
  final int[] contextIndex;
  int length;
  /** Backend-specific position of this history in the model's storage (e.g. a context entry index). */
  long handle;

  LmState(int capacity) {
    this.history = new int[Math.max(0, capacity)];
    this.contextIndex = new int[Math.max(0, capacity)];
  }

  /** Number of history tokens kept (0 … order−1). */
  public int length() {
    return length;
  }

  /** The {@code i}-th history token id, 0 = oldest kept. */
  public int word(int i) {
    if (i < 0 || i >= length) throw new IndexOutOfBoundsException("history index " + i + " of " + length);
    return history[i];
  }

  /** Makes this state a copy of {@code other} (same model). */
  public void copyFrom(LmState other) {
    System.arraycopy(other.history, 0, history, 0, other.length);
    System.arraycopy(other.contextIndex, 0, contextIndex, 0, other.length);
    length = other.length;
    handle = other.handle;
  }

  /** A fresh copy. */
  public LmState copy() {
    LmState s = new LmState(history.length);
    s.copyFrom(this);
    return s;
  }

  @Override
  public boolean equals(Object o) {
    if (!(o instanceof LmState)) return false;
    LmState s = (LmState) o;
    return length == s.length && Arrays.equals(history, 0, length, s.history, 0, s.length);
  }

  @Override
  public int hashCode() {
    int h = length;
    for (int i = 0; i < length; i++) h = 31 * h + history[i];
    return h;
  }

  @Override
  public String toString() {
    return "LmState" + Arrays.toString(Arrays.copyOf(history, length));
  }
}
