package steelyard.io;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;

/**
 * Writes an output file atomically: to a temporary file in the same directory, then moved into place, so a
 * crash leaves either the old file or the complete new one, never a partial one. {@code -} means stdout.
 */
public final class AtomicOutput {
  private AtomicOutput() {}

  /** Body of a write; may throw {@link IOException}. */
  @FunctionalInterface
  public interface WriterBody {
    void write(Writer out) throws IOException;
  }

  /** Writes UTF-8 text to {@code target} (or stdout when it is {@code -}). */
  public static void writeText(Path target, WriterBody body) {
    throw new UnsupportedOperationException("not built yet");
  }
}
