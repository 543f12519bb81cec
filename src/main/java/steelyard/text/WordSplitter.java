package steelyard.text;

import java.util.ArrayList;
import java.util.List;

/**
 * Splits normalised text into words in one pass over the code points: whitespace separates, punctuation is
 * optionally removed, inner dashes optionally separate. No regex: this runs on every scored string.
 */
final class WordSplitter {
  private WordSplitter() {}

  static List<String> split(String s, boolean strip, boolean splitHyphens) {
    List<String> out = new ArrayList<>();
    Pieces word = new Pieces(s);
    int n = s.length();
    int i = 0;
    while (i < n) {
      int cp = s.codePointAt(i);
      int len = Character.charCount(cp);
      if (CharClasses.isWhitespace(cp)) {
        word.flush(i, out);
      } else if (splitHyphens && CharClasses.isDash(cp)) {
        int j = endOfDashes(s, i);
        if (isInner(s, i, j)) {
          word.flush(i, out);
        } else if (strip) {
          word.skip(i);
        } else {
          word.keep(i);
        }
        i = j;
        continue;
      } else if (strip && CharClasses.isPunctuation(cp)) {
        word.skip(i);
      } else {
        word.keep(i);
      }
      i += len;
    }
    word.flush(n, out);
    return out;
  }

  private static int endOfDashes(String s, int i) {
    int j = i;
    while (j < s.length()) {
      int cp = s.codePointAt(j);
      if (!CharClasses.isDash(cp)) break;
      j += Character.charCount(cp);
    }
    return j;
  }

  /** A dash run [i, j) is inside a word when both neighbours are neither whitespace nor punctuation. */
  private static boolean isInner(String s, int i, int j) {
    if (i == 0 || j >= s.length()) return false;
    int before = s.codePointBefore(i);
    int after = s.codePointAt(j);
    return isWordChar(before) && isWordChar(after);
  }

  private static boolean isWordChar(int cp) {
    return !CharClasses.isWhitespace(cp) && !CharClasses.isPunctuation(cp);
  }

  /**
   * The word being built as kept stretches of the source: a word with nothing removed is one substring,
   * so the common case copies no characters twice.
   */
  private static final class Pieces {
    private final String s;
    private StringBuilder sb;
    private boolean spliced;
    private int start = -1;

    Pieces(String s) {
      this.s = s;
    }

    void keep(int i) {
      if (start < 0) start = i;
    }

    void skip(int i) {
      if (start >= 0) {
        builder().append(s, start, i);
        start = -1;
      }
      spliced = true;
    }

    void flush(int i, List<String> out) {
      if (!spliced) {
        if (start >= 0) out.add(s.substring(start, i));
      } else {
        if (start >= 0) builder().append(s, start, i);
        if (sb != null && sb.length() > 0) out.add(sb.toString());
        if (sb != null) sb.setLength(0);
      }
      start = -1;
      spliced = false;
    }

    private StringBuilder builder() {
      if (sb == null) sb = new StringBuilder();
      return sb;
    }
  }
}
