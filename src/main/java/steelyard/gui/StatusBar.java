package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.FlowLayout;
import java.awt.event.KeyEvent;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.KeyStroke;
import javax.swing.Timer;

/**
 * The strip at the bottom of the window: what the running task is doing, a progress bar and a Cancel
 * button (also Escape); otherwise a short note. EDT only.
 */
public final class StatusBar extends JPanel {
  private static final long serialVersionUID = 1L;
  private final JLabel note = new JLabel(" ");
  private final JProgressBar bar = new JProgressBar(0, 1000);
  private final JButton cancel = new JButton("Cancel");
  private final Timer clear = new Timer(4000, e -> note.setText(" "));
  private Runnable onCancel = () -> {};

  public StatusBar() {
    super(new BorderLayout(8, 0));
    setBorder(BorderFactory.createEmptyBorder(3, 8, 3, 8));
    note.setName("status.note");
    bar.setName("status.progress");
    bar.setPreferredSize(new Dimension(220, 14));
    bar.setStringPainted(false);
    cancel.setName("status.cancel");
    cancel.setMnemonic(KeyEvent.VK_C);
    cancel.setToolTipText("Stop the running task (Escape); the data shown stays as it was.");
    cancel.addActionListener(e -> onCancel.run());
    JPanel right = new JPanel(new FlowLayout(FlowLayout.RIGHT, 6, 0));
    right.setOpaque(false);
    right.add(bar);
    right.add(cancel);
    add(note, BorderLayout.CENTER);
    add(right, BorderLayout.EAST);
    clear.setRepeats(false);
    getInputMap(JComponent.WHEN_IN_FOCUSED_WINDOW).put(KeyStroke.getKeyStroke(KeyEvent.VK_ESCAPE, 0), "cancel-task");
    getActionMap().put("cancel-task", new javax.swing.AbstractAction() {
      private static final long serialVersionUID = 1L;
      @Override public void actionPerformed(java.awt.event.ActionEvent e) {
        if (cancel.isEnabled()) onCancel.run();
      }
    });
    idle();
  }

  void onCancel(Runnable r) {
    onCancel = r;
  }

  /** Shows a running task: {@code fraction} in 0 … 1, or NaN for "unknown". */
  public void show(String title, double fraction, String detail) {
    clear.stop();
    note.setText(detail == null || detail.equals(title) ? title + " …" : title + " — " + detail);
    bar.setVisible(true);
    bar.setIndeterminate(Double.isNaN(fraction));
    if (!Double.isNaN(fraction)) bar.setValue((int) Math.round(1000 * Math.max(0, Math.min(1, fraction))));
    cancel.setEnabled(true);
    cancel.setVisible(true);
  }

  /** No task runs. */
  public void idle() {
    bar.setIndeterminate(false);
    bar.setValue(0);
    bar.setVisible(false);
    cancel.setEnabled(false);
    cancel.setVisible(false);
    if (!clear.isRunning()) note.setText(" ");
  }

  /** A note that disappears after a few seconds. */
  public void flash(String text) {
    note.setText(text);
    clear.restart();
  }

  /** The current note (for tests). */
  public String noteText() {
    return note.getText();
  }
}
