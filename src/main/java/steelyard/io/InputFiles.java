package steelyard.io;

import java.io.BufferedInputStream;
import java.io.BufferedReader;
import java.io.FileInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.zip.ZipException;

/**
 * Opens any input file the same way: gzip detected by the {@code .gz} name (a {@code .gz} that is not gzip
 * is an {@link InputException}; every gzip member is checked and trailing data is an error, see
 * {@link StrictGzipInputStream}), UTF-8 decoded strictly (an invalid byte sequence is an error naming the
 * line), a leading BOM skipped, LF or CRLF accepted.
 *
 * <p>Streams: {@code -} is standard input, and a pipe, FIFO or process substitution ({@code <(…)},
 * {@code /dev/stdin}) is read like a file, once, from the start. A reader that needs a second pass must ask
 * {@link #requireRereadable} first, which refuses a stream with a message that says why.
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

  /** Whether {@code file} is read as a stream: {@code -} (standard input), a pipe, a FIFO or a device. */
  public static boolean isStream(Path file) {
    return isStandardInput(file) || OutputTarget.isSpecialFile(file);
  }

  /** Refuses a stream ({@link #isStream}) as {@code file}, because {@code why} (e.g. "--systems scores it twice") needs two passes. */
  public static void requireRereadable(Path file, String why) {
    if (file != null && isStream(file)) {
      throw InputException.inFile(file, "is a pipe or stream, which can be read only once, but " + why,
          "a regular file (save the stream to a file first)");
    }
  }

  /**
   * A warning when {@code firstLine}, the first line of a file read as plain text (one sentence per line),
   * looks like the header of a CSV file: no blanks, two or more comma-separated names, and either a column
   * the project's CSV files use ({@code utt_id}, {@code text}) or a {@code .csv} file name. Null otherwise.
   */
  public static String csvHeaderWarning(Path file, String firstLine) {
    if (firstLine == null) return null;
    String line = firstLine.startsWith("\uFEFF") ? firstLine.substring(1) : firstLine;
    if (line.isEmpty() || line.chars().anyMatch(Character::isWhitespace)) return null;
    String[] fields = line.split(",", -1);
    if (fields.length < 2) return null;
    boolean known = false;
    for (String f : fields) {
      if (!f.matches("[A-Za-z_][A-Za-z0-9_.-]*")) return null;
      known |= f.equals("utt_id") || f.equals("text");
    }
    String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
    if (!known && !name.endsWith(".csv") && !name.endsWith(".csv.gz")) return null;
    return file + ": the first line '" + Messages.shown(line, 60) + "' looks like a CSV header, but this file is read as plain text"
        + " (one sentence per line, every line counts); give a text file, e.g. the text column alone";
  }

  /** The whole content of {@code file}, gunzipped when its name ends in {@code .gz}; same checks as {@link #open}. */
  public static byte[] readAllBytes(Path file) {
    try (InputStream in = openBytes(file)) {
      return in.readAllBytes();
    } catch (java.io.EOFException e) {
      throw InputException.inFile(file, "gzip data is truncated", "a complete gzip file").withCause(e);
    } catch (ZipException e) {
      throw InputException.inFile(file, "gzip data is corrupt (" + e.getMessage() + ")", "a valid gzip file").withCause(e);
    } catch (IOException e) {
      throw InputException.inFile(file, "cannot read file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
  }

  /** The file's bytes, gunzipped when its name ends in {@code .gz}; {@code -} is standard input. */
  static InputStream openBytes(Path file) {
    if (Files.isDirectory(file)) throw InputException.inFile(file, "is a directory", "a file");
    InputStream raw;
    try {
      raw = new BufferedInputStream(openRaw(file), 1 << 16);
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
      return new StrictGzipInputStream(raw);
    } catch (ZipException | java.io.EOFException e) {
      closeQuietly(raw);
      throw InputException.inFile(file, "gzip header is damaged or truncated", "a valid gzip file").withCause(e);
    } catch (IOException e) {
      closeQuietly(raw);
      throw InputException.inFile(file, "cannot read file (" + e.getMessage() + ")", "a readable file").withCause(e);
    }
  }

  /**
   * Standard input for {@code -}; a {@link FileInputStream} for a pipe or device, whose channel-based
   * counterpart fails on pipes ("Illegal seek" when asked how much is available); else the usual stream.
   */
  private static InputStream openRaw(Path file) throws IOException {
    if (isStandardInput(file)) return new KeepOpen(System.in);
    if (OutputTarget.isSpecialFile(file)) return new FileInputStream(file.toFile());
    return Files.newInputStream(file);
  }

  private static boolean isStandardInput(Path file) {
    return file.toString().equals("-");
  }

  /** Standard input, which a reader may close without closing it for the rest of the process. */
  private static final class KeepOpen extends java.io.FilterInputStream {
    KeepOpen(InputStream in) {
      super(in);
    }

    @Override
    public void close() {
      // standard input stays open
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
