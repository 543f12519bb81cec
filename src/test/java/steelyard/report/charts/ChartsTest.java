package steelyard.report.charts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Collection;
import java.util.List;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.Marker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.data.category.CategoryDataset;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.XYZDataset;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;

/** The factories put exactly the given values into their datasets and mark what they are asked to mark. */
class ChartsTest {
  static {
    steelyard.report.HeadlessAwt.whenNoDisplay();
  }


  @Nested
  class ErrorAgainstWeight {
    @Test
    void datasetHoldsTheGivenStepsExactly() {
      StepSeries steps = ChartSamples.errorSteps();
      XYDataset data = ChartSamples.errorAgainstWeight().getXYPlot().getDataset();
      assertThat(data.getSeriesCount()).isEqualTo(1);
      assertThat(data.getSeriesKey(0)).isEqualTo(steps.name());
      assertSeries(data, 0, steps.x(), steps.y());
    }

    @Test
    void marksRankOneOracleAndTheChosenWeight() {
      XYPlot plot = ChartSamples.errorAgainstWeight().getXYPlot();
      assertThat(values(plot.getRangeMarkers(Layer.FOREGROUND))).containsExactly(23.82, 12.66);
      assertThat(values(plot.getDomainMarkers(Layer.FOREGROUND))).containsExactly(11.5);
      assertThat(labels(plot.getRangeMarkers(Layer.FOREGROUND))).containsExactly("rank 1: 23.82 %", "oracle: 12.66 %");
    }

    @Test
    void leavesOutMarkersWhoseValueIsUnknown() {
      XYPlot plot = Charts.errorAgainstWeight("λ", "WER (%)", ChartSamples.errorSteps(), Double.NaN, 12.0, Double.NaN).getXYPlot();
      assertThat(values(plot.getRangeMarkers(Layer.FOREGROUND))).containsExactly(12.0);
      assertThat(plot.getDomainMarkers(Layer.FOREGROUND)).isNull();
    }

    @Test
    void axesReachMarkersOutsideTheData() {
      XYPlot plot = Charts.errorAgainstWeight("λ", "WER (%)", ChartSamples.errorSteps(), 40.0, 2.0, 55.0).getXYPlot();
      assertThat(plot.getRangeAxis().getRange().contains(40.0)).isTrue();
      assertThat(plot.getRangeAxis().getRange().contains(2.0)).isTrue();
      assertThat(plot.getDomainAxis().getRange().contains(55.0)).isTrue();
    }

    @Test
    void usesDifferentLineStylesNotOnlyColours() {
      XYPlot plot = ChartSamples.errorAgainstWeight().getXYPlot();
      List<Marker> levels = List.copyOf(plot.getRangeMarkers(Layer.FOREGROUND));
      assertThat(levels.get(0).getStroke()).isNotEqualTo(levels.get(1).getStroke());
      assertThat(plot.getRenderer().getSeriesStroke(0)).isNotIn(levels.get(0).getStroke(), levels.get(1).getStroke());
    }
  }

  @Test
  void helpedAndHurtHoldTheGivenCountsAndDifferInStyle() {
    XYPlot plot = ChartSamples.helpedHurt().getXYPlot();
    double[] x = {0, 2, 5, 9, 14, 20, 30};
    assertSeries(plot.getDataset(), 0, x, new double[] {0, 40, 81, 104, 110, 112, 113});
    assertSeries(plot.getDataset(), 1, x, new double[] {0, 12, 20, 27, 36, 52, 70});
    assertThat(plot.getRenderer().getSeriesStroke(0)).isNotEqualTo(plot.getRenderer().getSeriesStroke(1));
    assertThat(plot.getRenderer().getSeriesShape(0)).isNotEqualTo(plot.getRenderer().getSeriesShape(1));
    assertThat(values(plot.getDomainMarkers(Layer.FOREGROUND))).containsExactly(11.5);
  }

  @Nested
  class ErrorSurface {
    @Test
    void cellsHoldTheGridValuesIndexedRowByY() {
      double[] xs = {1, 2, 3};
      double[] ys = {10, 20};
      double[][] e = {{5, 6, 7}, {8, 9, Double.NaN}};
      XYZDataset data = (XYZDataset) Charts.errorSurface("λ", "μ", xs, ys, e, 2, 10).getXYPlot().getDataset();
      assertThat(data.getItemCount(0)).isEqualTo(6);
      for (int iy = 0, k = 0; iy < 2; iy++) {
        for (int ix = 0; ix < 3; ix++, k++) {
          assertThat(data.getXValue(0, k)).isEqualTo(xs[ix]);
          assertThat(data.getYValue(0, k)).isEqualTo(ys[iy]);
          assertThat(Double.valueOf(data.getZValue(0, k))).isEqualTo(Double.valueOf(e[iy][ix]));
        }
      }
    }

    @Test
    void paintScaleSpansTheFiniteErrorsAndGreysMissingCells() {
      double[][] e = {{5, 6, 7}, {8, 9, Double.NaN}};
      JFreeChart chart = Charts.errorSurface("λ", "μ", new double[] {1, 2, 3}, new double[] {10, 20}, e, 2, 10);
      XYBlockRenderer r = (XYBlockRenderer) chart.getXYPlot().getRenderer();
      assertThat(r.getPaintScale().getLowerBound()).isEqualTo(5.0);
      assertThat(r.getPaintScale().getUpperBound()).isEqualTo(9.0);
      assertThat(r.getPaintScale().getPaint(Double.NaN)).isEqualTo(Palette.GREY);
      assertThat(r.getBlockWidth()).isEqualTo(1.0);
      assertThat(r.getBlockHeight()).isEqualTo(10.0);
      assertThat(chart.getSubtitleCount()).as("colour legend").isEqualTo(1);
    }

    @Test
    void aFlatSurfaceDrawsWithAScaleAroundItsOneValue() {
      double[][] e = {{16.5, 16.5}, {16.5, 16.5}};
      JFreeChart chart = Charts.errorSurface("λ", "μ", new double[] {0, 1}, new double[] {-1, 1}, e, 0, 0);
      XYBlockRenderer r = (XYBlockRenderer) chart.getXYPlot().getRenderer();
      assertThat(r.getPaintScale().getLowerBound()).isLessThan(16.5);
      assertThat(r.getPaintScale().getUpperBound()).isGreaterThan(16.5);
      assertThat(ChartExport.svg(chart, 300, 200)).contains("<svg");
    }

    @Test
    void marksTheChosenPointOnBothAxesAndWithALabel() {
      XYPlot plot = ChartSamples.surface().getXYPlot();
      assertThat(values(plot.getDomainMarkers(Layer.FOREGROUND))).containsExactly(14.0);
      assertThat(values(plot.getRangeMarkers(Layer.FOREGROUND))).containsExactly(2.5);
      assertThat(plot.getAnnotations()).hasSize(1);
    }

    @Test
    void refusesARowOfTheWrongLength() {
      assertThatThrownBy(() -> Charts.errorSurface("λ", "μ", new double[] {1, 2}, new double[] {1}, new double[][] {{1}}, 1, 1))
          .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("errorRate[0]");
    }
  }

  @Nested
  class ErrorPerGroup {
    @Test
    void holdsBeforeAndAfterPerGroupInOrder() {
      CategoryDataset data = ChartSamples.perGroup(List.of("spk03", "spk01", "sheet<2>")).getCategoryPlot().getDataset();
      assertThat(data.getColumnKeys()).containsExactly("spk03", "spk01", "sheet<2>");
      assertThat(data.getRowCount()).isEqualTo(2);
      for (int g = 0; g < 3; g++) {
        assertThat(data.getValue(0, g).doubleValue()).isEqualTo(18 + 3 * g);
        assertThat(data.getValue(1, g).doubleValue()).isEqualTo(12 + 2 * g);
      }
    }

    @Test
    void beforeIsOutlinedAndDashedAfterIsSolid() {
      CategoryPlot plot = ChartSamples.perGroup(List.of("a", "b")).getCategoryPlot();
      assertThat(plot.getRenderer().getSeriesOutlineStroke(0)).isNotEqualTo(plot.getRenderer().getSeriesOutlineStroke(1));
      assertThat(plot.getRenderer().getSeriesPaint(0)).isNotEqualTo(plot.getRenderer().getSeriesPaint(1));
    }

    @Test
    void refusesRepeatedGroupsRatherThanMergingThem() {
      assertThatThrownBy(() -> ChartSamples.perGroup(List.of("spk01", "spk01")))
          .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("repeated: spk01");
    }

    @Test
    void refusesMismatchedLengths() {
      assertThatThrownBy(() -> Charts.errorPerGroup(List.of("a", "b"), new double[] {1}, new double[] {1, 2}, "WER"))
          .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("before has 1");
    }
  }

  @Nested
  class ScoreBreakdown {
    @Test
    void holdsEachWeightedTermPerHypothesis() {
      CategoryDataset data = ChartSamples.breakdown().getCategoryPlot().getDataset();
      assertThat(data.getRowKeys()).containsExactly("acoustic", "LM", "length", "OOV");
      assertThat(data.getColumnKeys()).containsExactly("rank 1: bay nine", "pick: bay five");
      assertThat(data.getValue("LM", "rank 1: bay nine").doubleValue()).isEqualTo(-30.2);
      assertThat(data.getValue("length", "pick: bay five").doubleValue()).isEqualTo(8.0);
      assertThat(data.getValue("OOV", "pick: bay five").doubleValue()).isEqualTo(0.0);
    }

    @Test
    void namesWideSegmentsInTextAndLeavesNarrowOnesToTheLegend() {
      CategoryPlot plot = ChartSamples.breakdown().getCategoryPlot();
      var labels = plot.getRenderer().getDefaultItemLabelGenerator();
      assertThat(labels.generateLabel(plot.getDataset(), 1, 0)).isEqualTo("LM");
      assertThat(labels.generateLabel(plot.getDataset(), 3, 0)).isNull();
    }
  }

  @Test
  void stepSeriesRefusesUnorderedBreakpoints() {
    assertThatThrownBy(() -> new StepSeries("e", new double[] {1, 1}, new double[] {2, 3}))
        .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("strictly ascending");
  }

  @Test
  void stepSeriesIsACopy() {
    double[] x = {1, 2};
    StepSeries s = new StepSeries("e", x, new double[] {3, 4});
    x[0] = 99;
    s.x()[1] = 99;
    assertThat(s.x()).containsExactly(1, 2);
  }

  static void assertSeries(XYDataset data, int series, double[] x, double[] y) {
    assertThat(data.getItemCount(series)).isEqualTo(x.length);
    for (int k = 0; k < x.length; k++) {
      assertThat(data.getXValue(series, k)).as("x[%d]", k).isEqualTo(x[k]);
      assertThat(data.getYValue(series, k)).as("y[%d]", k).isEqualTo(y[k]);
    }
  }

  private static List<Double> values(Collection<?> markers) {
    return markers.stream().map(m -> ((ValueMarker) m).getValue()).toList();
  }

  private static List<String> labels(Collection<?> markers) {
    return markers.stream().map(m -> ((Marker) m).getLabel()).toList();
  }
}
