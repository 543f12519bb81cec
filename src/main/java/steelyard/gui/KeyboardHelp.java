package steelyard.gui;

import java.awt.Component;
import javax.swing.JMenu;
import javax.swing.JMenuBar;
import javax.swing.JMenuItem;
import javax.swing.KeyStroke;

/** The keyboard shortcuts of the menu bar as text, read from the menus themselves so the list cannot go stale. */
final class KeyboardHelp {
  private KeyboardHelp() {}

  static String text(JMenuBar bar) {
    StringBuilder sb = new StringBuilder();
    for (int m = 0; m < bar.getMenuCount(); m++) {
      JMenu menu = bar.getMenu(m);
      sb.append(menu.getText()).append(" (Alt+").append((char) menu.getMnemonic()).append(")\n");
      for (Component c : menu.getMenuComponents()) {
        if (!(c instanceof JMenuItem item) || c instanceof JMenu) continue;
        KeyStroke k = item.getAccelerator();
        sb.append("    ").append(item.getText());
        if (k != null) sb.append("  —  ").append(describe(k));
        if (!item.isEnabled()) sb.append("  (not available)");
        sb.append('\n');
      }
    }
    sb.append("\nEscape cancels the running task; in the list, arrow keys move between utterances;\n")
        .append("a focused slider moves with the arrow keys, Page Up and Page Down.");
    return sb.toString();
  }

  private static String describe(KeyStroke k) {
    String mods = java.awt.event.InputEvent.getModifiersExText(k.getModifiers());
    String key = java.awt.event.KeyEvent.getKeyText(k.getKeyCode());
    return mods.isEmpty() ? key : mods + "+" + key;
  }
}
