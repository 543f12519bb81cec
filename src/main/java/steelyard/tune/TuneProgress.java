package steelyard.tune;

/**
 * Receives the progress of a tuning run: the share done (0 … 1, never decreasing) and what it is doing.
 * Called from the thread that runs {@link Tuner#tune}; a window hands it on to its own event thread.
 */
@FunctionalInterface
public interface TuneProgress {
  /** Reports nothing. */
  TuneProgress NONE = (fraction, message) -> {};

  void update(double fraction, String message);
}
