package steelyard.lm.train;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Objects;
import java.util.function.Consumer;
import steelyard.io.InputException;
import steelyard.io.InputFiles;
import steelyard.text.Normaliser;
import steelyard.text.Unit;

/**
 * A corpus file, one sentence per line ({@code .gz} accepted), normalised line by line with the training
 * normalisation and split into words or grapheme clusters (with {@link Normaliser#SPACE_TOKEN} between
 * words). Streams: nothing but the current line is held.
 */
public final class CorpusFile implements SentenceSource {
  private final Path file;
  private final Normaliser normaliser;
  private final Unit unit;
  private final Consumer<String> warnings;
  private boolean warned;

  public CorpusFile(Path file, Normaliser normaliser, Unit unit) {
    this(file, normaliser, unit, w -> { });
  }

  /** A corpus whose first line, when it looks like a CSV header, gives one warning to {@code warnings}. */
  public CorpusFile(Path file, Normaliser normaliser, Unit unit, Consumer<String> warnings) {
    this.file = Objects.requireNonNull(file, "file");
    this.normaliser = Objects.requireNonNull(normaliser, "normaliser");
    this.unit = Objects.requireNonNull(unit, "unit");
    this.warnings = Objects.requireNonNull(warnings, "warnings");
  }

  @Override
  public Path file() {
    return file;
  }

  @Override
  public void forEach(Sink sink) {
    long line = 0;
    try (BufferedReader in = InputFiles.open(file)) {
      for (String raw = in.readLine(); raw != null; raw = in.readLine()) {
        line++;
        if (line == 1 && !warned) {
          String w = InputFiles.csvHeaderWarning(file, raw);
          if (w != null) warnings.accept(w);
          warned = true;
        }
        sink.accept(line, normaliser.tokenList(raw, unit));
      }
    } catch (IOException e) {
      throw InputException.at(file, line + 1, "cannot read: " + e.getMessage(), "a readable text file").withCause(e);
    } catch (UncheckedIOException e) {
      throw InputException.at(file, line + 1, "cannot read: " + e.getMessage(), "a readable text file").withCause(e);
    }
  }
}
