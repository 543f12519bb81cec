package steelyard.report.charts;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.labels.CategoryItemLabelGenerator;
import org.jfree.chart.labels.ItemLabelAnchor;
import org.jfree.chart.labels.ItemLabelPosition;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StackedBarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.CategoryDataset;
import org.jfree.data.category.DefaultCategoryDataset;

/** The category (bar) charts behind {@link Charts#errorPerGroup} and {@link Charts#scoreBreakdown}. */
final class BarCharts {
  /** A stacked segment narrower than this share of the value axis span gets no text label. */
  private static final double MIN_LABELLED_SHARE = 0.09;

  private BarCharts() {}

  static JFreeChart errorPerGroup(List<String> groups, double[] before, double[] after, String errorLabel) {
    Charts.unique("groups", groups);
    Charts.sameLength("groups", groups.size(), "before", before.length);
    Charts.sameLength("groups", groups.size(), "after", after.length);
    DefaultCategoryDataset data = new DefaultCategoryDataset();
    for (int g = 0; g < groups.size(); g++) {
      data.addValue(nullIfNaN(before[g]), "before (rank 1)", groups.get(g));
      data.addValue(nullIfNaN(after[g]), "after (chosen)", groups.get(g));
    }
    BarRenderer r = new BarRenderer();
    NumberAxis value = new NumberAxis(errorLabel);
    CategoryPlot plot = new CategoryPlot(data, new CategoryAxis(null), value, r);
    JFreeChart chart = finish(plot);
    r.setBarPainter(new StandardBarPainter());
    r.setShadowVisible(false);
    r.setDrawBarOutline(true);
    r.setItemMargin(0.06);
    r.setSeriesPaint(0, Palette.PALE_ORANGE);
    r.setSeriesOutlinePaint(0, Palette.ORANGE.darker());
    r.setSeriesOutlineStroke(0, new BasicStroke(1.6f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {4f, 2f}, 0f));
    r.setSeriesPaint(1, Palette.BLUE);
    r.setSeriesOutlinePaint(1, Palette.BLUE.darker());
    r.setSeriesOutlineStroke(1, new BasicStroke(1.0f));
    value.setAutoRangeIncludesZero(true);
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    plot.setRangeAxisLocation(AxisLocation.BOTTOM_OR_RIGHT);
    plot.setDomainGridlinesVisible(false);
    plot.getDomainAxis().setCategoryMargin(0.25);
    return chart;
  }

  static JFreeChart scoreBreakdown(List<String> hypothesisLabels, List<String> termNames, double[][] weightedTerms) {
    Charts.unique("hypothesis labels", hypothesisLabels);
    Charts.unique("term names", termNames);
    Charts.sameLength("hypothesis labels", hypothesisLabels.size(), "weightedTerms rows", weightedTerms.length);
    DefaultCategoryDataset data = new DefaultCategoryDataset();
    for (int h = 0; h < hypothesisLabels.size(); h++) {
      Charts.sameLength("term names", termNames.size(), "weightedTerms[" + h + "]", weightedTerms[h].length);
      for (int t = 0; t < termNames.size(); t++) {
        data.addValue(nullIfNaN(weightedTerms[h][t]), termNames.get(t), hypothesisLabels.get(h));
      }
    }
    StackedBarRenderer r = new StackedBarRenderer();
    NumberAxis value = new NumberAxis("weighted score term (natural log)");
    CategoryPlot plot = new CategoryPlot(data, new CategoryAxis(null), value, r);
    JFreeChart chart = finish(plot);
    r.setBarPainter(new StandardBarPainter());
    r.setShadowVisible(false);
    r.setDrawBarOutline(true);
    r.setDefaultOutlinePaint(Color.WHITE);
    r.setDefaultOutlineStroke(new BasicStroke(1.2f));
    for (int t = 0; t < termNames.size(); t++) r.setSeriesPaint(t, Palette.series(t));
    r.setDefaultItemLabelGenerator(new TermLabels(span(weightedTerms)));
    r.setDefaultItemLabelsVisible(true);
    r.setDefaultItemLabelFont(new Font(ChartStyle.FAMILY, Font.BOLD, 10));
    r.setDefaultItemLabelPaint(Color.WHITE);
    r.setDefaultPositiveItemLabelPosition(new ItemLabelPosition(ItemLabelAnchor.CENTER, TextAnchor.CENTER));
    r.setDefaultNegativeItemLabelPosition(new ItemLabelPosition(ItemLabelAnchor.CENTER, TextAnchor.CENTER));
    for (int t = 0; t < termNames.size(); t++) {
      if (isLight(Palette.series(t))) r.setSeriesItemLabelPaint(t, Palette.INK);
    }
    plot.setOrientation(PlotOrientation.HORIZONTAL);
    plot.setRangeAxisLocation(AxisLocation.BOTTOM_OR_RIGHT);
    plot.setDomainGridlinesVisible(false);
    plot.addRangeMarker(new ValueMarker(0.0, Palette.INK, new BasicStroke(1.2f)));
    return chart;
  }

  private static JFreeChart finish(CategoryPlot plot) {
    JFreeChart chart = ChartStyle.apply(new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, true));
    chart.getLegend().setFrame(BlockBorder.NONE);
    chart.getLegend().setPosition(RectangleEdge.BOTTOM);
    return chart;
  }

  private static Double nullIfNaN(double v) {
    return Double.isNaN(v) ? null : v;
  }

  // Width of the value axis the stacked bars need: the widest positive stack plus the widest negative one.
  private static double span(double[][] terms) {
    double pos = 0;
    double neg = 0;
    for (double[] row : terms) {
      double p = 0;
      double n = 0;
      for (double v : row) {
        if (v > 0) p += v;
        else if (v < 0) n -= v;
      }
      pos = Math.max(pos, p);
      neg = Math.max(neg, n);
    }
    return pos + neg;
  }

  private static boolean isLight(Color c) {
    return 0.299 * c.getRed() + 0.587 * c.getGreen() + 0.114 * c.getBlue() > 150;
  }

  /** The term's name on segments wide enough to hold it; nothing on narrow ones (the legend names them). */
  private record TermLabels(double span) implements CategoryItemLabelGenerator {
    @Override
    public String generateRowLabel(CategoryDataset dataset, int row) {
      return dataset.getRowKey(row).toString();
    }

    @Override
    public String generateColumnLabel(CategoryDataset dataset, int column) {
      return dataset.getColumnKey(column).toString();
    }

    @Override
    public String generateLabel(CategoryDataset dataset, int row, int column) {
      Number v = dataset.getValue(row, column);
      if (v == null || span <= 0 || Math.abs(v.doubleValue()) < MIN_LABELLED_SHARE * span) return null;
      return dataset.getRowKey(row).toString();
    }
  }
}
