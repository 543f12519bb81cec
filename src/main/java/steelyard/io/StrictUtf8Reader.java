package steelyard.io;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.zip.ZipException;

/**
 * Decodes a byte stream as strict UTF-8 and turns every defect into an {@link InputException} that names the
 * line (and column, counted in UTF-16 units): invalid byte sequences, NUL characters and a byte-order mark
 * anywhere but at the very start. A leading BOM is dropped. Line breaks pass through unchanged, so LF and
 * CRLF both reach the CSV parser.
 *
 * <p>Storage: one 64 KiB byte buffer and one 64 Ki-char buffer (192 KiB per open file), independent of
 * file size. Gzip failures surfacing from the stream (truncation, corrupt data) become file-level errors.
 */
final class StrictUtf8Reader extends Reader {
  private static final int BUFFER = 1 << 16;

  private final Path file;
  private final InputStream in;
  private final CharsetDecoder decoder =
      StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT);
  private final ByteBuffer bytes = ByteBuffer.allocate(BUFFER);
  private final CharBuffer chars = CharBuffer.allocate(BUFFER);
  private boolean endOfBytes;
  private boolean flushed;
  private long charsSeen;
  private long line = 1;
  private int column;

  StrictUtf8Reader(Path file, InputStream in) {
    this.file = file;
    this.in = in;
    chars.flip();
  }

  @Override
  public int read(char[] cbuf, int off, int len) throws IOException {
    if (len == 0) return 0;
    if (!chars.hasRemaining() && !fill()) return -1;
    int n = Math.min(len, chars.remaining());
    chars.get(cbuf, off, n);
    return n;
  }

  @Override
  public int read() throws IOException {
    if (!chars.hasRemaining() && !fill()) return -1;
    return chars.get();
  }

  @Override
  public void close() throws IOException {
    in.close();
  }

  /** Decodes at least one more char into {@link #chars}; false at end of input. */
  private boolean fill() {
    while (true) {
      if (flushed) return false;
      chars.clear();
      if (!endOfBytes) readBytes();
      if (charsSeen == 0 && line == 1 && column == 0) sniff();
      bytes.flip();
      CoderResult result = decoder.decode(bytes, chars, endOfBytes);
      bytes.compact();
      if (endOfBytes && result.isUnderflow()) {
        decoder.flush(chars);
        flushed = true;
      }
      chars.flip();
      scan();
      if (result.isError()) throw invalid(endOfBytes && bytes.position() == result.length());
      if (chars.hasRemaining()) return true;
    }
  }

  private void readBytes() {
    try {
      int n = in.read(bytes.array(), bytes.arrayOffset() + bytes.position(), bytes.remaining());
      if (n < 0) endOfBytes = true;
      else bytes.position(bytes.position() + n);
    } catch (EOFException e) {
      throw InputException.inFile(file, "gzip data is truncated after line " + line, "a complete gzip file").withCause(e);
    } catch (ZipException e) {
      throw InputException.inFile(file, "gzip data is corrupt near line " + line + " (" + e.getMessage() + ")", "a valid gzip file")
          .withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
  }

  /** Names two common mix-ups at the very start of a file, before they surface as an invalid byte. */
  private void sniff() {
    if (bytes.position() < 2) return;
    int b0 = bytes.get(0) & 0xff;
    int b1 = bytes.get(1) & 0xff;
    if ((b0 == 0xff && b1 == 0xfe) || (b0 == 0xfe && b1 == 0xff)) {
      throw InputException.inFile(file, "UTF-16 text (starts with a UTF-16 byte-order mark)", "UTF-8 text; convert the file to UTF-8 first");
    }
    if (b0 == 0x1f && b1 == 0x8b) {
      throw InputException.inFile(file, "gzip data although the name does not end in .gz", "a name ending in .gz for a gzipped file");
    }
  }

  /** Checks the freshly decoded chars; tracks line and column; drops a leading BOM. */
  private void scan() {
    int start = chars.position();
    int end = chars.limit();
    char[] a = chars.array();
    for (int i = start; i < end; i++) {
      char c = a[i];
      if (c == '\n') {
        line++;
        column = 0;
        continue;
      }
      column++;
      if (c == 0) {
        throw InputException.at(file, line, column, "NUL character (byte 0x00)", "UTF-8 text without NUL bytes; is this a binary or UTF-16 file?");
      }
      if (c == '\uFEFF') {
        if (charsSeen == 0 && i == start) {
          chars.position(start + 1);
          column = 0;
          continue;
        }
        throw InputException.at(file, line, column, "byte-order mark in the middle of the file", "a byte-order mark only at the very start, if at all; were two files concatenated?");
      }
    }
    charsSeen += end - start;
  }

  private InputException invalid(boolean atEnd) {
    String what = atEnd ? "incomplete UTF-8 sequence at end of file" : "invalid UTF-8 byte sequence";
    return InputException.at(file, line, column + 1, what, "UTF-8 text; convert the file to UTF-8 first");
  }
}
