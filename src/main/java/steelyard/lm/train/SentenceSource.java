package steelyard.lm.train;

import java.nio.file.Path;
import java.util.List;

/**
 * A re-readable stream of tokenised training sentences (one per corpus line). {@link Trainer} reads it once,
 * or twice when the vocabulary is limited (first pass: word frequencies).
 */
public interface SentenceSource {

  /** Receives one sentence: its 1-based line number and its normalised tokens (no sentence markers). */
  @FunctionalInterface
  interface Sink {
    void accept(long line, List<String> tokens);
  }

  /** Streams every sentence, in order, to {@code sink}. */
  void forEach(Sink sink);

  /** The file named in error messages, or null for text held in memory. */
  default Path file() {
    return null;
  }

  /** Sentences held in memory (already tokenised), numbered from line 1. */
  static SentenceSource of(List<List<String>> sentences) {
    return sink -> {
      long line = 0;
      for (List<String> s : sentences) sink.accept(++line, s);
    };
  }
}
