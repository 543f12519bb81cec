package steelyard.eval;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Function;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import steelyard.io.Hypothesis;
import steelyard.io.Reference;
import steelyard.io.UtteranceHypotheses;
import steelyard.text.NormalisationOptions;
import steelyard.text.Normaliser;
import steelyard.text.TokenSequence;
import steelyard.text.Unit;

class CorpusScorerTest {
  /** Whitespace words; {@code uh} and {@code um} flagged optional. */
  static final Function<String, TokenSequence> WORDS = raw -> {
    List<String> t = raw.isBlank() ? List.of() : Arrays.asList(raw.trim().split("\\s+"));
    boolean[] opt = new boolean[t.size()];
    for (int i = 0; i < opt.length; i++) opt[i] = t.get(i).equals("uh") || t.get(i).equals("um");
    return new TokenSequence(t, opt);
  };

  static Hypothesis hyp(String utt, int rank, String text) {
    return new Hypothesis(utt, "", rank, text, new double[0], "", rank - 1, rank + 1);
  }

  static UtteranceHypotheses nbest(String utt, String... texts) {
    List<Hypothesis> hs = new ArrayList<>();
    for (int i = 0; i < texts.length; i++) hs.add(hyp(utt, i + 1, texts[i]));
    return new UtteranceHypotheses(utt, hs, 0);
  }

  static LinkedHashMap<String, Reference> refs(String... idTextPairs) {
    LinkedHashMap<String, Reference> m = new LinkedHashMap<>();
    for (int i = 0; i < idTextPairs.length; i += 2)
      m.put(idTextPairs[i], new Reference(idTextPairs[i], idTextPairs[i + 1], "", i / 2 + 2));
    return m;
  }

  static CorpusScore score(Pick pick, MissingHypothesisPolicy missing, LinkedHashMap<String, Reference> refs, UtteranceHypotheses... utts) {
    return new CorpusScorer(WORDS, new CorpusScorer.Settings(pick, missing, 5, true)).score(refs, List.of(utts).iterator());
  }

  @Nested
  class Totals {
    @Test
    void sumsHandWorkedUtterances() {
      // Worked by hand: u1 "pick bay four" vs "pick bay for": C2 S1; u2 "two crates" vs "two crates": C2;
      // u3 "load the van" vs "load van now": cost 2 either as D(the) C(van) I(now) or as S(the,van) S(van,now);
      // walking back from the end the diagonal is preferred, so C1 S2. Totals C5 S3, N = 8, WER = 3/8, SER = 2/3.
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "pick bay four", "u2", "two crates", "u3", "load the van"),
          nbest("u1", "pick bay for"), nbest("u2", "two crates"), nbest("u3", "load van now"));
      assertThat(s.totals()).isEqualTo(new EditCounts(5, 3, 0, 0));
      assertThat(s.errorRate()).isEqualTo(3.0 / 8);
      assertThat(s.sentenceErrorRate()).isEqualTo(2.0 / 3);
      assertThat(s.utterances()).isEqualTo(3);
      assertThat(s.warnings()).isEmpty();
      assertThat(s.table().hypText(2)).isEqualTo("load van now");
    }

    @Test
    void emptyReferenceContributesItsInsertions() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "ok", "u2", ""), nbest("u1", "ok"), nbest("u2", "noise here"));
      assertThat(s.totals()).isEqualTo(new EditCounts(1, 0, 0, 2));
      assertThat(s.errorRate()).isEqualTo(2.0);
    }

    @Test
    void corpusWithoutReferenceTokensHasUndefinedRateAndWarns() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, refs("u1", ""), nbest("u1", "stray word"));
      assertThat(s.errorRate()).isNaN();
      assertThat(s.totals().errors()).isEqualTo(2);
      assertThat(s.warnings()).anyMatch(w -> w.contains("N = 0"));
    }

    @Test
    void veryLongUtterancesAreCountedExactlyButLeftOutOfTheErrorLists() {
      StringBuilder ref = new StringBuilder();
      StringBuilder hyp = new StringBuilder();
      for (int i = 0; i < 4200; i++) {
        ref.append("w").append(i % 50).append(' ');
        hyp.append(i % 7 == 0 ? "x" : "w" + (i % 50)).append(' ');
      }
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, refs("u1", ref.toString()), nbest("u1", hyp.toString()));
      // Worked by hand: every 7th of 4200 words is replaced by x, which matches nothing, so each of the 600 x is
      // an S or an I: cost >= S + I >= 600, reached by 600 substitutions; cost = 600 then forces D = 0, and
      // I = D + |hyp| - |ref| = 0, so the counts are C 3600, S 600 whatever the tie-breaking.
      assertThat(s.totals()).isEqualTo(new EditCounts(3600, 600, 0, 0));
      assertThat(s.substitutions()).isEmpty();
      assertThat(s.warnings()).anyMatch(w -> w.contains("too long"));
    }

    @Test
    void optionalTokensCountNeitherInNNorAsErrors() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "uh six pears"), nbest("u1", "six um pears"));
      assertThat(s.totals()).isEqualTo(new EditCounts(2, 0, 0, 0));
    }
  }

  @Nested
  class Missing {
    private final LinkedHashMap<String, Reference> refs = refs("u1", "four crates", "u2", "two bays", "u3", "one van");

    @Test
    void missingHypothesisCountsAsAllDeletionsByDefault() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, refs, nbest("u1", "four crates"), nbest("u9", "ghost"));
      assertThat(s.missingHypotheses()).containsExactly("u2", "u3");
      assertThat(s.missingReferences()).containsExactly("u9");
      assertThat(s.totals()).isEqualTo(new EditCounts(2, 0, 4, 0));
      assertThat(s.utterances()).isEqualTo(3);
      assertThat(s.table().status(1)).isEqualTo(UtteranceScores.MISSING_COUNTED);
      assertThat(s.deletions()).extracting(TokenTally::ref).containsExactly("bays", "one", "two", "van");
      assertThat(s.warnings()).hasSize(2);
    }

    @Test
    void excludedMissingHypothesisIsListedButNotCounted() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.EXCLUDE, refs, nbest("u1", "four crates"));
      assertThat(s.missingHypotheses()).containsExactly("u2", "u3");
      assertThat(s.totals()).isEqualTo(new EditCounts(2, 0, 0, 0));
      assertThat(s.utterances()).isEqualTo(1);
      assertThat(s.table().includedErrors()).containsExactly(0);
    }
  }

  @Nested
  class Picking {
    @Test
    void oracleTakesTheHypothesisWithFewestErrorsAndTiesGoToTheBetterRank() {
      CorpusScore s = score(Pick.ORACLE, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "six crates of pears"),
          nbest("u1", "sticks crates of bears", "six crates of bears", "six crates of hairs", "six crates of pears"));
      assertThat(s.table().hypRank(0)).isEqualTo(4);
      CorpusScore tie = score(Pick.ORACLE, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "six crates"), nbest("u1", "sticks crates", "six grates", "mix crates"));
      assertThat(tie.table().hypRank(0)).isEqualTo(1);
    }

    @Test
    void oracleIsNeverWorseThanFirst() {
      // Property: the oracle minimises errors per utterance, so its corpus errors are <= rank 1's.
      long seed = 99L;
      SplittableRandom rnd = new SplittableRandom(seed);
      String[] words = {"bay", "four", "for", "crates", "pears", "bears", "load", "van"};
      for (int trial = 0; trial < 50; trial++) {
        LinkedHashMap<String, Reference> refs = new LinkedHashMap<>();
        List<UtteranceHypotheses> utts = new ArrayList<>();
        for (int u = 0; u < 20; u++) {
          String id = "u" + u;
          refs.put(id, new Reference(id, sentence(rnd, words), "", u + 2));
          String[] texts = new String[1 + rnd.nextInt(6)];
          for (int k = 0; k < texts.length; k++) texts[k] = sentence(rnd, words);
          utts.add(nbest(id, texts));
        }
        CorpusScore first = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, refs, utts.toArray(new UtteranceHypotheses[0]));
        CorpusScore oracle = score(Pick.ORACLE, MissingHypothesisPolicy.ALL_DELETIONS, refs, utts.toArray(new UtteranceHypotheses[0]));
        assertThat(oracle.totals().errors()).as("seed %d trial %d", seed, trial).isLessThanOrEqualTo(first.totals().errors());
        assertThat(oracle.totals().referenceTokens()).isEqualTo(first.totals().referenceTokens());
      }
    }

    @Test
    void givenPickScoresTheCallersChoice() {
      CorpusScorer scorer = new CorpusScorer(WORDS, new CorpusScorer.Settings(Pick.GIVEN, MissingHypothesisPolicy.ALL_DELETIONS, 3, true));
      CorpusScore s = scorer.score(refs("u1", "six crates"), List.of(nbest("u1", "sticks crates", "six crates")).iterator(), u -> 1);
      assertThat(s.totals()).isEqualTo(new EditCounts(2, 0, 0, 0));
      assertThat(s.table().hypRank(0)).isEqualTo(2);
      assertThat(s.pick()).isEqualTo(Pick.GIVEN);
    }

    private String sentence(SplittableRandom rnd, String[] words) {
      StringBuilder sb = new StringBuilder();
      for (int i = rnd.nextInt(7); i > 0; i--) sb.append(words[rnd.nextInt(words.length)]).append(' ');
      return sb.toString().trim();
    }
  }

  @Nested
  class Breakdowns {
    @Test
    void groupComesFromReferenceElseFromHypothesis() {
      LinkedHashMap<String, Reference> refs = new LinkedHashMap<>();
      refs.put("u1", new Reference("u1", "a b", "north", 2));
      refs.put("u2", new Reference("u2", "c d", "", 3));
      UtteranceHypotheses u2 = new UtteranceHypotheses("u2",
          List.of(new Hypothesis("u2", "", 1, "c x", new double[0], "south", 0, 5)), 0);
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, refs, nbest("u1", "a b"), u2);
      assertThat(s.groups()).extracting(GroupScore::group).containsExactly("north", "south");
      assertThat(s.groups().get(1).counts()).isEqualTo(new EditCounts(1, 1, 0, 0));
      assertThat(s.groups().get(0).sentenceErrorRate()).isZero();
    }

    @Test
    void topConfusionsSortByCountThenTokenText() {
      CorpusScore s = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS,
          refs("u1", "four four pears", "u2", "bay bay", "u3", "van"),
          nbest("u1", "for for bears"), nbest("u2", "day pay"), nbest("u3", "van van"));
      assertThat(s.substitutions()).containsExactly(
          new TokenTally("four", "for", 2), new TokenTally("bay", "day", 1),
          new TokenTally("bay", "pay", 1), new TokenTally("pears", "bears", 1));
      assertThat(s.insertions()).containsExactly(new TokenTally("", "van", 1));
      assertThat(s.deletions()).isEmpty();
    }

    @Test
    void scoringTheSameInputTwiceGivesTheSameTable() {
      LinkedHashMap<String, Reference> r = refs("u1", "a b c", "u2", "d e");
      CorpusScore x = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, r, nbest("u1", "a c"), nbest("u2", "d e f"));
      CorpusScore y = score(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, r, nbest("u1", "a c"), nbest("u2", "d e f"));
      assertThat(x.table().includedErrors()).containsExactly(y.table().includedErrors());
      assertThat(x.totals()).isEqualTo(y.totals());
    }
  }

  @Test
  void graphemeClusterOfSeveralCodePointsCountsAsOneCharacter() {
    // Source: Unicode Standard Annex #29 (extended grapheme clusters): e + U+0301 is one user-perceived
    // character, and a regional-indicator pair (a flag) is one.
    Normaliser exact = Normaliser.create(new NormalisationOptions(false, false, false, true, null));
    CorpusScorer scorer = new CorpusScorer(raw -> exact.tokens(raw, Unit.CHAR),
        new CorpusScorer.Settings(Pick.FIRST, MissingHypothesisPolicy.ALL_DELETIONS, 3, false));
    String flag = "\uD83C\uDDF3\uD83C\uDDFF";
    CorpusScore s = scorer.score(refs("u1", "cafe\u0301" + flag), List.of(nbest("u1", "cafe" + flag)).iterator());
    // NFKC composes e + U+0301 into U+00E9; either way the reference has five characters: c a f é and the flag.
    assertThat(s.totals()).isEqualTo(new EditCounts(4, 1, 0, 0));
  }

  @Test
  void pairedComparisonCountsWinsOnTheCommonSet() {
    LinkedHashMap<String, Reference> r = refs("u1", "a b c", "u2", "d e", "u3", "f");
    CorpusScore a = score(Pick.FIRST, MissingHypothesisPolicy.EXCLUDE, r, nbest("u1", "a c"), nbest("u2", "d e"), nbest("u3", "f"));
    CorpusScore b = score(Pick.FIRST, MissingHypothesisPolicy.EXCLUDE, r, nbest("u1", "a b c"), nbest("u2", "x e"));
    PairedComparison c = PairedComparison.of(a, b, 200, 1L, 1);
    assertThat(c.utterances()).isEqualTo(2);
    assertThat(c.aBetter()).isEqualTo(1);
    assertThat(c.bBetter()).isEqualTo(1);
    assertThat(c.ties()).isZero();
    assertThat(c.signTestP()).isEqualTo(1.0);
    assertThat(c.referenceTokens()).isEqualTo(5);
  }
}
