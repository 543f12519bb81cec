package steelyard.gui;

import java.awt.Component;
import java.awt.Font;
import java.awt.event.MouseEvent;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import javax.swing.JTable;
import javax.swing.SwingConstants;
import javax.swing.table.AbstractTableModel;
import javax.swing.table.DefaultTableCellRenderer;
import javax.swing.table.JTableHeader;
import steelyard.gui.model.Corpus;
import steelyard.gui.model.HypothesisRow;
import steelyard.gui.model.ScoreTerms;

/**
 * The open utterance's hypotheses in their new order: role (pick, rank 1), recogniser rank, system, text,
 * every weighted score term (the unweighted value in the cell's tooltip), the total, the posterior and the
 * errors against the reference. Each column header explains its term in one sentence. EDT only.
 */
final class HypothesisTable extends JTable {
  private static final long serialVersionUID = 1L;
  private final Model model;

  HypothesisTable() {
    this(new Model());
  }

  private HypothesisTable(Model m) {
    super(m);
    this.model = m;
    setName("detail.hypotheses");
    setFillsViewportHeight(true);
    setAutoCreateRowSorter(true);
    setAutoResizeMode(AUTO_RESIZE_SUBSEQUENT_COLUMNS);
    setDefaultRenderer(Object.class, new Renderer());
    setDefaultRenderer(Double.class, new Renderer());
    setDefaultRenderer(Integer.class, new Renderer());
  }

  void show(List<HypothesisRow> rows, List<String> featureNames, boolean systems) {
    boolean structure = !ScoreTerms.names(featureNames).equals(model.terms) || systems != model.systems;
    model.rows = List.copyOf(rows);
    model.terms = ScoreTerms.names(featureNames);
    model.tips = ScoreTerms.tooltips(featureNames);
    model.systems = systems;
    if (structure) {
      model.fireTableStructureChanged();
      widths();
    } else {
      model.fireTableDataChanged();
    }
  }

  /** Fills the viewport when it is wide enough; scrolls sideways otherwise, so numbers are never cut. */
  @Override
  public boolean getScrollableTracksViewportWidth() {
    return getParent() == null || getPreferredSize().width < getParent().getWidth();
  }

  /** Rows as shown (for tests). */
  List<HypothesisRow> rows() {
    return model.rows;
  }

  @Override
  protected JTableHeader createDefaultTableHeader() {
    return new JTableHeader(columnModel) {
      private static final long serialVersionUID = 1L;
      @Override public String getToolTipText(MouseEvent e) {
        int c = columnAtPoint(e.getPoint());
        return c < 0 ? null : model.tooltip(convertColumnIndexToModel(c));
      }
    };
  }

  private void widths() {
    for (int c = 0; c < getColumnCount(); c++) {
      String name = model.getColumnName(c);
      int w = "text".equals(name) ? 240 : "role".equals(name) ? 70 : "#".equals(name) ? 30 : "rank".equals(name) || "errors".equals(name) ? 46
          : "system".equals(name) ? 90 : 68;
      getColumnModel().getColumn(c).setPreferredWidth(w);
      getColumnModel().getColumn(c).setMinWidth(Math.min(w, 30));
    }
  }

  private static final class Model extends AbstractTableModel {
    private static final long serialVersionUID = 1L;
    List<HypothesisRow> rows = new ArrayList<>();
    List<String> terms = new ArrayList<>();
    List<String> tips = new ArrayList<>();
    boolean systems;

    private int fixed() {
      return systems ? 5 : 4;
    }

    @Override public int getRowCount() { return rows.size(); }
    @Override public int getColumnCount() { return fixed() + terms.size() + 3; }

    @Override
    public String getColumnName(int c) {
      int f = fixed();
      if (c < f) return (systems ? new String[] {"#", "role", "rank", "system", "text"} : new String[] {"#", "role", "rank", "text"})[c];
      if (c < f + terms.size()) return terms.get(c - f);
      return new String[] {"total", "posterior", "errors"}[c - f - terms.size()];
    }

    String tooltip(int c) {
      int f = fixed();
      if (c >= f && c < f + terms.size()) return tips.get(c - f);
      switch (getColumnName(c)) {
        case "#": return "Position by total under the current weights (1 = best).";
        case "role": return "Which hypothesis is the pick and which is the recogniser's rank 1.";
        case "rank": return "The recogniser's own rank (1 = its best).";
        case "system": return "The recogniser or configuration that produced the hypothesis.";
        case "text": return "The hypothesis as given in the file.";
        case "total": return "The sum of the weighted terms: the log-linear score that N-best rescoring maximises.";
        case "posterior": return "The hypothesis's probability after scaling the totals by α and normalising (what MBR and the networks use).";
        case "errors": return "Substitutions, deletions and insertions against the reference (– without one).";
        default: return null;
      }
    }

    @Override
    public Class<?> getColumnClass(int c) {
      int f = fixed();
      if (c == 0 || c == 2) return Integer.class;
      if (c < f) return String.class;
      if (c == getColumnCount() - 1) return Integer.class;
      return Double.class;
    }

    @Override
    public Object getValueAt(int r, int c) {
      HypothesisRow h = rows.get(r);
      int f = fixed();
      if (c == 0) return h.newOrder();
      if (c == 1) return h.chosen() && h.first() ? "pick = rank 1" : h.chosen() ? "▶ pick" : h.first() ? "rank 1" : "";
      if (c == 2) return h.rank();
      if (systems && c == 3) return h.system();
      if (c == f - 1) return h.text();
      if (c < f + terms.size()) return h.weighted()[c - f];
      int k = c - f - terms.size();
      if (k == 0) return h.total();
      if (k == 1) return h.posterior();
      return h.errors() == Corpus.NO_REFERENCE ? null : h.errors();
    }

    HypothesisRow row(int r) {
      return rows.get(r);
    }
  }

  private final class Renderer extends DefaultTableCellRenderer {
    private static final long serialVersionUID = 1L;

    @Override
    public Component getTableCellRendererComponent(JTable t, Object value, boolean selected, boolean focus, int row, int col) {
      int mr = t.convertRowIndexToModel(row);
      int mc = t.convertColumnIndexToModel(col);
      HypothesisRow h = model.row(mr);
      Object shown = value;
      if (value instanceof Double d) {
        shown = model.getColumnName(mc).equals("posterior") ? String.format(Locale.ROOT, "%.3f", d)
            : String.format(Locale.ROOT, Math.abs(d) >= 100 ? "%.1f" : "%.2f", d);
      }
      if (value == null) shown = "–";
      super.getTableCellRendererComponent(t, shown, selected, focus, row, col);
      setHorizontalAlignment(value instanceof Number ? SwingConstants.RIGHT : SwingConstants.LEFT);
      setFont(getFont().deriveFont(h.chosen() ? Font.BOLD : Font.PLAIN));
      if (!selected) setBackground(h.chosen() ? Theme.CHOSEN_FILL : t.getBackground());
      int f = model.fixed();
      if (mc >= f && mc < f + model.terms.size()) {
        int term = mc - f;
        setToolTipText(String.format(Locale.ROOT, "%s: unweighted %.4f, weighted %.4f", model.terms.get(term), h.raw()[term], h.weighted()[term]));
      } else {
        setToolTipText(mc == f - 1 ? h.text() : null);
      }
      return this;
    }
  }
}
