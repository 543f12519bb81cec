package steelyard.gui;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.function.Consumer;
import javax.swing.SwingUtilities;
import javax.swing.SwingWorker;
import steelyard.gui.model.TaskProgress;

/**
 * The window's one background executor: every slow task (opening files, re-choosing by a network method,
 * sweeps for the charts, tuning) runs here as a {@link SwingWorker}, one at a time, with progress and
 * cancel shown in the {@link StatusBar}. A task submitted under the key of a task still queued or running
 * cancels that one first (a newer slider position supersedes an older one). Results reach the caller on the
 * Event Dispatch Thread with an {@link Outcome}.
 *
 * <p>Use from the EDT only.
 */
public final class Tasks {
  /** How a task ended. */
  public enum Outcome { COMPLETE, CANCELLED, FAILED }

  /** The body of a task, run off the EDT; it reports through {@code progress} and polls it for cancellation. */
  @FunctionalInterface
  public interface Job<T> {
    T run(TaskProgress progress) throws Exception;
  }

  /** Receives a task's end on the EDT: the value when {@link Outcome#COMPLETE}, the error when {@link Outcome#FAILED}. */
  @FunctionalInterface
  public interface Done<T> {
    void done(Outcome outcome, T value, Throwable error);
  }

  private final ExecutorService executor = Executors.newSingleThreadExecutor(r -> {
    Thread t = new Thread(r, "steelyard-window-tasks");
    t.setDaemon(true);
    return t;
  });
  private final StatusBar status;
  private final Map<String, Worker<?>> byKey = new HashMap<>();
  private Worker<?> running;
  private int pending;

  public Tasks(StatusBar status) {
    this.status = status;
    status.onCancel(this::cancelRunning);
  }

  /** Submits {@code job} titled {@code title}; a task with the same {@code key} still queued or running is cancelled. */
  public <T> void submit(String key, String title, Job<T> job, Done<T> done) {
    checkEdt();
    Worker<?> old = byKey.get(key);
    if (old != null && !old.isDone()) old.cancel(false);
    Worker<T> w = new Worker<>(key, title, job, done);
    byKey.put(key, w);
    pending++;
    executor.execute(w);
  }

  /** Whether a task is queued or running. */
  public boolean busy() {
    return pending > 0;
  }

  /** Cancels the running task, if any (the user asked: the status bar says so). */
  public void cancelRunning() {
    if (running != null) {
      running.byUser = true;
      running.cancel(false);
    }
  }

  /** Stops the executor (the window is closing); running work is asked to stop. */
  public void shutdown() {
    for (Worker<?> w : byKey.values()) w.cancel(false);
    executor.shutdownNow();
  }

  private static void checkEdt() {
    if (!SwingUtilities.isEventDispatchThread()) throw new IllegalStateException("Tasks is used from the Event Dispatch Thread only");
  }

  private record Step(double fraction, String note) {}

  private final class Worker<T> extends SwingWorker<T, Step> implements TaskProgress {
    private final String key;
    private final String title;
    private final Job<T> job;
    private final Done<T> done;
    /** Set when the user cancelled (not a newer task of the same key). */
    volatile boolean byUser;

    Worker(String key, String title, Job<T> job, Done<T> done) {
      this.key = key;
      this.title = title;
      this.job = job;
      this.done = done;
    }

    @Override
    protected T doInBackground() throws Exception {
      if (isCancelled()) throw new CancellationException("cancelled before it started");
      publish(new Step(0, title));
      return job.run(this);
    }

    @Override
    public void report(double fraction, String note) {
      publish(new Step(fraction, note));
    }

    @Override
    protected void process(List<Step> steps) {
      running = this;
      Step s = steps.get(steps.size() - 1);
      if (!isDone()) status.show(title, s.fraction(), s.note());
    }

    @Override
    protected void done() {
      pending--;
      if (byKey.get(key) == this) byKey.remove(key);
      if (running == this) running = null;
      if (pending == 0) status.idle();
      Outcome outcome;
      T value = null;
      Throwable error = null;
      try {
        value = get();
        outcome = Outcome.COMPLETE;
      } catch (CancellationException e) {
        outcome = Outcome.CANCELLED;
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        outcome = Outcome.CANCELLED;
      } catch (ExecutionException e) {
        error = e.getCause() == null ? e : e.getCause();
        outcome = error instanceof CancellationException ? Outcome.CANCELLED : Outcome.FAILED;
        if (outcome == Outcome.CANCELLED) error = null;
      }
      if (outcome == Outcome.CANCELLED && byUser) status.flash(title + ": cancelled");
      done.done(outcome, value, error);
    }
  }

  /** Convenience for callers that only care about success: failures go to {@code failed}, cancels are ignored. */
  public static <T> Done<T> onSuccess(Consumer<T> ok, Consumer<Throwable> failed) {
    return (o, v, e) -> {
      if (o == Outcome.COMPLETE) ok.accept(v);
      else if (o == Outcome.FAILED) failed.accept(e);
    };
  }
}
