package steelyard.lm;

import java.io.IOException;
import java.io.InputStream;
import java.nio.BufferUnderflowException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.zip.CRC32C;
import steelyard.io.AtomicOutput;
import steelyard.io.InputException;
import steelyard.io.InputFiles;

/**
 * The project's binary model file: the arrays of a {@link CompactModel}, bulk-read in one go.
 *
 * <p>Layout, all numbers little-endian:
 * <pre>
 * header, 32 bytes:
 *   0  8  magic  53 59 4C 4D 42 49 4E 1A ("SYLMBIN" + 0x1A)
 *   8  4  format version (1)
 *  12  4  reserved, 0
 *  16  8  payload length in bytes
 *  24  4  CRC32C of the payload
 *  28  4  reserved, 0
 * payload:
 *   int order (1 … 6), int flags (bit 0: suffix-closed), double log10 floor for tokens without a unigram
 *   int m, then m metadata lines        (each: int byte length, UTF-8 bytes)
 *   int V, then V tokens in id order    (each: int byte length, UTF-8 bytes)
 *   order × int: listed n-grams per order
 *   zero padding to a multiple of 4 bytes
 *   per order k = 1 … N: int length L, then L ints — the record array of order k exactly as described in
 *   {@link CompactModel} (unigrams 4 ints per token + sentinel; middle orders 4 ints per slot + sentinel;
 *   highest order: the word ids of all slots, then the probability bits of all slots)
 * </pre>
 * Reading checks magic, version, length and checksum before it looks at the payload, then checks the
 * structure (orders, lengths, child ranges, word ids) and the values as the ARPA reader would (strict UTF-8
 * tokens, each once; log10 probabilities ≤ 0; finite back-off weights; counts equal to the n-grams held), so a
 * damaged or edited file is an {@link InputException} naming the file (no line) and never a crash. The metadata lines carry unit and normalisation ({@link ModelMetadata}).
 */
public final class BinaryModelFile {
  static final byte[] MAGIC = {0x53, 0x59, 0x4C, 0x4D, 0x42, 0x49, 0x4E, 0x1A};
  public static final int VERSION = 1;
  static final int HEADER = 32;

  private BinaryModelFile() {}

  /** Writes {@code model} to {@code file} atomically. */
  public static void write(CompactModel model, Path file) {
    byte[] payload = payload(model);
    CRC32C crc = new CRC32C();
    crc.update(payload);
    ByteBuffer h = ByteBuffer.allocate(HEADER).order(ByteOrder.LITTLE_ENDIAN);
    h.put(MAGIC).putInt(VERSION).putInt(0).putLong(payload.length).putInt((int) crc.getValue()).putInt(0);
    AtomicOutput.writeBytes(file, os -> {
      os.write(h.array());
      os.write(payload);
    });
  }

  private static byte[] payload(CompactModel m) {
    List<byte[]> meta = utf8(m.metadata);
    List<byte[]> toks = utf8(List.of(m.tokens));
    long size = 16L + 4 + 4 + 4L * m.order;
    for (byte[] b : meta) size += 4 + b.length;
    for (byte[] b : toks) size += 4 + b.length;
    size = (size + 3) & ~3L;
    for (int[] a : m.levels) size += 4 + 4L * a.length;
    if (size > Integer.MAX_VALUE - 64) throw new IllegalArgumentException("model too large for one binary file: " + size + " bytes");
    ByteBuffer p = ByteBuffer.allocate((int) size).order(ByteOrder.LITTLE_ENDIAN);
    p.putInt(m.order).putInt(m.suffixClosed ? 1 : 0).putDouble(m.unknownFloorLog10);
    p.putInt(meta.size());
    for (byte[] b : meta) p.putInt(b.length).put(b);
    p.putInt(toks.size());
    for (byte[] b : toks) p.putInt(b.length).put(b);
    for (int c : m.ngramCounts) p.putInt(c);
    while ((p.position() & 3) != 0) p.put((byte) 0);
    for (int[] a : m.levels) {
      p.putInt(a.length);
      p.asIntBuffer().put(a);
      p.position(p.position() + 4 * a.length);
    }
    return p.array();
  }

  private static List<byte[]> utf8(List<String> lines) {
    List<byte[]> out = new ArrayList<>(lines.size());
    for (String s : lines) out.add(s.getBytes(StandardCharsets.UTF_8));
    return out;
  }

  /** Reads a model written by {@link #write}. */
  public static CompactModel read(Path file) {
    ByteBuffer all = readAll(file);
    if (all.remaining() == 0) throw InputException.inFile(file, "empty file", "a binary model file written by 'steelyard lm copy'");
    if (all.remaining() < HEADER) throw bad(file, "file too short for the header (" + all.remaining() + " bytes; truncated?)");
    byte[] magic = new byte[8];
    all.get(magic);
    if (!java.util.Arrays.equals(magic, MAGIC)) throw bad(file, "not a steelyard binary model (wrong magic bytes)");
    int version = all.getInt();
    if (version != VERSION) {
      throw InputException.inFile(file, "binary model format version " + Integer.toUnsignedString(version) + " is not supported",
          "version " + VERSION + " (convert the model again from its ARPA file)");
    }
    all.getInt();
    long length = all.getLong();
    int crc = all.getInt();
    all.getInt();
    if (length != all.remaining()) {
      throw bad(file, "payload is " + all.remaining() + " bytes but the header announces " + length + (length > all.remaining() ? " (truncated?)" : ""));
    }
    CRC32C c = new CRC32C();
    c.update(all.duplicate());
    if ((int) c.getValue() != crc) throw bad(file, "checksum mismatch (damaged file)");
    try {
      return parse(file, all.slice().order(ByteOrder.LITTLE_ENDIAN));
    } catch (BufferUnderflowException | IndexOutOfBoundsException | IllegalArgumentException e) {
      throw bad(file, "inconsistent payload (" + e.getClass().getSimpleName() + ")").withCause(e);
    }
  }

  private static CompactModel parse(Path file, ByteBuffer p) {
    int order = p.getInt();
    if (order < 1 || order > 6) throw bad(file, "order " + order + " out of range");
    int flags = p.getInt();
    double floor = p.getDouble();
    if (!(floor <= 0) || Double.isInfinite(floor)) throw bad(file, "bad unknown-token floor " + floor);
    List<String> meta = strings(file, p, "metadata line", false);
    List<String> toks = strings(file, p, "vocabulary token", true);
    int[] counts = new int[order];
    for (int k = 0; k < order; k++) if ((counts[k] = p.getInt()) < 0) throw bad(file, "negative n-gram count");
    while ((p.position() & 3) != 0) p.get();
    int v = toks.size();
    int[][] levels = new int[order][];
    for (int k = 0; k < order; k++) {
      int len = p.getInt();
      if (len < 0 || 4L * len > p.remaining()) throw bad(file, "array of order " + (k + 1) + " runs past the end");
      levels[k] = new int[len];
      p.asIntBuffer().get(levels[k]);
      p.position(p.position() + 4 * len);
    }
    if (p.hasRemaining()) throw bad(file, p.remaining() + " unexpected bytes after the last array");
    checkStructure(file, order, v, levels);
    checkValues(file, order, levels, counts);
    CompactModel m = new CompactModel(order, meta, toks.toArray(new String[0]), levels, counts, floor, false);
    if (m.sentenceStartId() < 0 || m.sentenceEndId() < 0 || m.unknownId() < 0) throw bad(file, "vocabulary lacks <s>, </s> or <unk>");
    // The flag is re-derived rather than trusted: a wrong flag would silently change scores.
    boolean closed = (flags & 1) != 0 && CompactBuilder.suffixClosed(m);
    return new CompactModel(order, meta, m.tokens, levels, counts, floor, closed);
  }

  private static List<String> strings(Path file, ByteBuffer p, String what, boolean tokens) {
    int n = p.getInt();
    if (n < 0 || n > p.remaining() / 4) throw bad(file, "string count " + n + " runs past the end");
    List<String> out = new ArrayList<>(n);
    Set<String> seen = tokens ? new HashSet<>() : null;
    CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
        .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
    for (int i = 0; i < n; i++) {
      int len = p.getInt();
      if (len < 0 || len > p.remaining()) throw bad(file, "string length " + len + " runs past the end");
      byte[] b = new byte[len];
      p.get(b);
      String s;
      try {
        s = utf8.decode(ByteBuffer.wrap(b)).toString();
      } catch (CharacterCodingException e) {
        throw bad(file, what + " " + i + " is not valid UTF-8");
      }
      if (tokens && (s.isEmpty() || !seen.add(s)))
        throw bad(file, what + " " + i + (s.isEmpty() ? " is empty" : " repeats an earlier token"));
      out.add(s);
    }
    return out;
  }

  /**
   * Refuses what the ARPA reader refuses, so that a file whose checksum was recomputed after an edit cannot
   * smuggle it in: a log10 probability that is positive, infinite or NaN on a listed n-gram (NaN marks a
   * context-only entry, which must have longer n-grams), a back-off weight that is not finite, and counts in
   * the payload that disagree with the n-grams the arrays hold (so {@code lm describe} reports what is there).
   */
  private static void checkValues(Path file, int order, int[][] levels, int[] counts) {
    for (int k = 0; k < order; k++) {
      int[] a = levels[k];
      boolean top = k == order - 1 && k > 0;
      int slots = top ? a.length / 2 : a.length / 4 - 1;
      int listed = 0;
      for (int s = 0; s < slots; s++) {
        if ((top ? a[s] : a[s * 4]) == CompactModel.EMPTY) continue;
        float prob = Float.intBitsToFloat(top ? a[slots + s] : a[s * 4 + 1]);
        boolean hasChildren = !top && k < order - 1 && a[s * 4 + 7] > a[s * 4 + 3];
        if (Float.isNaN(prob) && !hasChildren)
          throw bad(file, "an n-gram of order " + (k + 1) + " has no probability (NaN) and no longer n-grams");
        if (!Float.isNaN(prob)) {
          if (prob > 0 || Float.isInfinite(prob))
            throw bad(file, "an n-gram of order " + (k + 1) + " has the log10 probability " + prob + " (positive or infinite)");
          listed++;
        }
        if (!top && k < order - 1 && !Float.isFinite(Float.intBitsToFloat(a[s * 4 + 2])))
          throw bad(file, "an n-gram of order " + (k + 1) + " has a back-off weight that is not a finite number");
      }
      if (listed != counts[k])
        throw bad(file, "the payload counts " + counts[k] + " n-grams of order " + (k + 1) + " but its arrays hold " + listed);
    }
  }

  /** Checks array lengths, monotone child ranges and word ids so that queries can never index out of bounds. */
  private static void checkStructure(Path file, int order, int v, int[][] levels) {
    if (levels[0].length != 4 * (v + 1)) throw bad(file, "unigram array does not match the vocabulary");
    for (int k = 0; k < order; k++) {
      int[] a = levels[k];
      boolean top = k == order - 1 && k > 0;
      int stride = top ? 2 : 4; // highest order: words of all slots, then probabilities
      int slots = top ? a.length / 2 : a.length / 4 - 1;
      if (a.length % stride != 0 || slots < 0) throw bad(file, "array of order " + (k + 1) + " has a bad length");
      for (int s = 0; s < slots; s++) {
        int w = top ? a[s] : a[s * 4];
        if (w < -1 || w >= v || (k == 0 && w != -1 && w != s)) throw bad(file, "bad word id in order " + (k + 1));
      }
      if (k < order - 1) {
        int next = k + 1 == order - 1 ? levels[k + 1].length / 2 : levels[k + 1].length / 4 - 1;
        int prev = 0;
        for (int s = 0; s <= slots; s++) {
          int start = a[s * 4 + 3];
          if (start < prev || start > next) throw bad(file, "bad child range in order " + (k + 1));
          prev = start;
        }
        if (prev != next) throw bad(file, "child ranges of order " + (k + 1) + " do not cover order " + (k + 2));
      }
    }
  }

  private static ByteBuffer readAll(Path file) {
    if (InputFiles.isStream(file)) return readStream(file);
    try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
      long size = ch.size();
      if (size > Integer.MAX_VALUE - 64) throw bad(file, "file too large (" + size + " bytes)");
      ByteBuffer b = ByteBuffer.allocate((int) size).order(ByteOrder.LITTLE_ENDIAN);
      while (b.hasRemaining() && ch.read(b) >= 0) { }
      b.flip();
      return b;
    } catch (NoSuchFileException e) {
      throw InputException.inFile(file, "no such file", "an existing model file").withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read (" + e.getMessage() + ")", "a readable model file").withCause(e);
    }
  }

  /**
   * A model arriving through a pipe or FIFO: read to its end with plain reads (a stream has no size, and the
   * bulk-read shortcuts of {@link java.io.FileInputStream} ask for one: "Illegal seek").
   */
  private static ByteBuffer readStream(Path file) {
    try (InputStream in = new java.io.FileInputStream(file.toFile())) {
      java.io.ByteArrayOutputStream all = new java.io.ByteArrayOutputStream(1 << 16);
      byte[] buf = new byte[1 << 16];
      for (int n; (n = in.read(buf)) >= 0; ) {
        all.write(buf, 0, n);
        if (all.size() > Integer.MAX_VALUE - (1 << 20)) throw bad(file, "stream too large for a binary model");
      }
      return ByteBuffer.wrap(all.toByteArray()).order(ByteOrder.LITTLE_ENDIAN);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read (" + e.getMessage() + ")", "a readable model file").withCause(e);
    }
  }

  private static InputException bad(Path file, String problem) {
    return InputException.inFile(file, problem, "a binary model file written by 'steelyard lm copy' (format version " + VERSION + ")");
  }
}
