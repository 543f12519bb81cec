package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.FlowLayout;
import java.awt.Font;
import java.nio.file.Path;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JFileChooser;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.filechooser.FileNameExtensionFilter;
import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import steelyard.io.AtomicOutput;
import steelyard.report.charts.ChartExport;

/**
 * One chart of the window with a title and buttons that export it as PNG or SVG ({@link ChartExport}) at a
 * fixed size, so exported files do not depend on the window's size. EDT only.
 */
final class ChartBox extends JPanel {
  private static final long serialVersionUID = 1L;
  /** Size of exported charts in pixels. */
  static final int EXPORT_WIDTH = 1000;
  static final int EXPORT_HEIGHT = 600;
  private final ChartPanel panel = new ChartPanel(null, false, false, false, false, true);
  private final JLabel title;
  private final JLabel note = new JLabel(" ");
  private final String stem;

  ChartBox(String name, String titleText, String stem) {
    super(new BorderLayout());
    this.stem = stem;
    setName(name);
    setBorder(BorderFactory.createCompoundBorder(BorderFactory.createMatteBorder(0, 0, 1, 1, Theme.IGNORED),
        BorderFactory.createEmptyBorder(6, 8, 4, 8)));
    title = new JLabel(titleText);
    title.setFont(title.getFont().deriveFont(Font.BOLD, 13f));
    JButton png = new JButton("PNG…");
    JButton svg = new JButton("SVG…");
    png.setName(name + ".png");
    svg.setName(name + ".svg");
    png.setToolTipText("Save this chart as a PNG image (" + EXPORT_WIDTH + " × " + EXPORT_HEIGHT + ").");
    svg.setToolTipText("Save this chart as an SVG drawing.");
    png.addActionListener(e -> exportWithChooser("png"));
    svg.addActionListener(e -> exportWithChooser("svg"));
    JPanel buttons = new JPanel(new FlowLayout(FlowLayout.RIGHT, 4, 0));
    buttons.setOpaque(false);
    buttons.add(png);
    buttons.add(svg);
    JPanel top = new JPanel(new BorderLayout());
    top.setOpaque(false);
    top.add(title, BorderLayout.WEST);
    top.add(buttons, BorderLayout.EAST);
    add(top, BorderLayout.NORTH);
    panel.setMinimumDrawWidth(0);
    panel.setMinimumDrawHeight(0);
    panel.setMaximumDrawWidth(4000);
    panel.setMaximumDrawHeight(3000);
    panel.setName(name + ".chart");
    add(panel, BorderLayout.CENTER);
    note.setForeground(Theme.MUTED);
    note.setFont(note.getFont().deriveFont(11f));
    add(note, BorderLayout.SOUTH);
  }

  void chart(JFreeChart chart, String noteText) {
    panel.setChart(chart);
    note.setText(noteText == null || noteText.isEmpty() ? " " : noteText);
  }

  /** File name stem of exports, e.g. {@code error-surface}. */
  String stem() {
    return stem;
  }

  JFreeChart chart() {
    return panel.getChart();
  }

  /** Writes the chart to {@code target} as {@code format} ("png" or "svg"). */
  void export(String format, Path target) {
    JFreeChart c = panel.getChart();
    if (c == null) return;
    if ("png".equals(format)) {
      ChartExport.png(c, EXPORT_WIDTH, EXPORT_HEIGHT, target);
    } else {
      String svg = ChartExport.svg(c, EXPORT_WIDTH, EXPORT_HEIGHT);
      AtomicOutput.writeText(target, w -> w.write(svg + "\n"));
    }
  }

  void exportWithChooser(String format) {
    if (panel.getChart() == null) return;
    JFileChooser chooser = new JFileChooser();
    chooser.setFileFilter(new FileNameExtensionFilter(format.toUpperCase(java.util.Locale.ROOT) + " files", format));
    chooser.setSelectedFile(new java.io.File(stem + "." + format));
    if (chooser.showSaveDialog(this) != JFileChooser.APPROVE_OPTION) return;
    Path target = chooser.getSelectedFile().toPath();
    if (!target.getFileName().toString().toLowerCase(java.util.Locale.ROOT).endsWith("." + format)) {
      target = target.resolveSibling(target.getFileName() + "." + format);
    }
    try {
      export(format, target);
    } catch (RuntimeException e) {
      ErrorDialogs.show(this, "Cannot save the chart", e);
    }
  }
}
