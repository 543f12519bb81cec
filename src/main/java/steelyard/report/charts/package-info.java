/**
 * Chart factories shared by the HTML report and the window: plain records and arrays in, a
 * {@link org.jfree.chart.JFreeChart} out, no Swing frames; {@link steelyard.report.charts.ChartExport} turns a
 * chart into deterministic SVG text or a PNG file.
 *
 * <p>Colours come from {@link steelyard.report.charts.Palette} (chosen to stay apart under the common colour-vision
 * deficiencies), and no chart relies on colour alone: series also differ by line style, point shape, fill
 * versus outline, or a text label.
 */
package steelyard.report.charts;
