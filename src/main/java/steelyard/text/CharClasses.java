package steelyard.text;

/**
 * Code point classes used by the normaliser, with an ASCII fast path so that the common case never calls
 * into the Unicode tables.
 *
 * <p>Storage: one 128-entry {@code byte} table (128 bytes) for ASCII; everything above ASCII asks
 * {@link Character}.
 */
final class CharClasses {
  private static final byte WHITESPACE = 1;
  private static final byte PUNCTUATION = 2;
  private static final byte DASH = 4;
  private static final byte[] ASCII = new byte[128];

  static {
    for (int c = 0; c < 128; c++) ASCII[c] = classify(c);
  }

  private CharClasses() {}

  /**
   * Unicode whitespace: the White_Space property (Zs, Zl, Zp, TAB to CR, NEL) plus the ASCII information
   * separators U+001C–U+001F, which Java also treats as whitespace.
   */
  static boolean isWhitespace(int cp) {
    return cp < 128 ? (ASCII[cp] & WHITESPACE) != 0 : (classify(cp) & WHITESPACE) != 0;
  }

  /** Unicode punctuation: general categories Pc, Pd, Ps, Pe, Pi, Pf, Po. Symbols ($ + &lt; = &gt; ^ ` | ~) are not. */
  static boolean isPunctuation(int cp) {
    return cp < 128 ? (ASCII[cp] & PUNCTUATION) != 0 : (classify(cp) & PUNCTUATION) != 0;
  }

  /** Hyphens and dashes: general category Pd (hyphen-minus, U+2010 hyphen, en and em dashes, …). */
  static boolean isDash(int cp) {
    return cp < 128 ? (ASCII[cp] & DASH) != 0 : (classify(cp) & DASH) != 0;
  }

  private static byte classify(int cp) {
    byte flags = 0;
    if (cp == 0x85 || Character.isWhitespace(cp) || Character.isSpaceChar(cp)) flags |= WHITESPACE;
    switch (Character.getType(cp)) {
      case Character.DASH_PUNCTUATION:
        flags |= DASH | PUNCTUATION;
        break;
      case Character.CONNECTOR_PUNCTUATION:
      case Character.START_PUNCTUATION:
      case Character.END_PUNCTUATION:
      case Character.INITIAL_QUOTE_PUNCTUATION:
      case Character.FINAL_QUOTE_PUNCTUATION:
      case Character.OTHER_PUNCTUATION:
        flags |= PUNCTUATION;
        break;
      default:
        break;
    }
    return flags;
  }
}
