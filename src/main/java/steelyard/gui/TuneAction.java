package steelyard.gui;

import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.util.EnumSet;
import java.util.Locale;
import java.util.Set;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JOptionPane;
import javax.swing.JPanel;
import javax.swing.JSpinner;
import javax.swing.SpinnerNumberModel;
import steelyard.gui.model.Workspace;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.tune.MethodFigures;
import steelyard.tune.TuneResult;

/**
 * Weights ▸ Tune: asks which methods and how many cross-validation folds, runs the tuner in the background
 * (progress and cancel in the status bar), then shows what it found and moves the sliders to the result.
 * EDT only.
 */
final class TuneAction {
  private TuneAction() {}

  static void run(SteelyardWindow w) {
    Workspace ws = w.workspace();
    if (ws == null || w.settings() == null) return;
    JComboBox<String> which = new JComboBox<>(new String[] {"the current method (" + FiguresBand.methodName(w.settings().method()) + ")",
        "all four methods, keep the best"});
    which.setName("tune.methods");
    JSpinner folds = new JSpinner(new SpinnerNumberModel(5, 0, 20, 1));
    folds.setName("tune.folds");
    JPanel p = new JPanel(new GridBagLayout());
    row(p, 0, "Tune", 'u', which);
    row(p, 1, "Cross-validation folds", 'f', folds);
    GridBagConstraints c = new GridBagConstraints();
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(3, 0, 3, 8);
    c.gridx = 0;
    c.gridy = 2;
    c.gridwidth = 2;
    p.add(new JLabel("<html><body style='width:360px'>The tuner minimises the error of the picks on these utterances, "
        + "starting from the weights in effect; with folds it also reports the error of weights tuned without each "
        + "fold, a fairer guess of the error on new data.</body></html>"), c);
    if (JOptionPane.showConfirmDialog(w, p, "Tune the weights", JOptionPane.OK_CANCEL_OPTION, JOptionPane.PLAIN_MESSAGE)
        != JOptionPane.OK_OPTION) return;
    Set<RescoreMethod> methods = which.getSelectedIndex() == 0 ? EnumSet.of(w.settings().method()) : EnumSet.noneOf(RescoreMethod.class);
    start(w, methods, (Integer) folds.getValue());
  }

  private static void row(JPanel p, int y, String text, char mnemonic, javax.swing.JComponent field) {
    GridBagConstraints c = new GridBagConstraints();
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(3, 0, 3, 8);
    c.gridy = y;
    JLabel l = new JLabel(text);
    l.setDisplayedMnemonic(mnemonic);
    l.setLabelFor(field);
    p.add(l, c);
    c.gridx = 1;
    p.add(field, c);
  }

  /** Tunes {@code methods} (empty: all) with {@code k} folds from the weights in effect, in the background. */
  static void start(SteelyardWindow w, Set<RescoreMethod> methods, int k) {
    Workspace ws = w.workspace();
    RescoreWeights start = w.currentWeights();
    w.tasks.submit("tune", "Tuning the weights", pr -> ws.tune(start, methods, k, pr), (o, r, e) -> {
      if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(w, "Cannot tune", e);
      if (o != Tasks.Outcome.COMPLETE || ws != w.workspace()) return;
      w.applyTuned(r.weights(), r.method());
      JOptionPane.showMessageDialog(w, summary(r, ws), "Tuned", JOptionPane.INFORMATION_MESSAGE);
    });
  }

  /** What the tuner found, in a few lines. */
  static String summary(TuneResult r, Workspace ws) {
    String unit = ws.corpus().unit() == steelyard.text.Unit.CHAR ? "CER" : "WER";
    StringBuilder sb = new StringBuilder();
    sb.append(String.format(Locale.ROOT, "Kept: %s.  %s on these %d utterances: rank 1 %s, tuned %s", FiguresBand.methodName(r.method()),
        unit, r.utterances(), FiguresBand.percent(r.devFirstErrorRate()), FiguresBand.percent(r.devErrorRate())));
    if (!Double.isNaN(r.cvErrorRate())) sb.append(String.format(Locale.ROOT, ", cross-validated %s (%d folds)", FiguresBand.percent(r.cvErrorRate()), r.folds()));
    sb.append(".\n");
    for (MethodFigures f : r.perMethod()) {
      sb.append(String.format(Locale.ROOT, "  %s: %s%s%s%n", FiguresBand.methodName(f.method()), FiguresBand.percent(f.devErrorRate()),
          Double.isNaN(f.cvErrorRate()) ? "" : ", cross-validated " + FiguresBand.percent(f.cvErrorRate()),
          f.keptStart() ? " (starting weights kept)" : ""));
    }
    for (String warning : r.warnings()) sb.append("Note: ").append(warning).append('\n');
    sb.append("The sliders now show the tuned weights; File ▸ Save weights writes them.");
    return sb.toString();
  }
}
