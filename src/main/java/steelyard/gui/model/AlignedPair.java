package steelyard.gui.model;

import java.util.ArrayList;
import java.util.List;
import steelyard.eval.Alignment;
import steelyard.text.TokenSequence;

/**
 * One column of an alignment as the window draws it: a reference token over a hypothesis token with the
 * edit that relates them. Optional tokens (rules-file hesitations), which scoring ignores, get their own
 * columns so that nothing the recogniser said is hidden.
 *
 * @param kind      the edit
 * @param reference the reference token, or null
 * @param hypothesis the hypothesis token, or null
 */
public record AlignedPair(Kind kind, String reference, String hypothesis) {

  /** What relates the two tokens; {@link #mark} is the text mark shown beside the colour. */
  public enum Kind {
    CORRECT(""), SUBSTITUTION("S"), DELETION("D"), INSERTION("I"), IGNORED("opt");

    private final String mark;

    Kind(String mark) {
      this.mark = mark;
    }

    /** A short text mark, so that the edit never shows by colour alone. */
    public String mark() {
      return mark;
    }

    /** Whether the column counts as an error. */
    public boolean isError() {
      return this == SUBSTITUTION || this == DELETION || this == INSERTION;
    }
  }

  /**
   * The columns of {@code a} (an alignment of {@code hyp} against {@code ref}, optional tokens removed), with
   * each optional token put back where it stood.
   */
  public static List<AlignedPair> columns(Alignment a, TokenSequence ref, List<String> hyp, boolean[] hypOptional) {
    List<AlignedPair> out = new ArrayList<>();
    int nextRef = 0;
    int nextHyp = 0;
    for (int k = 0; k < a.size(); k++) {
      int r = a.refIndex(k);
      int h = a.hypIndex(k);
      if (r >= 0) nextRef = ignoredUpTo(out, ref.tokens(), ref.optional(), nextRef, r, true);
      if (h >= 0) nextHyp = ignoredUpTo(out, hyp, hypOptional, nextHyp, h, false);
      out.add(new AlignedPair(kind(a.op(k)), r < 0 ? null : ref.tokens().get(r), h < 0 ? null : hyp.get(h)));
      if (r >= 0) nextRef = r + 1;
      if (h >= 0) nextHyp = h + 1;
    }
    ignoredUpTo(out, ref.tokens(), ref.optional(), nextRef, ref.size(), true);
    ignoredUpTo(out, hyp, hypOptional, nextHyp, hyp.size(), false);
    return out;
  }

  /** Edit counts of {@code columns}: {S, D, I}. */
  public static int[] counts(List<AlignedPair> columns) {
    int[] c = new int[3];
    for (AlignedPair p : columns) {
      if (p.kind == Kind.SUBSTITUTION) c[0]++;
      else if (p.kind == Kind.DELETION) c[1]++;
      else if (p.kind == Kind.INSERTION) c[2]++;
    }
    return c;
  }

  private static int ignoredUpTo(List<AlignedPair> out, List<String> tokens, boolean[] optional, int from, int to, boolean isRef) {
    for (int i = from; i < to; i++) {
      if (optional == null || !optional[i]) continue;
      out.add(isRef ? new AlignedPair(Kind.IGNORED, tokens.get(i), null) : new AlignedPair(Kind.IGNORED, null, tokens.get(i)));
    }
    return Math.max(from, to);
  }

  private static Kind kind(byte op) {
    switch (op) {
      case Alignment.CORRECT: return Kind.CORRECT;
      case Alignment.SUBSTITUTION: return Kind.SUBSTITUTION;
      case Alignment.DELETION: return Kind.DELETION;
      case Alignment.INSERTION: return Kind.INSERTION;
      default: throw new AssertionError(op);
    }
  }
}
