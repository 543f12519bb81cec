package steelyard.gui;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Dimension;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import steelyard.gui.model.NetworkPicture;
import steelyard.report.charts.Palette;

/**
 * A confusion network drawn as slots left to right, each a column of competing tokens, highest posterior at
 * the top, with a bar and the value of each token's posterior. The arcs of the chosen transcript are
 * outlined, set in bold and joined by a line; a skipped slot (the empty arc) reads "(skip)". At most
 * {@link #MAX_ARCS} arcs per slot are drawn, with a count of the rest. EDT only.
 */
final class NetworkView extends DrawnComponent {
  private static final long serialVersionUID = 1L;
  static final int MAX_ARCS = 8;
  private static final int PAD = 8;
  private static final int GAP = 14;
  private static final int ROW = 38;
  private static final String SKIP = "(skip)";
  private NetworkPicture picture = new NetworkPicture(List.of());
  private String message = "no network";

  NetworkView() {
    super(javax.accessibility.AccessibleRole.CANVAS);
    setName("detail.network");
    setOpaque(true);
    setBackground(Color.WHITE);
  }

  void show(NetworkPicture p, String note) {
    picture = p;
    message = note;
    StringBuilder sb = new StringBuilder();
    for (NetworkPicture.Slot s : p.slots()) {
      for (NetworkPicture.Arc a : s.arcs()) if (a.chosen()) sb.append(a.token() == null ? "∅" : a.token()).append(' ');
    }
    getAccessibleContext().setAccessibleDescription("confusion network of " + p.slots().size() + " slots; chosen path: " + sb);
    revalidate();
    repaint();
  }

  @Override
  public Dimension getPreferredSize() {
    FontMetrics fm = getFontMetrics(getFont().deriveFont(Font.BOLD));
    int w = PAD;
    int rows = 1;
    for (NetworkPicture.Slot s : picture.slots()) {
      w += slotWidth(fm, s) + GAP;
      rows = Math.max(rows, Math.min(MAX_ARCS, s.arcs().size()) + (s.arcs().size() > MAX_ARCS ? 1 : 0));
    }
    return new Dimension(Math.max(w, 300), 28 + rows * ROW + PAD);
  }

  @Override
  protected void paintComponent(Graphics g0) {
    Graphics2D g = (Graphics2D) g0.create();
    g.setColor(getBackground());
    g.fillRect(0, 0, getWidth(), getHeight());
    g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
    g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
    Font plain = getFont();
    Font bold = plain.deriveFont(Font.BOLD);
    Font small = plain.deriveFont(10.5f);
    g.setFont(small);
    g.setColor(Theme.MUTED);
    g.drawString(message, PAD, 14);
    int x = PAD;
    int top = 24;
    List<int[]> chosen = new ArrayList<>();
    FontMetrics bfm = g.getFontMetrics(bold);
    for (int s = 0; s < picture.slots().size(); s++) {
      NetworkPicture.Slot slot = picture.slots().get(s);
      int w = slotWidth(bfm, slot);
      g.setColor(Theme.IGNORED);
      g.fillRoundRect(x - 3, top - 2, w + 6, Math.min(MAX_ARCS, slot.arcs().size()) * ROW + 4, 10, 10);
      for (int k = 0; k < Math.min(MAX_ARCS, slot.arcs().size()); k++) {
        NetworkPicture.Arc a = slot.arcs().get(k);
        int y = top + k * ROW;
        if (a.chosen()) chosen.add(new int[] {x, y, w});
        drawArc(g, a, x, y, w, plain, bold, small);
      }
      if (slot.arcs().size() > MAX_ARCS) {
        g.setFont(small);
        g.setColor(Theme.MUTED);
        g.drawString("+" + (slot.arcs().size() - MAX_ARCS) + " more", x + 4, top + MAX_ARCS * ROW + 14);
      }
      x += w + GAP;
    }
    g.setColor(Palette.BLUE);
    g.setStroke(new BasicStroke(2f));
    for (int k = 1; k < chosen.size(); k++) {
      int[] a = chosen.get(k - 1);
      int[] b = chosen.get(k);
      g.drawLine(a[0] + a[2], a[1] + ROW / 2 - 4, b[0], b[1] + ROW / 2 - 4);
    }
    g.dispose();
  }

  private static void drawArc(Graphics2D g, NetworkPicture.Arc a, int x, int y, int w, Font plain, Font bold, Font small) {
    if (a.chosen()) {
      g.setColor(Theme.CHOSEN_FILL);
      g.fillRoundRect(x, y + 1, w, ROW - 4, 8, 8);
      g.setColor(Palette.BLUE);
      g.setStroke(new BasicStroke(2f));
      g.drawRoundRect(x, y + 1, w, ROW - 4, 8, 8);
    }
    g.setFont(a.chosen() ? bold : plain);
    g.setColor(a.token() == null ? Theme.MUTED : Palette.INK);
    g.drawString(a.token() == null ? SKIP : a.token(), x + 5, y + 16);
    int barW = w - 44;
    g.setColor(new Color(0xE3, 0xE7, 0xEC));
    g.fillRect(x + 5, y + 22, barW, 6);
    g.setColor(a.chosen() ? Palette.BLUE : Theme.BAR);
    g.fillRect(x + 5, y + 22, (int) Math.round(barW * Math.max(0, Math.min(1, a.posterior()))), 6);
    g.setFont(small);
    g.setColor(Theme.MUTED);
    g.drawString(String.format(Locale.ROOT, "%.2f", a.posterior()), x + w - 34, y + 29);
  }

  private static int slotWidth(FontMetrics fm, NetworkPicture.Slot s) {
    int w = 60;
    for (int k = 0; k < Math.min(MAX_ARCS, s.arcs().size()); k++) {
      String t = s.arcs().get(k).token();
      w = Math.max(w, fm.stringWidth(t == null ? SKIP : t) + 16);
    }
    return w;
  }
}
