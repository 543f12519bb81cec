package steelyard.gui;

import java.nio.file.Path;
import javax.swing.JFileChooser;

/** File ▸ Export all charts: each chart of the Charts view as PNG and SVG into one folder. EDT only. */
final class ChartFolderExport {
  private ChartFolderExport() {}

  static void ask(SteelyardWindow w) {
    if (w.workspace() == null) return;
    w.views.setSelectedComponent(w.charts);
    JFileChooser chooser = new JFileChooser();
    chooser.setFileSelectionMode(JFileChooser.DIRECTORIES_ONLY);
    chooser.setDialogTitle("Folder for the charts");
    if (chooser.showSaveDialog(w) != JFileChooser.APPROVE_OPTION) return;
    try {
      int n = export(w.charts, chooser.getSelectedFile().toPath());
      w.status.flash("Saved " + n + " chart files to " + chooser.getSelectedFile());
    } catch (RuntimeException e) {
      ErrorDialogs.show(w, "Cannot save the charts", e);
    }
  }

  /** Writes every chart that is drawn as {@code <stem>.png} and {@code <stem>.svg}; returns the number of files. */
  static int export(ChartsView charts, Path folder) {
    int n = 0;
    for (ChartBox b : charts.boxes()) {
      if (b.chart() == null) continue;
      b.export("png", folder.resolve(b.stem() + ".png"));
      b.export("svg", folder.resolve(b.stem() + ".svg"));
      n += 2;
    }
    return n;
  }
}
