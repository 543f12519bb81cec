package steelyard.gui;

import java.awt.Component;
import java.awt.Container;
import java.awt.Graphics2D;
import java.awt.Window;
import java.awt.image.BufferedImage;
import java.io.Writer;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Properties;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BooleanSupplier;
import java.util.prefs.Preferences;
import javax.imageio.ImageIO;
import javax.swing.JDialog;
import javax.swing.JLabel;
import javax.swing.JMenu;
import javax.swing.JMenuItem;
import javax.swing.JTextArea;
import javax.swing.SwingUtilities;
import steelyard.gui.model.HypothesisRow;
import steelyard.gui.model.OpenRequest;
import steelyard.io.FeatureSpec;
import steelyard.rescore.RescoreMethod;
import steelyard.text.NormalisationOptions;

/**
 * The real-window scenario, run in a child JVM on an X display by {@link WindowTest}: starts the window on
 * the demo data, selects an utterance, moves the λ slider, opens a broken file, and writes what the window
 * shows (labels, the chosen hypothesis, the error dialog's message, EDT violations, timings) to a properties
 * file, plus a screenshot of each view. The parent compares the values with the command line.
 *
 * <p>Arguments: {@code ROOT UTT_ID LAMBDA SCREENSHOT_DIR RESULTS_FILE BAD_FILE PREFS_NODE}.
 */
public final class WindowScenario {
  private static final long WAIT_MS = 90_000;
  /** The posterior sharpness α of the consensus step (spreads the posteriors, so the network shows competition). */
  static final double CONSENSUS_ALPHA = 0.05;
  private final Properties out = new Properties();
  private final Path shots;
  private SteelyardWindow window;

  private WindowScenario(Path shots) {
    this.shots = shots;
  }

  public static void main(String[] args) throws Exception {
    WindowScenario s = new WindowScenario(Path.of(args[3]));
    int code = 0;
    try {
      s.run(Path.of(args[0]), args[1], Double.parseDouble(args[2]), Path.of(args[5]), args[6]);
    } catch (Throwable t) {
      s.out.setProperty("failure", t.toString());
      t.printStackTrace();
      code = 3;
    }
    try (Writer w = Files.newBufferedWriter(Path.of(args[4]))) {
      s.out.store(w, "window scenario");
    }
    System.exit(code);
  }

  private void run(Path root, String uttId, double lambda, Path badFile, String prefsNode) throws Exception {
    EdtCheck check = EdtCheck.install();
    selfCheck(check);
    Preferences node = Preferences.userRoot().node(prefsNode);
    long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
    window = onEdt(() -> SteelyardWindow.start(OpenRequest.demo(root), new WindowPrefs(node)));
    waitUntil("the demo is shown", () -> window.choices() != null && window.openUtterance() >= 0 && !window.tasks.busy());
    long shown = System.currentTimeMillis();
    long paint = shown - (System.nanoTime() - onEdt(window::firstPaintNanos)) / 1_000_000;
    out.setProperty("ms.firstPaint", Long.toString(paint - jvmStart));
    out.setProperty("ms.demoShown", Long.toString(shown - jvmStart));

    int u = onEdt(() -> indexOf(uttId));
    onEdt(() -> { window.list.select(u); return null; });
    waitUntil("the utterance opens", () -> window.openUtterance() == u);
    record("before");
    onEdt(() -> {
      var slider = window.weights.lambda.slider;
      slider.setValueIsAdjusting(true);
      slider.setValue(window.weights.lambda.toSlider(lambda));
      slider.setValueIsAdjusting(false);
      return null;
    });
    waitUntil("the choice follows λ", () -> !window.tasks.busy());
    record("after");
    out.setProperty("after.lambda", Double.toString(onEdt(() -> window.settings().lmWeight())));
    shot("utterance", window);
    onEdt(() -> { window.views.setSelectedIndex(1); return null; });
    waitUntil("the charts are drawn", () -> !window.tasks.busy() && window.charts.boxes().stream().allMatch(b -> b.chart() != null));
    shot("charts", window);
    onEdt(() -> {
      window.views.setSelectedIndex(0);
      window.detail.lower.setSelectedIndex(1);
      window.weights.method(RescoreMethod.CONSENSUS);
      window.weights.alpha.field.setValue(CONSENSUS_ALPHA);
      return null;
    });
    waitUntil("the consensus choice is shown", () -> !window.tasks.busy() && window.choices().method() == RescoreMethod.CONSENSUS
        && window.choices().weights().posteriorScale() == CONSENSUS_ALPHA);
    record("consensus");
    shot("network", window);
    onEdt(() -> { window.detail.lower.setSelectedIndex(0); return null; });
    tune(badFile.resolveSibling("tuned.weights.json"));
    audit();
    report(badFile.resolveSibling("window-report.html"));
    menus();
    importDialog(badFile);
    failedOpen(badFile);
    out.setProperty("edt.violations", Integer.toString(check.violations().size()));
    if (!check.violations().isEmpty()) out.setProperty("edt.first", check.violations().get(0));
    onEdt(() -> { window.close(); return null; });
    out.setProperty("prefs.recent", new WindowPrefs(node).recent().isEmpty() ? "" : new WindowPrefs(node).recent().get(0).hyps().toString());
    out.setProperty("prefs.hasBounds", Boolean.toString(new WindowPrefs(node).bounds() != null));
    node.removeNode();
  }

  /** The check is not vacuous: a label changed off the EDT is recorded. */
  private void selfCheck(EdtCheck check) throws Exception {
    javax.swing.JFrame frame = onEdt(() -> {
      javax.swing.JFrame f = new javax.swing.JFrame("self-check");
      f.add(new JLabel("before"));
      f.pack();
      f.setVisible(true);
      return f;
    });
    JLabel label = (JLabel) onEdt(() -> frame.getContentPane().getComponent(0));
    Thread t = new Thread(() -> label.setText("changed off the EDT"), "scenario-self-check");
    t.start();
    t.join();
    out.setProperty("edt.selfCheck", Integer.toString(check.violations().size()));
    onEdt(() -> { frame.dispose(); return null; });
    check.clear();
  }

  private int indexOf(String id) {
    for (int k = 0; k < window.workspace().corpus().size(); k++) if (window.workspace().corpus().uttId(k).equals(id)) return k;
    throw new IllegalArgumentException("no utterance " + id);
  }

  private void record(String prefix) throws Exception {
    onEdt(() -> {
      out.setProperty(prefix + ".error", window.band.errorText());
      out.setProperty(prefix + ".counts", ((JLabel) find(window, "figures.counts")).getText());
      HypothesisRow chosen = window.detail.table().rows().stream().filter(HypothesisRow::chosen).findFirst().orElse(null);
      out.setProperty(prefix + ".pick.rank", chosen == null ? "" : Integer.toString(chosen.rank()));
      out.setProperty(prefix + ".pick.text", chosen == null ? "" : chosen.text());
      out.setProperty(prefix + ".pick.label", window.detail.pickText());
      out.setProperty(prefix + ".alignment", window.detail.pickStrip().asText());
      return null;
    });
  }

  /** Tunes N-best without folds, closes the result dialog, records the band and saves the weights in effect. */
  private void tune(Path saved) throws Exception {
    onEdt(() -> {
      window.weights.method(RescoreMethod.NBEST);
      TuneAction.start(window, java.util.EnumSet.of(RescoreMethod.NBEST), 0);
      return null;
    });
    waitUntil("the tuner's result shows", () -> dialogTitled("Tuned") != null);
    JDialog d = onEdt(() -> dialogTitled("Tuned"));
    shot("tune", d);
    onEdt(() -> { d.dispose(); return null; });
    waitUntil("the tuned choice is shown", () -> !window.tasks.busy());
    record("tuned");
    out.setProperty("tuned.lambda", Double.toString(onEdt(() -> window.settings().lmWeight())));
    onEdt(() -> { window.saveWeights(saved); return null; });
    out.setProperty("tuned.weights", saved.toString());
  }

  /** Shows the overrule audit of the tuned choice, records its counts, opens its first overrule's utterance. */
  private void audit() throws Exception {
    onEdt(() -> { window.views.setSelectedIndex(2); return null; });
    waitUntil("the audit is shown", () -> !window.tasks.busy() && !window.audit.rows().isEmpty());
    onEdt(() -> {
      var rows = window.audit.rows();
      long helped = rows.stream().filter(r -> r.verdict() == steelyard.audit.Verdict.HELPED).count();
      long hurt = rows.stream().filter(r -> r.verdict() == steelyard.audit.Verdict.HURT).count();
      out.setProperty("audit.counts", "changed " + rows.size() + "   ▲ helped " + helped + "   ▼ hurt " + hurt);
      out.setProperty("audit.first", rows.get(0).uttId());
      window.audit.table().getSelectionModel().setSelectionInterval(0, 0);
      return null;
    });
    shot("audit", window);
    onEdt(() -> { window.openById(window.audit.rows().get(0).uttId()); return null; });
    out.setProperty("audit.opened", onEdt(() -> window.workspace().corpus().uttId(window.openUtterance())));
  }

  private void report(Path target) throws Exception {
    onEdt(() -> { ReportExport.export(window, target); return null; });
    waitUntil("the report is written", () -> !window.tasks.busy() && Files.exists(target));
    out.setProperty("report.file", target.toString());
  }

  private static JDialog dialogTitled(String title) {
    for (Window w : Window.getWindows()) if (w instanceof JDialog d && d.isShowing() && title.equals(d.getTitle())) return d;
    return null;
  }

  private void menus() throws Exception {
    onEdt(() -> {
      List<String> missing = new ArrayList<>();
      var bar = window.getJMenuBar();
      for (int m = 0; m < bar.getMenuCount(); m++) {
        JMenu menu = bar.getMenu(m);
        if (menu.getMnemonic() == 0) missing.add(menu.getText());
        for (Component c : menu.getMenuComponents()) {
          if (c instanceof JMenuItem item && item.getMnemonic() == 0) missing.add(menu.getText() + " ▸ " + item.getText());
        }
      }
      out.setProperty("menus.withoutMnemonic", String.join("; ", missing));
      return null;
    });
  }

  private void importDialog(Path badFile) throws Exception {
    OpenRequest bad = OpenRequest.of(badFile, null, null, null, FeatureSpec.parseList("acoustic,lm"), null, NormalisationOptions.EXACT,
        RescoreMethod.NBEST);
    AtomicReference<ImportDialog> dialog = new AtomicReference<>();
    SwingUtilities.invokeLater(() -> {
      ImportDialog d = new ImportDialog(window, window.tasks, bad);
      dialog.set(d);
      d.ask();
    });
    waitUntil("the preview is checked", () -> dialog.get() != null && dialog.get().isShowing() && !window.tasks.busy()
        && !dialog.get().preview().lines().isEmpty());
    onEdt(() -> {
      var lines = dialog.get().preview().lines();
      List<String> problems = new ArrayList<>();
      for (var l : lines) if (l.problem() != null) problems.add(l.problem());
      out.setProperty("import.problems", String.join("\n", problems));
      return null;
    });
    shot("import", dialog.get());
    onEdt(() -> { dialog.get().dispose(); return null; });
  }

  private void failedOpen(Path badFile) throws Exception {
    Object before = onEdt(window::workspace);
    String errorBefore = onEdt(window.band::errorText);
    onEdt(() -> {
      window.open(OpenRequest.of(badFile, null, null, null, FeatureSpec.parseList("acoustic,lm"), null, NormalisationOptions.EXACT,
          RescoreMethod.NBEST));
      return null;
    });
    waitUntil("the error dialog shows", () -> errorDialog() != null);
    JDialog d = onEdt(this::errorDialog);
    onEdt(() -> {
      out.setProperty("error.message", ((JTextArea) find(d, "error.message")).getText());
      return null;
    });
    shot("error", d);
    onEdt(() -> { d.dispose(); return null; });
    waitUntil("the open task ends", () -> !window.tasks.busy());
    out.setProperty("error.keptData", Boolean.toString(onEdt(window::workspace) == before && onEdt(window.band::errorText).equals(errorBefore)));
  }

  private JDialog errorDialog() {
    for (Window w : Window.getWindows()) {
      if (w instanceof JDialog d && d.isShowing() && find(d, "error.message") != null) return d;
    }
    return null;
  }

  private static Component find(Container c, String name) {
    for (Component k : c.getComponents()) {
      if (name.equals(k.getName())) return k;
      if (k instanceof Container sub) {
        Component f = find(sub, name);
        if (f != null) return f;
      }
    }
    return null;
  }

  /** Paints {@code w} into target/screenshots/NAME.png (after pending layout and paints settle). */
  private void shot(String name, Window w) throws Exception {
    Thread.sleep(150);
    BufferedImage img = onEdt(() -> {
      w.validate();
      BufferedImage i = new BufferedImage(Math.max(1, w.getWidth()), Math.max(1, w.getHeight()), BufferedImage.TYPE_INT_RGB);
      Graphics2D g = i.createGraphics();
      w.paintAll(g);
      g.dispose();
      return i;
    });
    Files.createDirectories(shots);
    ImageIO.write(img, "png", shots.resolve(name + ".png").toFile());
    out.setProperty("shot." + name, shots.resolve(name + ".png").toString());
  }

  private static <T> T onEdt(Callable<T> c) throws Exception {
    AtomicReference<T> v = new AtomicReference<>();
    AtomicReference<Exception> e = new AtomicReference<>();
    SwingUtilities.invokeAndWait(() -> {
      try {
        v.set(c.call());
      } catch (Exception x) {
        e.set(x);
      }
    });
    if (e.get() != null) throw e.get();
    return v.get();
  }

  private static void waitUntil(String what, BooleanSupplier onEdt) throws Exception {
    long deadline = System.currentTimeMillis() + WAIT_MS;
    while (System.currentTimeMillis() < deadline) {
      if (onEdt(onEdt::getAsBoolean)) return;
      Thread.sleep(25);
    }
    throw new IllegalStateException("timed out waiting until " + what);
  }

}
