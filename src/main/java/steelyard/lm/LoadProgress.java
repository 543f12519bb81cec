package steelyard.lm;

/** Receives progress while a model file is read (the command line shows it on stderr). Calls come from the loading thread. */
public interface LoadProgress {
  /** Reading starts; {@code total} units (n-grams) are expected. */
  void start(long total);

  /** {@code done} units have been read so far. */
  void step(long done);

  /** Reading finished. */
  void end();
}
