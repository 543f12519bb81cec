package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Component;
import java.awt.Font;
import java.awt.event.KeyEvent;
import java.awt.event.MouseAdapter;
import java.awt.event.MouseEvent;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;
import javax.swing.BorderFactory;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.JTable;
import javax.swing.JTextArea;
import javax.swing.KeyStroke;
import javax.swing.ListSelectionModel;
import javax.swing.SwingConstants;
import javax.swing.table.AbstractTableModel;
import javax.swing.table.DefaultTableCellRenderer;
import steelyard.audit.AuditCounts;
import steelyard.audit.AuditReport;
import steelyard.audit.Verdict;
import steelyard.gui.model.Choices;
import steelyard.gui.model.OverruleRow;
import steelyard.report.charts.Palette;

/**
 * The overrule audit: every utterance whose pick differs from rank 1, with its verdict, the errors of both,
 * the margin, the LM-weight interval in which the pick holds and where rank 1 returns, and the n-gram that
 * weighed most; below, the selected overrule's decisive n-grams. Enter or a double click opens the
 * utterance. EDT only.
 */
final class AuditView extends JPanel {
  private static final long serialVersionUID = 1L;
  private final JLabel summary = new JLabel(" ");
  private final Model model = new Model();
  private final JTable table = new JTable(model);
  private final JTextArea ngrams = new JTextArea();
  private Consumer<String> open = id -> {};

  AuditView() {
    super(new BorderLayout());
    setName("audit");
    summary.setName("audit.summary");
    summary.setBorder(BorderFactory.createEmptyBorder(8, 10, 8, 10));
    summary.setFont(summary.getFont().deriveFont(13f));
    table.setName("audit.table");
    table.setAutoCreateRowSorter(true);
    table.setSelectionMode(ListSelectionModel.SINGLE_SELECTION);
    table.setDefaultRenderer(Object.class, new Renderer());
    table.setDefaultRenderer(Double.class, new Renderer());
    table.setDefaultRenderer(Long.class, new Renderer());
    int[] widths = {96, 56, 100, 50, 44, 70, 140, 66, 230};
    for (int c = 0; c < widths.length; c++) table.getColumnModel().getColumn(c).setPreferredWidth(widths[c]);
    table.getSelectionModel().addListSelectionListener(e -> showNgrams());
    table.addMouseListener(new MouseAdapter() {
      @Override public void mouseClicked(MouseEvent e) {
        if (e.getClickCount() == 2) openSelected();
      }
    });
    table.getInputMap(JComponent.WHEN_ANCESTOR_OF_FOCUSED_COMPONENT).put(KeyStroke.getKeyStroke(KeyEvent.VK_ENTER, 0), "open-utterance");
    table.getActionMap().put("open-utterance", new javax.swing.AbstractAction() {
      private static final long serialVersionUID = 1L;
      @Override public void actionPerformed(java.awt.event.ActionEvent e) {
        openSelected();
      }
    });
    ngrams.setName("audit.ngrams");
    ngrams.setEditable(false);
    ngrams.setFont(new Font(Font.MONOSPACED, Font.PLAIN, 12));
    ngrams.setBorder(BorderFactory.createEmptyBorder(6, 8, 6, 8));
    JSplitPane split = new JSplitPane(JSplitPane.VERTICAL_SPLIT, new JScrollPane(table), new JScrollPane(ngrams));
    split.setResizeWeight(0.7);
    add(summary, BorderLayout.NORTH);
    add(split, BorderLayout.CENTER);
    clear("The audit is computed when this view is shown.");
  }

  /** Called with the utterance id the user opens. */
  void onOpen(Consumer<String> c) {
    open = c;
  }

  void show(AuditReport report, String unitName) {
    model.rows = OverruleRow.of(report);
    model.fireTableDataChanged();
    AuditCounts t = report.total();
    summary.setText(String.format(Locale.ROOT, "<html><b>%d overrules</b> (picks that differ from rank 1): "
        + "<span style='color:%s'>▲ helped %d</span> · <span style='color:%s'>▼ hurt %d</span> · ◆ neutral %d · ◇ unverified %d · "
        + "net %s errors %+d (%d rank 1 − %d picks). Enter opens the utterance.</html>", t.overrules(), Palette.hex(Palette.BLUE),
        t.helped(), Palette.hex(Palette.BRICK), t.hurt(), t.neutral(), t.unverified(), unitName, t.netErrorChange(),
        report.firstErrors(), report.chosenErrors()));
    if (!model.rows.isEmpty()) table.getSelectionModel().setSelectionInterval(0, 0);
    else ngrams.setText("No overrules: every pick has rank 1's tokens.");
  }

  void clear(String note) {
    model.rows = List.of();
    model.fireTableDataChanged();
    summary.setText(note);
    ngrams.setText("");
  }

  /** Rows shown (for tests). */
  List<OverruleRow> rows() {
    return model.rows;
  }

  JTable table() {
    return table;
  }

  private void openSelected() {
    int v = table.getSelectedRow();
    if (v >= 0) open.accept(model.rows.get(table.convertRowIndexToModel(v)).uttId());
  }

  private void showNgrams() {
    int v = table.getSelectedRow();
    if (v < 0) return;
    OverruleRow r = model.rows.get(table.convertRowIndexToModel(v));
    List<String> lines = new ArrayList<>();
    lines.add(r.uttId() + ": pick  \"" + r.overrule().pick().text() + "\"");
    lines.add(" ".repeat(r.uttId().length()) + "  rank 1 \"" + r.overrule().first().text() + "\"");
    if (r.overrule().reference() != null) lines.add(" ".repeat(r.uttId().length()) + "  ref    \"" + r.overrule().reference() + "\"");
    lines.add("");
    List<String> n = OverruleRow.ngramLines(r.overrule());
    if (n.isEmpty()) {
      lines.add("No decisive n-grams (no model, or the LM difference is zero).");
    } else {
      lines.add(String.format(Locale.ROOT, "%-28s %-28s %8s", "pick's n-gram (order, ln p)", "rank 1's n-gram", "Δ ln p"));
      lines.addAll(n);
      lines.add(String.format(Locale.ROOT, "%-57s %+8.3f", "ln P(pick) − ln P(rank 1)", r.overrule().ngrams().delta()));
    }
    ngrams.setText(String.join("\n", lines));
    ngrams.setCaretPosition(0);
  }

  private static final class Model extends AbstractTableModel {
    private static final long serialVersionUID = 1L;
    private static final String[] COLUMNS = {"Utterance", "Group", "Verdict", "Rank 1", "Pick", "Margin", "Pick holds for λ in",
        "Back at λ", "Decisive n-gram"};
    List<OverruleRow> rows = new ArrayList<>();

    @Override public int getRowCount() { return rows.size(); }
    @Override public int getColumnCount() { return COLUMNS.length; }
    @Override public String getColumnName(int c) { return COLUMNS[c]; }

    @Override
    public Class<?> getColumnClass(int c) {
      return c == 3 || c == 4 ? Long.class : c == 5 || c == 7 ? Double.class : String.class;
    }

    @Override
    public Object getValueAt(int r, int c) {
      OverruleRow o = rows.get(r);
      switch (c) {
        case 0: return o.uttId();
        case 1: return o.group();
        case 2: return verdictText(o.verdict());
        case 3: return o.firstErrors() < 0 ? null : o.firstErrors();
        case 4: return o.pickErrors() < 0 ? null : o.pickErrors();
        case 5: return o.margin();
        case 6: return Double.isNaN(o.flipLow()) ? "–" : "(" + edge(o.flipLow()) + ", " + edge(o.flipHigh()) + ")" + (o.flipExact() ? "" : " pool");
        case 7: return o.returnWeight();
        case 8: return o.topNgram();
        default: throw new IndexOutOfBoundsException("column " + c);
      }
    }
  }

  static String verdictText(Verdict v) {
    switch (v) {
      case HELPED: return Theme.verdictText(Choices.Verdict.HELPED);
      case HURT: return Theme.verdictText(Choices.Verdict.HURT);
      case NEUTRAL: return "◆ same errors";
      default: return "◇ no reference";
    }
  }

  private static String edge(double v) {
    if (v == Double.NEGATIVE_INFINITY) return "−∞";
    if (v == Double.POSITIVE_INFINITY) return "+∞";
    return String.format(Locale.ROOT, "%.3f", v);
  }

  private final class Renderer extends DefaultTableCellRenderer {
    private static final long serialVersionUID = 1L;

    @Override
    public Component getTableCellRendererComponent(JTable t, Object value, boolean selected, boolean focus, int row, int col) {
      Object shown = value;
      if (value instanceof Double d) {
        shown = Double.isNaN(d) ? "–" : Double.isInfinite(d) ? (d > 0 ? "+∞" : "−∞")
            : String.format(Locale.ROOT, Math.abs(d) >= 100 ? "%.1f" : "%.3f", d);
      }
      if (value == null) shown = "–";
      super.getTableCellRendererComponent(t, shown, selected, focus, row, col);
      setHorizontalAlignment(value instanceof Number ? SwingConstants.RIGHT : SwingConstants.LEFT);
      OverruleRow r = model.rows.get(t.convertRowIndexToModel(row));
      if (!selected) {
        setForeground(col == 2 ? (r.verdict() == Verdict.HELPED ? Palette.BLUE : r.verdict() == Verdict.HURT ? Palette.BRICK : Theme.MUTED)
            : t.getForeground());
      }
      return this;
    }
  }
}
