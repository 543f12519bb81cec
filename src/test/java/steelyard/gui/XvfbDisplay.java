package steelyard.gui;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.extension.ExtensionContext;
import org.junit.jupiter.api.extension.ParameterContext;
import org.junit.jupiter.api.extension.ParameterResolver;

/**
 * Gives a window test an X display: the session's own when {@code DISPLAY} is set, otherwise a private Xvfb
 * server ({@code Xvfb -displayfd 1 -screen 0 1600x1000x24 -nolisten tcp}, which picks a free display number
 * itself and reports it), stopped after the test class. Only when neither can be had is the test skipped,
 * with a message saying how to get one. Inject {@link Display} as a test parameter.
 */
final class XvfbDisplay implements ParameterResolver {
  private static final List<Path> XVFB = List.of(Path.of("/usr/bin/Xvfb"), Path.of("/usr/local/bin/Xvfb"));
  private static final long START_SECONDS = 20;

  /** The display to pass as {@code DISPLAY} to a child JVM, e.g. {@code :93}. */
  record Display(String name, boolean virtual) {}

  @Override
  public boolean supportsParameter(ParameterContext p, ExtensionContext e) {
    return p.getParameter().getType() == Display.class;
  }

  @Override
  public Object resolveParameter(ParameterContext p, ExtensionContext e) {
    ExtensionContext.Store store = e.getRoot().getStore(ExtensionContext.Namespace.create(XvfbDisplay.class));
    return store.getOrComputeIfAbsent("display", k -> display(), Server.class).display;
  }

  private static Server display() {
    String env = System.getenv("DISPLAY");
    if (env != null && !env.isBlank()) return new Server(new Display(env, false), null);
    Path xvfb = XVFB.stream().filter(Files::isExecutable).findFirst().orElse(null);
    Assumptions.assumeTrue(xvfb != null,
        "window tests skipped: DISPLAY is not set and Xvfb is not installed (install the 'xvfb' package, as .ci/run does)");
    try {
      Process p = new ProcessBuilder(xvfb.toString(), "-displayfd", "1", "-screen", "0", "1600x1000x24", "-nolisten", "tcp")
          .redirectErrorStream(false).redirectError(ProcessBuilder.Redirect.DISCARD).start();
      BufferedReader out = new BufferedReader(new InputStreamReader(p.getInputStream(), StandardCharsets.US_ASCII));
      String line = readLine(out, p);
      Assumptions.assumeTrue(line != null && line.strip().matches("\\d+"),
          "window tests skipped: Xvfb did not start (it reported '" + line + "')");
      return new Server(new Display(":" + line.strip(), true), p);
    } catch (IOException ex) {
      Assumptions.abort("window tests skipped: cannot start Xvfb (" + ex.getMessage() + ")");
      throw new AssertionError(ex);
    }
  }

  private static String readLine(BufferedReader out, Process p) throws IOException {
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(START_SECONDS);
    StringBuilder sb = new StringBuilder();
    while (System.nanoTime() < deadline) {
      while (out.ready()) {
        int c = out.read();
        if (c < 0 || c == '\n') return sb.toString();
        sb.append((char) c);
      }
      if (!p.isAlive()) return sb.length() > 0 ? sb.toString() : null;
      try {
        Thread.sleep(20);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        return null;
      }
    }
    p.destroy();
    return null;
  }

  /** The display and, for our own Xvfb, its process, stopped when the test run ends. */
  static final class Server implements ExtensionContext.Store.CloseableResource, AutoCloseable {
    final Display display;
    private final Process process;

    Server(Display display, Process process) {
      this.display = display;
      this.process = process;
    }

    @Override
    public void close() {
      if (process == null) return;
      process.destroy();
      try {
        if (!process.waitFor(5, TimeUnit.SECONDS)) process.destroyForcibly();
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }
  }
}
