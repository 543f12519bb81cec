package steelyard.io;

import java.nio.file.Path;
import java.util.LinkedHashMap;

/**
 * Reads a references CSV file ({@code utt_id,text[,group]}; header required; text may be empty) whole.
 * A duplicate {@code utt_id} or an empty one is an {@link InputException}.
 */
public final class ReferencesReader {
  private ReferencesReader() {}

  /** All references in file order, keyed by utterance id. */
  public static LinkedHashMap<String, Reference> readAll(Path file, ImportOptions options) {
    throw new UnsupportedOperationException("not built yet");
  }
}
