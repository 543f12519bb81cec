package steelyard.io;

/** Formatting of file content quoted in error messages, which must stay on one line. */
final class Messages {
  private Messages() {}

  /** A value as quoted in a message: one line (control characters escaped), at most {@code max} chars. */
  static String shown(String value, int max) {
    String v = value.length() <= max ? value : value.substring(0, max) + "…";
    StringBuilder sb = null;
    for (int i = 0; i < v.length(); i++) {
      char c = v.charAt(i);
      if (c >= 0x20 && c != 0x7f) {
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
}
