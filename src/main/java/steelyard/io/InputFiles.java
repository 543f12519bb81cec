package steelyard.io;

import java.io.BufferedInputStream;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.GZIPInputStream;
import java.util.zip.ZipException;

/**
 * Opens any input file the same way: gzip detected by the {@code .gz} name (a {@code .gz} that is not gzip
 * is an {@link InputException}), UTF-8 decoded strictly (an invalid byte sequence is an error naming the
 * line), a leading BOM skipped, LF or CRLF accepted.
 *
 * <p>Also rejected, with line and column: NUL characters (usually a UTF-16 or binary file) and a byte-order
 * mark after the start (usually two files concatenated). Errors surface from {@code read} calls as
 * {@link InputException}, an unchecked exception, so callers need no extra handling.
 */
public final class InputFiles {
  private static final int GZIP_MAGIC_1 = 0x1f;
  private static final int GZIP_MAGIC_2 = 0x8b;

  private InputFiles() {}

  /** A reader over the decoded text of {@code file}; a missing or unreadable file is an {@link InputException}. */
  public static BufferedReader open(Path file) {
    return new BufferedReader(openUnbuffered(file), 1 << 16);
  }

  /** Same checks as {@link #open}, for callers that buffer themselves (the CSV parser). */
  static StrictUtf8Reader openUnbuffered(Path file) {
    return new StrictUtf8Reader(file, openBytes(file));
  }

  /** Whether the file name says gzip ({@code .gz}, any case). */
  public static boolean isGzipName(Path file) {
    Path name = file.getFileName();
    return name != null && name.toString().toLowerCase(Locale.ROOT).endsWith(".gz");
  }

  /** The file's bytes, gunzipped when its name ends in {@code .gz}. */
  static InputStream openBytes(Path file) {
    if (Files.isDirectory(file)) throw InputException.inFile(file, "is a directory", "a file");
    InputStream raw;
    try {
      raw = new BufferedInputStream(Files.newInputStream(file), 1 << 16);
    } catch (NoSuchFileException e) {
      throw InputException.inFile(file, "no such file", "an existing file").withCause(e);
    } catch (AccessDeniedException e) {
      throw InputException.inFile(file, "permission denied", "a readable file").withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot open file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
    if (!isGzipName(file)) return raw;
    try {
      raw.mark(2);
      int b1 = raw.read();
      int b2 = raw.read();
      raw.reset();
      if (b1 != GZIP_MAGIC_1 || b2 != GZIP_MAGIC_2) {
        raw.close();
        String problem = b1 < 0 ? "empty file although its name ends in .gz" : "not gzip data although the name ends in .gz";
        throw InputException.inFile(file, problem, "a gzip file, or a name without .gz");
      }
      return new GZIPInputStream(raw, 1 << 16);
    } catch (ZipException | java.io.EOFException e) {
      closeQuietly(raw);
      throw InputException.inFile(file, "gzip header is damaged or truncated", "a valid gzip file").withCause(e);
    } catch (IOException e) {
      closeQuietly(raw);
      throw InputException.inFile(file, "cannot read file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
  }

  private static void closeQuietly(InputStream in) {
    try {
      in.close();
    } catch (IOException ignored) {
      // already failing with a better message
    }
  }
}
