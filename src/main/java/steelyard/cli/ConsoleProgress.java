package steelyard.cli;

import java.io.PrintWriter;
import me.tongfei.progressbar.ProgressBarConsumer;

/**
 * Draws a progress bar on a command's own error writer (picocli's {@code getErr()}), redrawing one line with a
 * carriage return, so progress follows the same stream as every other message of the command.
 */
final class ConsoleProgress implements ProgressBarConsumer {
  /** Characters a rendered bar may take: one less than a classic 80-column terminal. */
  private static final int WIDTH = 79;

  private final PrintWriter err;

  ConsoleProgress(PrintWriter err) {
    this.err = err;
  }

  /** Whether to draw progress: asked for, or the process is attached to a console. */
  static boolean wanted(boolean asked) {
    return asked || System.console() != null;
  }

  @Override
  public int getMaxRenderedLength() {
    return WIDTH;
  }

  @Override
  public void accept(String rendered) {
    err.print('\r');
    err.print(rendered);
    err.flush();
  }

  @Override
  public void close() {
    err.println();
    err.flush();
  }
}
