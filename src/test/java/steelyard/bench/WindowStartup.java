package steelyard.bench;

import java.lang.management.ManagementFactory;
import java.util.Locale;
import java.util.UUID;
import java.util.prefs.Preferences;
import javax.swing.SwingUtilities;
import steelyard.demo.DemoFiles;
import steelyard.gui.SteelyardWindow;
import steelyard.gui.WindowPrefs;
import steelyard.gui.model.OpenRequest;

/**
 * Window start on the demo data: milliseconds from the JVM's start to the window's first paint and to the
 * first paint with the demo data shown. Needs a display ({@code DISPLAY=:N}, e.g. Xvfb); preferences go to a
 * throw-away node.
 *
 * <pre>
 * Xvfb :77 -screen 0 1600x1000x24 -nolisten tcp &amp;
 * DISPLAY=:77 java -cp "target/test-classes:target/classes:$(cat cp.txt)" steelyard.bench.WindowStartup
 * </pre>
 */
public final class WindowStartup {
  private WindowStartup() {}

  public static void main(String[] args) throws Exception {
    long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
    Preferences node = Preferences.userRoot().node("steelyard-bench/" + UUID.randomUUID());
    SteelyardWindow[] w = new SteelyardWindow[1];
    SwingUtilities.invokeAndWait(() -> w[0] = SteelyardWindow.start(OpenRequest.demo(DemoFiles.root()), new WindowPrefs(node)));
    long painted = 0;
    while (true) {
      boolean[] state = new boolean[2];
      long[] first = new long[1];
      SwingUtilities.invokeAndWait(() -> {
        first[0] = w[0].firstPaintNanos();
        state[0] = w[0].choices() != null && w[0].openUtterance() >= 0;
      });
      if (painted == 0 && first[0] != 0) painted = System.currentTimeMillis() - (System.nanoTime() - first[0]) / 1_000_000;
      if (state[0]) break;
      Thread.sleep(5);
    }
    long shown = System.currentTimeMillis();
    System.out.printf(Locale.ROOT, "first paint %d ms, demo shown %d ms after the JVM started%n", painted - jvmStart, shown - jvmStart);
    SwingUtilities.invokeAndWait(() -> w[0].close());
    node.removeNode();
    System.exit(0);
  }
}
