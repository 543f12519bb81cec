package steelyard.lm;

import java.nio.file.Path;

/**
 * Loads and saves language models by file name: {@code .arpa} / {@code .arpa.gz} (log10 text interchange
 * format) or {@code .bin} (the project's binary format). Bad files throw {@link steelyard.io.InputException}.
 */
public final class ModelFiles {
  private ModelFiles() {}

  /** Loads a model for querying (the compact engine for large models). */
  public static LanguageModel load(Path file) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Loads a model in its exact editable form (for mixing, pruning, converting). */
  public static BackoffModel loadExact(Path file) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Saves atomically, format chosen by the file name. */
  public static void save(BackoffModel model, Path file) {
    throw new UnsupportedOperationException("not built yet");
  }
}
