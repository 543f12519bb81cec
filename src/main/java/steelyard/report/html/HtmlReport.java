package steelyard.report.html;

import gg.jte.ContentType;
import gg.jte.TemplateEngine;
import gg.jte.output.StringOutput;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import steelyard.io.AtomicOutput;
import steelyard.report.html.PageView.SectionView;
import steelyard.report.html.ReportModel.Section;
import steelyard.report.html.ReportModel.TokenKind;

/**
 * Writes the report as one self-contained HTML file: inline CSS, charts as inline SVG, no script, no
 * external resource (a Content-Security-Policy forbids loading anything and running any script), so it opens
 * offline and can be mailed as one file.
 *
 * <p>The page comes from jte templates ({@code src/main/jte}) compiled to Java at build time, with HTML
 * escaping of every value the templates print; only the charts' SVG, which JFreeSVG writes with its text
 * escaped, is inserted as markup. Same model, same bytes.
 *
 * <p>{@code HtmlReport.write(model, Path.of("report.html"));}
 */
public final class HtmlReport {
  /** Package of the generated template classes (see the jte plugin in pom.xml). */
  static final String TEMPLATE_PACKAGE = "steelyard.report.html.templates";
  private static final TemplateEngine ENGINE =
      TemplateEngine.createPrecompiled(null, ContentType.Html, HtmlReport.class.getClassLoader(), TEMPLATE_PACKAGE);

  private HtmlReport() {}

  /** Writes the page for {@code model} to {@code target} atomically ({@link AtomicOutput}); {@code -} is stdout. */
  public static void write(ReportModel model, Path target) {
    String html = render(model);
    AtomicOutput.writeText(target, out -> out.write(html));
  }

  /** The page for {@code model} as text. */
  public static String render(ReportModel model) {
    StringOutput out = new StringOutput(1 << 16);
    ENGINE.render("report.jte", view(model), out);
    return out.toString();
  }

  static PageView view(ReportModel model) {
    List<SectionView> sections = new ArrayList<>();
    for (int k = 0; k < model.sections().size(); k++) {
      Section s = model.sections().get(k);
      String anchor = "set-" + (k + 1);
      sections.add(new SectionView(anchor, s, s.tokens() == TokenKind.CHARACTERS, ReportCharts.render(s.charts(), s.errorName(), anchor)));
    }
    return new PageView(model, ReportModel.REVIEW_NOTICE, sections);
  }
}
