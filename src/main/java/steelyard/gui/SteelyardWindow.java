package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.Graphics;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.nio.file.Path;
import javax.swing.JFileChooser;
import javax.swing.JFrame;
import javax.swing.JPanel;
import javax.swing.JSplitPane;
import javax.swing.JTabbedPane;
import javax.swing.WindowConstants;
import javax.swing.filechooser.FileNameExtensionFilter;
import steelyard.gui.model.Choices;
import steelyard.gui.model.OpenRequest;
import steelyard.gui.model.WeightSettings;
import steelyard.gui.model.Workspace;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;
import steelyard.rescore.UtteranceResult;

/**
 * The Steelyard window: the corpus figures across the top, the utterance list on the left, the open
 * utterance and the charts in the middle, the weights on the right, the running task at the bottom. It
 * holds the open {@link Workspace}, the weight settings and the current {@link Choices}; every change of
 * weights re-chooses (live for N-best, in the background for the other methods) and refreshes every view.
 * A failed open shows the command line's message and keeps what was open.
 *
 * <p>Create and use on the Event Dispatch Thread only.
 */
public final class SteelyardWindow extends JFrame {
  private static final long serialVersionUID = 1L;
  final FiguresBand band = new FiguresBand();
  final UtteranceListPanel list = new UtteranceListPanel();
  final UtteranceView detail = new UtteranceView();
  final ChartsView charts = new ChartsView();
  final AuditView audit = new AuditView();
  final WeightsPanel weights = new WeightsPanel();
  final StatusBar status = new StatusBar();
  final JTabbedPane views = new JTabbedPane();
  final JSplitPane left;
  final JSplitPane right;
  final Tasks tasks = new Tasks(status);
  final WindowPrefs prefs;
  private final ChartRefresher chartRefresher;
  private final AuditRefresher auditRefresher;
  private final Menus menus;
  private Workspace workspace;
  private WeightSettings settings;
  /** The weights the sliders do not set (features, ω, system weights…): the file's, or the tuner's. */
  private RescoreWeights base;
  private Choices choices;
  private int open = -1;
  private long firstPaintNanos;

  public SteelyardWindow(WindowPrefs prefs) {
    super("Steelyard");
    this.prefs = prefs;
    setName("steelyard.window");
    setDefaultCloseOperation(WindowConstants.DO_NOTHING_ON_CLOSE);
    views.setName("views");
    views.addTab("Utterance", detail);
    views.addTab("Charts", charts);
    views.addTab("Overrules", audit);
    views.setMnemonicAt(0, 'U');
    views.setMnemonicAt(1, 'C');
    views.setMnemonicAt(2, 'O');
    right = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, views, weights);
    right.setResizeWeight(1);
    left = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, list, right);
    left.setResizeWeight(0);
    JPanel content = new JPanel(new BorderLayout()) {
      private static final long serialVersionUID = 1L;
      @Override public void paint(Graphics g) {
        super.paint(g);
        if (firstPaintNanos == 0) firstPaintNanos = System.nanoTime();
      }
    };
    content.add(band, BorderLayout.NORTH);
    content.add(left, BorderLayout.CENTER);
    content.add(status, BorderLayout.SOUTH);
    setContentPane(content);
    chartRefresher = new ChartRefresher(this);
    auditRefresher = new AuditRefresher(this);
    audit.onOpen(this::openById);
    menus = new Menus(this);
    setJMenuBar(menus.bar());
    list.onSelect(this::openUtterance);
    weights.listener(this::weightsChanged);
    weights.reset.addActionListener(e -> resetWeights());
    views.addChangeListener(e -> {
      chartRefresher.refreshIfVisible();
      auditRefresher.refreshIfVisible();
    });
    addWindowListener(new WindowAdapter() {
      @Override public void windowClosing(WindowEvent e) {
        close();
      }
    });
    restoreLayout();
  }

  /**
   * Installs the look, shows a new window remembering its layout in {@code prefs} and starts opening
   * {@code request} (null: nothing). Call on the EDT.
   */
  public static SteelyardWindow start(OpenRequest request, WindowPrefs prefs) {
    Theme.install();
    SteelyardWindow w = new SteelyardWindow(prefs);
    w.setVisible(true);
    if (prefs.layout("split.right", -1) < 0) {
      javax.swing.SwingUtilities.invokeLater(() -> w.right.setDividerLocation(w.right.getWidth() - WeightsPanel.WIDTH - w.right.getDividerSize()));
    }
    if (request != null) w.open(request);
    return w;
  }

  /** Opens the files of {@code request} in the background; the current data stays until they are read. */
  public void open(OpenRequest request) {
    tasks.submit("open", "Opening " + request.hyps().getFileName(), p -> Workspace.open(request, p), (o, ws, e) -> {
      if (o == Tasks.Outcome.COMPLETE) {
        install(ws);
        prefs.addRecent(request);
        menus.refreshRecent();
      } else if (o == Tasks.Outcome.FAILED) {
        ErrorDialogs.show(this, "Cannot open " + request.hyps().getFileName(), e);
      }
    });
  }

  /** Shows the import dialog and opens what it returns. */
  void openWithDialog() {
    OpenRequest start = workspace != null ? workspace.request() : prefs.recent().stream().findFirst().orElse(null);
    OpenRequest r = new ImportDialog(this, tasks, start).ask();
    if (r != null) open(r);
  }

  /** The open workspace, or null. */
  public Workspace workspace() { return workspace; }
  /** The current choices, or null. */
  public Choices choices() { return choices; }
  /** The weight settings in effect, or null. */
  public WeightSettings settings() { return settings; }
  /** The open utterance's corpus index, or −1. */
  public int openUtterance() { return open; }
  /** System.nanoTime() of the first paint, or 0. */
  public long firstPaintNanos() { return firstPaintNanos; }

  /** The full weights in effect. */
  RescoreWeights currentWeights() {
    return settings.apply(base);
  }

  void install(Workspace ws) {
    workspace = ws;
    base = ws.initialWeights();
    settings = WeightSettings.of(base, ws.request().methodOrDefault());
    weights.show(settings, base);
    setTitle("Steelyard — " + ws.request().hyps().getFileName());
    open = -1;
    choices = null;
    chartRefresher.invalidate();
    auditRefresher.invalidate();
    for (String w : ws.warnings()) status.flash("warning: " + w);
    rechoose(false);
  }

  void resetWeights() {
    if (workspace == null) return;
    base = workspace.initialWeights();
    settings = WeightSettings.of(base, settings.method());
    weights.show(settings, base);
    rechoose(false);
  }

  /** Moves every weight (and the method) to a tuning result and re-chooses. */
  void applyTuned(RescoreWeights tuned, RescoreMethod method) {
    if (workspace == null) return;
    base = tuned;
    settings = WeightSettings.of(tuned, method);
    weights.show(settings, base);
    rechoose(false);
  }

  private void weightsChanged(WeightSettings s, boolean adjusting) {
    if (workspace == null) return;
    settings = s;
    if (s.method() == RescoreMethod.NBEST || !adjusting) rechoose(adjusting);
    else status.flash("release to re-choose by " + FiguresBand.methodName(s.method()));
  }

  /**
   * Re-chooses under the current settings: at once for N-best, else as a background task. While a slider is
   * dragged ({@code adjusting}) the band and the open utterance follow every step; the list and the charts
   * follow when it is released.
   */
  void rechoose(boolean adjusting) {
    RescoreWeights w = currentWeights();
    RescoreMethod m = settings.method();
    if (m == RescoreMethod.NBEST) {
      show(workspace.rerank(w), adjusting);
      return;
    }
    Workspace ws = workspace;
    tasks.submit("choose", "Choosing by " + FiguresBand.methodName(m), p -> ws.choose(w, m, p), (o, c, e) -> {
      if (o == Tasks.Outcome.COMPLETE && ws == workspace && c.weights().equals(currentWeights())) show(c, false);
      else if (o == Tasks.Outcome.FAILED) ErrorDialogs.show(this, "Cannot choose", e);
    });
  }

  private void show(Choices c, boolean adjusting) {
    choices = c;
    band.show(c.figures(), c.method(), workspace.corpus().unit(),
        workspace.request().hyps().getFileName() + " · " + workspace.corpus().size() + " utterances");
    if (!adjusting || list.table().getRowCount() == 0) list.show(workspace.corpus(), c);
    if (open < 0 && workspace.corpus().size() > 0) list.select(0);
    else if (open >= 0) openUtterance(open);
    if (!adjusting) {
      chartRefresher.refreshIfVisible();
      auditRefresher.refreshIfVisible();
    }
  }

  /** Opens utterance {@code u} in the detail view. */
  void openUtterance(int u) {
    if (workspace == null || choices == null || u < 0) return;
    open = u;
    RescoreWeights w = choices.weights();
    UtteranceResult r = workspace.explain(u, w, choices.method());
    detail.show(workspace, u, r, w, choices);
  }

  /** Opens the utterance with id {@code id} in the Utterance view. */
  void openById(String id) {
    if (workspace == null) return;
    for (int u = 0; u < workspace.corpus().size(); u++) {
      if (workspace.corpus().uttId(u).equals(id)) {
        views.setSelectedIndex(0);
        list.select(u);
        return;
      }
    }
  }

  void saveWeights() {
    if (workspace == null) return;
    JFileChooser chooser = new JFileChooser();
    chooser.setFileFilter(new FileNameExtensionFilter("Weights files (JSON)", "json"));
    chooser.setSelectedFile(new java.io.File("weights.json"));
    if (chooser.showSaveDialog(this) != JFileChooser.APPROVE_OPTION) return;
    saveWeights(chooser.getSelectedFile().toPath());
  }

  /** Writes the weights in effect to {@code target}; a failure is shown in a dialog. */
  void saveWeights(Path target) {
    try {
      workspace.saveWeights(target, currentWeights());
      status.flash("Saved the weights to " + target);
    } catch (RuntimeException e) {
      ErrorDialogs.show(this, "Cannot save the weights", e);
    }
  }

  /** Saves the layout, stops the background tasks and closes the window. */
  public void close() {
    saveLayout();
    tasks.shutdown();
    dispose();
  }

  private void restoreLayout() {
    WindowPrefs.Bounds b = prefs.bounds();
    setMinimumSize(new Dimension(900, 600));
    if (b != null) setBounds(b.x(), b.y(), b.width(), b.height()); else setSize(1500, 920);
    if (b == null) setLocationRelativeTo(null);
    left.setDividerLocation(prefs.layout("split.left", 400));
    int savedRight = prefs.layout("split.right", -1);
    if (savedRight > 0) right.setDividerLocation(savedRight);
    detail.split.setDividerLocation(prefs.layout("split.detail", 380));
    views.setSelectedIndex(Math.max(0, Math.min(views.getTabCount() - 1, prefs.layout("view", 0))));
  }

  private void saveLayout() {
    prefs.bounds(new WindowPrefs.Bounds(getX(), getY(), getWidth(), getHeight()));
    prefs.putLayout("split.left", left.getDividerLocation());
    prefs.putLayout("split.right", right.getDividerLocation());
    prefs.putLayout("split.detail", detail.split.getDividerLocation());
    prefs.putLayout("view", views.getSelectedIndex());
    prefs.flush();
  }
}
