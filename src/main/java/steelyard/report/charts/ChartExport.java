package steelyard.report.charts;

import java.awt.RenderingHints;
import java.awt.geom.Rectangle2D;
import java.nio.file.Path;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.SVGHints;
import org.jfree.svg.ViewBox;
import steelyard.io.AtomicOutput;

/**
 * Turns a chart into an SVG element (text, for inlining in a page) or a PNG file.
 *
 * <p>SVG output is deterministic: the same chart at the same size gives the same characters, because the
 * element id and the prefix of every id in its {@code <defs>} (clip paths, gradients) are fixed instead of
 * JFreeSVG's time-based default. Two charts inlined in one page need different prefixes
 * ({@link #svg(JFreeChart, int, int, String)}), or their clip paths would collide. Text stays text (drawn as
 * {@code <text>} in a {@code sans-serif} family), with XML special characters escaped by JFreeSVG.
 */
public final class ChartExport {
  /** Id prefix used by {@link #svg(JFreeChart, int, int)}. */
  public static final String DEFAULT_ID = "chart";

  private ChartExport() {}

  /** The chart as one {@code <svg>} element of {@code w × h} pixels with id {@value #DEFAULT_ID}. */
  public static String svg(JFreeChart chart, int w, int h) {
    return svg(chart, w, h, DEFAULT_ID);
  }

  /**
   * The chart as one {@code <svg>} element of {@code w × h} pixels (a view box of the same size, so CSS may
   * scale it) whose id is {@code id} and whose definitions' ids start with {@code id + "-"}.
   *
   * @param id an XML name: a letter, then letters, digits, {@code -} or {@code _}
   */
  public static String svg(JFreeChart chart, int w, int h, String id) {
    checkSize(w, h);
    if (id == null || !id.matches("[A-Za-z][A-Za-z0-9_-]*")) throw new IllegalArgumentException("not a usable element id: " + id);
    SVGGraphics2D g = new SVGGraphics2D(w, h);
    g.setDefsKeyPrefix(id + "-");
    g.setRenderingHint(SVGHints.KEY_DRAW_STRING_TYPE, SVGHints.VALUE_DRAW_STRING_TYPE_STANDARD);
    g.setRenderingHint(RenderingHints.KEY_STROKE_CONTROL, RenderingHints.VALUE_STROKE_PURE);
    chart.draw(g, new Rectangle2D.Double(0, 0, w, h));
    return g.getSVGElement(id, true, new ViewBox(0, 0, w, h), null, null);
  }

  /** Writes the chart as a {@code w × h} PNG to {@code target}, atomically ({@link AtomicOutput}). */
  public static void png(JFreeChart chart, int w, int h, Path target) {
    checkSize(w, h);
    AtomicOutput.writeBytes(target, out -> ChartUtils.writeChartAsPNG(out, chart, w, h));
  }

  private static void checkSize(int w, int h) {
    if (w <= 0 || h <= 0) throw new IllegalArgumentException("chart size must be positive: " + w + " x " + h);
  }
}
