package steelyard.report.charts;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.Color;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.api.Test;

/**
 * The categorical colours stay apart under simulated colour-vision deficiencies, and the heat map's scale
 * darkens monotonically (so it reads in grey too).
 *
 * <p>Simulation: the full-severity (1.0) matrices of Machado, Oliveira &amp; Fernandes 2009, "A physiologically-based
 * model for simulation of color vision deficiency" (IEEE TVCG 15(6)), applied to linear RGB; values from memory.
 * Distance: CIE 1976 ΔE*ab in CIELAB with the D65 white (CIE 15:2004); sRGB transfer per IEC 61966-2-1.
 * Thresholds: a ΔE of about 2.3 is "just noticeable" (Sharma 2003, from memory); telling series apart at a glance
 * needs far more, and 15 is our common-practice floor.
 */
class PaletteTest {
  static final double MIN_DELTA_E = 15.0;

  enum Vision {
    TYPICAL(new double[] {1, 0, 0, 0, 1, 0, 0, 0, 1}),
    PROTANOPIA(new double[] {0.152286, 1.052583, -0.204868, 0.114503, 0.786281, 0.099216, -0.003882, -0.048116, 1.051998}),
    DEUTERANOPIA(new double[] {0.367322, 0.860646, -0.227968, 0.280085, 0.672501, 0.047413, -0.011820, 0.042940, 0.968881}),
    TRITANOPIA(new double[] {1.255528, -0.076749, -0.178779, -0.078411, 0.930809, 0.147602, 0.004733, 0.691367, 0.303900});

    final double[] m;

    Vision(double[] m) {
      this.m = m;
    }

    double[] simulate(Color c) {
      double r = linear(c.getRed());
      double g = linear(c.getGreen());
      double b = linear(c.getBlue());
      return new double[] {clamp(m[0] * r + m[1] * g + m[2] * b), clamp(m[3] * r + m[4] * g + m[5] * b), clamp(m[6] * r + m[7] * g + m[8] * b)};
    }
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @EnumSource(Vision.class)
  void everyPairOfSeriesColoursStaysApart(Vision vision) {
    List<Color> colours = Palette.SERIES;
    for (int a = 0; a < colours.size(); a++) {
      for (int b = a + 1; b < colours.size(); b++) {
        double d = deltaE(lab(vision.simulate(colours.get(a))), lab(vision.simulate(colours.get(b))));
        assertThat(d).as("%s: %s vs %s", vision, Palette.hex(colours.get(a)), Palette.hex(colours.get(b))).isGreaterThan(MIN_DELTA_E);
      }
    }
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @EnumSource(Vision.class)
  void textInkStandsOutFromEverySeriesColour(Vision vision) {
    for (Color c : Palette.SERIES) {
      double d = deltaE(lab(vision.simulate(Palette.INK)), lab(vision.simulate(c)));
      assertThat(d).as("%s: ink vs %s", vision, Palette.hex(c)).isGreaterThan(MIN_DELTA_E);
    }
  }

  @Test
  void heatMapScaleGetsDarkerFromLowToHigh() {
    SequentialScale scale = new SequentialScale(0, 100);
    double previous = Double.POSITIVE_INFINITY;
    for (int v = 0; v <= 100; v += 5) {
      double lightness = lab(Vision.TYPICAL.simulate((Color) scale.getPaint(v)))[0];
      assertThat(lightness).as("L* at %d", v).isLessThan(previous);
      previous = lightness;
    }
  }

  // sRGB 8-bit to linear (IEC 61966-2-1).
  static double linear(int v) {
    double c = v / 255.0;
    return c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  }

  static double clamp(double v) {
    return Math.max(0, Math.min(1, v));
  }

  // Linear sRGB to CIELAB (D65 white; sRGB-to-XYZ matrix of IEC 61966-2-1; CIE 15:2004 for L*a*b*).
  static double[] lab(double[] rgb) {
    double x = 0.4124 * rgb[0] + 0.3576 * rgb[1] + 0.1805 * rgb[2];
    double y = 0.2126 * rgb[0] + 0.7152 * rgb[1] + 0.0722 * rgb[2];
    double z = 0.0193 * rgb[0] + 0.1192 * rgb[1] + 0.9505 * rgb[2];
    double fx = f(x / 0.95047);
    double fy = f(y / 1.0);
    double fz = f(z / 1.08883);
    return new double[] {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
  }

  private static double f(double t) {
    double d = 6.0 / 29.0;
    return t > d * d * d ? Math.cbrt(t) : t / (3 * d * d) + 4.0 / 29.0;
  }

  static double deltaE(double[] p, double[] q) {
    return Math.sqrt(Math.pow(p[0] - q[0], 2) + Math.pow(p[1] - q[1], 2) + Math.pow(p[2] - q[2], 2));
  }
}
