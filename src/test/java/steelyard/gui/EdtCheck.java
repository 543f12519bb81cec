package steelyard.gui;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import javax.swing.JComponent;
import javax.swing.RepaintManager;
import javax.swing.SwingUtilities;

/**
 * A repaint manager that records every Swing call made off the Event Dispatch Thread which invalidates or
 * dirties a component (setText, setValue, revalidate… all end here). {@code repaint()} called by application
 * code is documented as thread-safe and is let through; a repaint issued by a Swing setter is not (the same
 * rule as the well-known thread-violation checks of Swing debugging). Install it before the window is made; the window tests fail on any record.
 */
final class EdtCheck extends RepaintManager {
  private final List<String> violations = Collections.synchronizedList(new ArrayList<>());

  static EdtCheck install() {
    EdtCheck c = new EdtCheck();
    RepaintManager.setCurrentManager(c);
    return c;
  }

  List<String> violations() {
    synchronized (violations) {
      return new ArrayList<>(violations);
    }
  }

  void clear() {
    violations.clear();
  }

  @Override
  public synchronized void addInvalidComponent(JComponent c) {
    check(c);
    super.addInvalidComponent(c);
  }

  @Override
  public void addDirtyRegion(JComponent c, int x, int y, int w, int h) {
    check(c);
    super.addDirtyRegion(c, x, y, w, h);
  }

  /**
   * Whether the call came through {@code repaint()} called by application code (thread-safe by contract),
   * rather than through a Swing or AWT method that changed state and then repainted (setText, setValue…).
   */
  private static boolean applicationRepaint(StackTraceElement[] stack) {
    boolean repaint = false;
    for (StackTraceElement e : stack) {
      if ("repaint".equals(e.getMethodName())) {
        repaint = true;
      } else if (repaint) {
        String k = e.getClassName();
        return !(k.startsWith("javax.swing.") || k.startsWith("java.awt."));
      }
    }
    return false;
  }

  private void check(JComponent c) {
    if (SwingUtilities.isEventDispatchThread()) return;
    StackTraceElement[] stack = Thread.currentThread().getStackTrace();
    if (applicationRepaint(stack)) return;
    StringBuilder sb = new StringBuilder("off the EDT on thread '" + Thread.currentThread().getName() + "': " + c.getClass().getName());
    for (int k = 2; k < Math.min(stack.length, 14); k++) sb.append("\n    at ").append(stack[k]);
    violations.add(sb.toString());
  }
}
