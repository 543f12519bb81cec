package steelyard.report;

/**
 * Lets chart and report tests draw (fonts need a graphics environment) on machines without a display: when
 * neither {@code DISPLAY} nor {@code WAYLAND_DISPLAY} is set, AWT is switched to headless mode. The test JVM is
 * started with {@code -Djava.awt.headless=false} so that window tests can use a (virtual) display; without one,
 * that setting makes every AWT graphics call fail, and drawing off-screen is all these tests need.
 *
 * <p>Call it from a static initialiser, before anything touches AWT.
 */
public final class HeadlessAwt {
  private HeadlessAwt() {}

  /** Switches AWT to headless mode when there is no display to talk to. */
  public static void whenNoDisplay() {
    if (isBlank(System.getenv("DISPLAY")) && isBlank(System.getenv("WAYLAND_DISPLAY"))) {
      System.setProperty("java.awt.headless", "true");
    }
  }

  private static boolean isBlank(String s) {
    return s == null || s.isBlank();
  }
}
