package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Component;
import java.awt.event.KeyEvent;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.function.IntConsumer;
import javax.swing.BorderFactory;
import javax.swing.Box;
import javax.swing.BoxLayout;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JTable;
import javax.swing.JTextField;
import javax.swing.ListSelectionModel;
import javax.swing.SwingConstants;
import javax.swing.event.DocumentEvent;
import javax.swing.event.DocumentListener;
import javax.swing.table.AbstractTableModel;
import javax.swing.table.DefaultTableCellRenderer;
import javax.swing.table.TableRowSorter;
import steelyard.gui.model.Choices;
import steelyard.gui.model.Corpus;
import steelyard.gui.model.UtteranceFilter;
import steelyard.gui.model.UtteranceRow;

/**
 * The utterance list: a filter (all, changed, helped, hurt, still wrong, new transcript), a search field (id
 * or text) and a sortable table of every utterance with its group, the errors of rank 1 and of the pick and
 * their difference. Selecting a row opens the utterance. EDT only.
 */
public final class UtteranceListPanel extends JPanel {
  private static final long serialVersionUID = 1L;
  private final JComboBox<UtteranceFilter> filter = new JComboBox<>(UtteranceFilter.values());
  private final JTextField search = new JTextField(14);
  private final Model model = new Model();
  private final JTable table = new JTable(model);
  private final JLabel count = new JLabel(" ");
  private Corpus corpus;
  private Choices choices;
  private IntConsumer onSelect = u -> {};
  private boolean updating;

  public UtteranceListPanel() {
    super(new BorderLayout(0, 4));
    setBorder(BorderFactory.createEmptyBorder(6, 6, 6, 2));
    filter.setName("list.filter");
    filter.setToolTipText("Which utterances to list: all, those whose pick differs from rank 1, helped, hurt, still wrong, or new transcripts.");
    search.setName("list.search");
    search.setToolTipText("Search by utterance id or by words of the pick, rank 1 or the reference (Ctrl+F).");
    search.putClientProperty("JTextField.placeholderText", "Search id or text");
    search.putClientProperty("JTextField.showClearButton", true);
    JLabel filterLabel = new JLabel("Show");
    filterLabel.setDisplayedMnemonic(KeyEvent.VK_H);
    filterLabel.setLabelFor(filter);
    JPanel top = new JPanel();
    top.setLayout(new BoxLayout(top, BoxLayout.X_AXIS));
    top.add(filterLabel);
    top.add(Box.createHorizontalStrut(6));
    top.add(filter);
    top.add(Box.createHorizontalStrut(6));
    top.add(search);
    add(top, BorderLayout.NORTH);

    table.setName("list.table");
    table.setSelectionMode(ListSelectionModel.SINGLE_SELECTION);
    table.setAutoCreateRowSorter(false);
    table.setFillsViewportHeight(true);
    TableRowSorter<Model> sorter = new TableRowSorter<>(model);
    Comparator<Integer> ints = Comparator.nullsFirst(Comparator.naturalOrder());
    for (int c : new int[] {2, 3, 4}) sorter.setComparator(c, ints);
    table.setRowSorter(sorter);
    int[] widths = {86, 52, 56, 40, 32, 104};
    for (int c = 0; c < widths.length; c++) table.getColumnModel().getColumn(c).setPreferredWidth(widths[c]);
    table.setDefaultRenderer(Object.class, new Renderer());
    table.setDefaultRenderer(Integer.class, new Renderer());
    table.getSelectionModel().addListSelectionListener(e -> {
      if (!e.getValueIsAdjusting() && !updating) {
        int u = selected();
        if (u >= 0) onSelect.accept(u);
      }
    });
    add(new JScrollPane(table), BorderLayout.CENTER);
    count.setForeground(Theme.MUTED);
    add(count, BorderLayout.SOUTH);

    filter.addActionListener(e -> refilter());
    search.getDocument().addDocumentListener(new DocumentListener() {
      @Override public void insertUpdate(DocumentEvent e) { refilter(); }
      @Override public void removeUpdate(DocumentEvent e) { refilter(); }
      @Override public void changedUpdate(DocumentEvent e) { refilter(); }
    });
  }

  /** Called with the corpus index of the utterance the user selects. */
  public void onSelect(IntConsumer c) {
    onSelect = c;
  }

  /** Shows {@code choices}; the selected utterance stays selected when it still passes the filter. */
  public void show(Corpus corpus, Choices choices) {
    this.corpus = corpus;
    this.choices = choices;
    refilter();
  }

  /** Selects utterance {@code u} (clearing the filter and search when it is hidden) and scrolls to it. */
  public void select(int u) {
    if (rowOf(u) < 0) {
      updating = true;
      filter.setSelectedItem(UtteranceFilter.ALL);
      search.setText("");
      updating = false;
      refilter();
    }
    int row = rowOf(u);
    if (row < 0) return;
    int view = table.convertRowIndexToView(row);
    table.getSelectionModel().setSelectionInterval(view, view);
    table.scrollRectToVisible(table.getCellRect(view, 0, true));
  }

  /** The corpus index of the selected utterance, or −1. */
  public int selected() {
    int v = table.getSelectedRow();
    return v < 0 ? -1 : model.rows.get(table.convertRowIndexToModel(v)).index();
  }

  /** Moves the keyboard focus to the search field. */
  public void focusSearch() {
    search.requestFocusInWindow();
    search.selectAll();
  }

  public UtteranceFilter filter() {
    return (UtteranceFilter) filter.getSelectedItem();
  }

  public void filter(UtteranceFilter f) {
    filter.setSelectedItem(f);
  }

  public JTable table() {
    return table;
  }

  private void refilter() {
    if (corpus == null || updating) return;
    int keep = selected();
    updating = true;
    try {
      model.rows = UtteranceRow.filtered(corpus, choices, filter(), search.getText());
      model.fireTableDataChanged();
      int row = keep < 0 ? -1 : rowOf(keep);
      if (row >= 0) {
        int view = table.convertRowIndexToView(row);
        table.getSelectionModel().setSelectionInterval(view, view);
      }
    } finally {
      updating = false;
    }
    count.setText(model.rows.size() + " of " + corpus.size() + " utterances");
  }

  private int rowOf(int u) {
    List<UtteranceRow> rows = model.rows;
    for (int i = 0; i < rows.size(); i++) if (rows.get(i).index() == u) return i;
    return -1;
  }

  private static final class Model extends AbstractTableModel {
    private static final long serialVersionUID = 1L;
    private static final String[] COLUMNS = {"Utterance", "Group", "Rank 1", "Pick", "Δ", "Verdict"};
    List<UtteranceRow> rows = new ArrayList<>();

    @Override public int getRowCount() { return rows.size(); }
    @Override public int getColumnCount() { return COLUMNS.length; }
    @Override public String getColumnName(int c) { return COLUMNS[c]; }
    @Override public Class<?> getColumnClass(int c) { return c >= 2 && c <= 4 ? Integer.class : String.class; }

    @Override
    public Object getValueAt(int r, int c) {
      UtteranceRow row = rows.get(r);
      switch (c) {
        case 0: return row.uttId();
        case 1: return row.group();
        case 2: return row.firstErrors() < 0 ? null : row.firstErrors();
        case 3: return row.pickErrors() < 0 ? null : row.pickErrors();
        case 4: return row.difference();
        case 5: return row.verdict();
        default: throw new IndexOutOfBoundsException("column " + c);
      }
    }

    UtteranceRow row(int r) {
      return rows.get(r);
    }
  }

  private final class Renderer extends DefaultTableCellRenderer {
    private static final long serialVersionUID = 1L;

    @Override
    public Component getTableCellRendererComponent(JTable t, Object value, boolean selected, boolean focus, int row, int col) {
      UtteranceRow r = model.row(t.convertRowIndexToModel(row));
      Object shown = value;
      if (value instanceof Choices.Verdict v) shown = Theme.verdictText(v) + (r.newTranscript() ? " (new)" : "");
      if (col == 4 && value instanceof Integer d && d > 0) shown = "+" + d;
      if (value == null && col >= 2 && col <= 4) shown = "–";
      super.getTableCellRendererComponent(t, shown, selected, focus, row, col);
      setHorizontalAlignment(col >= 2 && col <= 4 ? SwingConstants.RIGHT : SwingConstants.LEFT);
      Color fg = col == 5 || col == 4 ? Theme.verdict(r.verdict()) : t.getForeground();
      if (!selected) setForeground(fg);
      setToolTipText(col == 5 || col == 0 ? "<html>pick: " + escape(r.pickText()) + "<br>rank 1: " + escape(r.firstText())
          + (r.referenceText() == null ? "" : "<br>reference: " + escape(r.referenceText())) + "</html>" : null);
      return this;
    }
  }

  static String escape(String s) {
    return s == null ? "" : s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;");
  }
}
