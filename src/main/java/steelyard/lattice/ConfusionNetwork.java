package steelyard.lattice;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import steelyard.text.Vocabulary;

/**
 * A confusion network of one utterance (Mangu, Brill &amp; Stolcke 2000): an ordered sequence of slots, each
 * holding competing token arcs and, when some hypothesis has no token there, one empty arc. Built from the
 * utterance's hypotheses by progressive multiple alignment ({@link NetworkBuilder}); every hypothesis that
 * entered is a path through it, recorded arc by arc.
 *
 * <p><b>Posteriors</b> are probabilities (not logs): an arc's posterior is the summed posterior of the
 * hypotheses that put it there, divided by the summed posterior of all hypotheses that entered, so the arcs
 * of every slot sum to 1 (up to rounding).
 *
 * <p><b>Storage</b> (all primitive arrays, indices are global arc numbers {@code 0 … arcCount()-1}):
 * <ul>
 *   <li>{@code slotStart[int slots+1]}: the arcs of slot s are {@code [slotStart[s], slotStart[s+1])}, in
 *       order of first appearance (the arc of the earliest-entered hypothesis first);
 *   <li>{@code arcToken[int arcs]}: token id in {@link #vocabulary()}, or {@link #EMPTY};
 *   <li>{@code arcPosterior[double arcs]};
 *   <li>{@code hypStart[int arcs+1]}, {@code hypList[int]}: compressed lists of the input indices (ascending)
 *       of the hypotheses on each arc; one int per (hypothesis, slot);
 *   <li>{@code pathArc[int entered × slots]}: row k is the arc of the k-th entered hypothesis in each slot.
 * </ul>
 * Cost: 20 bytes per arc plus 8 bytes per (entered hypothesis × slot), e.g. about 17 KB for 100 hypotheses
 * over 20 slots; the vocabulary is shared or per network. Limits: int indices (2³¹ arcs). Immutable.
 */
public final class ConfusionNetwork {
  /** Token id of an empty (deletion) arc. */
  public static final int EMPTY = -1;

  private final Vocabulary vocabulary;
  private final int inputCount;
  private final int[] entered;
  private final boolean capped;
  private final int[] slotStart;
  private final int[] arcToken;
  private final double[] arcPosterior;
  private final int[] hypStart;
  private final int[] hypList;
  private final int[] pathArc;

  ConfusionNetwork(
      Vocabulary vocabulary, int inputCount, int[] entered, boolean capped, int[] slotStart, int[] arcToken,
      double[] arcPosterior, int[] hypStart, int[] hypList, int[] pathArc) {
    this.vocabulary = vocabulary;
    this.inputCount = inputCount;
    this.entered = entered;
    this.capped = capped;
    this.slotStart = slotStart;
    this.arcToken = arcToken;
    this.arcPosterior = arcPosterior;
    this.hypStart = hypStart;
    this.hypList = hypList;
    this.pathArc = pathArc;
  }

  /**
   * Builds the network of {@code hypotheses} (token lists in one unit) with their posteriors (≥ 0, not all
   * 0; renormalised over the hypotheses that enter), interning tokens in a new vocabulary.
   *
   * @param maxHypotheses at most this many hypotheses enter, the highest posteriors first (ties: input order)
   */
  public static ConfusionNetwork build(List<List<String>> hypotheses, double[] posteriors, int maxHypotheses) {
    return build(hypotheses, posteriors, maxHypotheses, new Vocabulary());
  }

  /** As {@link #build(List, double[], int)}, interning tokens in the given (caller-owned) vocabulary. */
  public static ConfusionNetwork build(
      List<List<String>> hypotheses, double[] posteriors, int maxHypotheses, Vocabulary vocabulary) {
    return NetworkBuilder.build(hypotheses, posteriors, maxHypotheses, vocabulary);
  }

  public Vocabulary vocabulary() {
    return vocabulary;
  }

  public int slotCount() {
    return slotStart.length - 1;
  }

  public int arcCount() {
    return arcToken.length;
  }

  /** First arc of {@code slot}. */
  public int arcStart(int slot) {
    return slotStart[slot];
  }

  /** One past the last arc of {@code slot}. */
  public int arcEnd(int slot) {
    return slotStart[slot + 1];
  }

  /** Token id of {@code arc}, or {@link #EMPTY}. */
  public int arcToken(int arc) {
    return arcToken[arc];
  }

  public boolean isEmpty(int arc) {
    return arcToken[arc] == EMPTY;
  }

  /** Raw token text of {@code arc}; null for the empty arc. */
  public String arcText(int arc) {
    return arcToken[arc] == EMPTY ? null : vocabulary.token(arcToken[arc]);
  }

  /** Posterior probability of {@code arc} (0 … 1). */
  public double arcPosterior(int arc) {
    return arcPosterior[arc];
  }

  /** Input indices (ascending) of the hypotheses that put {@code arc} there. */
  public int[] arcHypotheses(int arc) {
    return Arrays.copyOfRange(hypList, hypStart[arc], hypStart[arc + 1]);
  }

  /** Number of hypotheses on {@code arc}. */
  public int arcHypothesisCount(int arc) {
    return hypStart[arc + 1] - hypStart[arc];
  }

  /** Number of hypotheses given to {@link #build}. */
  public int inputCount() {
    return inputCount;
  }

  /** Number of hypotheses that entered the network (≤ the cap). */
  public int enteredCount() {
    return entered.length;
  }

  /** Input index of the k-th entered hypothesis (entry order: posterior descending, ties by input order). */
  public int enteredInput(int k) {
    return entered[k];
  }

  /** Whether the hypothesis cap left some inputs out. */
  public boolean capped() {
    return capped;
  }

  /** The arc of the k-th entered hypothesis in {@code slot}. */
  public int pathArc(int k, int slot) {
    return pathArc[k * slotCount() + slot];
  }

  /** The tokens of the k-th entered hypothesis read back from its path (empty arcs skipped). */
  public List<String> pathTokens(int k) {
    List<String> out = new ArrayList<>();
    for (int s = 0; s < slotCount(); s++) {
      int a = pathArc(k, s);
      if (arcToken[a] != EMPTY) out.add(vocabulary.token(arcToken[a]));
    }
    return out;
  }

  /**
   * The arc consensus decoding takes in {@code slot}: the highest posterior; ties go to the arc that
   * appeared first in the slot (the arc of the earliest-entered hypothesis).
   */
  public int consensusArc(int slot) {
    int best = slotStart[slot];
    for (int a = best + 1; a < slotStart[slot + 1]; a++) if (arcPosterior[a] > arcPosterior[best]) best = a;
    return best;
  }

  /** The entry number of input hypothesis {@code input}, or −1 when the cap left it out. */
  public int enteredIndexOf(int input) {
    for (int k = 0; k < entered.length; k++) if (entered[k] == input) return k;
    return -1;
  }
}
