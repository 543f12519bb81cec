package steelyard.cli;

import java.io.PrintWriter;
import java.util.function.LongSupplier;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import steelyard.tune.TuneProgress;

/**
 * The tuning run's progress on the command's stderr ({@link ConsoleProgress}), drawn only once the run has lasted
 * {@value #DELAY_MILLIS} ms, so a quick run prints nothing. The bar counts thousandths of the run; its message says
 * what the tuner is doing. Not thread-safe: the tuner reports from the thread that runs it.
 */
final class TuneProgressBar implements TuneProgress, AutoCloseable {
  /** How long a run must last before the bar appears. */
  static final long DELAY_MILLIS = 1000;
  private static final long STEPS = 1000;

  private final PrintWriter err;
  private final boolean wanted;
  private final LongSupplier nanoClock;
  private final long started;
  private ProgressBar bar;

  /**
   * A bar on {@code err} timed by {@code nanoClock} (e.g. {@code System::nanoTime}); when not {@code wanted}
   * ({@link ConsoleProgress#wanted}) it never draws.
   */
  TuneProgressBar(PrintWriter err, boolean wanted, LongSupplier nanoClock) {
    this.err = err;
    this.wanted = wanted;
    this.nanoClock = nanoClock;
    this.started = nanoClock.getAsLong();
  }

  @Override
  public void update(double fraction, String message) {
    if (!wanted) return;
    if (bar == null) {
      if (nanoClock.getAsLong() - started < DELAY_MILLIS * 1_000_000L) return;
      bar = new ProgressBarBuilder().setTaskName("tuning").setInitialMax(STEPS).setStyle(ProgressBarStyle.ASCII)
          .setConsumer(new ConsoleProgress(err)).setUpdateIntervalMillis(250).hideEta().build();
    }
    bar.stepTo(Math.round(Math.max(0, Math.min(1, fraction)) * STEPS));
    bar.setExtraMessage(message);
  }

  @Override
  public void close() {
    if (bar != null) bar.close();
  }
}
