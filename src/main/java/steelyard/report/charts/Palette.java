package steelyard.report.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Stroke;
import java.util.List;

/**
 * The colours and line styles of every chart and of the report's page.
 *
 * <p>The categorical colours were picked so that every pair stays clearly apart for readers with normal colour
 * vision and under simulated protanopia, deuteranopia and tritanopia (checked in the tests). They are still
 * never the only cue: each role also has its own line style or shape.
 *
 * <p>Roles: {@link #BLUE} the chosen weights' result ("after", helped); {@link #ORANGE} the recogniser's rank 1
 * ("before", hurt); {@link #GREEN} the oracle; {@link #INK} the chosen weight and text.
 */
public final class Palette {
  /** Text, axes and the chosen-weight marker. */
  public static final Color INK = new Color(0x22, 0x28, 0x31);
  /** Deep blue: the result with the chosen weights, overrules that helped. */
  public static final Color BLUE = new Color(0x1B, 0x5E, 0xA8);
  /** Amber orange: rank 1 (the recogniser's own choice), overrules that hurt. */
  public static final Color ORANGE = new Color(0xE0, 0x8A, 0x00);
  /** Blue green: the oracle (best hypothesis in each list). */
  public static final Color GREEN = new Color(0x0E, 0x8C, 0x73);
  /** Orchid pink. */
  public static final Color PLUM = new Color(0xD4, 0x7B, 0xB0);
  /** Sky blue. */
  public static final Color SKY = new Color(0x7C, 0xC3, 0xEA);
  /** Brick red. */
  public static final Color BRICK = new Color(0xB8, 0x3A, 0x24);
  /** Neutral grey: gaps, missing cells, grid lines. */
  public static final Color GREY = new Color(0x8A, 0x8F, 0x96);
  /** Pale amber: fill of "before" bars (drawn with an {@link #ORANGE} outline, so they read as outlined). */
  public static final Color PALE_ORANGE = new Color(0xFB, 0xE3, 0xB8);
  /** Light grid lines. */
  public static final Color GRID = new Color(0xDD, 0xE1, 0xE6);

  /** Categorical colours in the order series use them. */
  public static final List<Color> SERIES = List.of(BLUE, ORANGE, GREEN, PLUM, SKY, BRICK);

  /**
   * Stops of the sequential scale of the heat map, from low (light cream) to high (dark indigo); lightness falls
   * monotonically, so the order reads in grey too.
   */
  static final List<Color> SEQUENTIAL = List.of(
      new Color(0xFF, 0xF8, 0xDC), new Color(0xF4, 0xD7, 0x8C), new Color(0xE5, 0xA0, 0x5C),
      new Color(0xB9, 0x64, 0x6A), new Color(0x6E, 0x3D, 0x7E), new Color(0x1F, 0x1E, 0x4F));

  /** Solid line: the measured curve. */
  public static final Stroke SOLID = new BasicStroke(2.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER);
  /** Long dashes: rank 1 and other "before" levels. */
  public static final Stroke DASHED = dashes(2.0f, 9f, 5f);
  /** Dots: the oracle. */
  public static final Stroke DOTTED = new BasicStroke(2.4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND, 1f,
      new float[] {0.1f, 5f}, 0f);
  /** Dash and dot: the chosen weight. */
  public static final Stroke DASH_DOT = dashes(1.6f, 10f, 3f, 2f, 3f);

  private Palette() {}

  /** The categorical colour for series number {@code k} (cycling after {@link #SERIES} runs out). */
  public static Color series(int k) {
    return SERIES.get(Math.floorMod(k, SERIES.size()));
  }

  /** {@code c} as {@code #rrggbb}. */
  public static String hex(Color c) {
    return String.format(java.util.Locale.ROOT, "#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
  }

  private static Stroke dashes(float width, float... pattern) {
    return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, pattern, 0f);
  }
}
