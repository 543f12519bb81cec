package steelyard.text;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import steelyard.io.InputException;

class RulesTest {
  static Path fixture(String name) {
    try {
      return Path.of(RulesTest.class.getResource("/text/" + name).toURI());
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    }
  }

  static Normaliser withRules(String text, boolean fold, boolean strip, boolean hyphens) {
    NormalisationOptions o = new NormalisationOptions(fold, strip, hyphens, false, Path.of("test.rules"));
    return Normaliser.create(o, RulesFile.parse(text, o.rulesFile()));
  }

  static Normaliser withRules(String text) {
    return withRules(text, false, false, false);
  }

  @Nested
  class Equivalences {
    @Test
    void rewritesEachVariantToTheCanonicalForm() {
      Normaliser n = withRules("equate ok = okay | o.k.");
      assertThat(n.tokenList("okay then o.k. ok", Unit.WORD)).containsExactly("ok", "then", "ok", "ok");
    }

    @Test
    void matchesMultiWordVariantsLongestFirst() {
      Normaliser n = withRules("equate ok = oh kay | oh\nequate cold store = coldstore");
      assertThat(n.tokenList("oh kay the coldstore oh", Unit.WORD))
          .containsExactly("ok", "the", "cold", "store", "ok");
    }

    @Test
    void normalisesRuleSpellingsWithTheSameOptions() {
      Normaliser n = withRules("equate OK = Okay | O.K.", true, true, false);
      assertThat(n.tokenList("OKAY, o.k. Ok", Unit.WORD)).containsExactly("ok", "ok", "ok");
    }

    @Test
    void treatsAVariantThatNormalisesToTheCanonicalFormAsHarmless() {
      Normaliser n = withRules("equate cold store = cold-store | coldstore", false, false, true);
      assertThat(n.tokenList("cold-store coldstore", Unit.WORD)).containsExactly("cold", "store", "cold", "store");
      assertThat(n.ruleUsage().rules().get(0).tokens()).isEqualTo(1);
    }

    @Test
    void spellsCharactersOfTheCanonicalFormAtCharacterLevel() {
      Normaliser n = withRules("equate ok = okay");
      assertThat(n.tokenList("okay", Unit.CHAR)).containsExactly("o", "k");
    }

    @Test
    void readsEscapedSeparatorsLiterally() {
      Normaliser n = withRules("equate a\\=b = a\\|b | a\\\\b");
      assertThat(n.tokenList("a|b a\\b", Unit.WORD)).containsExactly("a=b", "a=b");
    }
  }

  @Nested
  class OptionalTokens {
    @Test
    void flagsOptionalWordsAndKeepsThem() {
      Normaliser n = withRules("optional uh | um | [noise]");
      TokenSequence seq = n.tokens("uh bay [noise] seven um", Unit.WORD);
      assertThat(seq.tokens()).containsExactly("uh", "bay", "[noise]", "seven", "um");
      assertThat(seq.optional()).containsExactly(true, false, true, false, true);
    }

    @Test
    void flagsEveryWordOfAnOptionalPhrase() {
      Normaliser n = withRules("optional you know");
      assertThat(n.tokens("bay you know seven", Unit.WORD).optional()).containsExactly(false, true, true, false);
    }

    @Test
    void flagsTheCanonicalFormWhenItIsOptional() {
      Normaliser n = withRules("equate uh = uhh | er\noptional uh");
      TokenSequence seq = n.tokens("er bay", Unit.WORD);
      assertThat(seq.tokens()).containsExactly("uh", "bay");
      assertThat(seq.optional()).containsExactly(true, false);
    }

    @Test
    void makesTheSpaceBeforeAnOptionalWordOptionalAtCharacterLevel() {
      Normaliser n = withRules("optional uh");
      TokenSequence seq = n.tokens("a uh b", Unit.CHAR);
      assertThat(seq.tokens()).containsExactly("a", "<sp>", "u", "h", "<sp>", "b");
      assertThat(seq.optional()).containsExactly(false, true, true, true, false, false);
    }

    @Test
    void makesTheSpaceAfterLeadingOptionalWordsOptional() {
      Normaliser n = withRules("optional uh | um");
      TokenSequence seq = n.tokens("uh um b c", Unit.CHAR);
      assertThat(seq.tokens()).containsExactly("u", "h", "<sp>", "u", "m", "<sp>", "b", "<sp>", "c");
      assertThat(seq.optional()).containsExactly(true, true, true, true, true, true, false, false, false);
    }

    @Test
    void keepsExactlyOneRequiredSpaceBetweenWordsAroundOptionalOnes() {
      Normaliser n = withRules("optional uh | um");
      TokenSequence seq = n.tokens("a uh um b", Unit.CHAR);
      int requiredSpaces = 0;
      for (int i = 0; i < seq.size(); i++)
        if (seq.tokens().get(i).equals(Normaliser.SPACE_TOKEN) && !seq.optional()[i]) requiredSpaces++;
      assertThat(requiredSpaces).isEqualTo(1);
    }
  }

  @Nested
  class DroppedTokens {
    @Test
    void removesDroppedWords() {
      Normaliser n = withRules("drop [crosstalk] | [unintelligible]");
      assertThat(n.tokenList("bay [crosstalk] seven [unintelligible]", Unit.WORD)).containsExactly("bay", "seven");
    }

    @Test
    void removesDroppedWordsWithTheirSpaceAtCharacterLevel() {
      Normaliser n = withRules("drop [crosstalk]");
      assertThat(n.tokenList("a [crosstalk] b", Unit.CHAR)).containsExactly("a", "<sp>", "b");
    }

    @Test
    void dropsFirstSoThatTheWordsAroundADroppedOneMeet() {
      Normaliser n = withRules("equate ok = oh kay\ndrop [crosstalk]");
      assertThat(n.tokenList("oh [crosstalk] kay", Unit.WORD)).containsExactly("ok");
      assertThat(n.ruleUsage().rules()).extracting(RuleUsage.RuleCount::tokens).containsExactly(2L, 1L);
    }

    @Test
    void dropsAVariantWhoseCanonicalFormIsDropped() {
      Normaliser n = withRules("equate [noise] = <noise>\ndrop [noise]");
      assertThat(n.tokenList("a <noise> b", Unit.WORD)).containsExactly("a", "b");
    }
  }

  @Nested
  class Usage {
    @Test
    void countsTheWordsEachRuleTouchedInFileOrder() {
      Normaliser n = Normaliser.create(new NormalisationOptions(true, false, false, false, fixture("warehouse.rules")));
      n.tokenList("Okay uh the cold-store um has 12 kilos [crosstalk] oh kay", Unit.WORD);
      n.tokenList("um [noise]", Unit.CHAR);
      RuleUsage usage = n.ruleUsage();
      assertThat(usage.rules()).extracting(RuleUsage.RuleCount::line).containsExactly(5, 6, 7, 8, 11, 12, 15);
      // okay (1) + oh kay (2); cold-store (1); kilos (1); uh, um, um (3); [noise] (1); [crosstalk] (1)
      assertThat(usage.rules()).extracting(RuleUsage.RuleCount::tokens).containsExactly(3L, 1L, 1L, 0L, 3L, 1L, 1L);
      assertThat(usage.total()).isEqualTo(10);
      assertThat(usage.rules().get(0).description()).isEqualTo("line 5: equate ok = okay | o.k. | oh kay");
    }

    @Test
    void makesTheReadmeExampleErrorFree() {
      Normaliser n = Normaliser.create(new NormalisationOptions(true, true, false, false, fixture("warehouse.rules")));
      TokenSequence ref = n.tokens("Okay, uh, twelve kilos to the cold-store [crosstalk]", Unit.WORD);
      TokenSequence hyp = n.tokens("ok twelve kg to the coldstore", Unit.WORD);
      assertThat(ref.tokens()).containsExactly("ok", "uh", "twelve", "kg", "to", "the", "cold", "store");
      assertThat(ref.optional()).containsExactly(false, true, false, false, false, false, false, false);
      assertThat(hyp.tokens()).containsExactly("ok", "twelve", "kg", "to", "the", "cold", "store");
    }

    @Test
    void startsFromZeroWithFreshCounts() {
      Normaliser n = withRules("optional uh");
      n.tokenList("uh uh", Unit.WORD);
      assertThat(n.ruleUsage().total()).isEqualTo(2);
      assertThat(n.withFreshCounts().ruleUsage().total()).isZero();
    }

    @Test
    void reportsNoRulesWithoutARulesFile() {
      assertThat(Normaliser.create(NormalisationOptions.EXACT).ruleUsage().rules()).isEmpty();
    }

    @Test
    void countsExactlyUnderConcurrentUse() throws Exception {
      Normaliser n = withRules("optional uh\ndrop [noise]");
      ExecutorService pool = Executors.newFixedThreadPool(4);
      try {
        List<Future<?>> jobs = new java.util.ArrayList<>();
        for (int t = 0; t < 4; t++)
          jobs.add(pool.submit(() -> {
            for (int i = 0; i < 2500; i++) n.tokens("uh a [noise] uh", Unit.WORD);
          }));
        for (Future<?> f : jobs) f.get();
      } finally {
        pool.shutdown();
      }
      assertThat(n.ruleUsage().rules()).extracting(RuleUsage.RuleCount::tokens).containsExactly(20_000L, 10_000L);
    }
  }

  @Nested
  class ReadingFiles {
    @Test
    void readsABomAndCrlfLineEndings() {
      Normaliser n = Normaliser.create(new NormalisationOptions(false, false, false, false, fixture("bom-crlf.rules")));
      assertThat(n.tokens("okay uh", Unit.WORD).optional()).containsExactly(false, true);
      assertThat(n.tokenList("okay uh", Unit.WORD)).containsExactly("ok", "uh");
    }

    @Test
    void readsAGzippedRulesFile() {
      Normaliser n = Normaliser.create(new NormalisationOptions(false, false, false, false, fixture("plain.rules.gz")));
      assertThat(n.tokenList("okay", Unit.WORD)).containsExactly("ok");
    }

    @Test
    void keepsAPhraseThatNormalisesToNothingAsAnInertRule() {
      Normaliser n = withRules("drop ...", false, true, false);
      assertThat(n.tokenList("a ... b", Unit.WORD)).containsExactly("a", "b");
      assertThat(n.ruleUsage().rules()).hasSize(1).first().extracting(RuleUsage.RuleCount::tokens).isEqualTo(0L);
    }
  }

  @Nested
  class Description {
    @Test
    void namesTheOptionsThatAreOn() {
      assertThat(Normaliser.create(NormalisationOptions.EXACT).describe()).isEqualTo("nfkc");
      assertThat(Normaliser.create(new NormalisationOptions(true, true, true, true, null)).describe())
          .isEqualTo("nfkc fold-case strip-punct split-hyphens ignore-space");
    }

    @Test
    void fingerprintsTheRulesButNotTheirComments() {
      String a = withRules("# one\noptional uh\n").describe();
      String b = withRules("optional uh\n\n# two\n").describe();
      String c = withRules("optional um\n").describe();
      assertThat(a).isEqualTo(b).matches("nfkc rules=test\\.rules#[0-9a-f]{8}");
      assertThat(c).isNotEqualTo(a);
    }
  }

  @Nested
  class MalformedFiles {
    @ParameterizedTest(name = "[{index}] {0}")
    @CsvSource(delimiter = '|', value = {
        "bad-unknown-keyword.rules|2|unknown rule 'swap'; expected equate, optional or drop",
        "bad-equate-without-equals.rules|2|equate rule without '='; expected equate CANONICAL = VARIANT | VARIANT …",
        "bad-equate-two-equals.rules|1|equate rule with more than one '='",
        "bad-empty-phrase.rules|1|empty phrase in optional rule; expected one or more words between each '|'",
        "bad-empty-canonical.rules|1|empty canonical form",
        "bad-conflict.rules|3|'uh' already has a rule on line 1; expected each spelling in one rule only",
        "bad-canonical-rewritten.rules|2|'ok' is the canonical form on line 1",
        "bad-canonical-is-variant.rules|2|canonical form 'okay' is rewritten by the rule on line 1",
        "bad-invalid-utf8.rules|2|invalid UTF-8; expected a UTF-8 text file",
        "bad-unknown-escape.rules|1|unknown escape '\\b'",
        "bad-trailing-backslash.rules|1|backslash at end of line",
        "bad-bar-before-equals.rules|1|'|' before '=' in equate rule",
        "bad-equals-in-optional.rules|1|'=' in optional rule"
    })
    void namesFileLineAndProblem(String name, int line, String problem) {
      Path file = fixture(name);
      NormalisationOptions o = new NormalisationOptions(false, false, false, false, file);
      assertThatThrownBy(() -> Normaliser.create(o))
          .isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.file()).isEqualTo(file.toString());
            assertThat(e.line()).isEqualTo(line);
          })
          .hasMessageStartingWith(file + ":" + line + ": " + problem);
    }

    @Test
    void namesAMissingFile(@TempDir Path dir) {
      Path missing = dir.resolve("none.rules");
      assertThatThrownBy(() -> Normaliser.create(new NormalisationOptions(false, false, false, false, missing)))
          .isInstanceOf(InputException.class).hasMessage(missing + ": no such rules file; expected an existing readable file");
    }

    @Test
    void namesAGzFileThatIsNotGzip() {
      Path file = fixture("bad-not-gzip.rules.gz");
      assertThatThrownBy(() -> Normaliser.create(new NormalisationOptions(false, false, false, false, file)))
          .isInstanceOf(InputException.class).hasMessageStartingWith(file + ": not a valid gzip file");
    }

    @Test
    void findsAConflictThatOnlyCaseFoldingCreates(@TempDir Path dir) throws Exception {
      Path file = dir.resolve("fold.rules");
      Files.writeString(file, "optional Uh\ndrop uh\n");
      assertThat(Normaliser.create(new NormalisationOptions(false, false, false, false, file)).tokenList("Uh uh", Unit.WORD))
          .containsExactly("Uh");
      assertThatThrownBy(() -> Normaliser.create(new NormalisationOptions(true, false, false, false, file)))
          .isInstanceOf(InputException.class).hasMessageStartingWith(file + ":2: 'uh' already has a rule on line 1");
    }
  }
}
