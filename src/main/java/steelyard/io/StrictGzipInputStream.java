package steelyard.io;

import java.io.EOFException;
import java.io.IOException;
import java.io.InputStream;
import java.util.zip.CRC32;
import java.util.zip.DataFormatException;
import java.util.zip.Inflater;
import java.util.zip.ZipException;

/**
 * Decompresses gzip data (RFC 1952) member by member and accepts nothing else: every member's header, deflate
 * data, CRC-32 and length are checked, and anything after the last complete member (garbage, or a next
 * member cut short) is an error. {@link java.util.zip.GZIPInputStream} instead stops silently at bytes after
 * a member that do not form a valid header, which drops data without a word.
 *
 * <p>Errors: {@link EOFException} when the data ends inside a member (truncated), {@link ZipException} for
 * anything malformed, including trailing data. Storage: one 64 KiB input buffer and the {@link Inflater}.
 * Not thread-safe.
 */
final class StrictGzipInputStream extends InputStream {
  private static final int MAGIC_1 = 0x1f;
  private static final int MAGIC_2 = 0x8b;
  private static final int DEFLATE = 8;
  private static final int FHCRC = 2;
  private static final int FEXTRA = 4;
  private static final int FNAME = 8;
  private static final int FCOMMENT = 16;
  private static final int RESERVED_FLAGS = 0xe0;

  private final InputStream in;
  private final Inflater inflater = new Inflater(true);
  private final CRC32 crc = new CRC32();
  private final byte[] buf = new byte[1 << 16];
  private int pos;
  private int lim;
  private long memberBytes;
  private boolean finished;

  /** Reads and checks the first member's header at once: a damaged header fails here. */
  StrictGzipInputStream(InputStream in) throws IOException {
    this.in = in;
    readHeader();
  }

  @Override
  public int read() throws IOException {
    byte[] one = new byte[1];
    int n = read(one, 0, 1);
    return n < 0 ? -1 : one[0] & 0xff;
  }

  @Override
  public int read(byte[] b, int off, int len) throws IOException {
    if (len == 0) return 0;
    while (!finished) {
      int n = inflate(b, off, len);
      if (n > 0) {
        crc.update(b, off, n);
        memberBytes += n;
        return n;
      }
      if (inflater.finished()) {
        pos = lim - inflater.getRemaining();
        readTrailer();
        if (!nextMember()) finished = true;
      } else if (inflater.needsDictionary()) {
        throw new ZipException("deflate data asks for a preset dictionary, which gzip does not use");
      } else if (inflater.needsInput()) {
        if (!fill()) throw new EOFException("gzip data ends inside a member");
        inflater.setInput(buf, pos, lim - pos);
      }
    }
    return -1;
  }

  @Override
  public void close() throws IOException {
    inflater.end();
    in.close();
  }

  private int inflate(byte[] b, int off, int len) throws ZipException {
    try {
      return inflater.inflate(b, off, len);
    } catch (DataFormatException e) {
      throw new ZipException("invalid deflate data (" + e.getMessage() + ")");
    }
  }

  /** After a member's trailer: true when another member follows, false at the end of the data. */
  private boolean nextMember() throws IOException {
    if (pos == lim && !fill()) return false;
    int b = buf[pos] & 0xff;
    if (b != MAGIC_1) throw new ZipException("data after the end of the gzip stream, starting with byte 0x" + Integer.toHexString(b));
    readHeader();
    return true;
  }

  private void readHeader() throws IOException {
    CRC32 headerCrc = new CRC32();
    int id1 = header(headerCrc);
    int id2 = header(headerCrc);
    if (id1 != MAGIC_1 || id2 != MAGIC_2) throw new ZipException("not gzip data (bad magic bytes)");
    if (header(headerCrc) != DEFLATE) throw new ZipException("unknown gzip compression method");
    int flags = header(headerCrc);
    if ((flags & RESERVED_FLAGS) != 0) throw new ZipException("reserved gzip header flags are set");
    for (int i = 0; i < 6; i++) header(headerCrc); // modification time, extra flags, operating system
    if ((flags & FEXTRA) != 0) {
      int xlen = header(headerCrc) | header(headerCrc) << 8;
      for (int i = 0; i < xlen; i++) header(headerCrc);
    }
    if ((flags & FNAME) != 0) while (header(headerCrc) != 0) { }
    if ((flags & FCOMMENT) != 0) while (header(headerCrc) != 0) { }
    if ((flags & FHCRC) != 0) {
      int expected = (int) (headerCrc.getValue() & 0xffff);
      int stored = readByte() | readByte() << 8;
      if (stored != expected) throw new ZipException("gzip header checksum mismatch");
    }
    inflater.reset();
    crc.reset();
    memberBytes = 0;
    inflater.setInput(buf, pos, lim - pos);
  }

  private void readTrailer() throws IOException {
    long storedCrc = readInt();
    long storedSize = readInt();
    if (storedCrc != crc.getValue()) throw new ZipException("CRC-32 mismatch (corrupt data)");
    if (storedSize != (memberBytes & 0xffffffffL)) throw new ZipException("length mismatch (corrupt data)");
  }

  private int header(CRC32 headerCrc) throws IOException {
    int b = readByte();
    headerCrc.update(b);
    return b;
  }

  private long readInt() throws IOException {
    long v = 0;
    for (int i = 0; i < 4; i++) v |= (long) readByte() << (8 * i);
    return v;
  }

  private int readByte() throws IOException {
    if (pos == lim && !fill()) throw new EOFException("gzip data ends inside a member header or trailer");
    return buf[pos++] & 0xff;
  }

  /** Refills the input buffer from the start; false at the end of the underlying stream. */
  private boolean fill() throws IOException {
    int n;
    do {
      n = in.read(buf, 0, buf.length);
    } while (n == 0);
    if (n < 0) {
      pos = lim = 0;
      return false;
    }
    pos = 0;
    lim = n;
    return true;
  }
}
