package steelyard.report.html;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import steelyard.eval.Aligner;
import steelyard.eval.Alignment;
import steelyard.report.html.ReportModel.AlignedText;
import steelyard.report.html.ReportModel.AlignedToken;
import steelyard.report.html.ReportModel.Op;

/**
 * Aligns a hypothesis's tokens against the reference's for display, with {@link Aligner#alignment} (unit
 * costs, the scorer's own tie-breaking), so the marks on the page agree with the error counts everywhere else.
 * Tokens are compared as strings: pass them normalised the way they were scored.
 *
 * <p>Not thread-safe (it keeps one {@link Aligner}); use one instance per thread.
 */
public final class TokenAlignment {
  private final Aligner aligner = new Aligner();

  /** The hypothesis {@code text}, its tokens aligned against {@code reference}, and its error count. */
  public AlignedText align(String text, List<String> reference, List<String> hypothesis) {
    List<AlignedToken> tokens = steps(reference, hypothesis);
    int errors = 0;
    for (AlignedToken t : tokens) if (t.op() != Op.MATCH) errors++;
    return new AlignedText(text, tokens, errors);
  }

  /** The aligned steps of {@code hypothesis} against {@code reference}, in reading order. */
  public List<AlignedToken> steps(List<String> reference, List<String> hypothesis) {
    Map<String, Integer> ids = new HashMap<>();
    int[] ref = ids(reference, ids);
    int[] hyp = ids(hypothesis, ids);
    Alignment a = aligner.alignment(ref, hyp);
    List<AlignedToken> out = new ArrayList<>(a.size());
    for (int k = 0; k < a.size(); k++) {
      String r = a.refIndex(k) < 0 ? null : reference.get(a.refIndex(k));
      String h = a.hypIndex(k) < 0 ? null : hypothesis.get(a.hypIndex(k));
      out.add(new AlignedToken(op(a.op(k)), r, h));
    }
    return out;
  }

  private static int[] ids(List<String> tokens, Map<String, Integer> ids) {
    int[] out = new int[tokens.size()];
    for (int k = 0; k < out.length; k++) out[k] = ids.computeIfAbsent(tokens.get(k), t -> ids.size());
    return out;
  }

  private static Op op(byte code) {
    return switch (code) {
      case Alignment.CORRECT -> Op.MATCH;
      case Alignment.SUBSTITUTION -> Op.SUBSTITUTION;
      case Alignment.DELETION -> Op.DELETION;
      case Alignment.INSERTION -> Op.INSERTION;
      default -> throw new AssertionError("unknown alignment operation " + code);
    };
  }
}
