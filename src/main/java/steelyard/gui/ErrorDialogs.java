package steelyard.gui;

import java.awt.Component;
import java.awt.Font;
import javax.swing.JOptionPane;
import javax.swing.JScrollPane;
import javax.swing.JTextArea;
import steelyard.io.InputException;

/**
 * User-facing errors: a dialog with the same message the command line prints (without its
 * {@code steelyard: } prefix), never a stack trace. Input problems are titled so; anything else is an
 * internal error to report.
 */
public final class ErrorDialogs {
  private ErrorDialogs() {}

  /** The message the window shows for {@code error}: the input problem, or an internal-error line. */
  public static String message(Throwable error) {
    InputException input = inputCause(error);
    if (input != null) return input.getMessage();
    return "internal error (please report it with what you did): " + error;
  }

  /** Shows {@code error} in a modal dialog over {@code parent}, titled {@code title}. */
  public static void show(Component parent, String title, Throwable error) {
    JTextArea text = new JTextArea(message(error));
    text.setName("error.message");
    text.setEditable(false);
    text.setLineWrap(true);
    text.setWrapStyleWord(true);
    text.setColumns(60);
    text.setRows(Math.min(8, 2 + text.getText().length() / 60));
    text.setFont(text.getFont().deriveFont(Font.PLAIN));
    text.setOpaque(false);
    JScrollPane scroll = new JScrollPane(text);
    scroll.setBorder(null);
    JOptionPane.showMessageDialog(parent, scroll, inputCause(error) != null ? title : title + " (internal error)",
        JOptionPane.ERROR_MESSAGE);
  }

  private static InputException inputCause(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause()) if (t instanceof InputException i) return i;
    return null;
  }
}
