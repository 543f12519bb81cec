package steelyard.report.html;

import java.util.List;

/**
 * What the page templates ({@code src/main/jte}) receive: the model plus what the templates cannot make
 * themselves (anchors, the charts' SVG text). Public only because the generated template classes live in a
 * sub-package; not an API.
 *
 * @param model    the report model
 * @param notice   the review notice, always shown
 * @param sections one view per model section, in the same order
 */
public record PageView(ReportModel model, String notice, List<SectionView> sections) {
  public PageView {
    sections = List.copyOf(sections);
  }

  /**
   * A section with its anchor and rendered charts.
   *
   * @param anchor     the section's element id
   * @param section    the model section
   * @param characters whether tokens are characters (joined without spaces)
   * @param charts     the charts that have data, in display order
   */
  public record SectionView(String anchor, ReportModel.Section section, boolean characters, List<ChartView> charts) {
    public SectionView {
      charts = List.copyOf(charts);
    }
  }

  /**
   * One rendered chart.
   *
   * @param id      element id of the {@code <svg>}
   * @param title   heading of the figure
   * @param caption how to read it (line styles, marks)
   * @param svg     the {@code <svg>} element, written by JFreeSVG (its text is XML-escaped)
   */
  public record ChartView(String id, String title, String caption, String svg) {}
}
