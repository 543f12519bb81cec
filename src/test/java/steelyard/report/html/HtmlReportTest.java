package steelyard.report.html;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import steelyard.report.HeadlessAwt;

/** The page escapes what it is given, carries the review notice, is self-contained and repeatable. */
class HtmlReportTest {
  static {
    HeadlessAwt.whenNoDisplay();
  }

  static final String SMALL = HtmlReport.render(SampleReports.small());
  static final String HOSTILE = HtmlReport.render(SampleReports.hostile());

  @Nested
  class Escaping {
    @Test
    void transcriptScriptTagsArePrintedNotRun() {
      assertThat(HOSTILE.toLowerCase()).doesNotContain("<script");
      assertThat(HOSTILE).contains("&lt;script&gt;document.title='pwned';window.steelyardPwned=1;&lt;/script&gt;");
    }

    @Test
    void attributeBreakoutsBecomeText() {
      assertThat(HOSTILE.toLowerCase()).doesNotContain("<img");
      assertThat(HOSTILE).contains("&gt;&lt;img src=x onerror=");
    }

    @Test
    void ampersandsAreEscaped() {
      assertThat(HOSTILE).contains("Fenwick &amp; Sons'").doesNotContain("Fenwick & Sons");
    }

    @Test
    void quotesInsideAttributesAreEscaped() {
      Matcher m = Pattern.compile("title=\"([^\"]*)\"").matcher(HOSTILE);
      List<String> titles = new ArrayList<>();
      while (m.find()) titles.add(m.group(1));
      assertThat(titles).anySatisfy(t -> assertThat(t).contains("onerror=&#34;document.title=&#39;pwned&#39;&#34;"));
      assertThat(titles).anySatisfy(t -> assertThat(t).contains("&lt;script"));
      Matcher after = Pattern.compile("title=\"[^\"]*\"(.)").matcher(HOSTILE);
      while (after.find()) assertThat(after.group(1)).as("character after a title attribute").isIn(">", " ");
    }

    @Test
    void everyTextFieldOfTheModelIsEscaped() {
      String raw = SampleReports.SCRIPT;
      assertThat(HOSTILE).doesNotContain(raw).doesNotContain(SampleReports.IMG);
      // title, section name, notes, utterance id, group, flip weight name, n-gram, pair counts, transcripts
      assertThat(count(HOSTILE, "&lt;script&gt;document.title")).isGreaterThanOrEqualTo(9);
    }
  }

  @Test
  void theReviewNoticeIsAlwaysThere() {
    String empty = HtmlReport.render(new ReportModel("Nothing yet", List.of(), List.of()));
    for (String page : List.of(SMALL, HOSTILE, empty)) {
      assertThat(page).contains("An automatic pick is not a verified transcript; transcripts with legal, medical or "
          + "safety weight need review by a person.");
    }
    assertThat(empty).contains("This report has no data sets.");
  }

  @Test
  void sameModelGivesTheSameBytes() {
    assertThat(HtmlReport.render(SampleReports.small())).isEqualTo(SMALL);
  }

  @Test
  void chartsAreInlineSvgWithPageWideUniqueIds() {
    assertThat(count(SMALL, "<svg ")).isEqualTo(4);
    Matcher m = Pattern.compile("\\bid=['\"]([^'\"]+)['\"]").matcher(SMALL);
    Set<String> ids = new HashSet<>();
    while (m.find()) assertThat(ids.add(m.group(1))).as("id %s is unique", m.group(1)).isTrue();
    assertThat(ids).contains("set-1", "set-2", "set-1-error", "set-1-verdicts", "set-1-surface", "set-1-groups");
  }

  @Test
  void needsNothingFromOutside() {
    String lower = SMALL.toLowerCase();
    assertThat(lower).doesNotContain("<script").doesNotContain("<link").doesNotContain("<iframe").doesNotContain("<img")
        .doesNotContain("src=").doesNotContain("@import").doesNotContain("url(http");
    // The only absolute URLs are XML namespace names on the inline SVG, which are never fetched.
    Matcher m = Pattern.compile("(\\w+(?::\\w+)?)=['\"]https?://").matcher(SMALL);
    while (m.find()) assertThat(m.group(1)).startsWith("xmlns");
    assertThat(SMALL).contains("Content-Security-Policy").contains("default-src 'none'");
  }

  @Test
  void marksEveryAlignmentOperationWithTextAsWellAsColour() {
    assertThat(SMALL).contains("<span class=\"tk op-s\" title=\"substituted for pallet\"><span class=\"mk\">~</span>palate"
        + "<span class=\"was\">(pallet)</span></span>");
    assertThat(SMALL).contains("<ins class=\"tk op-i\" title=\"inserted\"><span class=\"mk\">+</span>doc</ins>");
    assertThat(SMALL).containsPattern("<del class=\"tk op-d\" title=\"missing\"><span class=\"mk\">−</span>\\w+</del>|Marks against");
    assertThat(SMALL).contains("▲ helped").contains("▼ hurt").contains("= neutral").contains("? unverified");
  }

  @Test
  void characterAlignmentsShowMismatchedSpacesVisibly() {
    assertThat(SMALL).contains("<span class=\"seq\">").contains("~</span>l<span class=\"was\">(1)</span>");
  }

  @Test
  void printsFiguresWithIntervalsAndThePairedTest() {
    assertThat(SMALL).contains("14.89 %").contains("12.89 – 16.84 %").contains("−8.93 points (−37.5 %)")
        .contains("142 utterances better").contains("sign test p &lt; 0.0001").contains("Paired bootstrap p 0.0002");
  }

  @Test
  void writesTheSamePageAtomically(@TempDir Path dir) throws Exception {
    Path target = dir.resolve("report.html");
    HtmlReport.write(SampleReports.small(), target);
    assertThat(Files.readString(target)).isEqualTo(SMALL);
    try (var files = Files.list(dir)) {
      assertThat(files).containsExactly(target);
    }
  }

  private static int count(String haystack, String needle) {
    int n = 0;
    for (int at = haystack.indexOf(needle); at >= 0; at = haystack.indexOf(needle, at + 1)) n++;
    return n;
  }
}
