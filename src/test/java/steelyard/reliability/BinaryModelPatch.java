package steelyard.reliability;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.CRC32C;

/**
 * Edits a binary model file the way a tampering user or a buggy tool would, and then recomputes the
 * payload's CRC32C so that the checksum no longer catches it. The layout is read from the README's table of
 * the format (32-byte header, CRC32C at offset 24; payload: order, flags, floor, metadata lines, tokens,
 * counts, padding to 4 bytes, then per order an int array), independently of the product's reader.
 */
final class BinaryModelPatch {
  private static final int HEADER = 32;
  private static final int CRC_OFFSET = 24;

  private final byte[] bytes;
  private final ByteBuffer b;
  private final int order;
  private final List<String> tokens = new ArrayList<>();
  private final List<Integer> tokenOffsets = new ArrayList<>();
  private final int countsOffset;
  private final int[] arrayOffsets;
  private final int[] arrayLengths;

  private BinaryModelPatch(byte[] file) {
    bytes = file.clone();
    b = ByteBuffer.wrap(bytes).order(ByteOrder.LITTLE_ENDIAN);
    int p = HEADER;
    order = b.getInt(p);
    p += 16; // order, flags, floor (double)
    p = skipStrings(p, null, null);
    p = skipStrings(p, tokens, tokenOffsets);
    countsOffset = p;
    p += 4 * order;
    while (((p - HEADER) & 3) != 0) p++;
    arrayOffsets = new int[order];
    arrayLengths = new int[order];
    for (int k = 0; k < order; k++) {
      arrayLengths[k] = b.getInt(p);
      arrayOffsets[k] = p + 4;
      p += 4 + 4 * arrayLengths[k];
    }
    if (p != bytes.length) throw new IllegalStateException("layout not understood: ends at " + p + " of " + bytes.length);
  }

  static BinaryModelPatch of(byte[] file) {
    return new BinaryModelPatch(file);
  }

  /** Sets the unigram log10 probability of {@code token} (record {@code [id, P, back-off, child]}). */
  BinaryModelPatch setUnigramLog10(String token, float log10) {
    int id = tokens.indexOf(token);
    b.putInt(arrayOffsets[0] + 4 * (4 * id + 1), Float.floatToIntBits(log10));
    return this;
  }

  /** Sets the probability of the first occupied slot of the highest order (words of all slots, then P of all). */
  BinaryModelPatch setFirstTopOrderLog10(float log10) {
    int k = order - 1;
    int slots = arrayLengths[k] / 2;
    for (int s = 0; s < slots; s++) {
      if (b.getInt(arrayOffsets[k] + 4 * s) != -1) {
        b.putInt(arrayOffsets[k] + 4 * (slots + s), Float.floatToIntBits(log10));
        return this;
      }
    }
    throw new IllegalStateException("no occupied slot");
  }

  /** Adds {@code delta} to the stored count of n-grams of order {@code k} (1-based). */
  BinaryModelPatch addToCount(int k, int delta) {
    int at = countsOffset + 4 * (k - 1);
    b.putInt(at, b.getInt(at) + delta);
    return this;
  }

  /** Replaces the first byte of {@code token}'s UTF-8 bytes with 0xFF, which never occurs in UTF-8. */
  BinaryModelPatch breakTokenUtf8(String token) {
    bytes[tokenOffsets.get(tokens.indexOf(token))] = (byte) 0xFF;
    return this;
  }

  /** The edited file with a freshly computed payload checksum. */
  byte[] bytes() {
    CRC32C crc = new CRC32C();
    crc.update(bytes, HEADER, bytes.length - HEADER);
    b.putInt(CRC_OFFSET, (int) crc.getValue());
    return bytes.clone();
  }

  private int skipStrings(int p, List<String> into, List<Integer> offsets) {
    int n = b.getInt(p);
    p += 4;
    for (int i = 0; i < n; i++) {
      int len = b.getInt(p);
      p += 4;
      if (into != null) {
        into.add(new String(bytes, p, len, StandardCharsets.UTF_8));
        offsets.add(p);
      }
      p += len;
    }
    return p;
  }
}
