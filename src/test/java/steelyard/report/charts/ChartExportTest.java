package steelyard.report.charts;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.jfree.chart.JFreeChart;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.w3c.dom.Document;

/** SVG text is well-formed XML (checked with the JDK's own parser), repeatable, and PNG files are real images. */
class ChartExportTest {
  static {
    steelyard.report.HeadlessAwt.whenNoDisplay();
  }


  static Stream<Arguments> everyKindOfChart() {
    return Stream.of(
        Arguments.of("error against weight", (Supplier<JFreeChart>) ChartSamples::errorAgainstWeight),
        Arguments.of("helped and hurt", (Supplier<JFreeChart>) ChartSamples::helpedHurt),
        Arguments.of("surface", (Supplier<JFreeChart>) ChartSamples::surface),
        Arguments.of("per group", (Supplier<JFreeChart>) () -> ChartSamples.perGroup(List.of("spk01", "spk02"))),
        Arguments.of("breakdown", (Supplier<JFreeChart>) ChartSamples::breakdown));
  }

  static Stream<Arguments> everyKindOfEmptyChart() {
    return Stream.of(
        Arguments.of("error against weight", (Supplier<JFreeChart>) () ->
            Charts.errorAgainstWeight("λ", "WER (%)", StepSeries.empty("WER"), Double.NaN, Double.NaN, Double.NaN)),
        Arguments.of("helped and hurt", (Supplier<JFreeChart>) () ->
            Charts.helpedHurtAgainstWeight("λ", new double[0], new int[0], new int[0], Double.NaN)),
        Arguments.of("surface", (Supplier<JFreeChart>) () ->
            Charts.errorSurface("λ", "μ", new double[0], new double[0], new double[0][], Double.NaN, Double.NaN)),
        Arguments.of("per group", (Supplier<JFreeChart>) () -> Charts.errorPerGroup(List.of(), new double[0], new double[0], "WER")),
        Arguments.of("breakdown", (Supplier<JFreeChart>) () -> Charts.scoreBreakdown(List.of(), List.of(), new double[0][])));
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("everyKindOfChart")
  void svgIsWellFormedXml(String name, Supplier<JFreeChart> chart) throws Exception {
    Document doc = parse(ChartExport.svg(chart.get(), 640, 360, "c1"));
    assertThat(doc.getDocumentElement().getLocalName()).isEqualTo("svg");
    assertThat(doc.getDocumentElement().getNamespaceURI()).isEqualTo("http://www.w3.org/2000/svg");
    assertThat(doc.getDocumentElement().getAttribute("id")).isEqualTo("c1");
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("everyKindOfChart")
  void sameChartGivesTheSameSvgCharacters(String name, Supplier<JFreeChart> chart) {
    String first = ChartExport.svg(chart.get(), 640, 360);
    String second = ChartExport.svg(chart.get(), 640, 360);
    assertThat(second).isEqualTo(first);
  }

  @ParameterizedTest(name = "[{index}] {0}")
  @MethodSource("everyKindOfEmptyChart")
  void aChartWithNoDataStillRendersWithAMessage(String name, Supplier<JFreeChart> chart) throws Exception {
    String svg = ChartExport.svg(chart.get(), 400, 300);
    parse(svg);
    assertThat(svg).contains(ChartStyle.NO_DATA);
  }

  @Test
  void everyDefinitionIdCarriesThePrefixSoTwoChartsCanShareAPage() {
    String svg = ChartExport.svg(ChartSamples.surface(), 500, 300, "surface-7");
    Matcher m = Pattern.compile("\\bid='([^']*)'").matcher(svg);
    int ids = 0;
    while (m.find()) {
      ids++;
      assertThat(m.group(1)).startsWith("surface-7");
    }
    assertThat(ids).isGreaterThan(1);
  }

  @Test
  void markupInNamesIsEscapedNotInjected() throws Exception {
    String script = "<script>alert(1)</script>";
    String quotes = "&\"'<b>";
    String svg = ChartExport.svg(ChartSamples.perGroup(List.of(script, quotes)), 640, 360);
    Document doc = parse(svg);
    assertThat(doc.getElementsByTagNameNS("*", "script").getLength()).isZero();
    assertThat(doc.getElementsByTagNameNS("*", "b").getLength()).isZero();
    assertThat(doc.getDocumentElement().getTextContent()).contains(script).contains(quotes);
  }

  @Test
  void refusesAnIdThatIsNotAnXmlName() {
    assertThatThrownBy(() -> ChartExport.svg(ChartSamples.helpedHurt(), 10, 10, "1'><x"))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void pngIsAnImageOfTheRequestedSize(@TempDir Path dir) throws Exception {
    Path target = dir.resolve("surface.png");
    ChartExport.png(ChartSamples.surface(), 320, 200, target);
    var image = ImageIO.read(target.toFile());
    assertThat(image.getWidth()).isEqualTo(320);
    assertThat(image.getHeight()).isEqualTo(200);
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files).containsExactly(target);
    }
  }

  static Document parse(String xml) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(true);
    f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
    return f.newDocumentBuilder().parse(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
  }
}
