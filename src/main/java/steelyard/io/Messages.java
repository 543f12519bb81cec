package steelyard.io;

/** Formatting of file content quoted in error messages, which must stay on one line and be valid Unicode. */
public final class Messages {
  private Messages() {}

  /**
   * A value as quoted in a message: one line (control characters and lone surrogates escaped as
   * <code>&#92;uXXXX</code>), at most {@code max} chars.
   */
  public static String shown(String value, int max) {
    String v = value.length() <= max ? value : value.substring(0, max) + "…";
    StringBuilder sb = null;
    for (int i = 0; i < v.length(); i++) {
      char c = v.charAt(i);
      if (c >= 0x20 && c != 0x7f && !isLoneSurrogate(v, i)) {
        if (sb != null) sb.append(c);
        continue;
      }
      if (sb == null) sb = new StringBuilder(v.substring(0, i));
      switch (c) {
        case '\n' -> sb.append("\\n");
        case '\r' -> sb.append("\\r");
        case '\t' -> sb.append("\\t");
        default -> sb.append(String.format(java.util.Locale.ROOT, "\\u%04x", (int) c));
      }
    }
    return sb == null ? v : sb.toString();
  }

  /**
   * Index of the first UTF-16 surrogate in {@code s} that is not part of a pair (text that no UTF-8 file can
   * hold, e.g. from a JSON escape such as <code>&#92;uD800</code>), or −1.
   */
  public static int loneSurrogate(String s) {
    for (int i = 0; i < s.length(); i++) if (isLoneSurrogate(s, i)) return i;
    return -1;
  }

  private static boolean isLoneSurrogate(String s, int i) {
    char c = s.charAt(i);
    if (Character.isHighSurrogate(c)) return i + 1 >= s.length() || !Character.isLowSurrogate(s.charAt(i + 1));
    if (Character.isLowSurrogate(c)) return i == 0 || !Character.isHighSurrogate(s.charAt(i - 1));
    return false;
  }
}
