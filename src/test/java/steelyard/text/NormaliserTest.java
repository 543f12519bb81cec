package steelyard.text;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class NormaliserTest {
  private static final NormalisationOptions EXACT = NormalisationOptions.EXACT;
  private static final NormalisationOptions FOLD = new NormalisationOptions(true, false, false, false, null);
  private static final NormalisationOptions STRIP = new NormalisationOptions(false, true, false, false, null);
  private static final NormalisationOptions HYPHENS = new NormalisationOptions(false, false, true, false, null);
  private static final NormalisationOptions STRIP_HYPHENS = new NormalisationOptions(false, true, true, false, null);
  private static final NormalisationOptions NO_SPACE = new NormalisationOptions(false, false, false, true, null);

  private static List<String> words(NormalisationOptions o, String raw) {
    return Normaliser.create(o).tokenList(raw, Unit.WORD);
  }

  private static List<String> chars(NormalisationOptions o, String raw) {
    return Normaliser.create(o).tokenList(raw, Unit.CHAR);
  }

  @Nested
  class Nfkc {
    // Compatibility and canonical equivalents from Unicode Standard Annex #15, "Unicode Normalization Forms"
    // (the ligature, superscript and long-s examples of its NFKC figure, from memory), and the <wide>
    // compatibility decompositions of the full-width forms in the Unicode Character Database.
    @ParameterizedTest(name = "[{index}] {0} -> {1}")
    @CsvSource({
        "'\uFB01rst', first",            // LATIN SMALL LIGATURE FI -> f i (UAX #15)
        "'2\u2075', 25",                 // SUPERSCRIPT FIVE -> 5 (UAX #15)
        "'\u1E9B\u0323', '\u1E69'",      // long s with dot above + dot below -> s with dot below and above (UAX #15)
        "'\uFF11\uFF12\uFF13', 123",     // FULLWIDTH DIGITS -> ASCII digits (<wide>)
        "'\uFF22ay', Bay",               // FULLWIDTH LATIN CAPITAL B (<wide>)
        "'e\u0301', '\u00E9'",           // e + COMBINING ACUTE composes to U+00E9 (canonical composition, UAX #15)
        "'\u1100\u1161\u11A8', '\uAC01'" // Hangul jamo L V T compose to the syllable GAG (Unicode ch. 3.12)
    })
    void appliesNfkcAlways(String raw, String expected) {
      assertThat(words(EXACT, raw)).containsExactly(expected);
    }

    @Test
    void mapsNoBreakSpaceToAWordBoundary() {
      // U+00A0 has the compatibility decomposition <noBreak> 0020 (Unicode Character Database).
      assertThat(words(EXACT, "pallet\u00A0twelve")).containsExactly("pallet", "twelve");
    }

    @Test
    void leavesAlreadyNormalisedTextUnchanged() {
      assertThat(words(EXACT, "Crate 7 of Plums, ok?")).containsExactly("Crate", "7", "of", "Plums,", "ok?");
    }
  }

  @Nested
  class CaseFolding {
    @ParameterizedTest(name = "[{index}] {0} -> {1}")
    @CsvSource({"PLUMS, plums", "Cold, cold", "\u00C9CLAIR, \u00E9clair", "\u0394\u0395\u039B\u03A4\u0391, \u03B4\u03B5\u03BB\u03C4\u03B1"})
    void lowerCasesWithRootLocale(String raw, String expected) {
      assertThat(words(FOLD, raw)).containsExactly(expected);
    }

    @Test
    void keepsCaseWithoutTheOption() {
      assertThat(words(EXACT, "PLUMS")).containsExactly("PLUMS");
    }

    @Test
    void foldsCapitalIWithDotToAStableNfkcForm() {
      // Locale.ROOT lower-cases U+0130 to i + U+0307 (Unicode SpecialCasing.txt); the result is a fixed point.
      List<String> once = words(FOLD, "\u0130zmir");
      assertThat(once).containsExactly("i\u0307zmir");
      assertThat(words(FOLD, once.get(0))).isEqualTo(once);
    }
  }

  @Nested
  class Punctuation {
    @ParameterizedTest(name = "[{index}] {0} -> {1}")
    @CsvSource(delimiter = '|', value = {
        "ok, then.|ok then",
        "o'clock|oclock",                      // the apostrophe is Po: removed, not a word boundary
        "\u201Cplums\u201D (crate 4)|plums crate 4",
        "\u00BFque?|que",
        "dock_7|dock7",                        // Pc connector punctuation
        "...|''",                              // a word of punctuation only vanishes
        "$5 + 2 = 7|$5 + 2 = 7",               // symbols (Sc, Sm) are not punctuation
        "<noise>|<noise>",                     // < and > are Sm, unlike [ ]
        "[noise]|noise"
    })
    void stripsUnicodePunctuationCategories(String raw, String expected) {
      List<String> expectedWords = expected.isEmpty() ? List.of() : List.of(expected.split(" "));
      assertThat(words(STRIP, raw)).isEqualTo(expectedWords);
    }

    @Test
    void keepsPunctuationWithoutTheOption() {
      assertThat(words(EXACT, "o'clock.")).containsExactly("o'clock.");
    }

    @Test
    void recomposesAMarkThatMeetsANewBaseAfterStripping() {
      // "e" + "." + COMBINING ACUTE: once the full stop goes, e + U+0301 composes to U+00E9 (UAX #15).
      assertThat(words(STRIP, "e.\u0301")).containsExactly("\u00E9");
    }
  }

  @Nested
  class Hyphens {
    @ParameterizedTest(name = "[{index}] {0} -> {1}")
    @CsvSource(delimiter = '|', value = {
        "cold-store|cold store",
        "cold\u2013store|cold store",          // EN DASH
        "cold\u2014store|cold store",          // EM DASH
        "cold\u2010store|cold store",          // HYPHEN
        "well--known|well known",
        "twenty-one-kilo|twenty one kilo",
        "-5|-5",                               // leading: not inside a word
        "bay -|bay -",
        "(-5)|(-5)",                           // next to punctuation: not inside a word
        "5\u22123|5\u22123"                    // MINUS SIGN is Sm, not a dash
    })
    void splitsDashRunsInsideWords(String raw, String expected) {
      assertThat(words(HYPHENS, raw)).isEqualTo(List.of(expected.split(" ")));
    }

    @Test
    void keepsHyphenatedWordsWithoutTheOption() {
      assertThat(words(EXACT, "cold-store")).containsExactly("cold-store");
    }

    @Test
    void splitsBeforeStrippingSoBothOptionsGiveTwoWords() {
      assertThat(words(STRIP_HYPHENS, "cold-store, -5")).containsExactly("cold", "store", "5");
    }

    @Test
    void joinsHyphenatedWordsWhenOnlyStripping() {
      assertThat(words(STRIP, "cold-store")).containsExactly("coldstore");
    }
  }

  @Nested
  class Whitespace {
    @ParameterizedTest(name = "[{index}] {0}")
    @CsvSource(delimiter = '|', value = {
        "'crate  seven'", "'crate\tseven'", "'crate\nseven'", "'crate\r\nseven'", "'crate\u3000seven'",
        "'crate\u2028seven'", "'crate\u0085seven'", "'crate\u2009seven'", "'  crate seven  '"
    })
    void splitsAtAnyUnicodeWhitespace(String raw) {
      assertThat(words(EXACT, raw)).containsExactly("crate", "seven");
    }

    @Test
    void givesNoTokensForEmptyOrBlankText() {
      assertThat(words(EXACT, "")).isEmpty();
      assertThat(words(EXACT, " \t\n")).isEmpty();
      assertThat(chars(EXACT, " \t\n")).isEmpty();
    }

    @Test
    void doesNotSplitAtZeroWidthSpace() {
      // U+200B is Cf, not White_Space (Unicode PropList.txt).
      assertThat(words(EXACT, "a\u200Bb")).containsExactly("a\u200Bb");
    }
  }

  @Nested
  class CharacterUnit {
    @Test
    void collapsesAWhitespaceRunIntoOneSpaceToken() {
      assertThat(chars(EXACT, "ab \t\n c")).containsExactly("a", "b", Normaliser.SPACE_TOKEN, "c");
    }

    @Test
    void putsNoSpaceTokenAtTheEnds() {
      assertThat(chars(EXACT, "  ab  ")).containsExactly("a", "b");
    }

    @Test
    void leavesOutSpaceTokensWhenWhitespaceIsIgnored() {
      assertThat(chars(NO_SPACE, "ab  c")).containsExactly("a", "b", "c");
    }

    @Test
    void countsAClusterOfSeveralCodePointsAsOneCharacter() {
      // g + COMBINING DIAERESIS has no precomposed form, so it survives NFKC as two code points:
      // one extended grapheme cluster (Unicode Standard Annex #29, Table 1a).
      assertThat(chars(EXACT, "g\u0308o")).containsExactly("g\u0308", "o");
    }

    @Test
    void hasNoOptionalFlagsWithoutRules() {
      TokenSequence seq = Normaliser.create(EXACT).tokens("ab c", Unit.CHAR);
      assertThat(seq.optional()).containsOnly(false).hasSize(4);
    }

    @Test
    void returnsAnImmutableTokenList() {
      List<String> list = chars(EXACT, "ab");
      org.assertj.core.api.Assertions.assertThatThrownBy(() -> list.add("x"))
          .isInstanceOf(UnsupportedOperationException.class);
    }
  }

  @Nested
  class Join {
    @Test
    void joinsWordsWithSingleSpaces() {
      assertThat(Normaliser.join(List.of("crate", "seven"), Unit.WORD)).isEqualTo("crate seven");
    }

    @Test
    void joinsCharactersAndTurnsSpaceTokensIntoSpaces() {
      assertThat(Normaliser.join(List.of("o", "k", Normaliser.SPACE_TOKEN, "\uD83C\uDDE9\uD83C\uDDEA"), Unit.CHAR))
          .isEqualTo("ok \uD83C\uDDE9\uD83C\uDDEA");
    }

    @Test
    void joinsNothingToEmptyText() {
      assertThat(Normaliser.join(List.of(), Unit.CHAR)).isEmpty();
      assertThat(Normaliser.join(List.of(), Unit.WORD)).isEmpty();
    }
  }
}
