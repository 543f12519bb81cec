package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Component;
import java.awt.FlowLayout;
import java.awt.Frame;
import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.awt.event.KeyEvent;
import java.nio.file.Path;
import java.util.List;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JComponent;
import javax.swing.JDialog;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSpinner;
import javax.swing.JTable;
import javax.swing.JTextField;
import javax.swing.KeyStroke;
import javax.swing.SpinnerNumberModel;
import javax.swing.table.AbstractTableModel;
import javax.swing.table.DefaultTableCellRenderer;
import steelyard.gui.model.ImportPreview;
import steelyard.gui.model.OpenRequest;
import steelyard.io.FeatureSpec;
import steelyard.io.InputException;
import steelyard.rescore.RescoreMethod;
import steelyard.text.NormalisationOptions;
import steelyard.text.Unit;

/**
 * Choosing what to open: the hypotheses, references, model (a file, or a text to train one from), weights
 * and rules files, the feature columns with their conventions, unit and method. The first lines of the
 * hypotheses file are previewed; each bad row carries the import's own {@code file:line} message, checked
 * with the chosen features. EDT only.
 */
final class ImportDialog extends JDialog {
  private static final long serialVersionUID = 1L;
  static final int PREVIEW_LINES = 40;
  final JTextField hyps = new JTextField(36);
  final JTextField refs = new JTextField(36);
  final JTextField lm = new JTextField(36);
  final JCheckBox train = new JCheckBox("train from this text file, order");
  final JSpinner order = new JSpinner(new SpinnerNumberModel(3, 1, 6, 1));
  final JTextField weights = new JTextField(36);
  final JTextField rules = new JTextField(36);
  final JTextField features = new JTextField(36);
  final JComboBox<String> unit = new JComboBox<>(new String[] {"automatic", "word", "char"});
  final JComboBox<String> method = new JComboBox<>(new String[] {"N-best", "MBR", "consensus", "network search"});
  final JSpinner badRows = new JSpinner(new SpinnerNumberModel(0, 0, 1_000_000, 1));
  private final PreviewModel preview = new PreviewModel();
  private final JLabel fatal = new JLabel(" ");
  private final Tasks tasks;
  private OpenRequest result;

  ImportDialog(Frame owner, Tasks tasks, OpenRequest start) {
    super(owner, "Open hypotheses", true);
    this.tasks = tasks;
    setName("import");
    JPanel form = new JPanel(new GridBagLayout());
    form.setBorder(BorderFactory.createEmptyBorder(10, 12, 6, 12));
    int row = 0;
    row = fileRow(form, row, "Hypotheses", KeyEvent.VK_Y, hyps, "The hypotheses CSV (utt_id, text and score columns; .gz accepted).");
    row = fileRow(form, row, "References", KeyEvent.VK_R, refs, "The references CSV (utt_id, text); optional, needed for error rates.");
    row = fileRow(form, row, "Model", KeyEvent.VK_M, lm, "An n-gram model (.arpa, .arpa.gz or .bin), or a text file to train one from.");
    JPanel trainRow = new JPanel(new FlowLayout(FlowLayout.LEFT, 4, 0));
    train.setMnemonic(KeyEvent.VK_T);
    train.setToolTipText("Train a modified Kneser-Ney model on the Model text file in the background instead of loading one.");
    trainRow.add(train);
    trainRow.add(order);
    place(form, row++, null, trainRow);
    row = fileRow(form, row, "Weights", KeyEvent.VK_W, weights, "A weights file (JSON) to start from; optional.");
    row = fileRow(form, row, "Rules", KeyEvent.VK_U, rules, "A normalisation rules file (equivalences, optional tokens); optional.");
    features.setToolTipText("Score columns, comma-separated NAME[:ln|log10|cost|linear][:scale=S]; empty: those of the weights file.");
    row = labelled(form, row, "Features", KeyEvent.VK_F, features);
    JPanel options = new JPanel(new FlowLayout(FlowLayout.LEFT, 6, 0));
    options.add(mnemonicLabel("Unit", KeyEvent.VK_N, unit));
    options.add(unit);
    options.add(mnemonicLabel("Method", KeyEvent.VK_D, method));
    options.add(method);
    options.add(mnemonicLabel("Skip up to", KeyEvent.VK_K, badRows));
    options.add(badRows);
    options.add(new JLabel("bad rows"));
    place(form, row++, null, options);

    JTable table = new JTable(preview);
    table.setName("import.preview");
    table.getColumnModel().getColumn(0).setPreferredWidth(50);
    table.getColumnModel().getColumn(1).setPreferredWidth(420);
    table.getColumnModel().getColumn(2).setPreferredWidth(420);
    table.setDefaultRenderer(Object.class, new ProblemRenderer());
    JPanel center = new JPanel(new BorderLayout(0, 4));
    center.setBorder(BorderFactory.createEmptyBorder(0, 12, 0, 12));
    JLabel previewLabel = new JLabel("First lines of the hypotheses file, checked as the import checks them:");
    center.add(previewLabel, BorderLayout.NORTH);
    center.add(new JScrollPane(table), BorderLayout.CENTER);
    fatal.setName("import.fatal");
    fatal.setForeground(steelyard.report.charts.Palette.BRICK);
    center.add(fatal, BorderLayout.SOUTH);

    JButton check = new JButton("Check preview");
    check.setMnemonic(KeyEvent.VK_C);
    check.addActionListener(e -> refreshPreview());
    JButton open = new JButton("Open");
    open.setName("import.open");
    open.setMnemonic(KeyEvent.VK_O);
    open.addActionListener(e -> accept());
    JButton cancel = new JButton("Cancel");
    cancel.addActionListener(e -> dispose());
    JPanel buttons = new JPanel(new FlowLayout(FlowLayout.RIGHT));
    buttons.add(check);
    buttons.add(open);
    buttons.add(cancel);
    getRootPane().setDefaultButton(open);
    getRootPane().registerKeyboardAction(e -> dispose(), KeyStroke.getKeyStroke(KeyEvent.VK_ESCAPE, 0), JComponent.WHEN_IN_FOCUSED_WINDOW);

    add(form, BorderLayout.NORTH);
    add(center, BorderLayout.CENTER);
    add(buttons, BorderLayout.SOUTH);
    fill(start);
    hyps.addActionListener(e -> refreshPreview());
    features.addActionListener(e -> refreshPreview());
    setSize(980, 720);
    setLocationRelativeTo(owner);
    refreshPreview();
  }

  /** Shows the dialog and returns the request, or null when cancelled. */
  OpenRequest ask() {
    setVisible(true);
    return result;
  }

  /** The request the fields describe; an {@link InputException} names a bad field. */
  OpenRequest request() {
    Path h = path(hyps);
    if (h == null) throw InputException.option("Hypotheses", "no file chosen", "a hypotheses CSV file");
    Path model = path(lm);
    boolean trainIt = train.isSelected() && model != null;
    String u = (String) unit.getSelectedItem();
    Unit un = "word".equals(u) ? Unit.WORD : "char".equals(u) ? Unit.CHAR : null;
    return new OpenRequest(h, path(refs), trainIt ? null : model, trainIt ? model : null, (Integer) order.getValue(), path(weights),
        null, FeatureSpec.parseList(features.getText()), null, un, new NormalisationOptions(false, false, false, false, path(rules)),
        RescoreMethod.values()[method.getSelectedIndex()], (Integer) badRows.getValue(), steelyard.lm.BackoffModel.DEFAULT_UNKNOWN_FLOOR_LOG10);
  }

  /** The preview rows shown (for tests). */
  ImportPreview preview() {
    return preview.data;
  }

  void refreshPreview() {
    Path h = path(hyps);
    if (h == null) return;
    List<FeatureSpec> specs;
    try {
      specs = FeatureSpec.parseList(features.getText());
    } catch (InputException e) {
      fatal.setText(html(e.getMessage()));
      return;
    }
    tasks.submit("preview", "Checking " + h.getFileName(), p -> ImportPreview.of(h, specs, PREVIEW_LINES), (o, v, e) -> {
      if (o == Tasks.Outcome.COMPLETE) {
        preview.show(v);
        fatal.setText(v.fatal() != null ? html(v.fatal()) : v.hasProblems() ? html("Rows marked in red would stop the import (or be "
            + "skipped, up to the number allowed). First: " + v.lines().stream().filter(l -> l.problem() != null).findFirst().orElseThrow().problem())
            : " ");
        if (features.getText().isBlank() && path(weights) == null && !v.scoreColumns().isEmpty()) {
          features.setText(String.join(",", v.scoreColumns()));
        }
      } else if (o == Tasks.Outcome.FAILED) {
        fatal.setText(html(ErrorDialogs.message(e)));
      }
    });
  }

  private static String html(String s) {
    return "<html>" + UtteranceListPanel.escape(s) + "</html>";
  }

  private void accept() {
    try {
      result = request();
      dispose();
    } catch (InputException e) {
      ErrorDialogs.show(this, "Cannot open", e);
    }
  }

  private void fill(OpenRequest r) {
    if (r == null) return;
    hyps.setText(s(r.hyps()));
    refs.setText(s(r.refs()));
    lm.setText(s(r.lm() != null ? r.lm() : r.lmText()));
    train.setSelected(r.lmText() != null);
    order.setValue(r.trainOrder());
    weights.setText(s(r.weights()));
    rules.setText(s(r.normalisation().rulesFile()));
    features.setText(String.join(",", r.features().stream().map(FeatureSpec::toString).map(x -> x.replace(":ln", "")).toList()));
    unit.setSelectedIndex(r.unit() == null ? 0 : r.unit() == Unit.WORD ? 1 : 2);
    method.setSelectedIndex(r.methodOrDefault().ordinal());
    badRows.setValue(r.maxBadRows());
  }

  private int fileRow(JPanel form, int row, String text, int mnemonic, JTextField field, String tip) {
    field.setToolTipText(tip);
    JButton browse = new JButton("…");
    browse.setToolTipText("Choose the " + text.toLowerCase(java.util.Locale.ROOT) + " file");
    browse.addActionListener(e -> {
      JFileChooser c = new JFileChooser(field.getText().isBlank() ? null : Path.of(field.getText()).toAbsolutePath().getParent().toFile());
      if (c.showOpenDialog(this) == JFileChooser.APPROVE_OPTION) {
        field.setText(c.getSelectedFile().getPath());
        if (field == hyps) refreshPreview();
      }
    });
    JPanel p = new JPanel(new BorderLayout(4, 0));
    p.add(field, BorderLayout.CENTER);
    p.add(browse, BorderLayout.EAST);
    return labelled(form, row, text, mnemonic, field, p);
  }

  private int labelled(JPanel form, int row, String text, int mnemonic, JComponent field) {
    return labelled(form, row, text, mnemonic, field, field);
  }

  /** A row: the label (naming {@code field} and focusing it by mnemonic), then {@code shown} (the field, or a panel with it). */
  private int labelled(JPanel form, int row, String text, int mnemonic, JComponent field, JComponent shown) {
    field.setName("import." + text.toLowerCase(java.util.Locale.ROOT));
    GridBagConstraints c = new GridBagConstraints();
    c.gridy = row;
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(2, 0, 2, 8);
    form.add(mnemonicLabel(text, mnemonic, field), c);
    place(form, row, null, shown);
    return row + 1;
  }

  private static void place(JPanel form, int row, Object unused, JComponent comp) {
    GridBagConstraints c = new GridBagConstraints();
    c.gridy = row;
    c.gridx = 1;
    c.weightx = 1;
    c.fill = GridBagConstraints.HORIZONTAL;
    c.insets = new Insets(2, 0, 2, 0);
    form.add(comp, c);
  }

  private static JLabel mnemonicLabel(String text, int mnemonic, Component target) {
    JLabel l = new JLabel(text);
    l.setDisplayedMnemonic(mnemonic);
    l.setLabelFor(target);
    return l;
  }

  private static Path path(JTextField f) {
    String t = f.getText().strip();
    return t.isEmpty() ? null : Path.of(t);
  }

  private static String s(Path p) {
    return p == null ? "" : p.toString();
  }

  private static final class PreviewModel extends AbstractTableModel {
    private static final long serialVersionUID = 1L;
    ImportPreview data = new ImportPreview(List.of(), List.of(), List.of(), null, List.of());

    void show(ImportPreview p) {
      data = p;
      fireTableDataChanged();
    }

    @Override public int getRowCount() { return data.lines().size(); }
    @Override public int getColumnCount() { return 3; }
    @Override public String getColumnName(int c) { return new String[] {"line", "text", "problem"}[c]; }

    @Override
    public Object getValueAt(int r, int c) {
      ImportPreview.Line l = data.lines().get(r);
      return c == 0 ? Long.toString(l.number()) : c == 1 ? l.text() : l.problem() == null ? "" : l.problem();
    }

    boolean bad(int r) {
      return data.lines().get(r).problem() != null;
    }
  }

  private final class ProblemRenderer extends DefaultTableCellRenderer {
    private static final long serialVersionUID = 1L;

    @Override
    public Component getTableCellRendererComponent(JTable t, Object v, boolean sel, boolean focus, int row, int col) {
      super.getTableCellRendererComponent(t, v, sel, focus, row, col);
      boolean bad = preview.bad(t.convertRowIndexToModel(row));
      if (!sel) setBackground(bad ? Theme.DELETION : t.getBackground());
      setForeground(bad && col == 2 ? new Color(0x7A, 0x1E, 0x10) : t.getForeground());
      setToolTipText(bad ? (String) preview.getValueAt(t.convertRowIndexToModel(row), 2) : null);
      if (col == 0 && bad) setText(v + " ✗");
      return this;
    }
  }
}
