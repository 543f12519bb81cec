package steelyard.gui;

import java.awt.event.ActionEvent;
import java.awt.event.InputEvent;
import java.awt.event.KeyEvent;
import java.util.List;
import java.util.function.Consumer;
import javax.swing.AbstractAction;
import javax.swing.Action;
import javax.swing.ButtonGroup;
import javax.swing.JMenu;
import javax.swing.JMenuBar;
import javax.swing.JMenuItem;
import javax.swing.JOptionPane;
import javax.swing.JRadioButtonMenuItem;
import javax.swing.KeyStroke;
import steelyard.demo.DemoFiles;
import steelyard.gui.model.OpenRequest;
import steelyard.rescore.RescoreMethod;

/**
 * The menu bar: every action of the window with a mnemonic, most with an accelerator, and a one-line
 * description shown as its tooltip. EDT only.
 */
final class Menus {
  private static final int CTRL = InputEvent.CTRL_DOWN_MASK;

  private final SteelyardWindow w;
  private final JMenu recent = new JMenu("Recent");
  final Action tune;
  final Action audit;
  final Action report;

  Menus(SteelyardWindow w) {
    this.w = w;
    tune = action("Tune weights…", KeyEvent.VK_T, key(KeyEvent.VK_T, CTRL),
        "Let the tuner find the weights with the fewest errors on these utterances (needs references).", e -> TuneAction.run(w));
    audit = action("Overrules", KeyEvent.VK_O, key(KeyEvent.VK_3, CTRL),
        "Show the overrule audit: where the pick differs from rank 1, why, and how close the call was.", e -> w.views.setSelectedIndex(2));
    report = action("Export HTML report…", KeyEvent.VK_E, key(KeyEvent.VK_E, CTRL),
        "Write the figures, charts and overrule audit of the current choice as one self-contained HTML page.", e -> ReportExport.ask(w));
    w.weights.tune.setAction(tune);
    w.weights.tune.setText("Tune…");
  }

  JMenuBar bar() {
    JMenuBar bar = new JMenuBar();
    bar.add(file());
    bar.add(view());
    bar.add(weightsMenu());
    bar.add(help());
    return bar;
  }

  private JMenu file() {
    JMenu m = menu("File", KeyEvent.VK_F);
    m.add(action("Open…", KeyEvent.VK_O, key(KeyEvent.VK_O, CTRL), "Choose hypotheses, references, model and weights to open.",
        e -> w.openWithDialog()));
    m.add(action("Open the demo", KeyEvent.VK_D, key(KeyEvent.VK_D, CTRL | InputEvent.SHIFT_DOWN_MASK),
        "Open the bundled voice-log dev set with its model and weights.", e -> w.open(OpenRequest.demo(DemoFiles.root()))));
    recent.setMnemonic(KeyEvent.VK_R);
    recent.setName("menu.recent");
    m.add(recent);
    refreshRecent();
    m.addSeparator();
    m.add(action("Save weights…", KeyEvent.VK_S, key(KeyEvent.VK_S, CTRL), "Write the weights in effect to a weights file (JSON).",
        e -> w.saveWeights()));
    m.add(report);
    m.add(action("Export all charts…", KeyEvent.VK_C, key(KeyEvent.VK_E, CTRL | InputEvent.SHIFT_DOWN_MASK),
        "Save the four charts as PNG and SVG files into a folder.", e -> ChartFolderExport.ask(w)));
    m.addSeparator();
    m.add(action("Quit", KeyEvent.VK_Q, key(KeyEvent.VK_Q, CTRL), "Close the window.", e -> w.close()));
    return m;
  }

  private JMenu view() {
    JMenu m = menu("View", KeyEvent.VK_V);
    m.add(action("Utterance", KeyEvent.VK_U, key(KeyEvent.VK_1, CTRL), "Show the open utterance.", e -> w.views.setSelectedIndex(0)));
    m.add(action("Charts", KeyEvent.VK_C, key(KeyEvent.VK_2, CTRL), "Show the charts.", e -> w.views.setSelectedIndex(1)));
    m.add(audit);
    m.addSeparator();
    m.add(action("Find utterance", KeyEvent.VK_F, key(KeyEvent.VK_F, CTRL), "Search the utterances by id or text.",
        e -> w.list.focusSearch()));
    m.add(action("Next utterance", KeyEvent.VK_N, key(KeyEvent.VK_DOWN, InputEvent.ALT_DOWN_MASK), "Open the next utterance of the list.",
        e -> step(1)));
    m.add(action("Previous utterance", KeyEvent.VK_P, key(KeyEvent.VK_UP, InputEvent.ALT_DOWN_MASK),
        "Open the previous utterance of the list.", e -> step(-1)));
    m.add(action("Utterance list", KeyEvent.VK_L, key(KeyEvent.VK_L, CTRL | InputEvent.SHIFT_DOWN_MASK), "Move the focus to the list.",
        e -> w.list.table().requestFocusInWindow()));
    return m;
  }

  private JMenu weightsMenu() {
    JMenu m = menu("Weights", KeyEvent.VK_W);
    m.add(action("Reset to the file's weights", KeyEvent.VK_R, key(KeyEvent.VK_R, CTRL), "Back to the weights the weights file gave.",
        e -> w.resetWeights()));
    m.add(action("Focus the LM weight", KeyEvent.VK_L, key(KeyEvent.VK_L, CTRL), "Move the focus to the λ slider (arrows move it).",
        e -> w.weights.lambda.slider.requestFocusInWindow()));
    m.add(tune);
    m.addSeparator();
    ButtonGroup group = new ButtonGroup();
    String[] names = {"N-best", "MBR", "Consensus", "Network search"};
    int[] mnemonics = {KeyEvent.VK_N, KeyEvent.VK_M, KeyEvent.VK_C, KeyEvent.VK_S};
    for (RescoreMethod method : RescoreMethod.values()) {
      JRadioButtonMenuItem item = new JRadioButtonMenuItem(names[method.ordinal()]);
      item.setMnemonic(mnemonics[method.ordinal()]);
      item.setAccelerator(key(KeyEvent.VK_1 + method.ordinal(), InputEvent.ALT_DOWN_MASK));
      item.addActionListener(e -> w.weights.method(method));
      item.setSelected(method == RescoreMethod.NBEST);
      w.weights.watch(s -> item.setSelected(s.method() == method));
      group.add(item);
      m.add(item);
    }
    return m;
  }

  private JMenu help() {
    JMenu m = menu("Help", KeyEvent.VK_H);
    m.add(action("Keyboard", KeyEvent.VK_K, key(KeyEvent.VK_F1, 0), "List the keyboard shortcuts.",
        e -> JOptionPane.showMessageDialog(w, KeyboardHelp.text(w.getJMenuBar()), "Keyboard", JOptionPane.INFORMATION_MESSAGE)));
    m.add(action("About Steelyard", KeyEvent.VK_A, null, "Version and what the window shows.", e -> JOptionPane.showMessageDialog(w,
        "Steelyard picks, tunes and audits transcripts among competing recogniser outputs with an n-gram model.\n"
            + "An automatic pick is not a verified transcript: transcripts with legal, medical or safety weight need review by a person.",
        "About Steelyard", JOptionPane.INFORMATION_MESSAGE)));
    return m;
  }

  void refreshRecent() {
    recent.removeAll();
    List<OpenRequest> list = w.prefs.recent();
    for (int k = 0; k < list.size(); k++) {
      OpenRequest r = list.get(k);
      JMenuItem item = new JMenuItem((k + 1) + "  " + r.hyps().getFileName() + (r.refs() == null ? "" : " + " + r.refs().getFileName()));
      if (k < 9) item.setMnemonic(KeyEvent.VK_1 + k);
      item.setToolTipText(r.hyps().toString());
      item.addActionListener(e -> w.open(r));
      recent.add(item);
    }
    recent.setEnabled(!list.isEmpty());
  }

  private void step(int delta) {
    var t = w.list.table();
    if (t.getRowCount() == 0) return;
    int row = Math.max(0, Math.min(t.getRowCount() - 1, t.getSelectedRow() + delta));
    t.getSelectionModel().setSelectionInterval(row, row);
    t.scrollRectToVisible(t.getCellRect(row, 0, true));
  }

  private static JMenu menu(String text, int mnemonic) {
    JMenu m = new JMenu(text);
    m.setMnemonic(mnemonic);
    m.setName("menu." + text.toLowerCase(java.util.Locale.ROOT));
    return m;
  }

  private static KeyStroke key(int code, int modifiers) {
    return KeyStroke.getKeyStroke(code, modifiers);
  }

  static Action action(String name, int mnemonic, KeyStroke accelerator, String description, Consumer<ActionEvent> body) {
    Action a = new AbstractAction(name) {
      private static final long serialVersionUID = 1L;
      @Override public void actionPerformed(ActionEvent e) {
        body.accept(e);
      }
    };
    a.putValue(Action.MNEMONIC_KEY, mnemonic);
    if (accelerator != null) a.putValue(Action.ACCELERATOR_KEY, accelerator);
    a.putValue(Action.SHORT_DESCRIPTION, description);
    return a;
  }
}
