package steelyard.gui;

import java.awt.Color;
import java.awt.Dimension;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.util.List;
import steelyard.gui.model.AlignedPair;
import steelyard.report.charts.Palette;

/**
 * One transcript aligned against the reference, drawn as columns: the reference token over the transcript's
 * token, each edit tinted and labelled with its letter (S, D, I; "opt" for tokens the rules make optional),
 * so an edit never shows by colour alone. The tooltip and accessible description carry the same as text.
 * EDT only.
 */
final class AlignmentStrip extends DrawnComponent {
  private static final long serialVersionUID = 1L;
  private static final int PAD = 7;
  private static final int GAP = 3;
  private static final int TITLE = 84;
  private static final String MISSING = "—";
  private final String title;
  private List<AlignedPair> columns = List.of();
  private String summary = "";

  AlignmentStrip(String name, String title) {
    super(javax.accessibility.AccessibleRole.LABEL);
    this.title = title;
    setName(name);
    setFont(getFont() == null ? new Font(Font.SANS_SERIF, Font.PLAIN, 13) : getFont().deriveFont(13f));
  }

  /** Shows {@code cols} (empty: "no reference"). */
  void show(List<AlignedPair> cols) {
    columns = List.copyOf(cols);
    int[] c = AlignedPair.counts(columns);
    summary = columns.isEmpty() ? "no reference" : (c[0] + c[1] + c[2]) + " errors: " + c[0] + " S · " + c[1] + " D · " + c[2] + " I";
    String text = asText();
    setToolTipText("<html>" + UtteranceListPanel.escape(text) + "</html>");
    getAccessibleContext().setAccessibleDescription(title + ": " + text + "; " + summary);
    revalidate();
    repaint();
  }

  /** The alignment as text: {@code word}, {@code [S ref→hyp]}, {@code [D ref]}, {@code [I hyp]}, {@code (opt tok)}. */
  String asText() {
    StringBuilder sb = new StringBuilder();
    for (AlignedPair p : columns) {
      if (sb.length() > 0) sb.append(' ');
      switch (p.kind()) {
        case CORRECT: sb.append(p.reference()); break;
        case SUBSTITUTION: sb.append("[S ").append(p.reference()).append("→").append(p.hypothesis()).append(']'); break;
        case DELETION: sb.append("[D ").append(p.reference()).append(']'); break;
        case INSERTION: sb.append("[I ").append(p.hypothesis()).append(']'); break;
        default: sb.append("(opt ").append(p.reference() != null ? p.reference() : p.hypothesis()).append(')');
      }
    }
    return sb.toString();
  }

  String summary() {
    return summary;
  }

  @Override
  public Dimension getPreferredSize() {
    FontMetrics fm = getFontMetrics(getFont());
    int w = TITLE;
    for (AlignedPair p : columns) w += width(fm, p) + GAP;
    w += fm.stringWidth(summary) + 3 * PAD;
    return new Dimension(w, 3 * fm.getHeight() + 10);
  }

  @Override
  protected void paintComponent(Graphics g0) {
    Graphics2D g = (Graphics2D) g0.create();
    g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
    g.setFont(getFont());
    FontMetrics fm = g.getFontMetrics();
    int lh = fm.getHeight();
    int top = 3;
    g.setColor(Theme.MUTED);
    g.setFont(getFont().deriveFont(11f));
    g.drawString("reference", 0, top + lh - fm.getDescent());
    g.setColor(Palette.INK);
    g.setFont(getFont().deriveFont(Font.BOLD, 12f));
    g.drawString(title, 0, top + 2 * lh - fm.getDescent());
    g.setFont(getFont());
    int x = TITLE;
    for (AlignedPair p : columns) {
      int w = width(fm, p);
      Color fill = Theme.edit(p.kind());
      if (fill != null) {
        g.setColor(fill);
        g.fillRoundRect(x, top, w, 2 * lh + 4, 8, 8);
      }
      boolean ignored = p.kind() == AlignedPair.Kind.IGNORED;
      drawCentered(g, p.reference() == null ? (ignored ? "" : MISSING) : p.reference(), x, w, top + lh - fm.getDescent(),
          ignored ? Theme.MUTED : Palette.INK);
      drawCentered(g, p.hypothesis() == null ? (ignored ? "" : MISSING) : p.hypothesis(), x, w, top + 2 * lh - fm.getDescent(),
          p.kind().isError() ? Palette.INK : Theme.MUTED.darker());
      if (!p.kind().mark().isEmpty()) {
        g.setFont(getFont().deriveFont(Font.BOLD, 11f));
        drawCentered(g, p.kind().mark(), x, w, top + 3 * lh - fm.getDescent() + 2, markColour(p.kind()));
        g.setFont(getFont());
      }
      x += w + GAP;
    }
    g.setColor(Theme.MUTED);
    g.drawString(summary, x + 2 * PAD, top + 2 * lh - fm.getDescent());
    g.dispose();
  }

  private static Color markColour(AlignedPair.Kind k) {
    switch (k) {
      case SUBSTITUTION: return new Color(0x8A, 0x5A, 0x00);
      case DELETION: return Palette.BRICK;
      case INSERTION: return Palette.BLUE;
      default: return Theme.MUTED;
    }
  }

  private static void drawCentered(Graphics2D g, String s, int x, int w, int baseline, Color c) {
    g.setColor(c);
    g.drawString(s, x + (w - g.getFontMetrics().stringWidth(s)) / 2, baseline);
  }

  private static int width(FontMetrics fm, AlignedPair p) {
    int w = Math.max(fm.stringWidth(p.reference() == null ? MISSING : p.reference()),
        fm.stringWidth(p.hypothesis() == null ? MISSING : p.hypothesis()));
    return Math.max(w, fm.stringWidth("opt")) + 2 * PAD;
  }
}
