package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Font;
import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.util.Locale;
import javax.swing.BorderFactory;
import javax.swing.JLabel;
import javax.swing.JPanel;
import steelyard.gui.model.CorpusFigures;
import steelyard.report.charts.Palette;
import steelyard.rescore.RescoreMethod;
import steelyard.text.Unit;

/**
 * The band across the top of the window: the corpus error rate of the current choice in large type, rank 1
 * and the N-best oracle beside it, and how many choices changed, helped and hurt. EDT only.
 */
public final class FiguresBand extends JPanel {
  private static final long serialVersionUID = 1L;
  private final JLabel error = label("figures.error", Font.BOLD, 26f);
  private final JLabel errorCaption = label("figures.caption", Font.PLAIN, 11f);
  private final JLabel first = label("figures.first", Font.BOLD, 15f);
  private final JLabel oracle = label("figures.oracle", Font.BOLD, 15f);
  private final JLabel counts = label("figures.counts", Font.PLAIN, 13f);
  private final JLabel source = label("figures.source", Font.PLAIN, 11f);

  public FiguresBand() {
    super(new BorderLayout());
    setBackground(Theme.BAND);
    setBorder(BorderFactory.createEmptyBorder(8, 14, 8, 14));
    JPanel left = new JPanel(new GridBagLayout());
    left.setOpaque(false);
    GridBagConstraints c = new GridBagConstraints();
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(0, 0, 0, 28);
    c.gridx = 0;
    c.gridy = 0;
    left.add(error, c);
    c.gridy = 1;
    left.add(errorCaption, c);
    c.gridx = 1;
    c.gridy = 0;
    left.add(first, c);
    c.gridy = 1;
    left.add(caption("the recogniser's rank 1"), c);
    c.gridx = 2;
    c.gridy = 0;
    left.add(oracle, c);
    c.gridy = 1;
    left.add(caption("oracle: best in each list"), c);
    c.gridx = 3;
    c.gridy = 0;
    left.add(counts, c);
    c.gridy = 1;
    left.add(caption("choices that differ from rank 1, against the reference"), c);
    add(left, BorderLayout.WEST);
    source.setForeground(Theme.BAND_MUTED);
    add(source, BorderLayout.EAST);
    error.setForeground(Palette.SKY);
    errorCaption.setForeground(Theme.BAND_MUTED);
    clear();
  }

  /** Shows {@code f} for a choice by {@code method} in {@code unit}; {@code source} names the data. */
  public void show(CorpusFigures f, RescoreMethod method, Unit unit, String sourceText) {
    String rate = unit == Unit.CHAR ? "CER" : "WER";
    error.setText(rate + " " + percent(f.errorRate()));
    errorCaption.setText("chosen by " + methodName(method) + ", " + f.scored() + " utterances with a reference");
    first.setText("rank 1 " + percent(f.firstErrorRate()));
    oracle.setText("oracle " + percent(f.oracleErrorRate()));
    counts.setText(String.format(Locale.ROOT, "changed %d   ▲ helped %d   ▼ hurt %d%s", f.changed(), f.helped(), f.hurt(),
        f.newTranscripts() > 0 ? "   ◆ new " + f.newTranscripts() : ""));
    source.setText("<html><div style='text-align:right'>" + UtteranceListPanel.escape(sourceText) + "<br>"
        + "An automatic pick is not a verified transcript.</div></html>");
  }

  /** Nothing open. */
  public void clear() {
    error.setText("WER –");
    errorCaption.setText("open hypotheses and references (File ▸ Open)");
    first.setText("rank 1 –");
    oracle.setText("oracle –");
    counts.setText(" ");
    source.setText(" ");
  }

  /** The text of the corpus error label (for tests). */
  public String errorText() {
    return error.getText();
  }

  /** A rate as the band prints it: two decimals and a percent sign, or "–". */
  public static String percent(double rate) {
    return Double.isNaN(rate) ? "–" : String.format(Locale.ROOT, "%.2f %%", 100 * rate);
  }

  static String methodName(RescoreMethod m) {
    switch (m) {
      case NBEST: return "N-best";
      case MBR: return "MBR";
      case CONSENSUS: return "consensus";
      case LATTICE: return "network search";
      default: throw new AssertionError(m);
    }
  }

  private JLabel caption(String text) {
    JLabel l = label(null, Font.PLAIN, 11f);
    l.setText(text);
    l.setForeground(Theme.BAND_MUTED);
    return l;
  }

  private static JLabel label(String name, int style, float size) {
    JLabel l = new JLabel();
    if (name != null) l.setName(name);
    l.setFont(l.getFont().deriveFont(style, size));
    l.setForeground(Theme.BAND_TEXT);
    return l;
  }
}
