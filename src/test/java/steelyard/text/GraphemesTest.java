package steelyard.text;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class GraphemesTest {

  @Nested
  class ExtendedClusters {
    // Each row is one extended grapheme cluster per Unicode Standard Annex #29, "Unicode Text Segmentation"
    // (Table 1a examples, from memory, and the rules named beside each row).
    @ParameterizedTest(name = "[{index}] {1}")
    @CsvSource({
        "'e\u0301', e + COMBINING ACUTE (GB9)",
        "'g\u0308', g + COMBINING DIAERESIS (Table 1a)",
        "'\uD83C\uDDE9\uD83C\uDDEA', flag: two regional indicators (GB12)",
        "'\uD83D\uDC68\u200D\uD83D\uDC69\u200D\uD83D\uDC67', family: emoji ZWJ sequence (GB11)",
        "'\uD83D\uDC4D\uD83C\uDFFD', emoji + skin-tone modifier (GB9 Extend)",
        "'\u1100\u1161\u11A8', Hangul L V T jamo sequence (GB6 GB7 / Table 1a)",
        "'\uAC00\u11A8', Hangul LV syllable + T jamo (GB7)",
        "'\u0BA8\u0BBF', Tamil ni: letter + spacing mark (GB9a / Table 1a)",
        "'\u0937\u093F', Devanagari ssi: letter + spacing mark (GB9a / Table 1a)",
        "'\r\n', CR LF (GB3)"
    })
    void treatsTheSequenceAsOneCharacter(String text, String what) {
      assertThat(Graphemes.split(text)).containsExactly(text);
      assertThat(Graphemes.count(text)).isEqualTo(1);
    }

    @Test
    void splitsTwoFlagsIntoTwoCharacters() {
      // Regional indicators pair up from the start (GB12, GB13, Unicode Standard Annex #29).
      String de = "\uD83C\uDDE9\uD83C\uDDEA";
      String fr = "\uD83C\uDDEB\uD83C\uDDF7";
      assertThat(Graphemes.split(de + fr)).containsExactly(de, fr);
    }

    @Test
    void splitsBetweenHangulSyllables() {
      // Two LVT syllables: a break between T and L (GB999, Unicode Standard Annex #29).
      assertThat(Graphemes.split("\uAC01\uAC01")).containsExactly("\uAC01", "\uAC01");
    }

    @Test
    void breaksAroundControlCharacters() {
      // GB4 and GB5: break after and before controls, except CR LF (Unicode Standard Annex #29).
      assertThat(Graphemes.split("a\r\u0301")).containsExactly("a", "\r", "\u0301");
    }
  }

  @Nested
  class Api {
    @Test
    void returnsNoClustersForEmptyText() {
      assertThat(Graphemes.split("")).isEmpty();
      assertThat(Graphemes.count("")).isZero();
      assertThat(Graphemes.boundaries("")).containsExactly(0);
    }

    @Test
    void givesBoundariesAsCharOffsets() {
      assertThat(Graphemes.boundaries("ae\u0301b")).containsExactly(0, 1, 3, 4);
      assertThat(Graphemes.boundaries("ab")).containsExactly(0, 1, 2);
    }
  }

  @Nested
  class FastPath {
    private final Pattern cluster = Pattern.compile("\\X");

    /** The regex engine's own answer, without the below-U+0300 shortcut. */
    private List<String> byRegex(String s) {
      List<String> out = new ArrayList<>();
      Matcher m = cluster.matcher(s);
      while (m.find()) out.add(m.group());
      return out;
    }

    @Test
    void agreesWithTheRegexOnRandomTextBelowU0300() {
      long seed = 0x5EED_0300L;
      SplittableRandom rnd = new SplittableRandom(seed);
      for (int trial = 0; trial < 2000; trial++) {
        StringBuilder sb = new StringBuilder();
        int len = rnd.nextInt(12);
        for (int i = 0; i < len; i++) sb.append((char) (rnd.nextInt(8) == 0 ? "\r\n\t\u0000\u00AD".charAt(rnd.nextInt(5)) : rnd.nextInt(0x300)));
        String s = sb.toString();
        assertThat(Graphemes.split(s)).as("seed %d trial %d text %s", seed, trial, escape(s)).isEqualTo(byRegex(s));
        assertThat(Graphemes.count(s)).as("seed %d trial %d", seed, trial).isEqualTo(byRegex(s).size());
        assertThat(Graphemes.boundaries(s)).as("seed %d trial %d", seed, trial).hasSize(byRegex(s).size() + 1);
      }
    }
  }

  static String escape(String s) {
    StringBuilder sb = new StringBuilder();
    s.codePoints().forEach(cp -> sb.append(cp >= 0x20 && cp < 0x7F ? String.valueOf((char) cp) : String.format("\\u{%04X}", cp)));
    return sb.toString();
  }
}
