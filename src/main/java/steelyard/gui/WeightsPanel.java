package steelyard.gui;

import java.awt.BorderLayout;
import java.awt.GridBagConstraints;
import java.awt.GridBagLayout;
import java.awt.Insets;
import java.awt.event.KeyEvent;
import java.util.Map;
import java.util.function.BiConsumer;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import steelyard.gui.model.WeightSettings;
import steelyard.rescore.RescoreMethod;
import steelyard.rescore.RescoreWeights;

/**
 * The weights: the method and a slider with a number field for λ, μ, α, λ′ and μ′. Every change reaches the
 * window at once ({@code adjusting} true while a slider is dragged); the window re-ranks live for N-best and
 * re-chooses in the background for the other methods when the value settles. Weights a method does not use
 * are greyed. EDT only.
 */
public final class WeightsPanel extends JPanel {
  private static final long serialVersionUID = 1L;
  private static final RescoreMethod[] METHODS = RescoreMethod.values();

  private final JComboBox<String> method = new JComboBox<>(new String[] {"N-best", "MBR", "consensus", "network search"});
  final WeightControl lambda = new WeightControl("lambda", "λ  LM weight", KeyEvent.VK_L,
      "λ multiplies the domain model's natural-log probability of the whole transcript: higher trusts the model more.", 0, 40, false, 0.5);
  final WeightControl mu = new WeightControl("mu", "μ  length weight", KeyEvent.VK_G,
      "μ is added once per token: positive favours longer transcripts, negative shorter ones.", -20, 20, false, 0.5);
  final WeightControl alpha = new WeightControl("alpha", "α  posterior sharpness", KeyEvent.VK_P,
      "α multiplies the totals before they become posteriors: small α spreads belief over many hypotheses (MBR and networks).",
      0.001, 10, true, 0.01);
  final WeightControl lambda2 = new WeightControl("lambda2", "λ′  network LM", KeyEvent.VK_N,
      "λ′ weighs the model's log-probability of a path in the confusion-network search.", 0, 10, false, 0.1);
  final WeightControl mu2 = new WeightControl("mu2", "μ′  network length", KeyEvent.VK_W,
      "μ′ is added per token on a path in the confusion-network search.", -10, 10, false, 0.1);
  private final JLabel fixed = new JLabel(" ");
  final JButton reset = new JButton("Reset");
  final JButton tune = new JButton("Tune…");
  private BiConsumer<WeightSettings, Boolean> listener = (s, a) -> {};
  private final java.util.List<java.util.function.Consumer<WeightSettings>> watchers = new java.util.ArrayList<>();
  private boolean quiet;

  /** Width the panel asks for in the window. */
  static final int WIDTH = 350;

  public WeightsPanel() {
    super(new BorderLayout());
    setMinimumSize(new java.awt.Dimension(WIDTH - 40, 200));
    setPreferredSize(new java.awt.Dimension(WIDTH, 600));
    setBorder(BorderFactory.createEmptyBorder(10, 12, 10, 12));
    JPanel grid = new JPanel(new GridBagLayout());
    JLabel heading = new JLabel("Weights");
    heading.setFont(heading.getFont().deriveFont(java.awt.Font.BOLD, 15f));
    JLabel methodLabel = new JLabel("Method");
    methodLabel.setDisplayedMnemonic(KeyEvent.VK_M);
    methodLabel.setLabelFor(method);
    method.setName("weights.method");
    method.setToolTipText("How to choose: best total (N-best), fewest expected errors (MBR), the consensus of the "
        + "confusion network, or an LM search through it.");
    GridBagConstraints c = new GridBagConstraints();
    c.anchor = GridBagConstraints.WEST;
    c.gridwidth = 2;
    c.insets = new Insets(0, 0, 10, 0);
    grid.add(heading, c);
    c = new GridBagConstraints();
    c.gridy = 1;
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(0, 0, 4, 6);
    grid.add(methodLabel, c);
    c.gridx = 1;
    c.fill = GridBagConstraints.HORIZONTAL;
    c.insets = new Insets(0, 0, 4, 0);
    grid.add(method, c);
    WeightControl[] all = {lambda, mu, alpha, lambda2, mu2};
    for (int k = 0; k < all.length; k++) all[k].addTo(grid, k + 2);
    c = new GridBagConstraints();
    c.gridy = 20;
    c.gridwidth = 2;
    c.fill = GridBagConstraints.HORIZONTAL;
    c.insets = new Insets(12, 0, 0, 0);
    fixed.setForeground(Theme.MUTED);
    fixed.setName("weights.fixed");
    grid.add(fixed, c);
    JPanel buttons = new JPanel(new java.awt.GridLayout(1, 2, 6, 0));
    reset.setName("weights.reset");
    reset.setToolTipText("Back to the weights of the weights file (Ctrl+R).");
    tune.setName("weights.tune");
    buttons.add(reset);
    buttons.add(tune);
    c.gridy = 21;
    grid.add(buttons, c);
    add(grid, BorderLayout.NORTH);

    method.addActionListener(e -> {
      enableFor(selectedMethod());
      fire(false);
    });
    for (WeightControl w : all) w.listener((v, adjusting) -> fire(adjusting));
    enableFor(RescoreMethod.NBEST);
  }

  /** Receives every change: the new settings and whether a slider is still being dragged. */
  public void listener(BiConsumer<WeightSettings, Boolean> l) {
    listener = l;
  }

  /** Also tells {@code c} of every settings change, shown or made (menus that mirror the method). */
  public void watch(java.util.function.Consumer<WeightSettings> c) {
    watchers.add(c);
  }

  /** Shows {@code s} without firing; {@code base} supplies the weights the panel does not set (shown as text). */
  public void show(WeightSettings s, RescoreWeights base) {
    quiet = true;
    method.setSelectedIndex(s.method().ordinal());
    lambda.set(s.lmWeight());
    mu.set(s.lengthWeight());
    alpha.set(s.posteriorScale());
    lambda2.set(s.latticeLmWeight());
    mu2.set(s.latticeLengthWeight());
    enableFor(s.method());
    quiet = false;
    for (var c : watchers) c.accept(s);
    StringBuilder sb = new StringBuilder("<html><body style='width: " + (WIDTH - 110) + "px'>Also in effect: ");
    for (Map.Entry<String, Double> f : base.features().entrySet()) sb.append(f.getKey()).append(" × ").append(number(f.getValue())).append(", ");
    sb.append("OOV ω ").append(number(base.oovWeight()));
    if (!base.systemWeights().isEmpty()) sb.append(", systems ").append(base.systemWeights());
    fixed.setText(sb.append("</body></html>").toString());
  }

  /** The settings the controls show. */
  public WeightSettings settings() {
    return new WeightSettings(lambda.value(), mu.value(), alpha.value(), lambda2.value(), mu2.value(), selectedMethod());
  }

  /** Selects {@code m} (fires). */
  public void method(RescoreMethod m) {
    method.setSelectedIndex(m.ordinal());
  }

  private RescoreMethod selectedMethod() {
    return METHODS[Math.max(0, method.getSelectedIndex())];
  }

  private void enableFor(RescoreMethod m) {
    alpha.setEnabled(m != RescoreMethod.NBEST);
    lambda2.setEnabled(m == RescoreMethod.LATTICE);
    mu2.setEnabled(m == RescoreMethod.LATTICE);
  }

  private void fire(boolean adjusting) {
    if (quiet) return;
    WeightSettings s = settings();
    for (var c : watchers) c.accept(s);
    listener.accept(s, adjusting);
  }

  private static String number(double v) {
    return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
  }
}
