package steelyard.io;

import java.io.BufferedReader;
import java.nio.file.Path;

/**
 * Opens any input file the same way: gzip detected by the {@code .gz} name (a {@code .gz} that is not gzip
 * is an {@link InputException}), UTF-8 decoded strictly (an invalid byte sequence is an error naming the
 * line), a leading BOM skipped, LF or CRLF accepted.
 */
public final class InputFiles {
  private InputFiles() {}

  /** A reader over the decoded text of {@code file}; a missing or unreadable file is an {@link InputException}. */
  public static BufferedReader open(Path file) {
    throw new UnsupportedOperationException("not built yet");
  }
}
