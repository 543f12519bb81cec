package steelyard.report.charts;

import java.awt.Color;
import java.awt.Paint;
import java.io.Serializable;
import java.util.List;
import org.jfree.chart.renderer.PaintScale;

/**
 * A paint scale that interpolates linearly (in sRGB) between the {@link Palette#SEQUENTIAL} stops from
 * {@code lower} to {@code upper}; values outside are clamped, NaN is {@link Palette#GREY}. When the bounds are
 * equal every value gets the lowest stop.
 */
final class SequentialScale implements PaintScale, Serializable {
  private static final long serialVersionUID = 1L;

  private final double lower;
  private final double upper;

  SequentialScale(double lower, double upper) {
    if (!(lower <= upper)) throw new IllegalArgumentException("scale bounds must satisfy lower <= upper: " + lower + ", " + upper);
    this.lower = lower;
    this.upper = upper;
  }

  @Override
  public double getLowerBound() {
    return lower;
  }

  @Override
  public double getUpperBound() {
    return upper;
  }

  @Override
  public Paint getPaint(double value) {
    if (Double.isNaN(value)) return Palette.GREY;
    List<Color> stops = Palette.SEQUENTIAL;
    double t = upper > lower ? (value - lower) / (upper - lower) : 0.0;
    t = Math.max(0.0, Math.min(1.0, t)) * (stops.size() - 1);
    int k = Math.min((int) t, stops.size() - 2);
    return mix(stops.get(k), stops.get(k + 1), t - k);
  }

  private static Color mix(Color a, Color b, double f) {
    return new Color(channel(a.getRed(), b.getRed(), f), channel(a.getGreen(), b.getGreen(), f), channel(a.getBlue(), b.getBlue(), f));
  }

  private static int channel(int a, int b, double f) {
    return (int) Math.round(a + (b - a) * f);
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SequentialScale s && s.lower == lower && s.upper == upper;
  }

  @Override
  public int hashCode() {
    return Double.hashCode(lower) * 31 + Double.hashCode(upper);
  }
}
