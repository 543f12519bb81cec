package steelyard.text;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Mathematical invariants of normalisation over seeded random text: the output is a fixed point
 * (idempotence), and joining tokens then normalising gives the same tokens back.
 */
class NormaliserPropertyTest {
  private static final long SEED = 20261202L;
  private static final int TRIALS = 400;

  /** Letters, digits, punctuation, dashes, symbols, combining marks, whitespace and multi-code-point clusters. */
  private static final String[] PIECES = {
      "a", "b", "k", "o", "Z", "Q", "\u00E9", "\u00DF", "\u1E9E", "\u03A3", "\u03C3", "\u0130", "\u0131", "\uFB01",
      "0", "7", "\uFF17", "\u0667", "\u2075",
      ".", ",", "'", "\u2019", "!", "?", "(", ")", "[", "]", "\u00AB", "_", "\"", "\u00BF",
      "-", "--", "\u2013", "\u2014", "\u2010", "\u2212", "$", "+", "<", ">", "|",
      "\u0301", "\u0308", "\u0323", "\u200D", "\uD83C\uDDE9", "\uD83C\uDDEA", "\uD83D\uDC68", "\uD83C\uDFFD",
      "\u1100", "\u1161", "\u11A8", "\uAC00",
      " ", "  ", "\t", "\n", "\r\n", "\u00A0", "\u3000", "\u2028", "\u2009"
  };

  static Stream<NormalisationOptions> allOptions() {
    List<NormalisationOptions> out = new ArrayList<>();
    for (int bits = 0; bits < 16; bits++)
      out.add(new NormalisationOptions((bits & 1) != 0, (bits & 2) != 0, (bits & 4) != 0, (bits & 8) != 0, null));
    return out.stream();
  }

  private static String randomText(SplittableRandom rnd) {
    StringBuilder sb = new StringBuilder();
    int n = rnd.nextInt(16);
    for (int i = 0; i < n; i++) sb.append(PIECES[rnd.nextInt(PIECES.length)]);
    return sb.toString();
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("allOptions")
  void normalisingItsOwnWordTokensChangesNothing(NormalisationOptions options) {
    Normaliser n = Normaliser.create(options);
    SplittableRandom rnd = new SplittableRandom(SEED);
    for (int trial = 0; trial < TRIALS; trial++) {
      String raw = randomText(rnd);
      List<String> words = n.tokenList(raw, Unit.WORD);
      String why = String.format("seed %d trial %d text %s", SEED, trial, GraphemesTest.escape(raw));
      for (String w : words) assertThat(n.tokenList(w, Unit.WORD)).as(why + " word " + GraphemesTest.escape(w)).containsExactly(w);
      assertThat(n.tokenList(Normaliser.join(words, Unit.WORD), Unit.WORD)).as(why).isEqualTo(words);
    }
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("allOptions")
  void joiningCharacterTokensGivesTheSameTokensBack(NormalisationOptions options) {
    Normaliser n = Normaliser.create(options);
    SplittableRandom rnd = new SplittableRandom(SEED + 1);
    for (int trial = 0; trial < TRIALS; trial++) {
      String raw = randomText(rnd);
      List<String> chars = n.tokenList(raw, Unit.CHAR);
      String why = String.format("seed %d trial %d text %s", SEED + 1, trial, GraphemesTest.escape(raw));
      // With whitespace ignored the words are concatenated, which can merge clusters across a word
      // boundary (two regional indicators); the round trip then goes through the word text.
      String text = options.ignoreWhitespace()
          ? Normaliser.join(n.tokenList(raw, Unit.WORD), Unit.WORD)
          : Normaliser.join(chars, Unit.CHAR);
      assertThat(n.tokenList(text, Unit.CHAR)).as(why).isEqualTo(chars);
      if (!options.ignoreWhitespace()) assertThat(text).as(why).isEqualTo(Normaliser.join(n.tokenList(raw, Unit.WORD), Unit.WORD));
    }
  }

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("allOptions")
  void characterTokensSpellTheWordTokens(NormalisationOptions options) {
    Normaliser n = Normaliser.create(options);
    SplittableRandom rnd = new SplittableRandom(SEED + 2);
    for (int trial = 0; trial < TRIALS; trial++) {
      String raw = randomText(rnd);
      List<String> words = n.tokenList(raw, Unit.WORD);
      List<String> chars = n.tokenList(raw, Unit.CHAR);
      String why = String.format("seed %d trial %d text %s", SEED + 2, trial, GraphemesTest.escape(raw));
      int clusters = 0;
      for (String w : words) clusters += Graphemes.count(w);
      int spaces = options.ignoreWhitespace() || words.isEmpty() ? 0 : words.size() - 1;
      assertThat(chars).as(why).hasSize(clusters + spaces);
      assertThat(chars.stream().filter(Normaliser.SPACE_TOKEN::equals).count()).as(why).isEqualTo(spaces);
    }
  }

  private static final String[] VOCAB = {"uh", "UH", "um", "okay", "ok", "O.K.", "bay", "seven", "[noise]", "[crosstalk]", "crate", "oh", "kay"};
  private static final String RULES = "equate ok = okay | o.k. | oh kay\noptional uh | um | [noise]\ndrop [crosstalk]\n";

  @ParameterizedTest(name = "[{index}] {arguments}")
  @MethodSource("allOptions")
  void rulesAreAFixedPointToo(NormalisationOptions base) {
    NormalisationOptions options = new NormalisationOptions(base.foldCase(), base.stripPunctuation(),
        base.splitHyphens(), base.ignoreWhitespace(), Path.of("property.rules"));
    Normaliser n = Normaliser.create(options, RulesFile.parse(RULES, options.rulesFile()));
    SplittableRandom rnd = new SplittableRandom(SEED + 3);
    for (int trial = 0; trial < TRIALS; trial++) {
      StringBuilder sb = new StringBuilder();
      for (int i = rnd.nextInt(10); i > 0; i--) sb.append(VOCAB[rnd.nextInt(VOCAB.length)]).append(' ');
      String raw = sb.toString();
      TokenSequence once = n.tokens(raw, Unit.WORD);
      TokenSequence twice = n.tokens(Normaliser.join(once.tokens(), Unit.WORD), Unit.WORD);
      String why = String.format("seed %d trial %d text %s", SEED + 3, trial, raw);
      assertThat(twice.tokens()).as(why).isEqualTo(once.tokens());
      assertThat(twice.optional()).as(why).isEqualTo(once.optional());
      assertThat(once.tokens()).as(why).doesNotContain("[crosstalk]", "crosstalk", "okay");
    }
  }
}
