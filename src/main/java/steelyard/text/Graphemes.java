package steelyard.text;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Splits text into user-perceived characters: extended grapheme clusters as defined by Unicode Standard
 * Annex #29 (Unicode Text Segmentation), found with {@code \X} of {@link java.util.regex}. Java 17's
 * {@link java.text.BreakIterator} implements legacy clusters only, so it is not used.
 *
 * <p>Fast path: a string whose code units are all below U+0300 splits at every code unit without the
 * regex engine (no code point below U+0300 is Extend, SpacingMark, Prepend, ZWJ or Regional_Indicator, and
 * the only pair that joins there, CR LF, is checked). Thread-safe: the pattern is shared, matchers are
 * per call.
 */
public final class Graphemes {
  private static final Pattern CLUSTER = Pattern.compile("\\X");
  /** First code unit that can take part in a multi-code-point cluster, apart from CR LF. */
  private static final char FIRST_JOINING = '\u0300';

  /**
   * One shared string per code unit below U+0300, so the fast path allocates nothing per character
   * (768 one-char strings, about 40 KB once per JVM).
   */
  private static final String[] SINGLE = new String[FIRST_JOINING];

  static {
    for (char c = 0; c < FIRST_JOINING; c++) SINGLE[c] = String.valueOf(c);
  }

  private Graphemes() {}

  /** The extended grapheme clusters of {@code text}, in order; empty for an empty string. */
  public static List<String> split(CharSequence text) {
    List<String> out = new ArrayList<>(text.length());
    addTo(text, out);
    return out;
  }

  /** Appends the clusters of {@code text} to {@code out}. */
  public static void addTo(CharSequence text, List<String> out) {
    int n = text.length();
    if (isSimple(text)) {
      for (int i = 0; i < n; i++) {
        if (crlfAt(text, i)) {
          out.add("\r\n");
          i++;
        } else {
          out.add(SINGLE[text.charAt(i)]);
        }
      }
      return;
    }
    Matcher m = CLUSTER.matcher(text);
    while (m.find()) out.add(m.group());
  }

  /** The number of extended grapheme clusters in {@code text}. */
  public static int count(CharSequence text) {
    int n = text.length();
    if (isSimple(text)) {
      int c = 0;
      for (int i = 0; i < n; i++, c++) if (crlfAt(text, i)) i++;
      return c;
    }
    Matcher m = CLUSTER.matcher(text);
    int c = 0;
    while (m.find()) c++;
    return c;
  }

  /**
   * Cluster boundaries as char offsets: {@code [0, b1, b2, …, text.length()]}; a string of k clusters gives
   * k + 1 offsets ({@code [0]} for the empty string).
   */
  public static int[] boundaries(CharSequence text) {
    int n = text.length();
    int[] out = new int[n + 1];
    int k = 1;
    if (isSimple(text)) {
      for (int i = 0; i < n; i++) {
        if (crlfAt(text, i)) i++;
        out[k++] = i + 1;
      }
    } else {
      Matcher m = CLUSTER.matcher(text);
      while (m.find()) out[k++] = m.end();
    }
    return java.util.Arrays.copyOf(out, k);
  }

  private static boolean isSimple(CharSequence text) {
    for (int i = 0, n = text.length(); i < n; i++) if (text.charAt(i) >= FIRST_JOINING) return false;
    return true;
  }

  private static boolean crlfAt(CharSequence text, int i) {
    return text.charAt(i) == '\r' && i + 1 < text.length() && text.charAt(i + 1) == '\n';
  }
}
