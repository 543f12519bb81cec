package steelyard.reliability;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;

/**
 * Seeded byte-level mutations of a valid input: bit flips, truncation, inserted quotes, commas, newlines,
 * NULs, byte-order marks and format keywords, duplicated or deleted lines, spliced ranges and pure random
 * bytes. One {@code SplittableRandom} seed fully determines the result, so a failing case is replayed from
 * its seed alone.
 */
final class Mutator {
  private static final byte[][] SNIPPETS = bytes(
      "\"", ",", "\n", "\r\n", "\r", "\u0000", "\uFEFF", "\t", "\\", "|", "=", " ", "#", "\"\"", ",,", "\n\n",
      "NaN", "-Infinity", "Infinity", "1e308", "-1e-320", "0x1p3", "+", "-", "99999999999999999999", "-0",
      "\\data\\", "ngram 1=", "ngram 2=2000000000", "\\1-grams:", "\\2-grams:", "\\3-grams:", "\\end\\", "-99", "<s>", "</s>", "<unk>",
      "equate", "optional", "drop", "utt_id", "text", "rank", "system", "acoustic", "\u200F", "\u202E", "e\u0301", "\uD83D",
      "\u00e9", "\u0000\u0000\u0000\u0000");

  private Mutator() {}

  /** Applies 1 to 4 random mutations (or, one time in 20, replaces everything by random bytes). */
  static byte[] mutate(byte[] seed, SplittableRandom r) {
    if (r.nextInt(20) == 0) return randomBytes(r, r.nextInt(200));
    byte[] b = seed;
    for (int i = 0, n = 1 + r.nextInt(4); i < n; i++) b = once(b, r);
    return b;
  }

  private static byte[] once(byte[] b, SplittableRandom r) {
    int len = b.length;
    switch (r.nextInt(9)) {
      case 0: { // bit flips
        byte[] c = b.clone();
        for (int i = 0, n = 1 + r.nextInt(4); i < n && len > 0; i++) c[r.nextInt(len)] ^= (byte) (1 << r.nextInt(8));
        return c;
      }
      case 1: // truncation
        return java.util.Arrays.copyOf(b, len == 0 ? 0 : r.nextInt(len));
      case 2: case 3: // inserted snippet
        return insert(b, r.nextInt(len + 1), SNIPPETS[r.nextInt(SNIPPETS.length)]);
      case 4: // duplicated line
        return duplicateLine(b, r);
      case 5: { // deleted range
        if (len == 0) return b;
        int from = r.nextInt(len);
        int to = Math.min(len, from + 1 + r.nextInt(Math.max(1, len / 4)));
        return splice(b, from, to, new byte[0]);
      }
      case 6: { // a range copied elsewhere
        if (len == 0) return b;
        int from = r.nextInt(len);
        int to = Math.min(len, from + 1 + r.nextInt(40));
        return insert(b, r.nextInt(len + 1), java.util.Arrays.copyOfRange(b, from, to));
      }
      case 7: // random bytes inserted
        return insert(b, r.nextInt(len + 1), randomBytes(r, 1 + r.nextInt(8)));
      default: { // a byte replaced by a digit, sign or dot (numbers are where readers parse hardest)
        if (len == 0) return b;
        byte[] c = b.clone();
        c[r.nextInt(len)] = (byte) "0123456789-.e+ ".charAt(r.nextInt(15));
        return c;
      }
    }
  }

  private static byte[] duplicateLine(byte[] b, SplittableRandom r) {
    String s = new String(b, StandardCharsets.ISO_8859_1);
    String[] lines = s.split("\n", -1);
    if (lines.length < 2) return b;
    int i = r.nextInt(lines.length);
    int at = r.nextInt(lines.length);
    StringBuilder out = new StringBuilder();
    for (int k = 0; k < lines.length; k++) {
      if (k == at) out.append(lines[i]).append('\n');
      out.append(lines[k]);
      if (k < lines.length - 1) out.append('\n');
    }
    return out.toString().getBytes(StandardCharsets.ISO_8859_1);
  }

  private static byte[] insert(byte[] b, int at, byte[] what) {
    return splice(b, at, at, what);
  }

  private static byte[] splice(byte[] b, int from, int to, byte[] what) {
    ByteArrayOutputStream out = new ByteArrayOutputStream(b.length + what.length);
    out.write(b, 0, from);
    out.write(what, 0, what.length);
    out.write(b, to, b.length - to);
    return out.toByteArray();
  }

  static byte[] randomBytes(SplittableRandom r, int n) {
    byte[] b = new byte[n];
    for (int i = 0; i < n; i++) b[i] = (byte) r.nextInt(256);
    return b;
  }

  private static byte[][] bytes(String... s) {
    byte[][] out = new byte[s.length][];
    for (int i = 0; i < s.length; i++) out[i] = s[i].getBytes(StandardCharsets.UTF_8);
    return out;
  }
}
