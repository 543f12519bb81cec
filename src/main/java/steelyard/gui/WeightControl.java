package steelyard.gui;

import java.awt.GridBagConstraints;
import java.awt.Insets;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JSlider;
import javax.swing.JSpinner;
import javax.swing.SpinnerNumberModel;

/**
 * One weight: a label, a slider and a number field kept in step. The slider covers a useful range (linear,
 * or logarithmic for scales); the field accepts any finite value (the slider then rests at its end). Fires
 * {@link Listener#changed} with {@code adjusting} true while the slider is dragged and false when a value is
 * settled (slider released, field committed). EDT only.
 */
final class WeightControl {
  /** Receives weight changes. */
  interface Listener {
    void changed(double value, boolean adjusting);
  }

  private static final int STEPS = 400;
  final JLabel label;
  final JSlider slider = new JSlider(0, STEPS);
  final JSpinner field;
  private final double min;
  private final double max;
  private final boolean logarithmic;
  private boolean syncing;
  private Listener listener = (v, a) -> {};

  WeightControl(String name, String text, int mnemonic, String tooltip, double min, double max, boolean logarithmic, double step) {
    this.min = min;
    this.max = max;
    this.logarithmic = logarithmic;
    label = new JLabel(text);
    label.setDisplayedMnemonic(mnemonic);
    field = new JSpinner(new SpinnerNumberModel(logarithmic ? 1.0 : 0.0, logarithmic ? 1e-9 : -1e6, 1e6, step));
    field.setEditor(new JSpinner.NumberEditor(field, "0.####"));
    ((JSpinner.DefaultEditor) field.getEditor()).getTextField().setColumns(6);
    label.setLabelFor(((JSpinner.DefaultEditor) field.getEditor()).getTextField());
    slider.setName("weights." + name + ".slider");
    field.setName("weights." + name + ".field");
    label.setToolTipText(tooltip);
    slider.setToolTipText(tooltip);
    field.setToolTipText(tooltip);
    slider.addChangeListener(e -> {
      if (syncing) return;
      double v = fromSlider(slider.getValue());
      syncing = true;
      field.setValue(v);
      syncing = false;
      listener.changed(v, slider.getValueIsAdjusting());
    });
    field.addChangeListener(e -> {
      if (syncing) return;
      double v = ((Number) field.getValue()).doubleValue();
      syncing = true;
      slider.setValue(toSlider(v));
      syncing = false;
      listener.changed(v, false);
    });
  }

  void listener(Listener l) {
    listener = l;
  }

  /** Sets the value without firing. */
  void set(double v) {
    syncing = true;
    field.setValue(v);
    slider.setValue(toSlider(v));
    syncing = false;
  }

  double value() {
    return ((Number) field.getValue()).doubleValue();
  }

  void setEnabled(boolean on) {
    label.setEnabled(on);
    slider.setEnabled(on);
    field.setEnabled(on);
  }

  /** Adds label, slider and field as one row of a grid-bag panel. */
  void addTo(JPanel p, int row) {
    GridBagConstraints c = new GridBagConstraints();
    c.gridy = row * 2;
    c.gridx = 0;
    c.anchor = GridBagConstraints.WEST;
    c.insets = new Insets(8, 0, 0, 6);
    p.add(label, c);
    c.gridx = 1;
    c.anchor = GridBagConstraints.EAST;
    c.insets = new Insets(8, 0, 0, 0);
    p.add(field, c);
    c.gridy = row * 2 + 1;
    c.gridx = 0;
    c.gridwidth = 2;
    c.fill = GridBagConstraints.HORIZONTAL;
    c.insets = new Insets(0, 0, 0, 0);
    p.add(slider, c);
  }

  double fromSlider(int s) {
    double t = (double) s / STEPS;
    if (logarithmic) return round(Math.exp(Math.log(min) + t * (Math.log(max) - Math.log(min))), 4);
    return round(min + t * (max - min), 3);
  }

  int toSlider(double v) {
    double t = logarithmic ? (Math.log(Math.max(v, 1e-300)) - Math.log(min)) / (Math.log(max) - Math.log(min)) : (v - min) / (max - min);
    return (int) Math.round(STEPS * Math.max(0, Math.min(1, t)));
  }

  /** {@code v} to {@code digits} significant digits (log scale) or decimals (linear), so slider values read cleanly. */
  private double round(double v, int digits) {
    if (logarithmic) {
      if (v == 0) return 0;
      double scale = Math.pow(10, digits - 1 - Math.floor(Math.log10(Math.abs(v))));
      return Math.round(v * scale) / scale;
    }
    double scale = Math.pow(10, digits);
    return Math.round(v * scale) / scale;
  }
}
