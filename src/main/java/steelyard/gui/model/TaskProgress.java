package steelyard.gui.model;

import java.util.concurrent.CancellationException;

/**
 * How a slow task reports how far it is and learns that the user cancelled it. The window passes one backed
 * by a {@code SwingWorker}; tests and benchmarks pass {@link #NONE}. Implementations must be thread-safe:
 * a task may report from several worker threads.
 */
public interface TaskProgress {
  /** Ignores reports and is never cancelled. */
  TaskProgress NONE = new TaskProgress() {
    @Override public void report(double fraction, String note) {}
    @Override public boolean isCancelled() { return false; }
  };

  /**
   * @param fraction share done, 0 … 1, or {@code NaN} when the total is not known
   * @param note     a few words on the current step ("reading the model")
   */
  void report(double fraction, String note);

  boolean isCancelled();

  /** Throws {@link CancellationException} when the task was cancelled. */
  default void checkCancelled() {
    if (isCancelled()) throw new CancellationException("cancelled");
  }
}
