package steelyard.io;

import java.io.Closeable;
import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * Streaming RFC 4180 record reader: comma-separated, fields optionally in double quotes, a doubled quote
 * inside a quoted field stands for one quote, quoted fields may span lines. Records end at LF or CRLF; a CR
 * inside quotes, or not followed by LF, is data and kept, except that a lone CR before the first LF of the
 * file means CR-only line ends, an {@link InputException}. Wholly empty lines between records are skipped.
 *
 * <p>Tracks the physical line on which each record starts, for messages. A quote inside an unquoted field or
 * text after a closing quote is a row-level problem ({@link #problem()}), so lenient mode can skip the row;
 * a quote still open at end of file is fatal.
 *
 * <p>Memory: a 64 Ki-char read buffer plus the current record's kept fields. Limits guard against a runaway
 * quote or a binary file: a field may hold at most {@value #MAX_FIELD_CHARS} chars and a record at most
 * {@value #MAX_FIELDS} fields; beyond that the read fails with an {@link InputException} instead of filling
 * the heap. Columns not marked in {@link #keepOnly} are scanned but never turned into strings.
 */
final class CsvRecordReader implements Closeable {
  static final int MAX_FIELD_CHARS = 1 << 20;
  static final int MAX_FIELDS = 4096;

  private final Path file;
  private final Reader in;
  private final char[] buf = new char[1 << 16];
  private int pos;
  private int lim;
  private boolean eof;
  private final StringBuilder sb = new StringBuilder();

  private long line = 1;
  private long recordLine;
  private String[] fields = new String[16];
  private int count;
  private boolean[] keep;
  private String problem;
  private String problemExpected;
  /** Whether a record has ended at a line feed yet: a lone CR before that means CR-only line ends. */
  private boolean lineFeedSeen;

  CsvRecordReader(Path file, Reader in) {
    this.file = file;
    this.in = in;
  }

  /** From now on only columns {@code i} with {@code keep[i]} are materialised; others read as null. */
  void keepOnly(boolean[] keep) {
    this.keep = keep.clone();
  }

  /** Reads the next record; false at end of file. */
  boolean next() {
    while (true) {
      if (peek() < 0) return false;
      recordLine = line;
      count = 0;
      problem = null;
      problemExpected = null;
      if (peek() == '\n' || peekCrLf()) {
        skipLineEnd();
        continue;
      }
      readRecord();
      return true;
    }
  }

  /** Number of fields in the current record. */
  int size() {
    return count;
  }

  /** Field {@code i} of the current record, or null when the column is not kept. */
  String field(int i) {
    return fields[i];
  }

  /** The physical line on which the current record starts (1-based). */
  long line() {
    return recordLine;
  }

  /** A syntax problem of the current record (stray quote), or null when it is well-formed. */
  String problem() {
    return problem;
  }

  /** What would have been well-formed, when {@link #problem()} is not null. */
  String problemExpected() {
    return problemExpected;
  }

  @Override
  public void close() {
    try {
      in.close();
    } catch (IOException e) {
      // nothing was lost: the file was only read
    }
  }

  private void readRecord() {
    while (readField() == ',') {
      // next field of the same record
    }
  }

  /** Reads one field and its terminator; returns ',' or -1 (end of record). */
  private int readField() {
    if (count == MAX_FIELDS) {
      throw InputException.at(file, recordLine, "row has more than " + MAX_FIELDS + " fields", "a CSV file with a few columns; is this really CSV?");
    }
    boolean kept = keep == null || (count < keep.length && keep[count]);
    sb.setLength(0);
    int length;
    long fieldLine = line;
    int c;
    if (peek() == '"') {
      read();
      length = readQuoted(kept, fieldLine);
      c = read();
      if (c == '\r' && peek() != '\n' && !lineFeedSeen) throw crOnly();
      if (c != ',' && c != '\n' && c >= 0 && !(c == '\r' && peek() == '\n')) {
        note("text after the closing quote of field " + (count + 1), "a comma or the end of the row after a closing quote");
        while (c >= 0 && c != ',' && c != '\n' && !(c == '\r' && peek() == '\n')) {
          if (++length > MAX_FIELD_CHARS) throw tooLong(fieldLine);
          if (kept) sb.append((char) c);
          c = read();
        }
      }
    } else {
      c = readUnquoted(kept, fieldLine);
    }
    if (c == '\r') c = read();
    if (c == '\n') {
      line++;
      lineFeedSeen = true;
    }
    store(kept ? sb.toString() : null);
    return c == ',' ? ',' : -1;
  }

  /** Reads a quoted field's content after its opening quote, through its closing quote; returns its length. */
  private int readQuoted(boolean kept, long fieldLine) {
    int length = 0;
    while (true) {
      if (pos == lim && !refill()) {
        throw InputException.at(file, fieldLine, "quoted field opened on this line is never closed",
            "a closing double quote (\") before the end of the file");
      }
      int i = pos;
      while (i < lim && buf[i] != '"') {
        if (buf[i] == '\n') line++;
        i++;
      }
      length += i - pos;
      if (length > MAX_FIELD_CHARS) throw tooLong(fieldLine);
      if (kept) sb.append(buf, pos, i - pos);
      pos = i;
      if (i == lim) continue;
      pos++;
      if (peek() != '"') return length;
      pos++;
      if (++length > MAX_FIELD_CHARS) throw tooLong(fieldLine);
      if (kept) sb.append('"');
    }
  }

  /** Reads an unquoted field up to its terminator; returns ',' or '\n' or '\r' (before LF) or -1 at EOF. */
  private int readUnquoted(boolean kept, long fieldLine) {
    int length = 0;
    while (true) {
      if (pos == lim && !refill()) return -1;
      int i = pos;
      while (i < lim) {
        char ch = buf[i];
        if (ch == ',' || ch == '\n' || ch == '\r' || ch == '"') break;
        i++;
      }
      length += i - pos;
      if (length > MAX_FIELD_CHARS) throw tooLong(fieldLine);
      if (kept) sb.append(buf, pos, i - pos);
      pos = i;
      if (i == lim) continue;
      char ch = buf[pos++];
      if (ch == ',' || ch == '\n') return ch;
      if (ch == '\r' && peek() == '\n') return '\r';
      if (ch == '\r' && !lineFeedSeen) throw crOnly();
      if (ch == '"') note("double quote inside unquoted field " + (count + 1), "the whole field in double quotes, with each inner quote doubled (\"\")");
      if (++length > MAX_FIELD_CHARS) throw tooLong(fieldLine);
      if (kept) sb.append(ch);
    }
  }

  private void store(String value) {
    if (count == fields.length) fields = Arrays.copyOf(fields, fields.length * 2);
    fields[count++] = value;
  }

  private void note(String what, String expected) {
    if (problem == null) {
      problem = what;
      problemExpected = expected;
    }
  }

  private InputException tooLong(long fieldLine) {
    return InputException.at(file, fieldLine, "field longer than " + MAX_FIELD_CHARS + " characters", "shorter fields; is a quote left open?");
  }

  private void skipLineEnd() {
    if (read() == '\r') read();
    line++;
    lineFeedSeen = true;
  }

  /**
   * A carriage return not followed by a line feed before any line feed: the file has CR-only line ends (classic
   * Mac OS), which would otherwise read as one long header row and zero data rows.
   */
  private InputException crOnly() {
    return InputException.at(file, recordLine, "the line ends are lone carriage returns (CR, as in classic Mac OS files), so the file would read as one row",
        "LF or CRLF line ends; convert the file's line ends first");
  }

  private boolean peekCrLf() {
    if (peek() != '\r') return false;
    if (pos + 1 >= lim) compactAndFill();
    return pos + 1 < lim && buf[pos + 1] == '\n';
  }

  private int peek() {
    if (pos == lim && !refill()) return -1;
    return buf[pos];
  }

  private int read() {
    if (pos == lim && !refill()) return -1;
    return buf[pos++];
  }

  private boolean refill() {
    if (eof) return false;
    pos = 0;
    lim = 0;
    fillTail();
    return lim > 0;
  }

  /** Keeps unread chars at the front and reads more behind them (for two-char lookahead). */
  private void compactAndFill() {
    if (eof) return;
    int rest = lim - pos;
    System.arraycopy(buf, pos, buf, 0, rest);
    pos = 0;
    lim = rest;
    fillTail();
  }

  private void fillTail() {
    try {
      while (lim < buf.length) {
        int n = in.read(buf, lim, buf.length - lim);
        if (n < 0) {
          eof = true;
          return;
        }
        if (n == 0) continue;
        lim += n;
        return;
      }
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
  }
}
