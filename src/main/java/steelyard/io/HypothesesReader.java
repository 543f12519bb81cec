package steelyard.io;

import java.io.Closeable;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.List;

/**
 * Streams a hypotheses CSV file one utterance at a time; memory does not grow with file size.
 *
 * <p>Contract (documented in the README): header row required; columns {@code utt_id} and {@code text}
 * required, {@code system}, {@code rank}, {@code group} optional, any other column kept unread unless it is
 * named as a feature. Rows of one utterance are contiguous: an {@code utt_id} that reappears after another
 * utterance is an {@link InputException}. {@code rank} is unique per (utt_id, system). Bad input throws
 * {@link InputException} only (or is skipped and reported in lenient mode).
 *
 * <pre>{@code
 * try (HypothesesReader r = HypothesesReader.open(path, ImportOptions.strict(features))) {
 *   while (r.hasNext()) { UtteranceHypotheses u = r.next(); ... }
 * }
 * }</pre>
 *
 * <p>Not thread-safe.
 */
public final class HypothesesReader implements Closeable, Iterator<UtteranceHypotheses> {

  private HypothesesReader() {}

  /** Opens a plain, gzipped ({@code .gz}) file; UTF-8 with or without BOM; LF or CRLF. */
  public static HypothesesReader open(Path file, ImportOptions options) {
    throw new UnsupportedOperationException("not built yet");
  }

  /** The header row's column names, in file order. */
  public List<String> header() {
    throw new UnsupportedOperationException("not built yet");
  }

  /** Whether the file has a {@code system} column. */
  public boolean hasSystemColumn() {
    throw new UnsupportedOperationException("not built yet");
  }

  @Override
  public boolean hasNext() {
    throw new UnsupportedOperationException("not built yet");
  }

  @Override
  public UtteranceHypotheses next() {
    throw new UnsupportedOperationException("not built yet");
  }

  @Override
  public void close() {}
}
