package steelyard.lm;

import java.nio.file.Path;
import java.util.Locale;
import java.util.function.Consumer;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.io.OutputTarget;
import steelyard.lm.arpa.ArpaReader;
import steelyard.lm.arpa.ArpaWriter;

/**
 * Loads and saves language models by file name: {@code .arpa} / {@code .arpa.gz} (log10 text interchange
 * format, read by {@link ArpaReader}, written by {@link ArpaWriter}) or {@code .bin} (the project's binary format,
 * {@link BinaryModelFile}). Bad files throw {@link steelyard.io.InputException}; saving is atomic.
 */
public final class ModelFiles {
  /** How a file is read: the floor for closed-vocabulary ARPA files, where warnings go, optional progress. */
  public record LoadOptions(double unknownFloorLog10, Consumer<String> warnings, LoadProgress progress) {
    /** Floor −7, warnings printed to stderr, no progress. */
    public static final LoadOptions DEFAULT = new LoadOptions(BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10,
        w -> System.err.println("steelyard: warning: " + w), null);

    public LoadOptions {
      if (!(unknownFloorLog10 <= 0) || Double.isInfinite(unknownFloorLog10)) {
        throw InputException.option("--oov-log10-prob", "value " + unknownFloorLog10 + " is not a finite log10 probability", "a number <= 0");
      }
      if (warnings == null) warnings = w -> { };
    }
  }

  /** The model file kinds, recognised by name. */
  public enum Kind { ARPA, BINARY }

  private ModelFiles() {}

  /** The kind of {@code file} by its name; any other name is an {@link InputException}. */
  public static Kind kind(Path file) {
    String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
    if (name.endsWith(".arpa") || name.endsWith(".arpa.gz")) return Kind.ARPA;
    if (name.endsWith(".bin")) return Kind.BINARY;
    String why = InputFiles.isStream(file) ? " (a pipe or standard input has no file name to tell the format by; save the model to a file)" : "";
    throw InputException.option(file.toString(), "unknown model file type" + why, "a name ending in .arpa, .arpa.gz or .bin");
  }

  /** Loads a model for querying (the compact engine for large models). */
  public static LanguageModel load(Path file) {
    return load(file, LoadOptions.DEFAULT);
  }

  /** Loads a model for querying with explicit options: always a {@link CompactModel}. */
  public static CompactModel load(Path file, LoadOptions options) {
    switch (kind(file)) {
      case ARPA:
        return CompactModel.of(ArpaReader.read(file, options.unknownFloorLog10(), options.warnings(), options.progress()));
      default:
        return BinaryModelFile.read(file);
    }
  }

  /**
   * Loads a model in its exact editable form (for mixing, pruning, converting). From {@code .bin} the model is
   * rebuilt from the stored single-precision values, so it equals the ARPA model it came from to about 7 digits.
   */
  public static BackoffModel loadExact(Path file) {
    return loadExact(file, LoadOptions.DEFAULT);
  }

  /** Loads a model in its exact editable form with explicit options. */
  public static BackoffModel loadExact(Path file, LoadOptions options) {
    switch (kind(file)) {
      case ARPA:
        return ArpaReader.read(file, options.unknownFloorLog10(), options.warnings(), options.progress());
      default:
        return BinaryModelFile.read(file).toBackoffModel();
    }
  }

  /**
   * The format a model is saved in: by the file name; ARPA text for {@code -} (standard output) and for a
   * device, FIFO or descriptor whose name does not say ({@code /dev/null}, {@code /dev/fd/3}).
   */
  public static Kind outputKind(Path file) {
    String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
    boolean named = name.endsWith(".arpa") || name.endsWith(".arpa.gz") || name.endsWith(".bin");
    if (!named && (file.toString().equals("-") || OutputTarget.kind(file) != OutputTarget.Kind.REPLACE)) return Kind.ARPA;
    return kind(file);
  }

  /**
   * As {@link #save(BackoffModel, Path)}, but standard output ({@code -}, {@code /dev/stdout}) is {@code stdout}
   * (a command's own output writer), which takes the ARPA text and is flushed, not closed.
   */
  public static void save(BackoffModel model, Path file, java.io.Writer stdout) {
    if (OutputTarget.kind(file) == OutputTarget.Kind.STDOUT) ArpaWriter.write(model, file, stdout);
    else save(model, file);
  }

  /** Saves atomically, format chosen by the file name ({@code -}: ARPA text on standard output). */
  public static void save(BackoffModel model, Path file) {
    switch (outputKind(file)) {
      case ARPA:
        ArpaWriter.write(model, file);
        return;
      default:
        BinaryModelFile.write(CompactModel.of(model), file);
    }
  }
}
